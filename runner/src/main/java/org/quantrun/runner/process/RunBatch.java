package org.quantrun.runner.process;

import java.io.IOException;
import java.io.PrintWriter;
import java.net.InetAddress;
import java.nio.charset.CharacterCodingException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.Clock;
import java.time.Instant;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.Set;
import java.util.concurrent.ExecutionException;
import java.util.concurrent.ExecutorService;
import java.util.concurrent.Executors;
import java.util.concurrent.Future;
import org.quantrun.core.importer.ColumnNames;
import org.quantrun.core.importer.ImportException;
import org.quantrun.core.importer.ImportSettings;
import org.quantrun.core.importer.RawRun;
import org.quantrun.core.method.Method;
import org.quantrun.core.method.MethodException;
import org.quantrun.core.method.MethodLoader;
import org.quantrun.core.method.prep.PrepSheet;
import org.quantrun.core.method.prep.PrepSheetParser;
import org.quantrun.core.model.CalibrationStatus;
import org.quantrun.core.model.RunResult;
import org.quantrun.core.model.RunVerdict;
import org.quantrun.core.qc.Verdict;
import org.quantrun.runner.Main;
import org.quantrun.runner.StartupTrace;
import org.quantrun.runner.MethodFiles;
import org.quantrun.runner.output.Digests;
import org.quantrun.runner.plugins.ImporterPlugins;
import org.quantrun.runner.plugins.RunFileImport;
import org.quantrun.runner.write.Audit;
import org.quantrun.runner.write.OutputFormat;
import org.quantrun.runner.write.ResultsFolder;
import org.slf4j.Logger;
import org.slf4j.LoggerFactory;
import org.slf4j.Marker;
import org.slf4j.MarkerFactory;

/**
 * Processes one or more exports with one method: checks every input first (a usage or input error
 * stops everything before anything is written), then reads, processes and writes each run into
 * its own results folder. Shared by {@code quantrun process} and {@code quantrun demo}.
 */
public final class RunBatch {
  private static final Logger LOG = LoggerFactory.getLogger(RunBatch.class);
  /** Marks log events the user has already been told about: they go to the log file only. */
  static final Marker FILE_ONLY = MarkerFactory.getMarker(org.quantrun.runner.LogSetup.FILE_ONLY);

  /**
   * An input file and how the audit trail names it.
   *
   * @param file the file to read
   * @param shownPath the path the audit trail records
   */
  public record Input(Path file, String shownPath) {
    /**
     * An input named by its own path.
     *
     * @param file the file
     * @return the input
     */
    public static Input of(Path file) {
      return new Input(file, file.toAbsolutePath().normalize().toString());
    }

    String name() {
      return MethodFiles.name(file);
    }
  }

  /**
   * What to process.
   *
   * @param command the command's name for messages, e.g. {@code quantrun process}
   * @param exports the exports, each its own run
   * @param method the method file
   * @param prep the prep sheet, if any
   * @param profile an import profile that replaces the method's, if any
   * @param outDir the folder the results folders go into
   * @param formats the outputs to write
   * @param plugins the loaded importers
   * @param arguments the command line, for the audit trail
   */
  public record Request(String command, List<Input> exports, Input method, Optional<Input> prep, Optional<Input> profile,
      Path outDir, Set<OutputFormat> formats, ImporterPlugins.Result plugins, List<String> arguments) {
    /**
     * Copies the lists.
     *
     * @param command the command's name
     * @param exports the exports
     * @param method the method file
     * @param prep the prep sheet
     * @param profile the profile override
     * @param outDir the output folder
     * @param formats the outputs
     * @param plugins the importers
     * @param arguments the command line
     */
    public Request {
      exports = List.copyOf(exports);
      formats = Set.copyOf(formats);
      arguments = List.copyOf(arguments);
    }
  }

  /**
   * What became of one export.
   *
   * @param export the export's file name
   * @param exitCode its exit code (0, 1, 2 or 3)
   * @param folder the published results folder, when processed
   * @param summary what the run concluded, when processed (the full result is not kept: a batch of
   *     many runs must not hold them all in memory)
   */
  public record Outcome(String export, int exitCode, Optional<Path> folder, Optional<Summary> summary) {}

  /**
   * What a processed run concluded, in short.
   *
   * @param runId the run's id
   * @param methodId the method's id
   * @param methodVersion the method's version
   * @param verdict the run's verdict
   * @param failures failed QC checks plus rejected calibrations
   * @param reruns how many reruns were requested
   */
  public record Summary(String runId, String methodId, String methodVersion, RunVerdict verdict, int failures, int reruns) {}

  /**
   * What became of the whole batch.
   *
   * @param exitCode the highest exit code of any export (0 when all were in order), or 2 when the
   *     inputs were refused before any run was read
   * @param outcomes one per export, in order; empty when the inputs were refused
   */
  public record Report(int exitCode, List<Outcome> outcomes) {
    /**
     * Copies the list.
     *
     * @param exitCode the exit code
     * @param outcomes the outcomes
     */
    public Report {
      outcomes = List.copyOf(outcomes);
    }
  }

  private final RunPipeline pipeline;
  private final Clock clock;
  /** The method file parsed last: a batch with the same method bytes reuses it (one batch per file in watch). */
  private volatile ParsedMethod lastMethod;

  /**
   * A batch runner.
   *
   * @param pipeline turns runs into results
   * @param clock the clock for start and end times
   */
  public RunBatch(RunPipeline pipeline, Clock clock) {
    this.pipeline = pipeline;
    this.clock = clock;
  }

  /**
   * Runs the batch.
   *
   * @param req what to process
   * @param out where each run's one-line summary goes
   * @param err where problems (and the progress bar) go
   * @param interactive whether standard error is a terminal (the progress bar is drawn only then)
   * @return the exit code and each export's outcome
   */
  public Report run(Request req, PrintWriter out, PrintWriter err, boolean interactive) {
    Prepared p;
    try {
      p = prepare(req);
      StartupTrace.mark("method, profile and prep sheet read");
    } catch (MethodFiles.Failure f) {
      f.lines().forEach(err::println);
      err.flush();
      LOG.info(FILE_ONLY, "{}: inputs refused: {}", req.command(), String.join(" | ", f.lines()));
      return new Report(Main.EXIT_INPUT_ERROR, List.of());
    }
    for (ImporterPlugins.Problem problem : req.plugins().problems()) {
      err.println("quantrun: " + (problem.source().endsWith(".jar") ? "plugin skipped: " : "") + problem.text());
    }
    List<Outcome> outcomes = new ArrayList<>();
    Progress progress = new Progress(err, req.exports().size(), interactive);
    int exit = Main.EXIT_OK;
    int workers = Math.min(req.exports().size(), Runtime.getRuntime().availableProcessors());
    if (workers <= 1) {
      for (Input export : req.exports()) {
        progress.start(export.name());
        Outcome o = one(req, p, export, out, err, progress);
        outcomes.add(o);
        exit = Math.max(exit, o.exitCode());
        progress.step();
      }
    } else {
      // several exports: a worker per core; each run's messages are replayed in input order
      ExecutorService pool = Executors.newFixedThreadPool(workers, r -> {
        Thread t = new Thread(r, "quantrun-run");
        t.setDaemon(true);
        return t;
      });
      try {
        List<Future<Buffered>> futures = new ArrayList<>();
        for (Input export : req.exports()) {
          futures.add(pool.submit(() -> {
            java.io.StringWriter o = new java.io.StringWriter();
            java.io.StringWriter e = new java.io.StringWriter();
            PrintWriter po = new PrintWriter(o);
            PrintWriter pe = new PrintWriter(e);
            Outcome outcome = one(req, p, export, po, pe, new Progress(pe, 1, false));
            po.flush();
            pe.flush();
            return new Buffered(outcome, o.toString(), e.toString());
          }));
        }
        for (int i = 0; i < futures.size(); i++) {
          progress.start(req.exports().get(i).name());
          Buffered b = await(futures.get(i));
          b.out().lines().forEach(l -> progress.println(out, l));
          b.err().lines().forEach(l -> progress.println(err, l));
          outcomes.add(b.outcome());
          exit = Math.max(exit, b.outcome().exitCode());
          progress.step();
        }
      } finally {
        pool.shutdownNow();
      }
    }
    progress.finish();
    out.flush();
    err.flush();
    return new Report(exit, outcomes);
  }

  /** One run's outcome and the messages it printed, kept for printing in input order. */
  private record Buffered(Outcome outcome, String out, String err) {}

  private static Buffered await(Future<Buffered> f) {
    try {
      return f.get();
    } catch (InterruptedException e) {
      Thread.currentThread().interrupt();
      throw new IllegalStateException("interrupted while processing", e);
    } catch (ExecutionException e) {
      // one() catches everything a run can throw; anything else is an internal error
      throw new IllegalStateException("a run failed unexpectedly", e.getCause());
    }
  }

  /** Everything read and checked before the first run. */
  private record Prepared(Method method, String methodSha, ImportSettings settings, Optional<PrepSheet> prep,
      List<Audit.InputFile> sharedInputs) {}

  private Prepared prepare(Request req) throws MethodFiles.Failure {
    String cmd = req.command();
    List<Audit.InputFile> inputs = new ArrayList<>();
    Method method = method(req, inputs);
    String methodSha = inputs.get(0).sha256();

    Optional<Input> profile = req.profile().or(() -> MethodFiles.profile(req.method().file(), method).map(Input::of));
    ImportSettings settings = ImportSettings.DEFAULT;
    if (profile.isPresent()) {
      requireFile(cmd, "--profile", profile.get());
      try {
        settings = RunFileImport.loadProfile(profile.get().file());
      } catch (ImportException e) {
        throw new MethodFiles.Failure(List.of(cmd + ": " + e.getMessage()));
      }
      inputs.add(inputFile("import-profile", profile.get()));
    }
    ImportSettings.Builder b = settings.toBuilder();
    if (!method.importSettings().detect()) {
      b.importer(method.importSettings().importer());
    }
    for (Map.Entry<String, String> e : method.importSettings().settings().entrySet()) {
      b.option(e.getKey(), e.getValue());
    }
    // the columns the method reads per injection (a standard's level, a dilution factor)
    method.injectionColumns().forEach(b::injectionColumn);
    // the column the method reads each injection's type from is the export's type column, chosen
    // before another one a built-in name finds (such as "Type" beside "Sample Type")
    method.identification().typeColumn().ifPresent(t -> b.alias(ColumnNames.SAMPLE_TYPE, List.of(t)));
    settings = b.build();

    Optional<PrepSheet> prep = Optional.empty();
    if (req.prep().isPresent()) {
      Input in = req.prep().get();
      requireFile(cmd, "--prep", in);
      if (method.dilution().prepSheet().isEmpty()) {
        throw new MethodFiles.Failure(List.of(cmd + ": --prep " + in.name() + ": method " + method.identity().id()
            + " describes no prep sheet (expected a dilution.prep-sheet section in " + req.method().name() + ")"));
      }
      try {
        if (Files.size(in.file()) > PrepSheetParser.MAX_CHARACTERS) {
          throw new MethodFiles.Failure(List.of(in.name() + ": the prep sheet is larger than "
              + PrepSheetParser.MAX_CHARACTERS / (1 << 20) + " MiB and is refused"));
        }
        prep = Optional.of(PrepSheetParser.parse(MethodFiles.readUtf8(in.file()), in.name(), method.dilution().prepSheet().get()));
      } catch (MethodException e) {
        throw MethodFiles.problems(cmd, in.name(), e.problems());
      } catch (CharacterCodingException e) {
        throw new MethodFiles.Failure(List.of(in.name() + ": the file is not UTF-8 text (expected a UTF-8 CSV prep sheet)"));
      } catch (IOException e) {
        throw new MethodFiles.Failure(List.of(cmd + ": " + in.name() + ": cannot be read (" + e.getMessage() + ")"));
      }
      inputs.add(inputFile("prep-sheet", in));
    }
    for (Input e : req.exports()) {
      requireFile(cmd, "export", e);
    }
    if (req.plugins().importers().isEmpty()) {
      throw new MethodFiles.Failure(List.of(cmd + ": no importers are installed (expected importer plugin jars in the plugins folder)"));
    }
    if (Files.exists(req.outDir()) && !Files.isDirectory(req.outDir())) {
      throw new MethodFiles.Failure(List.of(cmd + ": --out " + req.outDir() + ": is not a folder"));
    }
    return new Prepared(method, methodSha, settings, prep, inputs);
  }

  /**
   * Reads the method file once, digests what was read and parses exactly that; a method whose bytes
   * are the same as last time (the watch service runs one batch per file) is not parsed again.
   */
  private Method method(Request req, List<Audit.InputFile> inputs) throws MethodFiles.Failure {
    Input in = req.method();
    requireFile(req.command(), "--method", in);
    byte[] bytes;
    try {
      if (Files.size(in.file()) > 4L * MethodLoader.MAX_CHARACTERS) {
        // larger than any method file can be (at most 4 bytes a character): refused by the loader
        return MethodFiles.load(in.file(), req.command());
      }
      bytes = Files.readAllBytes(in.file());
    } catch (IOException e) {
      throw new MethodFiles.Failure(List.of(req.command() + ": " + in.name() + ": cannot be read (" + e.getMessage() + ")"));
    }
    String sha = Digests.sha256(bytes);
    inputs.add(new Audit.InputFile("method", in.name(), in.shownPath(), sha, bytes.length));
    Path key = in.file().toAbsolutePath().normalize();
    ParsedMethod last = lastMethod;
    if (last != null && last.file().equals(key) && last.sha256().equals(sha)) {
      return last.method();
    }
    Method method = MethodFiles.load(in.file(), bytes, req.command());
    lastMethod = new ParsedMethod(key, sha, method);
    return method;
  }

  /** The method file parsed last, by its path and digest. */
  private record ParsedMethod(Path file, String sha256, Method method) {}

  private static void requireFile(String cmd, String what, Input in) throws MethodFiles.Failure {
    if (!Files.isRegularFile(in.file())) {
      throw new MethodFiles.Failure(List.of(cmd + ": " + what + " " + in.file()
          + (Files.exists(in.file()) ? ": is not a file" : ": no such file")));
    }
    if (!Files.isReadable(in.file())) {
      throw new MethodFiles.Failure(List.of(cmd + ": " + what + " " + in.file() + ": cannot be read"));
    }
  }

  private static Audit.InputFile inputFile(String role, Input in) throws MethodFiles.Failure {
    try {
      return new Audit.InputFile(role, in.name(), in.shownPath(), Digests.sha256(in.file()), Files.size(in.file()));
    } catch (IOException e) {
      throw new MethodFiles.Failure(List.of("quantrun: " + in.name() + ": cannot be read (" + e.getMessage() + ")"));
    }
  }

  private Outcome one(Request req, Prepared p, Input export, PrintWriter out, PrintWriter err, Progress progress) {
    String name = export.name();
    Instant started = clock.instant();
    LOG.info("{}: processing {} with method {} {}", req.command(), name, p.method().identity().id(), p.method().identity().version());
    try {
      List<Audit.InputFile> inputs = new ArrayList<>();
      inputs.add(inputFile("export", export));
      inputs.addAll(p.sharedInputs());
      RunFileImport reader = new RunFileImport(req.plugins().selection());
      RawRun raw = reader.read(export.file(), p.settings());
      StartupTrace.mark(name + " imported");
      RunResult result = pipeline.process(raw, p.method(), p.prep());
      StartupTrace.mark(name + " processed");
      List<Audit.PluginRef> plugins = req.plugins().importers().stream()
          .map(li -> new Audit.PluginRef(li.pluginId(), li.version(), li.importer().id(),
              li.source().map(s -> s.getFileName().toString()), li.sha256()))
          .toList();
      Audit audit = new Audit(Main.version(), System.getProperty("java.version"), user(), host(), started, inputs,
          new Audit.MethodRef(p.method().identity().id(), p.method().identity().version(), p.methodSha()), plugins,
          raw.importerId(), req.arguments());
      Path folder = ResultsFolder.write(req.outDir(), result, p.method(), req.formats(), audit, clock, Main.version());
      StartupTrace.mark(name + " written");
      int failures = failures(result);
      int code = failures > 0 ? Main.EXIT_QC_FAILED : Main.EXIT_OK;
      String report = req.formats().contains(OutputFormat.HTML) ? folder.resolve("report.html").toString() : folder.toString();
      progress.println(out, name + ": run " + result.run().runId() + ": " + result.verdict().token()
          + (failures > 0 ? " (" + failures + (failures == 1 ? " QC failure" : " QC failures") + ")" : "")
          + " -> " + report);
      LOG.info("{}: {} -> {} ({}, exit {})", req.command(), name, folder, result.verdict().token(), code);
      return new Outcome(name, code, Optional.of(folder), Optional.of(new Summary(result.run().runId(), result.run().methodId(),
          result.run().methodVersion(), result.verdict(), failures, result.reruns().size())));
    } catch (MethodFiles.Failure f) {
      f.lines().forEach(l -> progress.println(err, l));
      return new Outcome(name, Main.EXIT_INPUT_ERROR, Optional.empty(), Optional.empty());
    } catch (ImportException e) {
      progress.println(err, req.command() + ": " + e.getMessage());
      LOG.info(FILE_ONLY, "{}: {} refused: {}", req.command(), name, e.getMessage());
      return new Outcome(name, Main.EXIT_INPUT_ERROR, Optional.empty(), Optional.empty());
    } catch (RunPipeline.RunInputException e) {
      // the core's messages begin with the export's name already
      String message = e.getMessage().startsWith(name + ":") ? e.getMessage() : name + ": " + e.getMessage();
      progress.println(err, req.command() + ": " + message);
      LOG.info(FILE_ONLY, "{}: {} refused: {}", req.command(), name, e.getMessage());
      return new Outcome(name, Main.EXIT_INPUT_ERROR, Optional.empty(), Optional.empty());
    } catch (IOException e) {
      progress.println(err, req.command() + ": " + name + ": cannot write the results into " + req.outDir() + " (" + e.getMessage() + ")");
      LOG.info(FILE_ONLY, "{}: {}: cannot write results", req.command(), name, e);
      return new Outcome(name, Main.EXIT_INPUT_ERROR, Optional.empty(), Optional.empty());
    } catch (OutOfMemoryError e) {
      // the run's data are garbage once this frame is left: the other runs can go on
      progress.println(err, req.command() + ": " + name + ": " + Main.outOfMemoryAdvice() + "; nothing was written for this run");
      LOG.error(FILE_ONLY, "{}: out of memory while processing {}", req.command(), name, e);
      return new Outcome(name, Main.EXIT_INTERNAL_ERROR, Optional.empty(), Optional.empty());
    } catch (RuntimeException | LinkageError e) {
      progress.println(err, req.command() + ": " + name + ": internal error (" + e + "); nothing was written for this run;"
          + " details are in the log file");
      LOG.error(FILE_ONLY, "{}: internal error while processing {}", req.command(), name, e);
      return new Outcome(name, Main.EXIT_INTERNAL_ERROR, Optional.empty(), Optional.empty());
    }
  }

  /**
   * Counts what makes a processed run exit with code 1: QC checks that failed (not-evaluated checks
   * do not count) and calibrations rejected by the method's acceptance rules.
   *
   * @param result the run
   * @return the number of failures
   */
  public static int failures(RunResult result) {
    long qc = result.qc().stream().filter(q -> q.verdict() == Verdict.FAILED).count();
    long cal = result.calibrations().stream().filter(c -> c.status() == CalibrationStatus.REJECTED).count();
    return (int) (qc + cal);
  }

  private static String user() {
    return Optional.ofNullable(System.getProperty("user.name")).orElse("unknown");
  }

  private static String host() {
    return Host.NAME;
  }

  /** The host name, looked up once: a slow name service must not slow every run. */
  private static final class Host {
    static final String NAME = lookUp();

    private static String lookUp() {
      try {
        return InetAddress.getLocalHost().getHostName();
      } catch (IOException | RuntimeException e) {
        return Optional.ofNullable(System.getenv("HOSTNAME")).or(() -> Optional.ofNullable(System.getenv("COMPUTERNAME")))
            .orElse("unknown");
      }
    }
  }
}
