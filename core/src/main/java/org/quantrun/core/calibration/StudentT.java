package org.quantrun.core.calibration;

import java.util.concurrent.ConcurrentHashMap;
import org.apache.commons.math3.distribution.TDistribution;

/**
 * Quantiles of Student's t distribution, from Commons Math, remembered per (probability, degrees of
 * freedom) because a run asks for the same few values thousands of times.
 */
public final class StudentT {
  private static final ConcurrentHashMap<Key, Double> CACHE = new ConcurrentHashMap<>();
  private static final int CACHE_LIMIT = 10_000;

  private record Key(double probability, int dof) {}

  private StudentT() {}

  /**
   * The quantile t(p, dof): the value below which a fraction p of the distribution lies.
   *
   * @param probability p, strictly between 0 and 1
   * @param dof degrees of freedom, at least 1
   */
  public static double quantile(double probability, int dof) {
    if (!(probability > 0 && probability < 1)) {
      throw new IllegalArgumentException("probability must lie strictly between 0 and 1, was " + probability);
    }
    if (dof < 1) {
      throw new IllegalArgumentException("degrees of freedom must be at least 1, was " + dof);
    }
    Key key = new Key(probability, dof);
    Double t = CACHE.get(key);
    if (t == null) {
      t = new TDistribution(null, dof).inverseCumulativeProbability(probability);
      if (CACHE.size() < CACHE_LIMIT) {
        CACHE.put(key, t);
      }
    }
    return t;
  }

  /**
   * The two-sided critical value for a confidence level: t(1 - alpha/2, dof) with alpha = 1 -
   * confidence (e.g. confidence 0.95 and 4 dof give 2.776).
   */
  public static double twoSided(double confidence, int dof) {
    checkConfidence(confidence);
    return quantile(1 - (1 - confidence) / 2, dof);
  }

  /**
   * The one-sided critical value t(confidence, dof) (e.g. 0.99 and 6 dof give 3.143, the value the
   * MDL procedure uses for seven replicates).
   */
  public static double oneSided(double confidence, int dof) {
    checkConfidence(confidence);
    return quantile(confidence, dof);
  }

  static void checkConfidence(double confidence) {
    if (!(confidence > 0 && confidence < 1)) {
      throw new IllegalArgumentException(
          "confidence must lie strictly between 0 and 1 (e.g. 0.95), was " + confidence);
    }
  }
}
