package org.quantrun.core.calibration;

import java.util.Arrays;
import java.util.List;
import java.util.OptionalDouble;
import org.apache.commons.math3.stat.descriptive.moment.StandardDeviation;

/**
 * The method detection limit of US 40 CFR Part 136, Appendix B, revision 2: MDL = max(MDL_s,
 * MDL_b).
 *
 * <ul>
 *   <li>MDL_s = t(n_s - 1, 0.99 one-sided) * S_s over n_s &gt;= 7 spiked samples (the procedure
 *       spreads them over at least three preparation batches; that is the lab's to arrange).
 *   <li>MDL_b from method blanks: when every blank gives a numerical result, mean (taken as 0 if
 *       negative) + t(n_b - 1, 0.99) * S_b; with 100 or more blanks, the result ranked n_b * 0.99
 *       (rounded to the nearest whole number) in ascending order; when only some give numerical
 *       results, the highest of them; when none does, MDL_b does not apply.
 * </ul>
 *
 * @param spikedMdl MDL_s
 * @param blankMdl MDL_b; empty when no blank gave a numerical result or no blanks were given
 * @param mdl the larger of the two
 * @param spikedT the t value used for MDL_s
 */
public record MethodDetectionLimit(double spikedMdl, OptionalDouble blankMdl, double mdl, double spikedT) {
  /** Fewest spiked samples (and method blanks, when given) the procedure accepts. */
  public static final int MIN_REPLICATES = 7;
  /** Number of blanks from which the percentile rule replaces the t statistic. */
  public static final int PERCENTILE_RULE_BLANKS = 100;
  private static final double CONFIDENCE = 0.99;

  /**
   * Computes the MDL.
   *
   * @param spikedResults results of at least 7 spiked samples, in concentration units
   * @param blankResults results of the method blanks, empty where a blank gave no numerical
   *     result; an empty list when no blanks are used (then MDL = MDL_s), else at least 7
   * @throws IllegalArgumentException for too few results or a non-finite value
   */
  public static MethodDetectionLimit compute(double[] spikedResults, List<OptionalDouble> blankResults) {
    if (spikedResults.length < MIN_REPLICATES) {
      throw new IllegalArgumentException("the MDL needs at least " + MIN_REPLICATES
          + " spiked samples, got " + spikedResults.length);
    }
    checkFinite(spikedResults, "spiked result");
    double tS = StudentT.oneSided(CONFIDENCE, spikedResults.length - 1);
    double mdlS = tS * new StandardDeviation(true).evaluate(spikedResults);

    OptionalDouble mdlB = OptionalDouble.empty();
    if (!blankResults.isEmpty()) {
      if (blankResults.size() < MIN_REPLICATES) {
        throw new IllegalArgumentException("the MDL needs at least " + MIN_REPLICATES
            + " method blanks when blanks are used, got " + blankResults.size());
      }
      double[] numeric = blankResults.stream().filter(OptionalDouble::isPresent)
          .mapToDouble(OptionalDouble::getAsDouble).toArray();
      checkFinite(numeric, "method blank result");
      if (numeric.length == blankResults.size()) {
        mdlB = OptionalDouble.of(allNumericBlanks(numeric));
      } else if (numeric.length > 0) {
        mdlB = OptionalDouble.of(Arrays.stream(numeric).max().getAsDouble());
      }
    }
    double mdl = mdlB.isPresent() ? Math.max(mdlS, mdlB.getAsDouble()) : mdlS;
    return new MethodDetectionLimit(mdlS, mdlB, mdl, tS);
  }

  private static double allNumericBlanks(double[] blanks) {
    int n = blanks.length;
    if (n >= PERCENTILE_RULE_BLANKS) {
      double[] sorted = blanks.clone();
      Arrays.sort(sorted);
      int rank = (int) Math.round(n * CONFIDENCE);
      return sorted[Math.max(1, Math.min(n, rank)) - 1];
    }
    double mean = Arrays.stream(blanks).average().getAsDouble();
    double t = StudentT.oneSided(CONFIDENCE, n - 1);
    return Math.max(mean, 0) + t * new StandardDeviation(true).evaluate(blanks);
  }

  private static void checkFinite(double[] values, String what) {
    for (double v : values) {
      if (!Double.isFinite(v)) {
        throw new IllegalArgumentException(what + " " + v + " is not a finite number");
      }
    }
  }
}
