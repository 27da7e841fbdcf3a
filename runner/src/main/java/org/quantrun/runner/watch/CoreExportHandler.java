package org.quantrun.runner.watch;

import com.fasterxml.jackson.databind.ObjectMapper;
import com.fasterxml.jackson.databind.node.ObjectNode;
import java.io.IOException;
import java.io.Reader;
import java.nio.charset.CharacterCodingException;
import java.nio.charset.CodingErrorAction;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import org.quantrun.core.importer.ImportException;
import org.quantrun.core.importer.ImportSettings;
import org.quantrun.core.importer.RawRun;
import org.quantrun.core.method.Method;
import org.quantrun.core.method.MethodException;
import org.quantrun.core.method.MethodLoader;
import org.quantrun.core.method.prep.PrepSheet;
import org.quantrun.core.method.prep.PrepSheetParser;
import org.quantrun.core.model.RunResult;
import org.quantrun.core.processing.ProcessingException;
import org.quantrun.core.processing.RunProcessor;
import org.quantrun.runner.output.Digests;
import org.quantrun.runner.output.OutputFolder;
import org.quantrun.runner.output.SafeNames;
import org.quantrun.runner.plugins.ImporterPlugins;
import org.quantrun.runner.plugins.RunFileImport;

/**
 * Imports an export with the existing importers, processes it with core's run processor and
 * writes a results folder holding {@code run.json} (run id, source, its SHA-256, verdict and
 * counts). Every route's method, import profile and prep sheet are read and checked once, when
 * the handler is made.
 */
public final class CoreExportHandler implements ExportHandler {
  private static final ObjectMapper JSON = new ObjectMapper();

  private record Prepared(Method method, ImportSettings settings, Optional<PrepSheet> prep) {}

  private final RunFileImport importer;
  private final Map<Route, Prepared> routes = new HashMap<>();

  /**
   * Reads and checks every route's files.
   *
   * @param routes the routes
   * @param plugins the loaded importers
   * @throws WatchConfigException naming every file that cannot be used, and why
   */
  public CoreExportHandler(List<Route> routes, ImporterPlugins.Result plugins) throws WatchConfigException {
    this.importer = new RunFileImport(plugins.selection());
    List<String> problems = new ArrayList<>();
    if (plugins.importers().isEmpty()) {
      problems.add("no importers are installed (expected importer plugin jars in the plugins folder)");
    }
    for (Route r : routes) {
      try {
        this.routes.put(r, prepare(r));
      } catch (WatchConfigException e) {
        problems.addAll(e.lines());
      }
    }
    if (!problems.isEmpty()) {
      throw new WatchConfigException(problems);
    }
  }

  private static Prepared prepare(Route r) throws WatchConfigException {
    String name = name(r.method());
    Method method;
    try (Reader reader = strictUtf8(r.method())) {
      method = MethodLoader.load(reader, name);
    } catch (MethodException e) {
      List<String> lines = new ArrayList<>();
      e.problems().forEach(p -> lines.add(p.toString()));
      throw new WatchConfigException(lines);
    } catch (CharacterCodingException e) {
      throw new WatchConfigException(name + ": the file is not UTF-8 text (expected a UTF-8 YAML method file)");
    } catch (IOException e) {
      throw new WatchConfigException(r.method() + ": the method file cannot be read (" + e.getMessage() + ")");
    }
    Optional<Path> profile = r.profile().or(() -> method.importSettings().profile()
        .map(p -> r.method().toAbsolutePath().getParent().resolve(p)));
    ImportSettings settings = ImportSettings.DEFAULT;
    if (profile.isPresent()) {
      try {
        settings = RunFileImport.loadProfile(profile.get());
      } catch (ImportException e) {
        throw new WatchConfigException(e.getMessage());
      }
    }
    ImportSettings.Builder b = settings.toBuilder();
    if (!method.importSettings().detect()) {
      b.importer(method.importSettings().importer());
    }
    method.importSettings().settings().forEach(b::option);
    Optional<PrepSheet> prep = Optional.empty();
    if (r.prep().isPresent()) {
      String prepName = name(r.prep().get());
      if (method.dilution().prepSheet().isEmpty()) {
        throw new WatchConfigException(prepName + ": method " + method.identity().id()
            + " describes no prep sheet (expected a dilution.prep-sheet section in " + name + ")");
      }
      try {
        prep = Optional.of(PrepSheetParser.parse(read(r.prep().get()), prepName, method.dilution().prepSheet().get()));
      } catch (MethodException e) {
        List<String> lines = new ArrayList<>();
        e.problems().forEach(p -> lines.add(p.toString()));
        throw new WatchConfigException(lines);
      } catch (CharacterCodingException e) {
        throw new WatchConfigException(prepName + ": the file is not UTF-8 text (expected a UTF-8 CSV prep sheet)");
      } catch (IOException e) {
        throw new WatchConfigException(prepName + ": the prep sheet cannot be read (" + e.getMessage() + ")");
      }
    }
    return new Prepared(method, b.build(), prep);
  }

  @Override
  public WatchOutcome handle(Path export, Route route, Path workFolder) {
    Prepared p = routes.get(route);
    if (p == null) {
      throw new IllegalStateException("route not prepared: " + route.name());
    }
    RawRun raw;
    try {
      raw = importer.read(export, p.settings());
    } catch (ImportException e) {
      return new WatchOutcome.Refused(e.getMessage(), "check that the file is a complete export of the kind method "
          + p.method().identity().id() + " expects; fix or export it again, then drop it into the inbox again");
    }
    RunResult result;
    try {
      result = RunProcessor.process(raw, p.method(), p.prep());
    } catch (ProcessingException e) {
      return new WatchOutcome.Refused(name(export) + ": " + e.getMessage(), "check that the run fits method "
          + p.method().identity().id() + " (sample ids, analyte lines, standards); correct the export or the method,"
          + " then drop the file into the inbox again");
    }
    try {
      String sha = Digests.sha256(export);
      ObjectNode n = JSON.createObjectNode();
      n.put("run_id", result.run().runId()).put("source", result.run().sourceName()).put("source_sha256", sha)
          .put("method", p.method().identity().id()).put("method_version", p.method().identity().version())
          .put("verdict", result.verdict().token()).put("results", result.results().size())
          .put("calibrations", result.calibrations().size()).put("qc_checks", result.qc().size())
          .put("reruns", result.reruns().size())
          .put("caution", "Results need review by a qualified analyst; the lab's accredited method and local regulations govern.");
      try (OutputFolder out = OutputFolder.create(workFolder, SafeNames.of(result.run().runId(), "run"))) {
        Files.write(out.staging().resolve("run.json"), JSON.writerWithDefaultPrettyPrinter().writeValueAsBytes(n));
        Path folder = out.publish();
        return new WatchOutcome.Processed(folder, "run " + result.run().runId() + ": " + result.verdict().token());
      }
    } catch (IOException e) {
      throw new java.io.UncheckedIOException("cannot write the results of " + name(export), e);
    }
  }

  private static String read(Path file) throws IOException {
    try (Reader r = strictUtf8(file)) {
      StringBuilder b = new StringBuilder();
      char[] buf = new char[8192];
      for (int n = r.read(buf); n >= 0; n = r.read(buf)) {
        b.append(buf, 0, n);
      }
      return b.toString();
    }
  }

  private static Reader strictUtf8(Path file) throws IOException {
    return new java.io.BufferedReader(new java.io.InputStreamReader(Files.newInputStream(file),
        StandardCharsets.UTF_8.newDecoder().onMalformedInput(CodingErrorAction.REPORT)
            .onUnmappableCharacter(CodingErrorAction.REPORT)));
  }

  static String name(Path p) {
    return p.getFileName() == null ? p.toString() : p.getFileName().toString();
  }
}
