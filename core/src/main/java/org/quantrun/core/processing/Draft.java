package org.quantrun.core.processing;

import java.util.ArrayList;
import java.util.EnumSet;
import java.util.List;
import java.util.Optional;
import java.util.OptionalDouble;
import java.util.OptionalInt;
import org.quantrun.core.calibration.LimitSource;
import org.quantrun.core.calibration.RangePosition;
import org.quantrun.core.method.Analyte;
import org.quantrun.core.method.ResultFlag;

/**
 * The working state of one analyte line in one injection while the run is processed: the
 * quantified concentration in the measured solution, the limits, the factor to the original
 * sample, the flags raised so far and the trace. QC adds flags; reporting freezes it into an
 * {@link org.quantrun.core.model.AnalyteResult}.
 */
final class Draft {
  final Classified injection;
  final Analyte analyte;
  /** The analyte line's key, made once per line: every result and check of the line holds it. */
  final String analyteKey;
  final boolean reportedLine;
  final Signal raw;
  final EnumSet<ResultFlag> flags = EnumSet.noneOf(ResultFlag.class);
  final List<String> trace = new ArrayList<>();
  /** Concentration in the measured solution; NaN when not quantified. */
  double x0 = Double.NaN;
  double halfWidth = Double.NaN;
  double lod = Double.NaN;
  double loq = Double.NaN;
  Optional<LimitSource> limitsFrom = Optional.empty();
  /** Multiplies a solution concentration into the original sample (dilution and preparation). */
  double toSample = 1;
  double dilutionFactor = 1;
  String unit;
  RangePosition position = RangePosition.IN_RANGE;
  OptionalInt suggestedDilution = OptionalInt.empty();
  /** Why the result cannot be reported, when it cannot. */
  Optional<String> notReportable = Optional.empty();
  /** Why this result must be measured again, in plain words (QC adds to it). */
  final List<String> rerunReasons = new ArrayList<>();
  /** The reporting limit used by QC rules, in solution units; NaN when unknown. */
  double reportingLimit = Double.NaN;

  Draft(Classified injection, Analyte analyte, String analyteKey, boolean reportedLine, Signal raw, String unit) {
    this.injection = injection;
    this.analyte = analyte;
    this.analyteKey = analyteKey;
    this.reportedLine = reportedLine;
    this.raw = raw;
    this.unit = unit;
  }

  boolean quantified() {
    return !Double.isNaN(x0) && notReportable.isEmpty();
  }

  void notReportable(String reason, ResultFlag flag) {
    if (notReportable.isEmpty()) {
      notReportable = Optional.of(reason);
    }
    flags.add(flag);
    trace.add("not reportable: " + reason);
  }

  /** Below the LOD (negative results included); false when no limits are known. */
  boolean belowLod() {
    return quantified() && !Double.isNaN(lod) && x0 < lod;
  }

  OptionalDouble sample(double solutionValue) {
    return Double.isNaN(solutionValue) ? OptionalDouble.empty() : OptionalDouble.of(solutionValue * toSample);
  }
}
