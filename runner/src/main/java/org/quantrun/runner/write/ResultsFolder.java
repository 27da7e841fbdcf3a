package org.quantrun.runner.write;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.Clock;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Set;
import org.quantrun.core.method.Method;
import org.quantrun.core.model.RunResult;
import org.quantrun.runner.output.Digests;
import org.quantrun.runner.output.OutputFolder;
import org.quantrun.runner.output.SafeNames;

/**
 * Writes the results folder of one processed run: the chosen outputs and {@code audit.json},
 * staged and then published whole under the first free name of {@code NAME}, {@code NAME-2}, ...
 * (see {@link OutputFolder}); nothing is overwritten and nothing half-written is left behind.
 */
public final class ResultsFolder {
  /** The audit trail's file name. */
  public static final String AUDIT = "audit.json";

  private ResultsFolder() {}

  /**
   * The folder name for a run: its id made safe, else the export's file name without extension.
   *
   * @param run the processed run
   * @return a safe folder name
   */
  public static String folderName(RunResult run) {
    String source = run.run().sourceName();
    int dot = source.lastIndexOf('.');
    String stem = SafeNames.of(dot > 0 ? source.substring(0, dot) : source, "run");
    return SafeNames.of(run.run().runId(), stem);
  }

  /**
   * Writes and publishes the folder.
   *
   * @param parent the folder the results folder goes into (created if missing)
   * @param run the processed run
   * @param method the method it was processed with
   * @param formats the outputs to write
   * @param audit the audit trail so far
   * @param clock the clock for the end time and the report's time stamp
   * @param quantrunVersion the version for the report
   * @return the published folder
   * @throws IOException if a file cannot be written (nothing is left behind)
   */
  public static Path write(Path parent, RunResult run, Method method, Set<OutputFormat> formats, Audit audit,
      Clock clock, String quantrunVersion) throws IOException {
    ResultTables tables = ResultTables.of(run, method.reporting());
    Map<String, byte[]> files = new LinkedHashMap<>();
    if (formats.contains(OutputFormat.CSV)) {
      files.put("results.csv", CsvOutput.bytes(tables.results()));
      files.put("results-wide.csv", CsvOutput.bytes(tables.resultsWide()));
      files.put("calibration.csv", CsvOutput.bytes(tables.calibration()));
      files.put("calibration-levels.csv", CsvOutput.bytes(tables.calibrationLevels()));
      files.put("qc.csv", CsvOutput.bytes(tables.qc()));
      files.put("reruns.csv", CsvOutput.bytes(tables.reruns()));
    }
    if (formats.contains(OutputFormat.JSON)) {
      files.put("run.json", RunJson.bytes(run, tables));
    }
    if (formats.contains(OutputFormat.HTML)) {
      HtmlReport.Context ctx = new HtmlReport.Context(quantrunVersion, clock.instant().toString(),
          method.identity().description());
      files.put("report.html", HtmlReport.render(run, tables, method.reporting(), ctx).getBytes(StandardCharsets.UTF_8));
    }
    try (OutputFolder out = OutputFolder.create(parent, folderName(run))) {
      List<Audit.OutputFile> written = new ArrayList<>();
      for (Map.Entry<String, byte[]> f : files.entrySet()) {
        Files.write(out.staging().resolve(f.getKey()), f.getValue());
        written.add(new Audit.OutputFile(f.getKey(), Digests.sha256(f.getValue()), f.getValue().length));
      }
      Files.write(out.staging().resolve(AUDIT), audit.json(clock.instant(), written));
      return out.publish();
    }
  }
}
