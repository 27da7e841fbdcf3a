package org.quantrun.core.processing;

import java.math.RoundingMode;
import java.util.OptionalDouble;
import org.quantrun.core.method.ReportingRules;
import org.quantrun.core.method.ResultFlag;
import org.quantrun.core.method.RoundingRule;
import org.quantrun.core.model.AnalyteResult;

/**
 * Freezes a draft into a reported result by the method's reporting rules:
 *
 * <ul>
 *   <li>below the LOD (negative results included; their signed value stays in {@code value}): "&lt;
 *       LOD" in the original sample, or the value, or the method's text; a negative result is
 *       flagged, one below -LOD as a possible over-correction;
 *   <li>from the LOD to the LOQ: the value flagged as estimated (or plainly, or "&lt; LOQ");
 *   <li>otherwise the value, rounded to the method's significant figures (half to even unless the
 *       method says half up). QC is judged on unrounded values; rounding is for the text only.
 * </ul>
 */
final class ResultWriter {
  /** The reported text of a result that cannot be reported. */
  static final String NOT_REPORTABLE = "not reportable";

  private ResultWriter() {}

  /** Sets the limit-related flags of a quantified draft (before QC reads them). */
  static void limitFlags(Draft d) {
    if (!d.quantified()) {
      return;
    }
    if (d.x0 < 0) {
      d.flags.add(ResultFlag.NEGATIVE);
    }
    if (Double.isNaN(d.lod)) {
      return;
    }
    if (d.x0 < d.lod) {
      d.flags.add(ResultFlag.BELOW_LOD);
      d.flags.remove(ResultFlag.EXTRAPOLATED);
      if (d.x0 < -d.lod) {
        d.flags.add(ResultFlag.OVER_CORRECTION);
      }
    } else if (!Double.isNaN(d.loq) && d.x0 < d.loq) {
      d.flags.add(ResultFlag.ESTIMATED);
    }
  }

  /**
   * The reported result of a draft; equal texts, traces, flag sets and optionals of the run's
   * results are shared through {@code shared}.
   */
  static AnalyteResult freeze(Draft d, ReportingRules rules, Shared shared) {
    String reported = shared.text(reportedText(d, rules));
    Signal s = d.raw;
    OptionalDouble mean = s.hasValue() ? OptionalDouble.of(s.mean()) : OptionalDouble.empty();
    double rsd = s.rsdPercent();
    boolean q = d.quantified();
    return new AnalyteResult(
        d.injection.position(), d.injection.sampleId(), d.injection.role(), d.analyteKey, d.analyte.name(),
        shared.value(d.analyte.line().or(() -> d.analyte.mass().map(String::valueOf))), d.reportedLine,
        q ? d.sample(d.x0) : OptionalDouble.empty(), reported, d.unit,
        q ? d.sample(d.halfWidth) : OptionalDouble.empty(),
        d.sample(d.lod), d.sample(d.loq), d.dilutionFactor, shared.flags(d.flags), mean,
        Double.isNaN(rsd) ? OptionalDouble.empty() : OptionalDouble.of(rsd), s.count(), shared.value(d.limitsFrom),
        q ? OptionalDouble.of(d.x0) : OptionalDouble.empty(), d.suggestedDilution, shared.trace(d.trace));
  }

  private static String reportedText(Draft d, ReportingRules rules) {
    if (!d.quantified()) {
      return NOT_REPORTABLE;
    }
    double value = d.x0 * d.toSample;
    if (!Double.isNaN(d.lod) && d.x0 < d.lod) {
      switch (rules.belowLod()) {
        case LESS_THAN_LOD:
          return "< " + round(d.lod * d.toSample, rules);
        case TEXT:
          return rules.belowLodText();
        default:
          return round(value, rules);
      }
    }
    if (!Double.isNaN(d.loq) && d.x0 < d.loq) {
      switch (rules.betweenLodLoq()) {
        case LESS_THAN_LOQ:
          return "< " + round(d.loq * d.toSample, rules);
        default:
          return round(value, rules);
      }
    }
    return round(value, rules);
  }

  static String round(double v, ReportingRules rules) {
    RoundingMode mode = rules.rounding() == RoundingRule.HALF_UP ? RoundingMode.HALF_UP : RoundingMode.HALF_EVEN;
    return SignificantFigures.format(v, rules.significantFigures(), mode);
  }
}
