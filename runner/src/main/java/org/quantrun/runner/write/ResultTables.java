package org.quantrun.runner.write;

import java.util.ArrayList;
import java.util.HashMap;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import org.quantrun.core.Token;
import org.quantrun.core.calibration.CalibrationFit;
import org.quantrun.core.method.ReportingRules;
import org.quantrun.core.method.ResultFlag;
import org.quantrun.core.model.AnalyteResult;
import org.quantrun.core.model.CalibrationLevel;
import org.quantrun.core.model.CalibrationResult;
import org.quantrun.core.model.InjectionRecord;
import org.quantrun.core.model.QcCheck;
import org.quantrun.core.model.RerunRequest;
import org.quantrun.core.model.RunResult;

/**
 * The tables of one processed run, made once from the {@link RunResult} and written by every
 * writer (CSV, JSON, HTML). Column names and order are the public contract of the results folder:
 * the first columns of each table are those the documentation lists, further columns may only be
 * added at the end.
 *
 * @param results one row per injection x analyte line ({@code results.csv})
 * @param resultsWide one row per injection, one column per reported analyte line ({@code results-wide.csv})
 * @param calibration one row per analyte line ({@code calibration.csv})
 * @param calibrationLevels one row per fit point ({@code calibration-levels.csv})
 * @param qc one row per QC check ({@code qc.csv})
 * @param reruns one row per rerun request ({@code reruns.csv})
 * @param injections one row per injection, as classified (in {@code run.json} and the report)
 */
public record ResultTables(
    Table results, Table resultsWide, Table calibration, Table calibrationLevels, Table qc, Table reruns,
    Table injections) {

  /** The columns of {@code results.csv}, in order. */
  public static final List<String> RESULT_COLUMNS = List.of("run_id", "position", "sample_id", "sample_type",
      "analyte", "line", "value", "reported", "unit", "ci_half_width", "lod", "loq", "dilution_factor", "flags",
      "signal_mean", "signal_rsd_pct", "replicates", "limits_from", "analyte_key", "reported_line",
      "solution_concentration", "suggested_dilution");

  /** The columns of {@code calibration.csv}, in order. */
  public static final List<String> CALIBRATION_COLUMNS = List.of("analyte", "line", "curve", "weighting", "n", "dof",
      "c0", "c1", "c2", "se_c0", "se_c1", "se_c2", "s_yx", "r2", "lod", "loq", "status", "reason", "analyte_key",
      "unit", "reported_line", "blank_signal");

  /** The columns of {@code calibration-levels.csv}, in order. */
  public static final List<String> LEVEL_COLUMNS = List.of("analyte", "line", "level", "position", "x", "y", "sd",
      "weight", "fitted", "residual", "back_calculated", "percent_error", "verdict", "reason", "analyte_key");

  /** The columns of {@code qc.csv}, in order. */
  public static final List<String> QC_COLUMNS = List.of("position", "sample_id", "check", "analyte", "measured",
      "expected", "result", "unit_of_result", "window_low", "window_high", "verdict", "reason");

  /** The columns of {@code reruns.csv}, in order. */
  public static final List<String> RERUN_COLUMNS = List.of("position", "sample_id", "analyte", "reason", "dilution");

  /** The first columns of {@code results-wide.csv}; one column per reported analyte line follows. */
  public static final List<String> WIDE_KEY_COLUMNS = List.of("run_id", "position", "sample_id", "sample_type");

  /** The columns of the injections table, in order. */
  public static final List<String> INJECTION_COLUMNS = List.of("position", "sample_id", "sample_type", "level",
      "parent_sample_id", "prep_batch", "dilution_factor", "timestamp", "identified_by");

  /**
   * Makes the tables of a run.
   *
   * @param run the processed run
   * @param reporting the method's reporting rules (flags are written as the lab's qualifier codes)
   * @return the tables
   */
  public static ResultTables of(RunResult run, ReportingRules reporting) {
    return new ResultTables(results(run, reporting), wide(run), calibration(run), levels(run), qc(run), reruns(run),
        injections(run));
  }

  /**
   * The flags of a result as written: the lab's qualifier codes, in the result's order, joined by {@code ;}.
   *
   * @param flags the flags
   * @param reporting the reporting rules
   * @return the text, empty when there are no flags
   */
  public static String flagText(List<ResultFlag> flags, ReportingRules reporting) {
    if (flags.isEmpty()) {
      return "";
    }
    StringBuilder b = new StringBuilder(reporting.qualifier(flags.get(0)));
    for (int i = 1; i < flags.size(); i++) {
      b.append(';').append(reporting.qualifier(flags.get(i)));
    }
    return b.toString();
  }

  private static Table results(RunResult run, ReportingRules reporting) {
    String runId = run.run().runId();
    List<AnalyteResult> results = run.results();
    return Table.computed("results", RESULT_COLUMNS, results.size(), i -> {
      AnalyteResult r = results.get(i);
      return List.of(Cell.of(runId), Cell.of(r.position()), Cell.of(r.sampleId()), token(r.role()),
          Cell.of(r.analyte()), Cell.ofText(r.line()), Cell.of(r.value()), Cell.of(r.reported()), Cell.of(r.unit()),
          Cell.of(r.ciHalfWidth()), Cell.of(r.lod()), Cell.of(r.loq()), Cell.of(r.dilutionFactor()),
          Cell.of(flagText(r.flags(), reporting)), Cell.of(r.signalMean()), Cell.of(r.signalRsdPct()),
          Cell.of(r.replicates()), Cell.ofText(r.limitsFrom().map(Token::token)), Cell.of(r.analyteKey()),
          Cell.of(r.reportedLine()), Cell.of(r.solutionConcentration()), Cell.of(r.suggestedDilution()));
    });
  }

  private static Table wide(RunResult run) {
    // the reported line of each analyte, in method order (then any line met only in the results);
    // a column's unit and analyte are those of the last result of its line
    Map<String, Integer> column = new HashMap<>();
    List<String> keyOrder = new ArrayList<>();
    List<String> unitOf = new ArrayList<>();
    Map<String, String> analyteOf = new HashMap<>();
    wideKeys(run, column, keyOrder, unitOf, analyteOf);
    List<String> columns = wideColumns(keyOrder, unitOf, analyteOf);
    Map<Integer, WideRow> rows = wideRows(run, column, keyOrder.size());
    return new Table("results-wide", columns, wideCells(run.run().runId(), rows));
  }

  // the passes of the wide table as methods of their own: short methods are compiled quickly,
  // and a loop is not compiled again and again inside a long method

  private static void wideKeys(RunResult run, Map<String, Integer> column, List<String> keyOrder, List<String> unitOf,
      Map<String, String> analyteOf) {
    for (CalibrationResult c : run.calibrations()) {
      if (c.reportedLine()) {
        int k = column.computeIfAbsent(c.analyteKey(), key -> add(keyOrder, unitOf, key));
        unitOf.set(k, c.unit());
      }
    }
    for (AnalyteResult r : run.results()) {
      if (r.reportedLine()) {
        int k = column.computeIfAbsent(r.analyteKey(), key -> add(keyOrder, unitOf, key));
        unitOf.set(k, r.unit());
        analyteOf.put(r.analyteKey(), r.analyte());
      }
    }
    run.calibrations().forEach(c -> analyteOf.putIfAbsent(c.analyteKey(), c.analyte()));
  }

  private static List<String> wideColumns(List<String> keyOrder, List<String> unitOf, Map<String, String> analyteOf) {
    Map<String, Integer> analyteCount = new HashMap<>();
    for (String k : keyOrder) {
      analyteCount.merge(analyteOf.getOrDefault(k, k), 1, Integer::sum);
    }
    List<String> columns = new ArrayList<>(WIDE_KEY_COLUMNS);
    for (int k = 0; k < keyOrder.size(); k++) {
      String key = keyOrder.get(k);
      String analyte = analyteOf.getOrDefault(key, key);
      columns.add((analyteCount.get(analyte) == 1 ? analyte : key) + " [" + unitOf.get(k) + "]");
    }
    return columns;
  }

  /**
   * One row per injection, in the order injections first appear; a later result of the same
   * injection and line replaces an earlier one.
   */
  private static Map<Integer, WideRow> wideRows(RunResult run, Map<String, Integer> column, int width) {
    Map<Integer, WideRow> rows = new LinkedHashMap<>();
    WideRow last = null;
    for (AnalyteResult r : run.results()) {
      if (last == null || last.first.position() != r.position()) {
        last = rows.get(r.position());
        if (last == null) {
          last = new WideRow(r, new String[width]);
          rows.put(r.position(), last);
        }
      }
      if (r.reportedLine()) {
        last.values[column.get(r.analyteKey())] = r.reported();
      }
    }
    return rows;
  }

  private static List<List<Cell>> wideCells(String runId, Map<Integer, WideRow> rows) {
    List<List<Cell>> cells = new ArrayList<>(rows.size());
    for (WideRow w : rows.values()) {
      List<Cell> row = new ArrayList<>(WIDE_KEY_COLUMNS.size() + w.values.length);
      row.add(Cell.of(runId));
      row.add(Cell.of(w.first.position()));
      row.add(Cell.of(w.first.sampleId()));
      row.add(token(w.first.role()));
      for (String v : w.values) {
        row.add(v == null ? Cell.BLANK : Cell.of(v));
      }
      cells.add(row);
    }
    return cells;
  }

  /** An injection's row of the wide table: its first result, and the reported value per column. */
  private record WideRow(AnalyteResult first, String[] values) {}

  private static int add(List<String> keyOrder, List<String> unitOf, String key) {
    keyOrder.add(key);
    unitOf.add(null);
    return keyOrder.size() - 1;
  }

  private static Table calibration(RunResult run) {
    List<List<Cell>> rows = new ArrayList<>();
    for (CalibrationResult c : run.calibrations()) {
      Optional<CalibrationFit> fit = c.fit();
      List<Cell> row = new ArrayList<>();
      row.add(Cell.of(c.analyte()));
      row.add(Cell.ofText(c.line()));
      row.add(token(c.curve()));
      row.add(token(c.weighting()));
      row.add(fit.map(f -> Cell.of(f.n())).orElse(Cell.BLANK));
      row.add(fit.map(f -> Cell.of(f.dof())).orElse(Cell.BLANK));
      for (int power = 0; power <= 2; power++) {
        int p = power;
        row.add(fit.filter(f -> f.curve().hasTerm(p)).map(f -> Cell.of(f.coefficient(p))).orElse(Cell.BLANK));
      }
      for (int power = 0; power <= 2; power++) {
        int p = power;
        row.add(fit.map(f -> Cell.of(f.standardError(p))).orElse(Cell.BLANK));
      }
      row.add(fit.map(f -> Cell.of(f.sYx())).orElse(Cell.BLANK));
      row.add(fit.map(f -> Cell.of(f.r2())).orElse(Cell.BLANK));
      row.add(c.limits().map(l -> Cell.of(l.lod())).orElse(Cell.BLANK));
      row.add(c.limits().map(l -> Cell.of(l.loq())).orElse(Cell.BLANK));
      row.add(token(c.status()));
      row.add(Cell.of(String.join("; ", c.reasons())));
      row.add(Cell.of(c.analyteKey()));
      row.add(Cell.of(c.unit()));
      row.add(Cell.of(c.reportedLine()));
      row.add(Cell.of(c.blankSignal()));
      rows.add(row);
    }
    return new Table("calibration", CALIBRATION_COLUMNS, rows);
  }

  private static Table levels(RunResult run) {
    List<List<Cell>> rows = new ArrayList<>();
    for (CalibrationResult c : run.calibrations()) {
      for (CalibrationLevel l : c.levels()) {
        rows.add(List.of(Cell.of(c.analyte()), Cell.ofText(c.line()), Cell.of(l.level()), Cell.of(l.position()),
            Cell.of(l.x()), Cell.of(l.y()), Cell.of(l.sd()), Cell.of(l.weight()), Cell.of(l.fitted()),
            Cell.of(l.residual()), Cell.of(l.backCalculated()), Cell.of(l.percentError()), token(l.verdict()),
            Cell.ofText(l.reason()), Cell.of(c.analyteKey())));
      }
    }
    return new Table("calibration-levels", LEVEL_COLUMNS, rows);
  }

  private static Table qc(RunResult run) {
    List<QcCheck> qc = run.qc();
    return Table.computed("qc", QC_COLUMNS, qc.size(), i -> {
      QcCheck q = qc.get(i);
      return List.of(Cell.of(q.position()), Cell.of(q.sampleId()), token(q.check()), Cell.of(q.analyteKey()),
          Cell.of(q.measured()), Cell.of(q.expected()), Cell.of(q.result()), Cell.of(q.unitOfResult()),
          Cell.of(q.windowLow()), Cell.of(q.windowHigh()), token(q.verdict()), Cell.ofText(q.reason()));
    });
  }

  private static Table reruns(RunResult run) {
    List<RerunRequest> reruns = run.reruns();
    return Table.computed("reruns", RERUN_COLUMNS, reruns.size(), i -> {
      RerunRequest r = reruns.get(i);
      return List.of(Cell.of(r.position()), Cell.of(r.sampleId()), Cell.of(r.analyteKey()), Cell.of(r.reason()),
          Cell.of(r.dilution()));
    });
  }

  private static Table injections(RunResult run) {
    List<InjectionRecord> injections = run.injections();
    return Table.computed("injections", INJECTION_COLUMNS, injections.size(), n -> {
      InjectionRecord i = injections.get(n);
      return List.of(Cell.of(i.position()), Cell.of(i.sampleId()), token(i.role()), Cell.ofText(i.level()),
          Cell.ofText(i.parentSampleId()), Cell.ofText(i.prepBatch()), Cell.of(i.dilutionFactor()),
          Cell.ofText(i.timestamp()), Cell.of(i.identifiedBy()));
    });
  }

  private static Cell token(Token t) {
    return Cell.of(t.token());
  }
}
