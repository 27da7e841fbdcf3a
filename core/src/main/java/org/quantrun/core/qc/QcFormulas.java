package org.quantrun.core.qc;

import java.util.OptionalDouble;

/**
 * The QC formulas of the trade and the rules that decide whether they are judged. All values are
 * unrounded concentrations in one unit; limits and windows are the method's.
 *
 * <ul>
 *   <li>recovery of a check standard, LCS or low-level check: measured / true * 100;
 *   <li>blank: |result| at most a limit (usually the reporting limit or a fraction of it);
 *   <li>duplicate (and MS/MSD): RPD = |a - b| / ((a + b) / 2) * 100 when both results are at least
 *       a multiple (5) of the reporting limit, else |a - b| against the reporting limit (or, if the
 *       method says so, not evaluated); RPD is not evaluated when a + b &lt;= 0;
 *   <li>matrix spike: (spiked - unspiked) / added * 100, an unspiked result below the LOD counting
 *       as 0; not judged when the unspiked result exceeds a multiple (4) of the amount added;
 *   <li>serial dilution: %D = |U - f D| / U * 100 (f the dilution, 5), judged only when U is at
 *       least a multiple of the reporting limit;
 *   <li>replicate readings: %RSD = SD / mean * 100, judged only when the mean is at least a
 *       multiple (10) of the reporting limit.
 * </ul>
 */
public final class QcFormulas {
  private static final String PERCENT = "%";

  private QcFormulas() {}

  /** Recovery measured / true * 100, judged against {@code window} (in %). */
  public static CheckOutcome recovery(double measured, double trueValue, Window window) {
    if (!(trueValue != 0 && Double.isFinite(trueValue))) {
      return CheckOutcome.notEvaluated(OptionalDouble.empty(), PERCENT, window,
          "no true value to compute a recovery against");
    }
    return CheckOutcome.judged(measured / trueValue * 100, PERCENT, window, "recovery");
  }

  /**
   * A blank: |result| must not exceed {@code limit}; the value reported is the result itself.
   *
   * @param unit the concentration unit, for the outcome
   */
  public static CheckOutcome blank(double result, double limit, String unit) {
    Window w = new Window(-limit, limit);
    if (Math.abs(result) <= limit) {
      return new CheckOutcome(OptionalDouble.of(result), unit, w, Verdict.PASSED, java.util.Optional.empty());
    }
    return new CheckOutcome(OptionalDouble.of(result), unit, w, Verdict.FAILED, java.util.Optional.of(
        "blank result " + CheckOutcome.fmt(result) + " " + unit + " is above the limit "
            + CheckOutcome.fmt(limit) + " " + unit + " in absolute value"));
  }

  /** The relative percent difference |a - b| / ((a + b) / 2) * 100; empty when a + b &lt;= 0. */
  public static OptionalDouble rpd(double a, double b) {
    double sum = a + b;
    return sum > 0 ? OptionalDouble.of(Math.abs(a - b) / (sum / 2) * 100) : OptionalDouble.empty();
  }

  /**
   * A duplicate pair (sample and duplicate, or MS and MSD).
   *
   * @param a the first result
   * @param b the second result
   * @param threshold the RPD is judged only when both results are at least this (by common
   *     practice 5 times the reporting limit)
   * @param rpdLimit the highest acceptable RPD in %
   * @param absoluteLimit below the threshold, the highest acceptable |a - b| (by common practice
   *     the reporting limit); NaN leaves such a pair not evaluated
   * @param unit the concentration unit, for an absolute difference
   */
  public static CheckOutcome duplicate(double a, double b, double threshold, double rpdLimit,
      double absoluteLimit, String unit) {
    if (a >= threshold && b >= threshold) {
      OptionalDouble rpd = rpd(a, b);
      if (rpd.isEmpty()) {
        return CheckOutcome.notEvaluated(rpd, PERCENT, Window.atMost(rpdLimit), "a + b <= 0: no RPD");
      }
      return CheckOutcome.judged(rpd.getAsDouble(), PERCENT, Window.atMost(rpdLimit), "RPD");
    }
    if (Double.isNaN(absoluteLimit)) {
      return CheckOutcome.notEvaluated(rpd(a, b), PERCENT, Window.atMost(rpdLimit),
          "a result is below " + CheckOutcome.fmt(threshold) + ", the least an RPD is judged at");
    }
    return CheckOutcome.judged(Math.abs(a - b), unit, Window.atMost(absoluteLimit), "absolute difference");
  }

  /**
   * A matrix spike recovery.
   *
   * @param spiked the spiked sample's result
   * @param unspiked the unspiked sample's result (pass 0 when it is below the LOD)
   * @param added the concentration added to the final solution
   * @param window the acceptable recovery in %
   * @param maxUnspikedMultiple the spike is not judged when the unspiked result exceeds this
   *     multiple of the amount added (4 by common practice)
   */
  public static CheckOutcome spikeRecovery(double spiked, double unspiked, double added, Window window,
      double maxUnspikedMultiple) {
    if (!(added > 0)) {
      return CheckOutcome.notEvaluated(OptionalDouble.empty(), PERCENT, window, "no spike amount added");
    }
    double recovery = (spiked - unspiked) / added * 100;
    if (unspiked > maxUnspikedMultiple * added) {
      return CheckOutcome.notEvaluated(OptionalDouble.of(recovery), PERCENT, window,
          "the unspiked result is more than " + CheckOutcome.fmt(maxUnspikedMultiple) + "x the amount added");
    }
    return CheckOutcome.judged(recovery, PERCENT, window, "spike recovery");
  }

  /**
   * A serial dilution: %D = |U - f D| / U * 100.
   *
   * @param undiluted the undiluted sample's result U
   * @param diluted the diluted result D as measured (not yet multiplied by f)
   * @param factor the serial dilution f (5 for a 1:5 dilution)
   * @param limit the highest acceptable %D
   * @param minimumUndiluted the check is judged only when U is at least this concentration
   *     (usually a multiple of the reporting limit)
   */
  public static CheckOutcome serialDilution(double undiluted, double diluted, double factor, double limit,
      double minimumUndiluted) {
    Window w = Window.atMost(limit);
    if (!(undiluted > 0) || undiluted < minimumUndiluted) {
      OptionalDouble d = undiluted > 0
          ? OptionalDouble.of(Math.abs(undiluted - factor * diluted) / undiluted * 100) : OptionalDouble.empty();
      return CheckOutcome.notEvaluated(d, PERCENT, w,
          "the undiluted result is below " + CheckOutcome.fmt(minimumUndiluted) + ", the least a serial dilution is judged at");
    }
    return CheckOutcome.judged(Math.abs(undiluted - factor * diluted) / undiluted * 100, PERCENT, w, "%D");
  }

  /**
   * The %RSD of an injection's replicate readings.
   *
   * @param mean the mean of the readings (in concentration or signal)
   * @param sd their standard deviation
   * @param limit the highest acceptable %RSD
   * @param minimumMean judged only when the mean is at least this (in the same unit)
   */
  public static CheckOutcome replicateRsd(double mean, double sd, double limit, double minimumMean) {
    Window w = Window.atMost(limit);
    OptionalDouble rsd = mean != 0 ? OptionalDouble.of(sd / Math.abs(mean) * 100) : OptionalDouble.empty();
    if (rsd.isEmpty() || mean < minimumMean) {
      return CheckOutcome.notEvaluated(rsd, PERCENT, w,
          "the mean is below " + CheckOutcome.fmt(minimumMean) + ", the least %RSD is judged at");
    }
    return CheckOutcome.judged(rsd.getAsDouble(), PERCENT, w, "%RSD");
  }
}
