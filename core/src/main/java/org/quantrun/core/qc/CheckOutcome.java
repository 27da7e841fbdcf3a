package org.quantrun.core.qc;

import java.util.Optional;
import java.util.OptionalDouble;

/**
 * The result of one QC formula applied to one analyte: the value it gives, the window it was
 * judged against, the verdict and, when not passed, the reason in plain words.
 *
 * @param value the value the formula gives (a recovery in %, an RPD in %, an absolute
 *     difference); empty when it could not be computed
 * @param unit the unit of {@code value}: "%" or the concentration unit
 * @param window the window {@code value} was judged against
 * @param verdict passed, failed or not evaluated
 * @param reason why the check failed or was not evaluated; empty when it passed
 */
public record CheckOutcome(
    OptionalDouble value, String unit, Window window, Verdict verdict, Optional<String> reason) {

  /** A judged outcome: passed if the window contains the value, else failed with a reason. */
  static CheckOutcome judged(double value, String unit, Window window, String what) {
    if (window.contains(value)) {
      return new CheckOutcome(OptionalDouble.of(value), unit, window, Verdict.PASSED, Optional.empty());
    }
    return new CheckOutcome(OptionalDouble.of(value), unit, window, Verdict.FAILED,
        Optional.of(what + " " + fmt(value) + (unit.equals("%") ? " %" : " " + unit)
            + " is outside " + window + (unit.equals("%") ? " %" : " " + unit)));
  }

  /** An outcome that was not judged, with the value if one could be computed. */
  static CheckOutcome notEvaluated(OptionalDouble value, String unit, Window window, String reason) {
    return new CheckOutcome(value, unit, window, Verdict.NOT_EVALUATED, Optional.of(reason));
  }

  static String fmt(double v) {
    return String.format(java.util.Locale.ROOT, "%.4g", v);
  }
}
