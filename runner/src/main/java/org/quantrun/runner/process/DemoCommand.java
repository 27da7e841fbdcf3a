package org.quantrun.runner.process;

import java.io.IOException;
import java.io.InputStream;
import java.io.PrintWriter;
import java.io.UncheckedIOException;
import java.nio.file.DirectoryStream;
import java.nio.file.Files;
import java.nio.file.LinkOption;
import java.nio.file.Path;
import java.time.Clock;
import java.util.ArrayList;
import java.util.EnumSet;
import java.util.List;
import java.util.Locale;
import java.util.Optional;
import java.util.concurrent.Callable;
import org.quantrun.runner.Main;
import org.quantrun.runner.plugins.PluginOptions;
import org.quantrun.runner.write.OutputFormat;
import picocli.CommandLine;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Option;

/**
 * {@code quantrun demo}: processes the bundled demo run (an invented run of an invented lab) with
 * its example method into {@code ./quantrun-demo/}, then prints the report's path and the run's
 * verdict. The demo files travel inside quantrun.jar, so the demo works from any folder.
 */
@Command(
    name = "demo",
    mixinStandardHelpOptions = true,
    description = {
      "Processes the bundled demo run into ./quantrun-demo/ and prints the report's path and verdict.",
      "",
      "The demo run R2611A (invented data of an invented lab) is processed with its example method "
          + "config-examples/demo-R2611A.yaml."
    },
    exitCodeListHeading = "%nExit codes:%n",
    exitCodeList = {
      "0:the demo run was processed (whatever its verdict, which is printed)",
      "2:usage error, or the output folder cannot be written",
      "3:internal error (details in the log file)"},
    footer = {"", "Caution: demo results are a demonstration; real results need review by a qualified analyst,",
      "and the lab's accredited method and local regulations govern."})
public final class DemoCommand implements Callable<Integer> {
  /** Where the bundled demo files are on the class path. */
  static final String RESOURCES = "/org/quantrun/runner/demo/";
  /** The demo method, relative to the bundle. */
  static final String METHOD = "config-examples/demo-R2611A.yaml";

  /** The three dialects of the demo export and the import profile that reads each. */
  enum Dialect {
    /** Comma-separated, long layout. */
    LONG("demo-data/run-R2611A-long.csv", "config-examples/importers/long-csv.yaml"),
    /** Semicolon-separated, decimal comma, wide layout. */
    WIDE("demo-data/run-R2611A-wide.txt", "config-examples/importers/wide-semicolon.yaml"),
    /** Fixed-width text report. */
    REPORT("demo-data/run-R2611A-report.txt", "config-examples/importers/fixed-width-report.yaml");

    final String export;
    final String profile;

    Dialect(String export, String profile) {
      this.export = export;
      this.profile = profile;
    }
  }

  @Option(names = "--out", paramLabel = "DIR", defaultValue = "quantrun-demo",
      description = "folder the demo's results folder goes into (default: ${DEFAULT-VALUE})")
  Path outDir;

  @Option(names = "--dialect", paramLabel = "D", defaultValue = "long",
      description = "which of the three demo exports to read: long (CSV), wide (semicolon, decimal comma) or report "
          + "(fixed-width) (default: ${DEFAULT-VALUE})")
  String dialect;

  @Mixin PluginOptions plugins;

  @CommandLine.Spec CommandLine.Model.CommandSpec spec;

  private final RunPipeline pipeline;
  private final Clock clock;

  /** The demo with core's run processor. */
  public DemoCommand() {
    this(CorePipeline.INSTANCE, Clock.systemUTC());
  }

  /**
   * The demo with another pipeline and clock (for tests).
   *
   * @param pipeline turns runs into results
   * @param clock the clock
   */
  public DemoCommand(RunPipeline pipeline, Clock clock) {
    this.pipeline = pipeline;
    this.clock = clock;
  }

  @Override
  public Integer call() throws IOException {
    PrintWriter out = spec.commandLine().getOut();
    PrintWriter err = spec.commandLine().getErr();
    Dialect d;
    try {
      d = Dialect.valueOf(dialect.trim().toUpperCase(Locale.ROOT));
    } catch (IllegalArgumentException e) {
      throw new CommandLine.ParameterException(spec.commandLine(),
          "--dialect: unknown value '" + dialect + "' (expected: long, wide, report)");
    }
    Path bundle = Files.createTempDirectory("quantrun-demo-inputs-");
    try {
      Path export = extract(bundle, d.export);
      Path method = extract(bundle, METHOD);
      Path profile = extract(bundle, d.profile);
      RunBatch.Request req = new RunBatch.Request("quantrun demo",
          List.of(new RunBatch.Input(export, "(bundled) " + d.export)),
          new RunBatch.Input(method, "(bundled) " + METHOD), Optional.empty(),
          Optional.of(new RunBatch.Input(profile, "(bundled) " + d.profile)), outDir, EnumSet.allOf(OutputFormat.class),
          plugins.load(spec), spec.commandLine().getParseResult().originalArgs());
      RunBatch.Report report = new RunBatch(pipeline, clock).run(req, new PrintWriter(PrintWriter.nullWriter()), err, false);
      RunBatch.Outcome o = report.outcomes().isEmpty() ? null : report.outcomes().get(0);
      if (o == null || o.folder().isEmpty()) {
        err.println("quantrun demo: the demo run was not processed (see above)");
        err.flush();
        return report.exitCode() == 0 ? Main.EXIT_INTERNAL_ERROR : report.exitCode();
      }
      RunBatch.Summary result = o.summary().get();
      out.println("Demo run " + result.runId() + " (" + d.export.substring(d.export.lastIndexOf('/') + 1) + ", method "
          + result.methodId() + " " + result.methodVersion() + ")");
      out.println("verdict: " + result.verdict().token() + " (" + result.failures() + " QC failures, "
          + result.reruns() + " reruns)");
      out.println("report:  " + o.folder().get().resolve("report.html"));
      out.println("folder:  " + o.folder().get());
      out.println("Caution: invented demo data; real results need review by a qualified analyst.");
      out.flush();
      return Main.EXIT_OK;
    } finally {
      deleteTree(bundle);
    }
  }

  private static Path extract(Path bundle, String name) throws IOException {
    Path target = bundle.resolve(name);
    Files.createDirectories(target.getParent());
    try (InputStream in = DemoCommand.class.getResourceAsStream(RESOURCES + name)) {
      if (in == null) {
        throw new IllegalStateException("the demo file " + name + " is missing from this build of quantrun");
      }
      Files.copy(in, target);
    }
    return target;
  }

  private static void deleteTree(Path p) {
    try {
      if (Files.isDirectory(p, LinkOption.NOFOLLOW_LINKS)) {
        List<Path> children = new ArrayList<>();
        try (DirectoryStream<Path> s = Files.newDirectoryStream(p)) {
          s.forEach(children::add);
        }
        children.forEach(DemoCommand::deleteTree);
      }
      Files.deleteIfExists(p);
    } catch (IOException e) {
      throw new UncheckedIOException(e);
    }
  }
}
