package org.quantrun.core.qc;

import java.util.Locale;

/**
 * An acceptance window [low, high], ends included. Either end may be open (infinite), e.g. an RPD
 * limit is the window [-infinity, 20].
 *
 * @param low the lowest acceptable value
 * @param high the highest acceptable value
 */
public record Window(double low, double high) {

  /** Checks the window is ordered and not NaN. */
  public Window {
    if (Double.isNaN(low) || Double.isNaN(high) || low > high) {
      throw new IllegalArgumentException("window [" + low + ", " + high + "] is not ordered (expected low <= high)");
    }
  }

  /** A window with both ends, e.g. a recovery of 90 to 110 %. */
  public static Window between(double low, double high) {
    return new Window(low, high);
  }

  /** A window with only an upper end, e.g. an RPD of at most 20 %. */
  public static Window atMost(double high) {
    return new Window(Double.NEGATIVE_INFINITY, high);
  }

  /**
   * Whether v lies in the window, ends included. A value beyond an end by less than one part in
   * 10^9 of that end counts as on it: that is the rounding noise of binary arithmetic (11.0 / 10.0
   * * 100 is 110.00000000000001), not a failure.
   */
  public boolean contains(double v) {
    return v >= low - slack(low) && v <= high + slack(high);
  }

  private static double slack(double end) {
    return Double.isInfinite(end) ? 0 : 1e-9 * Math.max(1, Math.abs(end));
  }

  @Override
  public String toString() {
    if (low == Double.NEGATIVE_INFINITY) {
      return String.format(Locale.ROOT, "<= %s", high);
    }
    return String.format(Locale.ROOT, "%s to %s", low, high);
  }
}
