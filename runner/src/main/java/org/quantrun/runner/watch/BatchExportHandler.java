package org.quantrun.runner.watch;

import java.io.PrintWriter;
import java.io.StringWriter;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.Clock;
import java.util.ArrayList;
import java.util.EnumSet;
import java.util.List;
import java.util.Set;
import org.quantrun.core.importer.ImportException;
import org.quantrun.core.processing.ProcessingException;
import org.quantrun.core.processing.RunProcessor;
import org.quantrun.runner.Main;
import org.quantrun.runner.MethodFiles;
import org.quantrun.runner.plugins.ImporterPlugins;
import org.quantrun.runner.plugins.RunFileImport;
import org.quantrun.runner.process.RunBatch;
import org.quantrun.runner.process.RunPipeline;
import org.quantrun.runner.write.OutputFormat;

/**
 * Processes one export exactly as {@code quantrun process} does: the same {@link RunBatch} (read,
 * process, write every output: results.csv, results-wide.csv, calibration.csv,
 * calibration-levels.csv, qc.csv, reruns.csv, run.json, report.html, audit.json), with the work
 * folder as its output folder, so watch and process make the same results folders. What {@code
 * process} would print on standard error becomes the problem of the file's error note.
 */
public final class BatchExportHandler implements ExportHandler {
  /** Core's run processor, its run-level input errors as the pipeline's. */
  private static final RunPipeline CORE = (run, method, prep) -> {
    try {
      return RunProcessor.process(run, method, prep);
    } catch (ProcessingException e) {
      throw new RunPipeline.RunInputException(e.getMessage(), e);
    }
  };

  private final ImporterPlugins.Result plugins;
  private final List<String> arguments;
  private final RunBatch batch;
  private final Set<OutputFormat> formats = EnumSet.allOf(OutputFormat.class);

  /**
   * Checks every route's method, import profile and prep sheet once, so a bad configuration stops
   * the service before it takes any file.
   *
   * @param routes the routes
   * @param plugins the loaded importers
   * @param arguments the watch command line, for each audit trail
   * @param clock the clock for the audit trail and the report
   * @throws WatchConfigException naming every file that cannot be used, and why
   */
  public BatchExportHandler(List<Route> routes, ImporterPlugins.Result plugins, List<String> arguments, Clock clock)
      throws WatchConfigException {
    this.plugins = plugins;
    this.arguments = List.copyOf(arguments);
    this.batch = new RunBatch(CORE, clock);
    List<String> problems = new ArrayList<>();
    if (plugins.importers().isEmpty()) {
      problems.add("no importers are installed (expected importer plugin jars in the plugins folder)");
    }
    for (Route r : routes) {
      try {
        var method = MethodFiles.load(r.method(), "quantrun watch");
        if (r.profile().isPresent()) {
          RunFileImport.loadProfile(r.profile().get());
        }
        if (r.prep().isPresent() && !Files.isRegularFile(r.prep().get())) {
          problems.add("route " + r.name() + ": prep sheet " + r.prep().get() + ": no such file");
        }
        if (r.prep().isPresent() && method.dilution().prepSheet().isEmpty()) {
          problems.add("route " + r.name() + ": method " + method.identity().id() + " describes no prep sheet (expected a"
              + " dilution.prep-sheet section in " + MethodFiles.name(r.method()) + ")");
        }
      } catch (MethodFiles.Failure f) {
        problems.addAll(f.lines());
      } catch (ImportException e) {
        problems.add("route " + r.name() + ": " + e.getMessage());
      }
    }
    if (!problems.isEmpty()) {
      throw new WatchConfigException(problems);
    }
  }

  @Override
  public WatchOutcome handle(Path export, Route route, Path workFolder) {
    RunBatch.Request req = new RunBatch.Request("quantrun watch", List.of(RunBatch.Input.of(export)),
        RunBatch.Input.of(route.method()), route.prep().map(RunBatch.Input::of), route.profile().map(RunBatch.Input::of),
        workFolder, formats, plugins, arguments);
    StringWriter out = new StringWriter();
    StringWriter err = new StringWriter();
    RunBatch.Report report;
    try (PrintWriter o = new PrintWriter(out); PrintWriter e = new PrintWriter(err)) {
      report = batch.run(req, o, e, false);
    }
    String problem = problemText(err.toString());
    if (report.outcomes().size() == 1 && report.outcomes().get(0).folder().isPresent()) {
      String summary = out.toString().strip();
      int arrow = summary.lastIndexOf(" -> ");
      summary = arrow > 0 ? summary.substring(0, arrow) : summary; // the work folder's path is not where it ends up
      String prefix = MethodFiles.name(export) + ": ";
      return new WatchOutcome.Processed(report.outcomes().get(0).folder().get(),
          summary.startsWith(prefix) ? summary.substring(prefix.length()) : summary);
    }
    if (report.exitCode() == Main.EXIT_INTERNAL_ERROR) {
      throw new IllegalStateException(problem.isEmpty() ? "internal error" : problem);
    }
    if (report.outcomes().isEmpty()) {
      return new WatchOutcome.Refused(problem, "the method, import profile or prep sheet of route " + route.name()
          + " cannot be used any more: correct it, then move the file back into the inbox");
    }
    if (problem.contains("cannot write the results")) {
      return new WatchOutcome.Refused(problem, "make room or fix the permissions of the output folder, then move the file"
          + " back into the inbox");
    }
    return new WatchOutcome.Refused(problem, "check that the file is a complete export of the kind route " + route.name()
        + " expects (method " + MethodFiles.name(route.method()) + "); correct it or export it again, then drop it into"
        + " the inbox again");
  }

  /** What process would print on standard error, as one text without its command-name prefixes. */
  private static String problemText(String err) {
    List<String> lines = new ArrayList<>();
    for (String l : err.strip().split("\\R")) {
      String t = l.strip();
      if (t.startsWith("quantrun watch: ")) {
        t = t.substring("quantrun watch: ".length());
      }
      if (!t.isEmpty() && !t.startsWith("quantrun: plugin skipped")) {
        lines.add(t);
      }
    }
    return String.join("\n             ", lines);
  }
}
