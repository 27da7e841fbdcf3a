package org.quantrun.runner.write;

import java.io.BufferedOutputStream;
import java.io.BufferedWriter;
import java.io.IOException;
import java.io.OutputStream;
import java.io.OutputStreamWriter;
import java.io.Writer;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.security.DigestOutputStream;
import java.time.Clock;
import java.util.ArrayList;
import java.util.List;
import java.util.Set;
import java.util.concurrent.FutureTask;
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
    try (OutputFolder out = OutputFolder.create(parent, folderName(run))) {
      Path dir = out.staging();
      List<Audit.OutputFile> written = new ArrayList<>();
      FileBody html = null;
      // the report's charts, drawn by the report's thread and, once the tables are written, by this one
      ChartSet charts = formats.contains(OutputFormat.HTML) ? new ChartSet(run) : null;
      if (charts != null) {
        HtmlReport.Context ctx = new HtmlReport.Context(quantrunVersion, clock.instant().toString(),
            method.identity().description(), audit.inputs());
        html = o -> {
          try (Writer w = textWriter(o)) {
            HtmlReport.write(w, run, tables, method.reporting(), ctx, charts);
          }
        };
      }
      boolean tablesToo = formats.contains(OutputFormat.CSV) || formats.contains(OutputFormat.JSON);
      // the report (the slowest output) is written on a thread of its own while the tables are
      // written here: everything it reads is immutable
      FutureTask<Audit.OutputFile> report = null;
      if (html != null && tablesToo) {
        FileBody body = html;
        report = new FutureTask<>(() -> file(dir, "report.html", body));
        Thread t = new Thread(report, "quantrun-report");
        t.setDaemon(true);
        t.start();
      }
      try {
        if (formats.contains(OutputFormat.CSV)) {
          for (Table t : List.of(tables.results(), tables.resultsWide(), tables.calibration(), tables.calibrationLevels(),
              tables.qc(), tables.reruns())) {
            written.add(file(dir, t.name() + ".csv", o -> {
              try (Writer w = textWriter(o)) {
                CsvOutput.write(t, w);
              }
            }));
          }
        }
        if (formats.contains(OutputFormat.JSON)) {
          written.add(file(dir, "run.json", o -> {
            try (OutputStream b = new BufferedOutputStream(o, 1 << 16)) {
              RunJson.write(run, tables, b);
            }
          }));
        }
        if (report != null) {
          charts.help();
        }
      } catch (IOException | RuntimeException | Error e) {
        if (report != null) {
          try {
            Uninterruptibly.get(report);
          } catch (IOException | RuntimeException | Error also) {
            e.addSuppressed(also);
          }
        }
        throw e;
      }
      if (report != null) {
        // waited for even when this thread is interrupted, so the staging folder is never removed under it
        written.add(Uninterruptibly.get(report));
      } else if (html != null) {
        written.add(file(dir, "report.html", html));
      }
      Files.write(dir.resolve(AUDIT), audit.json(clock.instant(), written));
      return out.publish();
    }
  }

  /** UTF-8 text into a stream, as {@link Files#newBufferedWriter(Path, java.nio.charset.Charset, java.nio.file.OpenOption...)} writes it. */
  private static Writer textWriter(OutputStream out) {
    return new BufferedWriter(new OutputStreamWriter(out, StandardCharsets.UTF_8.newEncoder()));
  }

  /** Writes the bytes of one file into a stream and closes it. */
  @FunctionalInterface
  private interface FileBody {
    void writeTo(OutputStream out) throws IOException;
  }

  /**
   * Writes one file of the folder, digesting its bytes on their way to disk.
   *
   * @return the file with the SHA-256 of the bytes that went into it and its size on disk
   */
  private static Audit.OutputFile file(Path dir, String name, FileBody body) throws IOException {
    // whole 64 KB blocks to the file: a CSV writer's encoder hands over 8 KB at a time
    DigestOutputStream digest = Digests.sha256(new BufferedOutputStream(Files.newOutputStream(dir.resolve(name)), 1 << 16));
    try (digest) {
      body.writeTo(digest);
    }
    return new Audit.OutputFile(name, Digests.hex(digest), Files.size(dir.resolve(name)));
  }
}
