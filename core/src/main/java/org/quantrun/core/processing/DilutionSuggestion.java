package org.quantrun.core.processing;

import java.util.OptionalInt;

/**
 * Suggests a dilution for an over-range result: the smallest of 2, 5, 10, 20, 50, 100, 200, 500 and
 * 1000 that brings the measured concentration under a fraction (80 % by default) of the top
 * standard.
 */
public final class DilutionSuggestion {
  /** The dilutions a lab prepares routinely, ascending. */
  private static final int[] STEPS = {2, 5, 10, 20, 50, 100, 200, 500, 1000};
  /** The default fraction of the top standard a diluted result should fall under. */
  public static final double DEFAULT_TARGET_FRACTION = 0.8;

  private DilutionSuggestion() {}

  /**
   * The suggested further dilution of the measured solution.
   *
   * @param measured the concentration in the measured solution (before any dilution factor)
   * @param topStandard the concentration of the highest standard
   * @param targetFraction the fraction of the top standard the diluted result should fall under
   * @return the dilution, or empty when even 1000 is not enough (or the result is not over range)
   */
  public static OptionalInt suggest(double measured, double topStandard, double targetFraction) {
    double target = targetFraction * topStandard;
    if (!(measured >= target)) {
      return OptionalInt.empty();
    }
    for (int step : STEPS) {
      if (measured / step < target) {
        return OptionalInt.of(step);
      }
    }
    return OptionalInt.empty();
  }
}
