package org.quantrun.core.processing;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.Locale;
import java.util.Objects;
import java.util.Optional;
import java.util.OptionalDouble;
import org.quantrun.core.calibration.BackCalculation;
import org.quantrun.core.calibration.CalibrationException;
import org.quantrun.core.calibration.CalibrationFit;
import org.quantrun.core.calibration.CalibrationPoint;
import org.quantrun.core.calibration.DetectionLimits;
import org.quantrun.core.calibration.FitOptions;
import org.quantrun.core.calibration.InversePrediction;
import org.quantrun.core.calibration.LimitEstimate;
import org.quantrun.core.calibration.LimitSource;
import org.quantrun.core.calibration.PredictionStatus;
import org.quantrun.core.calibration.RangePosition;
import org.quantrun.core.method.Analyte;
import org.quantrun.core.method.CalibrationAcceptance;
import org.quantrun.core.method.CalibrationBlankHandling;
import org.quantrun.core.method.FitPoints;
import org.quantrun.core.method.LimitPolicy;
import org.quantrun.core.method.Method;
import org.quantrun.core.method.ResultFlag;
import org.quantrun.core.method.SampleRole;
import org.quantrun.core.model.CalibrationLevel;
import org.quantrun.core.model.CalibrationResult;
import org.quantrun.core.model.CalibrationStatus;
import org.quantrun.core.processing.SamplePrep.PrepOf;
import org.quantrun.core.qc.Verdict;

/**
 * One analyte line through the run, in the fixed order of the trade: internal-standard ratio,
 * blank correction, calibration and its acceptance, limits, then quantitation of every injection
 * that is not a calibration solution. QC comes after, over all lines ({@link QcEvaluator}).
 */
final class AnalyteLineWork {
  /** Confidence level of the reported intervals. */
  static final double CONFIDENCE = 0.95;

  private final Method method;
  private final Analyte analyte;
  private final boolean reportedLine;
  private final List<Classified> injections;
  private final Signal[] raw;
  private final InternalStandardWork.Correction isCorrection;
  private final SamplePrep prep;

  private final List<String> trace = new ArrayList<>();
  private Signal[] corrected;
  private OptionalDouble blankSignal = OptionalDouble.empty();
  private Optional<CalibrationFit> fit = Optional.empty();
  private final List<String> rejections = new ArrayList<>();
  /** True when nothing could be calibrated at all: no line, or no standard holds the analyte. */
  private boolean notCalibrated;
  private final List<CalibrationLevel> levels = new ArrayList<>();
  private Optional<LimitEstimate> calibrationLimits = Optional.empty();
  private CalibrationResult result;
  private Draft[] drafts;

  AnalyteLineWork(Method method, Analyte analyte, List<Classified> injections, Signal[] raw,
      InternalStandardWork.Correction isCorrection, SamplePrep prep) {
    this.method = method;
    this.analyte = analyte;
    this.reportedLine = method.isReportedLine(analyte);
    this.injections = injections;
    this.raw = raw;
    this.isCorrection = isCorrection;
    this.prep = prep;
  }

  Analyte analyte() {
    return analyte;
  }

  CalibrationResult calibration() {
    return result;
  }

  /** The drafts of the quantified injections, indexed like the run's injections (null elsewhere). */
  Draft[] drafts() {
    return drafts;
  }

  Optional<CalibrationFit> fit() {
    return fit;
  }

  AnalyteLineWork run() {
    if (Arrays.stream(raw).allMatch(Objects::isNull)) {
      rejections.add("the export has no line " + analyte.key());
      notCalibrated = true;
      finishCalibration();
      quantify();
      return this;
    }
    correct();
    calibrate();
    quantify();
    return this;
  }

  // ------------------------------------------------------------------ corrections

  private void correct() {
    corrected = ratioCorrected(raw, isCorrection);
    if (isCorrection.active()) {
      trace.add("internal standard " + isCorrection.name() + ": signals x (IS in calibration blank / IS in the solution)");
    }
    CalibrationBlankHandling handling = method.blanks().calibrationBlank();
    if (handling == CalibrationBlankHandling.SUBTRACT) {
      double[] blanks = calibrationBlankMeans();
      if (blanks.length == 0) {
        rejections.add("no calibration blank with a valid reading to subtract");
        return;
      }
      double b = Signal.mean(blanks);
      blankSignal = OptionalDouble.of(b);
      subtract(corrected, b);
      trace.add(String.format(Locale.ROOT, "calibration blank subtracted: mean of %d injection%s, %s",
          blanks.length, blanks.length == 1 ? "" : "s", Text.num(b)));
    } else if (handling == CalibrationBlankHandling.ZERO_POINT) {
      trace.add("calibration blank fitted as the zero point");
    }
  }

  /** The signals times the internal-standard ratio of their injection (null where there is no ratio). */
  private static Signal[] ratioCorrected(Signal[] raw, InternalStandardWork.Correction isCorrection) {
    Signal[] corrected = new Signal[raw.length];
    for (int j = 0; j < raw.length; j++) {
      double ratio = isCorrection.ratio(j);
      corrected[j] = raw[j] == null || Double.isNaN(ratio) ? null : raw[j].corrected(ratio, 0);
    }
    return corrected;
  }

  /** Subtracts the blank signal b from every signal, in place. */
  private static void subtract(Signal[] signals, double b) {
    for (int j = 0; j < signals.length; j++) {
      if (signals[j] != null) {
        signals[j] = signals[j].corrected(1, b);
      }
    }
  }

  private double[] calibrationBlankMeans() {
    List<Double> v = new ArrayList<>();
    for (Classified c : injections) {
      Signal s = corrected[c.index()];
      if (c.role() == SampleRole.CALIBRATION_BLANK && s != null && s.hasValue()) {
        v.add(s.mean());
      }
    }
    return v.stream().mapToDouble(Double::doubleValue).toArray();
  }

  // ------------------------------------------------------------------ calibration

  private record FitSource(String level, int position, double x, Signal signal) {}

  private void calibrate() {
    List<FitSource> sources = fitSources();
    if (!rejections.isEmpty()) {
      finishCalibration();
      return;
    }
    if (sources.isEmpty()) {
      rejections.add("no standard of the run holds " + analyte.name() + " with a valid reading");
      notCalibrated = true;
      finishCalibration();
      return;
    }
    List<CalibrationPoint> points = new ArrayList<>();
    List<FitSource> pointSource = new ArrayList<>();
    addPoints(sources, analyte.fitPoints() == FitPoints.READINGS, points, pointSource);
    fitAndAccept(points, pointSource);
    finishCalibration();
  }

  /** The standards (and, fitted as the zero point, the calibration blanks) with a valid reading, in run order. */
  private List<FitSource> fitSources() {
    List<FitSource> sources = new ArrayList<>();
    boolean zeroPoint = method.blanks().calibrationBlank() == CalibrationBlankHandling.ZERO_POINT;
    for (Classified c : injections) {
      Signal s = corrected[c.index()];
      if (s == null || !s.hasValue()) {
        continue;
      }
      if (c.role() == SampleRole.STANDARD) {
        Optional<Double> x = method.level(c.level().get()).flatMap(l -> l.concentration(analyte.name()));
        x.ifPresent(v -> sources.add(new FitSource(c.level().get(), c.position(), v, s)));
      } else if (zeroPoint && c.role() == SampleRole.CALIBRATION_BLANK) {
        sources.add(new FitSource("blank", c.position(), 0, s));
      }
    }
    return sources;
  }

  /**
   * Adds the calibration points of the sources (each reading, or each injection's mean) to
   * {@code points}, and the source of each point to {@code pointSource}.
   */
  private static void addPoints(List<FitSource> sources, boolean readings, List<CalibrationPoint> points,
      List<FitSource> pointSource) {
    for (FitSource f : sources) {
      OptionalDouble sd = Double.isNaN(f.signal().sd()) ? OptionalDouble.empty() : OptionalDouble.of(f.signal().sd());
      if (readings) {
        for (double v : f.signal().values()) {
          points.add(new CalibrationPoint(f.x(), v, sd));
          pointSource.add(f);
        }
      } else {
        points.add(new CalibrationPoint(f.x(), f.signal().mean(), sd));
        pointSource.add(f);
      }
    }
  }

  private void fitAndAccept(List<CalibrationPoint> points, List<FitSource> pointSource) {
    try {
      CalibrationFit f = CalibrationFit.fit(points, new FitOptions(analyte.curve(), analyte.weighting()));
      fit = Optional.of(f);
      accept(f, pointSource);
    } catch (CalibrationException e) {
      rejections.add(e.getMessage());
    }
  }

  private void accept(CalibrationFit f, List<FitSource> sources) {
    CalibrationAcceptance rules = method.qc().calibration();
    checkShape(f, rules);
    double lowest = lowestPositive(sources);
    double rl = analyte.reportingLimit().orElse(Double.NaN);
    List<BackCalculation> back = f.backCalculations();
    for (int i = 0; i < back.size(); i++) {
      addLevel(back.get(i), sources.get(i), rules, lowest, rl);
    }
    calibrationLimits = calibrationLimits(f);
  }

  /** The correlation (r or r^2) against its minimum, and a quadratic's turning point. */
  private void checkShape(CalibrationFit f, CalibrationAcceptance rules) {
    double r2 = f.r2();
    double r = Math.signum(f.slopeAt(f.xMin())) * Math.sqrt(Math.max(0, r2));
    if (rules.minR2().isPresent()) {
      if (r2 < rules.minR2().get()) {
        rejections.add(String.format(Locale.ROOT, "r^2 %.6f is below the minimum %s", r2, Text.num(rules.minR2().get())));
      }
    } else {
      double minR = rules.minR().orElse(org.quantrun.core.method.MethodDefaults.MIN_R);
      if (r < minR) {
        rejections.add(String.format(Locale.ROOT, "r %.6f is below the minimum %s", r, Text.num(minR)));
      }
    }
    if (!f.isMonotonic()) {
      rejections.add("the quadratic turns at x = " + Text.num(f.vertex().getAsDouble())
          + " inside the calibrated range (not monotonic)");
    }
  }

  /** The lowest concentration above zero among the sources (infinity when there is none). */
  private static double lowestPositive(List<FitSource> sources) {
    double lowest = Double.POSITIVE_INFINITY;
    for (FitSource s : sources) {
      if (s.x() > 0) {
        lowest = Math.min(lowest, s.x());
      }
    }
    return lowest;
  }

  /** Judges one fitted point by its back-calculated value and adds it to the levels. */
  private void addLevel(BackCalculation b, FitSource s, CalibrationAcceptance rules, double lowest, double rl) {
    Verdict verdict;
    Optional<String> reason = Optional.empty();
    if (b.x() == 0) {
      if (Double.isNaN(rl) || b.backCalculated().isEmpty()) {
        verdict = Verdict.NOT_EVALUATED;
        reason = Optional.of("a blank point is judged against the reporting limit, which the method does not give");
      } else if (Math.abs(b.backCalculated().getAsDouble()) <= rl) {
        verdict = Verdict.PASSED;
      } else {
        verdict = Verdict.FAILED;
        reason = Optional.of("blank point reads back as " + Text.num(b.backCalculated().getAsDouble())
            + ", beyond the reporting limit " + Text.num(rl));
      }
    } else {
      double limit = b.x() == lowest ? rules.maxBackCalcErrorLowest() : rules.maxBackCalcError();
      if (b.percentError().isEmpty()) {
        verdict = Verdict.FAILED;
        reason = Optional.of("the curve does not reach this standard's signal");
      } else if (Math.abs(b.percentError().getAsDouble()) <= limit + 1e-9) {
        verdict = Verdict.PASSED;
      } else {
        verdict = Verdict.FAILED;
        reason = Optional.of(String.format(Locale.ROOT, "reads back %+.2f %% off (limit %s %%%s)",
            b.percentError().getAsDouble(), Text.num(limit), b.x() == lowest ? ", lowest standard" : ""));
      }
    }
    if (verdict == Verdict.FAILED) {
      rejections.add("standard " + s.level() + " (injection " + s.position() + "): " + reason.get());
    }
    OptionalDouble sd = s.signal().count() >= 2 ? OptionalDouble.of(s.signal().sd()) : OptionalDouble.empty();
    levels.add(new CalibrationLevel(s.level(), s.position(), b.x(), b.y(), sd, b.weight(), b.fitted(),
        b.residual(), b.backCalculated(), b.percentError(), verdict, reason));
  }

  private Optional<LimitEstimate> calibrationLimits(CalibrationFit f) {
    if (f.sYx().isEmpty()) {
      return Optional.empty();
    }
    LimitPolicy p = method.limits();
    double s0 = DetectionLimits.signalSdAtZero(f);
    double slope = Math.abs(f.slopeAt(0));
    return Optional.of(new LimitEstimate(p.calibrationLodMultiplier() * s0 / slope,
        p.calibrationLoqMultiplier() * s0 / slope, s0, LimitSource.CALIBRATION));
  }

  private void finishCalibration() {
    CalibrationStatus status = rejections.isEmpty() && fit.isPresent() ? CalibrationStatus.ACCEPTED : CalibrationStatus.REJECTED;
    List<String> t = new ArrayList<>(trace);
    fit.ifPresent(f -> t.add("fit: " + f.curve().token() + ", weighting " + f.weighting().token() + ", "
        + f.n() + " points (" + analyte.fitPoints().token() + ")"));
    result = new CalibrationResult(analyte.key(), analyte.name(), analyte.line().or(() -> analyte.mass().map(String::valueOf)),
        reportedLine, analyte.curve(), analyte.weighting(), analyte.unit().token(), fit, status, rejections, levels,
        calibrationLimits, blankSignal, t);
  }

  // ------------------------------------------------------------------ limits and quantitation

  private Optional<LimitEstimate> resultLimits() {
    LimitPolicy p = method.limits();
    for (LimitSource source : p.order()) {
      switch (source) {
        case METHOD: {
          Optional<Double> mdl = analyte.mdl();
          Optional<Double> rl = analyte.reportingLimit();
          if (mdl.isPresent() || rl.isPresent()) {
            double lod = mdl.orElseGet(rl::get);
            double loq = rl.orElseGet(() -> mdl.get() * p.blankLoqMultiplier() / p.blankLodMultiplier());
            return Optional.of(new LimitEstimate(lod, loq, Double.NaN, LimitSource.METHOD));
          }
          break;
        }
        case RUN_BLANKS: {
          List<Double> blanks = runBlankMeans();
          if (blanks.size() >= Math.max(2, p.minBlankReplicates()) && fit.isPresent()) {
            double sd = Signal.sd(blanks.stream().mapToDouble(Double::doubleValue).toArray());
            double slope = Math.abs(fit.get().slopeAt(0));
            return Optional.of(new LimitEstimate(p.blankLodMultiplier() * sd / slope, p.blankLoqMultiplier() * sd / slope,
                sd, LimitSource.RUN_BLANKS));
          }
          break;
        }
        case CALIBRATION:
          if (calibrationLimits.isPresent()) {
            return calibrationLimits;
          }
          break;
        default:
          throw new AssertionError(source);
      }
    }
    return Optional.empty();
  }

  /** The mean signals of the calibration blank, ICB and CCBs with a valid reading, in run order. */
  private List<Double> runBlankMeans() {
    List<Double> blanks = new ArrayList<>();
    for (Classified c : injections) {
      Signal s = corrected[c.index()];
      boolean blank = c.role() == SampleRole.CALIBRATION_BLANK || c.role() == SampleRole.ICB || c.role() == SampleRole.CCB;
      if (blank && s != null && s.hasValue()) {
        blanks.add(s.mean());
      }
    }
    return blanks;
  }

  /** Trace steps shared by every result (the numbers are in the result's own fields). */
  private static final String[] SIGNAL_STEPS = {
    "signal: no valid reading", "signal: one valid reading", "signal: mean of 2 valid readings",
    "signal: mean of 3 valid readings", "signal: mean of 4 valid readings", "signal: mean of 5 valid readings",
    "signal: mean of more than 5 valid readings"};
  private static final String QUANTIFIED_WITH_INTERVAL =
      "x0 read off the curve in the measured solution, with its 95 % interval of the calibration scatter";
  private static final String QUANTIFIED = "x0 read off the curve in the measured solution (no interval: no degrees of freedom)";

  private void quantify() {
    drafts = new Draft[raw.length];
    String key = analyte.key();
    String blankStep = blankSignal.isPresent()
        ? "calibration blank signal " + Text.num(blankSignal.getAsDouble()) + " subtracted" : null;
    String curveStep = fit.map(f -> "read off the " + f.curve().token() + " curve (weighting " + f.weighting().token()
        + ", " + f.n() + " points)").orElse("");
    Optional<LimitEstimate> limits = rejections.isEmpty() ? resultLimits() : Optional.empty();
    boolean accepted = result.status() == CalibrationStatus.ACCEPTED;
    double top = analyte.workingRange().map(w -> w.high()).orElseGet(() -> fit.map(CalibrationFit::xMax).orElse(Double.NaN));
    double tolerance = analyte.workingRange().isPresent() ? 0 : method.qc().calibration().overRangeTolerance() / 100;
    for (Classified c : injections) {
      if (c.isCalibrationOrIgnored()) {
        continue;
      }
      Signal s = raw[c.index()];
      PrepOf p = prep.of(c, analyte.unit());
      Draft d = draft(c, key, s, p, limits);
      drafts[c.index()] = d;
      if (!accepted) {
        markNotCalibrated(d);
      } else if (readable(d, c, s, p)) {
        readOff(d, c, blankStep, curveStep, top, tolerance);
      }
    }
  }

  /** A new draft of the injection, with its preparation and the line's limits. */
  private Draft draft(Classified c, String key, Signal s, PrepOf p, Optional<LimitEstimate> limits) {
    Draft d = new Draft(c, analyte, key, reportedLine, s == null ? new Signal(new double[0], Double.NaN, Double.NaN, List.of()) : s,
        p.unit());
    d.toSample = p.toSample();
    d.dilutionFactor = p.dilutionFactor();
    d.trace.addAll(p.trace());
    limits.ifPresent(l -> {
      d.lod = l.lod();
      d.loq = l.loq();
      d.limitsFrom = Optional.of(l.source());
    });
    d.reportingLimit = analyte.reportingLimit().orElse(limits.map(LimitEstimate::loq).orElse(Double.NaN));
    return d;
  }

  /** Marks a draft not reportable because the line's calibration was rejected or impossible. */
  private void markNotCalibrated(Draft d) {
    if (notCalibrated) {
      d.notReportable("not calibrated: " + String.join("; ", rejections), ResultFlag.NOT_CALIBRATED);
    } else {
      d.notReportable("calibration rejected: " + String.join("; ", rejections), ResultFlag.CALIBRATION_FAILED);
    }
  }

  /**
   * Whether the injection's signal can be read off the curve; when not, marks the draft not
   * reportable with the reason. Also flags an internal standard outside its window.
   */
  private boolean readable(Draft d, Classified c, Signal s, PrepOf p) {
    if (s == null) {
      d.notReportable("the export has no reading of " + analyte.key() + " for this injection", ResultFlag.NO_VALID_READINGS);
      return false;
    }
    d.trace.add(SIGNAL_STEPS[Math.min(s.count(), SIGNAL_STEPS.length - 1)]);
    s.excluded().forEach(e -> d.trace.add("left out " + e));
    if (!s.hasValue() && s.markedOverRange()) {
      d.flags.add(ResultFlag.OVER_RANGE);
      d.position = RangePosition.ABOVE_RANGE;
      d.notReportable("the instrument marked every reading over its range", ResultFlag.NO_VALID_READINGS);
      return false;
    }
    if (!s.hasValue()) {
      d.notReportable("no valid reading (" + String.join("; ", s.excluded()) + ")", ResultFlag.NO_VALID_READINGS);
      return false;
    }
    Optional<String> isProblem = isCorrection.problem(c.index());
    if (isProblem.isPresent()) {
      d.notReportable(isProblem.get(), ResultFlag.INTERNAL_STANDARD_FAILED);
      return false;
    }
    if (isCorrection.outOfWindow(c.index())) {
      d.flags.add(ResultFlag.INTERNAL_STANDARD_FAILED);
    }
    if (p.problem().isPresent()) {
      d.notReportable(p.problem().get(), ResultFlag.NOT_CALIBRATED);
      return false;
    }
    return true;
  }

  /** Reads the corrected signal off the curve: x0, its interval, and the range flags. */
  private void readOff(Draft d, Classified c, String blankStep, String curveStep, double top, double tolerance) {
    CalibrationFit f = fit.get();
    Signal y = corrected[c.index()];
    if (isCorrection.active()) {
      d.trace.add("internal standard " + isCorrection.name() + ": signal x " + Text.num(isCorrection.ratio(c.index())));
    }
    if (blankStep != null) {
      d.trace.add(blankStep);
    }
    d.trace.add(curveStep);
    int m = analyte.fitPoints() == FitPoints.READINGS ? y.count() : 1;
    InversePrediction pr = f.predict(y.mean(), m, CONFIDENCE);
    d.position = pr.position();
    if (pr.status() == PredictionStatus.NO_ROOT_IN_RANGE) {
      d.flags.add(ResultFlag.NO_ROOT_IN_RANGE);
      if (pr.position() == RangePosition.ABOVE_RANGE) {
        d.flags.add(ResultFlag.OVER_RANGE);
        pr.nearestRoot().ifPresent(x -> d.suggestedDilution = DilutionSuggestion.suggest(x, top, DilutionSuggestion.DEFAULT_TARGET_FRACTION));
      }
      d.notReportable("the curve does not reach signal " + Text.num(y.mean()) + " inside the calibrated range",
          ResultFlag.NO_ROOT_IN_RANGE);
      return;
    }
    d.x0 = pr.x0().getAsDouble();
    d.halfWidth = pr.halfWidth().orElse(Double.NaN);
    d.trace.add(pr.halfWidth().isPresent() ? QUANTIFIED_WITH_INTERVAL : QUANTIFIED);
    if (d.x0 > top * (1 + tolerance)) {
      d.flags.add(ResultFlag.OVER_RANGE);
      d.suggestedDilution = DilutionSuggestion.suggest(d.x0, top, DilutionSuggestion.DEFAULT_TARGET_FRACTION);
    } else if (pr.position() == RangePosition.BELOW_RANGE && !(d.x0 < d.lod)) {
      d.flags.add(ResultFlag.EXTRAPOLATED);
    }
  }
}
