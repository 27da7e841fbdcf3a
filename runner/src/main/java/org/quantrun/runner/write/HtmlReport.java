package org.quantrun.runner.write;

import java.io.IOException;
import java.io.StringWriter;
import java.io.UncheckedIOException;
import java.io.Writer;
import java.util.ArrayList;
import java.util.EnumSet;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.Set;
import org.quantrun.core.method.ReportingRules;
import org.quantrun.core.method.ResultFlag;
import org.quantrun.core.model.AnalyteResult;
import org.quantrun.core.model.CalibrationResult;
import org.quantrun.core.model.CalibrationStatus;
import org.quantrun.core.model.RunResult;
import org.quantrun.core.model.RunVerdict;
import org.quantrun.core.qc.Verdict;

/**
 * Writes {@code report.html}: one self-contained page (styles inline, plots as inline SVG, no
 * script, no external resource of any kind) that opens in any browser and prints on A4 or Letter.
 * It holds the run summary and verdict, per analyte line a calibration plot with its statistics
 * and level table, the QC table, the results table, the rerun list, the flags legend and the
 * caution. Every verdict is written as a word with a symbol; colour only repeats it. Every text
 * that comes from the export or the method is HTML-escaped.
 */
public final class HtmlReport {
  private static final org.slf4j.Logger LOG = org.slf4j.LoggerFactory.getLogger(HtmlReport.class);

  /** The caution every report carries. */
  public static final String CAUTION = "Results can decide whether water is safe to drink or a site is contaminated. "
      + "These results need review by a qualified analyst before they are reported; the lab's accredited method "
      + "(ISO/IEC 17025) and the local regulations govern, not this tool. Confidence half-widths cover the "
      + "calibration's scatter only: they are not the measurement uncertainty of a result.";

  /**
   * What the report says about how it was made.
   *
   * @param quantrunVersion the quantrun version
   * @param generatedAt when the report was made, ISO-8601 text
   * @param methodDescription the method's description, possibly empty
   * @param inputs the input files with their SHA-256, as the audit trail records them
   */
  public record Context(String quantrunVersion, String generatedAt, String methodDescription, List<Audit.InputFile> inputs) {
    /**
     * Copies the list.
     *
     * @param quantrunVersion the quantrun version
     * @param generatedAt when the report was made
     * @param methodDescription the method's description
     * @param inputs the input files
     */
    public Context {
      inputs = List.copyOf(inputs);
    }
  }

  private static final String STYLE = """
      :root { --ok: #1b6e31; --bad: #b3261e; --na: #6b6b6b; --line: #c8c8c8; }
      * { box-sizing: border-box; }
      body { font-family: "DejaVu Sans", "Segoe UI", Helvetica, Arial, sans-serif; font-size: 10pt; color: #111;
             margin: 1.5em auto; max-width: 64em; padding: 0 1em; line-height: 1.35; }
      h1 { font-size: 17pt; margin: 0 0 .3em; }
      h2 { font-size: 13pt; margin: 1.6em 0 .5em; border-bottom: 2px solid #333; padding-bottom: .15em; }
      h3 { font-size: 11pt; margin: 1.2em 0 .4em; }
      table { border-collapse: collapse; width: 100%; margin: .4em 0 1em; font-size: 8.5pt; }
      th, td { border: 1px solid var(--line); padding: 2px 4px; text-align: left; vertical-align: top;
               overflow-wrap: break-word; }
      th { background: #eee; font-weight: 600; }
      thead { display: table-header-group; }
      tr { break-inside: avoid; }
      td.num { text-align: right; font-variant-numeric: tabular-nums; white-space: nowrap; }
      table.facts { width: auto; }
      table.facts th { text-align: left; background: #f4f4f4; }
      .caution { border: 2px solid #333; padding: .5em .8em; margin: .8em 0; background: #fffbe6; }
      .verdict { font-size: 12pt; padding: .4em .8em; border: 2px solid currentColor; display: inline-block; margin: .3em 0; }
      .v-passed, .v-accepted, .v-in-control { color: var(--ok); }
      .v-failed, .v-rejected, .v-out-of-control { color: var(--bad); font-weight: 600; }
      .v-reruns-needed { color: #8a5a00; font-weight: 600; }
      .v-not-evaluated { color: var(--na); }
      .calibration { break-inside: avoid; page-break-inside: avoid; margin-bottom: 1.2em; }
      .calibration svg { width: 100%; height: auto; display: block; }
      .side { display: flex; flex-wrap: wrap; gap: 1em; align-items: flex-start; }
      .side > * { flex: 1 1 18em; }
      .side > figure { flex: 3 1 26em; margin: 0; }
      td.nowrap { white-space: nowrap; }
      .muted { color: #555; }
      @page { margin: 14mm 12mm; }
      @media print {
        body { margin: 0; max-width: none; padding: 0; font-size: 9pt; }
        h2 { break-after: avoid; page-break-after: avoid; }
        h3 { break-after: avoid; page-break-after: avoid; }
        .verdict, .caution { -webkit-print-color-adjust: exact; print-color-adjust: exact; }
        table { font-size: 7.5pt; }
      }
      """;

  private HtmlReport() {}

  /**
   * The report as HTML text.
   *
   * @param run the processed run
   * @param tables its tables
   * @param reporting the method's reporting rules (for the flags legend)
   * @param context how the report was made
   * @return the HTML document
   */
  public static String render(RunResult run, ResultTables tables, ReportingRules reporting, Context context) {
    StringWriter text = new StringWriter();
    try {
      write(text, run, tables, reporting, context);
    } catch (IOException e) {
      throw new UncheckedIOException(e);
    }
    return text.toString();
  }

  /**
   * Writes the report, streaming: a large run never needs the whole page in memory.
   *
   * @param out where the HTML goes
   * @param run the processed run
   * @param tables its tables
   * @param reporting the method's reporting rules (for the flags legend)
   * @param context how the report was made
   * @throws IOException if writing fails
   */
  public static void write(Writer out, RunResult run, ResultTables tables, ReportingRules reporting, Context context)
      throws IOException {
    write(out, run, tables, reporting, context, new ChartSet(run));
  }

  /** As {@link #write(Writer, RunResult, ResultTables, ReportingRules, Context)}, with charts another thread may help draw. */
  static void write(Writer out, RunResult run, ResultTables tables, ReportingRules reporting, Context context,
      ChartSet charts) throws IOException {
    Sink h = new Sink(out);
    try {
      page(h, run, tables, reporting, context, charts);
      h.flush();
    } catch (UncheckedIOException e) {
      throw e.getCause();
    }
  }

  private static void page(Sink h, RunResult run, ResultTables tables, ReportingRules reporting, Context context,
      ChartSet charts) {
    String runId = Html.escape(run.run().runId());
    h.append("<!DOCTYPE html>\n<html lang=\"en\">\n<head>\n<meta charset=\"utf-8\">\n")
        .append("<meta name=\"viewport\" content=\"width=device-width, initial-scale=1\">\n")
        .append("<meta name=\"generator\" content=\"quantrun ").append(Html.escape(context.quantrunVersion())).append("\">\n")
        .append("<title>Run ").append(runId).append(": quantrun report</title>\n<style>\n").append(STYLE)
        .append("</style>\n</head>\n<body>\n");
    h.append("<header>\n<h1>Run ").append(runId).append("</h1>\n");
    h.append("<p class=\"verdict ").append(cls(run.verdict().token())).append("\" id=\"verdict\">Run verdict: <strong>")
        .append(symbol(run.verdict())).append(' ').append(Html.escape(run.verdict().token())).append("</strong></p>\n");
    caution(h);
    h.append("</header>\n");

    summary(h, run, context);
    findings(h, run);
    calibrations(h, run, tables, charts);
    section(h, "qc", "QC checks", tables.qc(), List.of(
        col("position", "pos."), col("sample_id", "sample"), col("check", "check"), col("analyte", "analyte line"),
        col("measured", "measured"), col("expected", "expected"), col("result", "result"), col("unit_of_result", "unit"),
        col("window_low", "low"), col("window_high", "high"), col("verdict", "verdict"), col("reason", "reason")),
        "No QC checks were made.");
    section(h, "results", "Results", tables.results(), List.of(
        col("position", "pos."), col("sample_id", "sample"), col("sample_type", "type"), col("analyte", "analyte"),
        col("line", "line"), col("reported", "reported"), col("unit", "unit"), col("value", "value"),
        col("ci_half_width", "\u00b1 CI"), col("lod", "LOD"), col("loq", "LOQ"), col("dilution_factor", "DF"),
        col("flags", "flags"), col("limits_from", "limits from")),
        "No results.");
    h.append("<p class=\"muted\">Value, LOD, LOQ and the confidence half-width (\u00b1 CI, calibration scatter only) are in "
        + "the original sample and shown here to five significant figures; results.csv holds them in full. "
        + "Alternate lines of an analyte are listed too; results-wide.csv holds the reported line of each.</p>\n");
    section(h, "reruns", "Reruns", tables.reruns(), List.of(
        col("position", "pos."), col("sample_id", "sample"), col("analyte", "analyte line"), col("reason", "reason"),
        col("dilution", "further dilution")), "Nothing needs to be rerun.");
    legend(h, run, reporting);
    h.append("<footer>\n<h2 id=\"caution\">Caution</h2>\n");
    caution(h);
    h.append("<p class=\"muted\">Made by quantrun ").append(Html.escape(context.quantrunVersion())).append(" at ")
        .append(Html.escape(context.generatedAt())).append(". The audit trail (audit.json) records the SHA-256 of every input.</p>\n");
    h.append("</footer>\n</body>\n</html>\n");
  }

  /** Buffered output of the page; a write failure surfaces as {@link UncheckedIOException}. */
  private static final class Sink {
    private final ChunkedText out;
    final StringBuilder buffer;

    Sink(Writer out) {
      this.out = new ChunkedText(out);
      this.buffer = this.out.text;
    }

    Sink append(String text) {
      buffer.append(text);
      flushIfFull();
      return this;
    }

    Sink append(char c) {
      buffer.append(c);
      return this;
    }

    void flushIfFull() {
      try {
        out.flushIfFull();
      } catch (IOException e) {
        throw new UncheckedIOException(e);
      }
    }

    void flush() {
      try {
        out.flush();
      } catch (IOException e) {
        throw new UncheckedIOException(e);
      }
    }
  }

  private static void caution(Sink h) {
    h.append("<p class=\"caution\"><strong>Caution.</strong> ").append(Html.escape(CAUTION)).append("</p>\n");
  }

  private static void summary(Sink h, RunResult run, Context context) {
    h.append("<h2 id=\"summary\">Run summary</h2>\n<div class=\"side\">\n<table class=\"facts\">\n");
    var info = run.run();
    fact(h, "run id", info.runId());
    fact(h, "export", info.sourceName());
    fact(h, "importer", info.importerId());
    fact(h, "method", info.methodId() + " version " + info.methodVersion());
    if (!context.methodDescription().isEmpty()) {
      fact(h, "method description", context.methodDescription());
    }
    fact(h, "injections", Integer.toString(run.injections().size()));
    long accepted = run.calibrations().stream().filter(c -> c.status() == CalibrationStatus.ACCEPTED).count();
    fact(h, "calibrations", accepted + " accepted, " + (run.calibrations().size() - accepted) + " rejected, of "
        + run.calibrations().size() + " analyte lines");
    Map<Verdict, Long> qc = new LinkedHashMap<>();
    for (Verdict v : Verdict.values()) {
      qc.put(v, run.qc().stream().filter(q -> q.verdict() == v).count());
    }
    fact(h, "QC checks", qc.get(Verdict.PASSED) + " passed, " + qc.get(Verdict.FAILED) + " failed, "
        + qc.get(Verdict.NOT_EVALUATED) + " not evaluated");
    fact(h, "results", run.results().size() + " (injection x analyte line)");
    fact(h, "reruns", Integer.toString(run.reruns().size()));
    fact(h, "verdict", symbol(run.verdict()) + " " + run.verdict().token());
    h.append("</table>\n");
    if (!info.metadata().isEmpty()) {
      h.append("<table class=\"facts\" id=\"metadata\">\n<caption>From the export</caption>\n");
      info.metadata().forEach((k, v) -> fact(h, k, v));
      h.append("</table>\n");
    }
    h.append("</div>\n");
    if (!context.inputs().isEmpty()) {
      h.append("<table class=\"inputs\" data-table=\"inputs\">\n<caption>Inputs (SHA-256 as in audit.json)</caption>\n"
          + "<thead><tr><th scope=\"col\">role</th><th scope=\"col\">file</th><th scope=\"col\">SHA-256</th></tr></thead>\n<tbody>\n");
      for (Audit.InputFile f : context.inputs()) {
        h.append("<tr><td>").append(Html.escape(f.role())).append("</td><td>").append(Html.escape(f.name()))
            .append("</td><td><code>").append(Html.escape(f.sha256())).append("</code></td></tr>\n");
      }
      h.append("</tbody>\n</table>\n");
    }
  }

  private static void fact(Sink h, String key, String value) {
    h.append("<tr><th scope=\"row\">").append(Html.escape(key)).append("</th><td>").append(Html.escape(value)).append("</td></tr>\n");
  }

  private static void findings(Sink h, RunResult run) {
    if (run.findings().isEmpty()) {
      return;
    }
    h.append("<h2 id=\"findings\">Run findings</h2>\n<ul>\n");
    for (String f : run.findings()) {
      h.append("<li>").append(Html.escape(f)).append("</li>\n");
    }
    h.append("</ul>\n");
  }

  /**
   * The element id of the section of the {@code i}-th calibration.
   *
   * @param i the calibration's index in the run
   * @return e.g. {@code cal-1}
   */
  static String anchor(int i) {
    return "cal-" + (i + 1);
  }

  private static void calibrations(Sink h, RunResult run, ResultTables tables, ChartSet charts) {
    h.append("<h2 id=\"calibrations\">Calibrations</h2>\n");
    if (run.calibrations().isEmpty()) {
      h.append("<p>No analyte lines.</p>\n");
      return;
    }
    Table cal = tables.calibration();
    Table levels = tables.calibrationLevels();
    int levelKey = levels.column("analyte_key");
    for (int i = 0; i < run.calibrations().size(); i++) {
      CalibrationResult c = run.calibrations().get(i);
      String anchor = anchor(i);
      h.append("<section class=\"calibration\" id=\"").append(anchor).append("\">\n<h3>")
          .append(Html.escape(c.analyteKey())).append(c.reportedLine() ? "" : " (alternate line)").append(": <span class=\"")
          .append(cls(c.status().token())).append("\">").append(c.status() == CalibrationStatus.ACCEPTED ? "\u2713 " : "\u2717 ")
          .append(Html.escape(c.status().token())).append("</span></h3>\n");
      if (!c.reasons().isEmpty()) {
        h.append("<p>Why rejected: ").append(Html.escape(String.join("; ", c.reasons()))).append("</p>\n");
      }
      h.append("<div class=\"side\">\n");
      Optional<String> plot;
      try {
        plot = charts.get(i);
      } catch (RuntimeException | java.awt.AWTError | LinkageError | InternalError e) {
        // a machine without fonts for Java's drawing: the numbers below still stand, the report says why there is no plot
        LOG.warn("the calibration plot of {} could not be drawn: {}", c.analyteKey(), e.toString());
        plot = Optional.empty();
        h.append("<p>The plot could not be drawn on this machine (").append(Html.escape(e.toString())).append(").</p>\n");
      }
      plot.ifPresentOrElse(
          svg -> h.append("<figure>\n").append(svg).append("\n<figcaption class=\"muted\">Standards and fitted curve (top), "
              + "residuals y \u2212 fitted (bottom). Crosses mark standards outside the back-calculation limit.</figcaption>\n</figure>\n"),
          () -> h.append(c.levels().isEmpty() ? "<p>No fit points: nothing to plot.</p>\n" : ""));
      List<Cell> row = cal.rows().get(i);
      h.append("<table class=\"facts fit\">\n");
      String[][] stats = {{"curve", "curve"}, {"weighting", "weighting"}, {"n", "n"}, {"dof", "degrees of freedom"},
          {"c0", "c0 (intercept)"}, {"se_c0", "standard error of c0"}, {"c1", "c1 (slope)"}, {"se_c1", "standard error of c1"},
          {"c2", "c2"}, {"se_c2", "standard error of c2"}, {"s_yx", "s y/x"}, {"r2", "r\u00b2"},
          {"lod", "LOD from this calibration (" + c.unit() + ", solution)"}, {"loq", "LOQ from this calibration (" + c.unit() + ", solution)"},
          {"blank_signal", "calibration blank signal subtracted"}};
      for (String[] s : stats) {
        Cell v = row.get(cal.column(s[0]));
        if (!(v instanceof Cell.Blank)) {
          h.append("<tr><th scope=\"row\">").append(Html.escape(s[1])).append("</th><td class=\"num\" data-column=\"")
              .append(s[0]).append("\">").append(Html.cell(v)).append("</td></tr>\n");
        }
      }
      h.append("</table>\n</div>\n");
      List<List<Cell>> mine = new ArrayList<>();
      for (List<Cell> l : levels.rows()) {
        if (l.get(levelKey).plain().equals(c.analyteKey())) {
          mine.add(l);
        }
      }
      table(h, new Table(levels.name(), levels.columns(), mine), List.of(col("level", "level"), col("position", "pos."),
          col("x", "x (" + c.unit() + ")"), col("y", "signal y"), col("sd", "SD"), col("weight", "weight"),
          col("fitted", "fitted"), col("residual", "residual"), col("back_calculated", "back-calculated"),
          col("percent_error", "% error"), col("verdict", "verdict"), col("reason", "reason")), "levels");
      if (!c.trace().isEmpty()) {
        h.append("<p class=\"muted\">Signal corrections: ").append(Html.escape(String.join("; ", c.trace()))).append("</p>\n");
      }
      h.append("</section>\n");
    }
  }

  private record Col(String column, String label) {}

  private static Col col(String column, String label) {
    return new Col(column, label);
  }

  private static void section(Sink h, String id, String title, Table t, List<Col> cols, String none) {
    h.append("<h2 id=\"").append(id).append("\">").append(Html.escape(title)).append("</h2>\n");
    if (t.rows().isEmpty()) {
      h.append("<p>").append(Html.escape(none)).append("</p>\n");
      return;
    }
    table(h, t, cols, id);
  }

  private static final int OTHER = 0;
  private static final int VERDICT = 1;
  private static final int FLAGS = 2;
  private static final int NOWRAP = 3;
  private static final int SAMPLE_ID = 4;

  private static void table(Sink h, Table t, List<Col> cols, String cssClass) {
    int[] idx = new int[cols.size()];
    int[] kind = new int[cols.size()];
    for (int i = 0; i < idx.length; i++) {
      String column = cols.get(i).column();
      idx[i] = t.column(column);
      kind[i] = switch (column) {
        case "verdict" -> VERDICT;
        case "flags" -> FLAGS;
        case "line", "analyte" -> NOWRAP;
        case "sample_id" -> SAMPLE_ID;
        default -> OTHER;
      };
    }
    h.append("<table class=\"").append(cssClass).append("\" data-table=\"").append(t.name()).append("\">\n<thead><tr>");
    for (Col c : cols) {
      h.append("<th scope=\"col\" data-column=\"").append(c.column()).append("\">").append(Html.escape(c.label())).append("</th>");
    }
    h.append("</tr></thead>\n<tbody>\n");
    StringBuilder b = h.buffer;
    for (List<Cell> row : t.rows()) {
      b.append("<tr>");
      for (int i = 0; i < idx.length; i++) {
        Cell v = row.get(idx[i]);
        int k = kind[i];
        if (k == VERDICT) {
          String token = v.plain();
          b.append("<td class=\"").append(cls(token)).append("\">").append(verdictSymbol(token)).append(' ');
          Html.escape(b, token);
          b.append("</td>");
        } else if (v instanceof Cell.Num || v instanceof Cell.Whole) {
          b.append("<td class=\"num\">");
          Html.cell(b, v);
          b.append("</td>");
        } else if (k == FLAGS) {
          // a break opportunity after each separator; the text stays exactly that of results.csv
          b.append("<td>").append(Html.cell(v).replace(";", ";<wbr>")).append("</td>");
        } else {
          // short ids and line names stay on one line; a long id may wrap rather than widen the page
          boolean nowrap = k == NOWRAP || k == SAMPLE_ID && v.plain().length() <= 16;
          b.append(nowrap ? "<td class=\"nowrap\">" : "<td>");
          Html.cell(b, v);
          b.append("</td>");
        }
      }
      b.append("</tr>\n");
      h.flushIfFull();
    }
    h.append("</tbody>\n</table>\n");
  }

  private static void legend(Sink h, RunResult run, ReportingRules reporting) {
    h.append("<h2 id=\"flags\">Flags legend</h2>\n");
    Set<ResultFlag> used = EnumSet.noneOf(ResultFlag.class);
    for (AnalyteResult r : run.results()) {
      used.addAll(r.flags());
    }
    h.append("<p>Flags in the results column <em>flags</em>, as this method writes them. Flags raised in this run are marked "
        + "\u25cf; the others are listed for reference.</p>\n");
    h.append("<table class=\"legend\">\n<thead><tr><th scope=\"col\">code</th><th scope=\"col\">flag</th>"
        + "<th scope=\"col\">in this run</th><th scope=\"col\">meaning</th></tr></thead>\n<tbody>\n");
    for (ResultFlag f : ResultFlag.values()) {
      h.append("<tr><td>").append(Html.escape(reporting.qualifier(f))).append("</td><td>").append(Html.escape(f.token()))
          .append("</td><td>").append(used.contains(f) ? "\u25cf yes" : "no").append("</td><td>")
          .append(Html.escape(FlagLegend.meaning(f))).append("</td></tr>\n");
    }
    h.append("</tbody>\n</table>\n");
    h.append("<p>QC verdicts: \u2713 passed, \u2717 failed, \u2013 not evaluated (the rule does not apply to these values; "
        + "neither a pass nor a failure).</p>\n");
  }

  private static String symbol(RunVerdict v) {
    return switch (v) {
      case IN_CONTROL -> "\u2713";
      case RERUNS_NEEDED -> "\u26a0";
      case OUT_OF_CONTROL -> "\u2717";
    };
  }

  private static String verdictSymbol(String token) {
    if (token.equals(Verdict.PASSED.token())) {
      return "\u2713";
    }
    if (token.equals(Verdict.FAILED.token())) {
      return "\u2717";
    }
    return "\u2013";
  }

  private static String cls(String token) {
    return "v-" + token.replace(' ', '-');
  }
}
