package org.quantrun.runner.write;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.OptionalDouble;
import java.util.OptionalInt;
import org.quantrun.core.calibration.CalibrationFit;
import org.quantrun.core.calibration.CalibrationPoint;
import org.quantrun.core.calibration.CurveModel;
import org.quantrun.core.calibration.DetectionLimits;
import org.quantrun.core.calibration.FitOptions;
import org.quantrun.core.calibration.LimitSource;
import org.quantrun.core.calibration.Weighting;
import org.quantrun.core.method.Method;
import org.quantrun.core.method.MethodLoader;
import org.quantrun.core.method.ResultFlag;
import org.quantrun.core.method.SampleRole;
import org.quantrun.core.model.AnalyteResult;
import org.quantrun.core.model.CalibrationLevel;
import org.quantrun.core.model.CalibrationResult;
import org.quantrun.core.model.CalibrationStatus;
import org.quantrun.core.model.InjectionRecord;
import org.quantrun.core.model.QcCheck;
import org.quantrun.core.model.QcKind;
import org.quantrun.core.model.RerunRequest;
import org.quantrun.core.model.RunInfo;
import org.quantrun.core.model.RunResult;
import org.quantrun.core.model.RunVerdict;
import org.quantrun.core.qc.Verdict;

/**
 * An invented run, built by hand for the writers' tests: run R2701B of the invented Kestrel Brook
 * lab, two analyte lines (Pb accepted, Cd rejected), a sample whose id is an HTML script tag, one
 * whose id is a spreadsheet formula, QC that passes, fails and is not evaluated, and two reruns.
 * Its fits are real fits of invented points, so every statistic is consistent.
 */
public final class InventedRun {
  /** A sample id that would be a script if it were not escaped. */
  public static final String SCRIPT_ID = "<script>alert('x')</script>";
  /** A sample id that a spreadsheet would run as a formula. */
  public static final String FORMULA_ID = "=HYPERLINK(\"http://example.invalid\",\"open\")";

  private InventedRun() {}

  /** The method of the invented run: the drinking-water example (for its reporting rules). */
  public static Method method() {
    try {
      return MethodLoader.load(Files.readString(Path.of("../config-examples/drinking-water-trace-metals.yaml")),
          "drinking-water-trace-metals.yaml");
    } catch (IOException | org.quantrun.core.method.MethodException e) {
      throw new IllegalStateException(e);
    }
  }

  /** The run. */
  public static RunResult run() {
    Map<String, String> metadata = new LinkedHashMap<>();
    metadata.put("Instrument", "OES-2 (invented)");
    metadata.put("Analyst", "<b>J. Doe</b>");
    RunInfo info = new RunInfo("R2701B", "run-R2701B.csv", "delimited", "KBW-DW-OES-03", "3.1", metadata);

    List<InjectionRecord> injections = new ArrayList<>();
    String[][] seq = {
      {"CAL-BLK", "calibration-blank", ""}, {"STD-1", "standard", "S1"}, {"STD-2", "standard", "S2"},
      {"STD-3", "standard", "S3"}, {"STD-4", "standard", "S4"}, {"ICV", "icv", ""}, {"ICB", "icb", ""},
      {"W2701-001", "sample", ""}, {"W2701-001-DUP", "duplicate", ""}, {SCRIPT_ID, "sample", ""},
      {FORMULA_ID, "sample", ""}, {"CCV-1", "ccv", ""}};
    for (int i = 0; i < seq.length; i++) {
      SampleRole role = role(seq[i][1]);
      injections.add(new InjectionRecord(i + 1, seq[i][0], role, seq[i][2].isEmpty() ? Optional.empty() : Optional.of(seq[i][2]),
          role == SampleRole.DUPLICATE ? Optional.of("W2701-001") : Optional.empty(), Optional.empty(),
          i == 10 ? 10.0 : 1.0, Optional.of("2027-01-12 10:" + (10 + i) + ":00"), "rule " + (i + 1)));
    }

    double[] x = {5, 20, 50, 100};
    double[] pbY = {412.5, 1608.0, 4049.0, 8077.0};
    double[] cdY = {905.0, 3590.0, 9100.0, 16100.0};
    CalibrationResult pb = calibration("Pb 220.353", "Pb", "220.353", x, pbY, CalibrationStatus.ACCEPTED, List.of(), -1);
    CalibrationResult cd = calibration("Cd 214.439", "Cd", "214.439", x, cdY, CalibrationStatus.REJECTED,
        List.of("STD-4 back-calculates 10.9 % off (limit 10 %)"), 3);

    List<AnalyteResult> results = new ArrayList<>();
    for (InjectionRecord inj : injections.subList(5, injections.size())) {
      for (CalibrationResult c : List.of(pb, cd)) {
        results.add(result(inj, c));
      }
    }

    List<QcCheck> qc = List.of(
        new QcCheck(6, "ICV", QcKind.ICV, "Pb 220.353", OptionalDouble.of(49.1), OptionalDouble.of(50), OptionalDouble.of(98.2),
            "%", OptionalDouble.of(95), OptionalDouble.of(105), Verdict.PASSED, Optional.empty()),
        new QcCheck(7, "ICB", QcKind.ICB, "Cd 214.439", OptionalDouble.of(0.12), OptionalDouble.empty(), OptionalDouble.of(0.12),
            "ug/L", OptionalDouble.empty(), OptionalDouble.of(1), Verdict.PASSED, Optional.empty()),
        new QcCheck(9, "W2701-001-DUP", QcKind.DUPLICATE, "Pb 220.353", OptionalDouble.of(3.1), OptionalDouble.of(2.9),
            OptionalDouble.of(6.666666666666667), "%", OptionalDouble.empty(), OptionalDouble.of(20), Verdict.NOT_EVALUATED,
            Optional.of("both results below 5 x the reporting limit; difference 0.2 <= 5")),
        new QcCheck(12, "CCV-1", QcKind.CCV, "Cd 214.439", OptionalDouble.of(22.9), OptionalDouble.of(20), OptionalDouble.of(114.5),
            "%", OptionalDouble.of(90), OptionalDouble.of(110), Verdict.FAILED, Optional.of("recovery 114.5 % above 110 %")));
    List<RerunRequest> reruns = List.of(
        new RerunRequest(8, "W2701-001", "Cd 214.439", "CCV-1 failed for Cd 214.439", OptionalInt.empty()),
        new RerunRequest(11, FORMULA_ID, "Pb 220.353", "over range", OptionalInt.of(10)));
    return new RunResult(info, injections, List.of(pb, cd), results, qc, reruns, RunVerdict.RERUNS_NEEDED,
        List.of("CCV-1 failed for Cd 214.439: samples 8 to 11 need a rerun for Cd"));
  }

  private static SampleRole role(String token) {
    for (SampleRole r : SampleRole.values()) {
      if (r.token().equals(token)) {
        return r;
      }
    }
    throw new IllegalArgumentException(token);
  }

  private static CalibrationResult calibration(String key, String analyte, String line, double[] x, double[] y,
      CalibrationStatus status, List<String> reasons, int failedLevel) {
    List<CalibrationPoint> pts = new ArrayList<>();
    for (int i = 0; i < x.length; i++) {
      pts.add(CalibrationPoint.of(x[i], y[i]));
    }
    CalibrationFit fit = CalibrationFit.fit(pts, new FitOptions(CurveModel.LINEAR, Weighting.INVERSE_X));
    List<CalibrationLevel> levels = new ArrayList<>();
    double[] w = fit.weights();
    for (int i = 0; i < x.length; i++) {
      double back = fit.predict(y[i]).x0().getAsDouble();
      boolean bad = i == failedLevel;
      levels.add(new CalibrationLevel("S" + (i + 1), i + 2, x[i], y[i], OptionalDouble.of(y[i] * 0.01), w[i],
          fit.signalAt(x[i]), y[i] - fit.signalAt(x[i]), OptionalDouble.of(back), OptionalDouble.of((back - x[i]) / x[i] * 100),
          bad ? Verdict.FAILED : Verdict.PASSED, bad ? Optional.of("more than 10 % off") : Optional.empty()));
    }
    return new CalibrationResult(key, analyte, Optional.of(line), true, CurveModel.LINEAR, Weighting.INVERSE_X, "ug/L",
        Optional.of(fit), status, reasons, levels, DetectionLimits.fromCalibration(fit), OptionalDouble.of(101.5),
        List.of("calibration blank signal 101.5 subtracted"));
  }

  private static AnalyteResult result(InjectionRecord inj, CalibrationResult c) {
    boolean rejected = c.status() == CalibrationStatus.REJECTED;
    double signal = inj.role() == SampleRole.ICB ? c.fit().get().coefficient(0) - 40 : 300 + inj.position() * 97.3;
    double solution = (signal - c.fit().get().coefficient(0)) / c.fit().get().coefficient(1);
    double df = inj.dilutionFactor();
    List<ResultFlag> flags = new ArrayList<>();
    String reported;
    OptionalDouble value = OptionalDouble.of(solution * df);
    if (rejected) {
      flags.add(ResultFlag.CALIBRATION_FAILED);
      reported = "calibration failed";
      value = OptionalDouble.empty();
    } else if (solution * df < 1.5) {
      flags.add(ResultFlag.BELOW_LOD);
      if (solution < 0) {
        flags.add(ResultFlag.NEGATIVE);
      }
      reported = "< 1.5";
    } else {
      if (inj.position() == 11) {
        flags.add(ResultFlag.OVER_RANGE);
      }
      reported = Double.toString(Math.round(solution * df * 10) / 10.0);
    }
    return new AnalyteResult(inj.position(), inj.sampleId(), inj.role(), c.analyteKey(), c.analyte(), c.line(), true, value,
        reported, "ug/L", rejected ? OptionalDouble.empty() : OptionalDouble.of(0.8123456789 * df), OptionalDouble.of(1.5 * df),
        OptionalDouble.of(5.0 * df), df, flags, OptionalDouble.of(signal), OptionalDouble.of(1.234), 3,
        Optional.of(LimitSource.METHOD), rejected ? OptionalDouble.empty() : OptionalDouble.of(solution), OptionalInt.empty(),
        List.of("fit " + c.analyteKey(), "dilution factor " + df));
  }
}
