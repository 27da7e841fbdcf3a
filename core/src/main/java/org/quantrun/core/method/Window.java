package org.quantrun.core.method;

/**
 * An acceptance window in percent, both ends included (for example a recovery of 90 to 110 %).
 *
 * @param low lowest accepted value, percent
 * @param high highest accepted value, percent; greater than {@code low}
 */
public record Window(double low, double high) {

  /**
   * Checks the window is ordered.
   *
   * @param low lowest accepted value, percent
   * @param high highest accepted value, percent; greater than {@code low}
   * @throws IllegalArgumentException if the ends are not ordered
   */
  public Window {
    if (!Double.isFinite(low) || !Double.isFinite(high) || low >= high) {
      throw new IllegalArgumentException("window must have low < high, got " + low + ".." + high);
    }
  }

  /**
   * Whether a value lies inside the window (ends included).
   *
   * @param value the value, percent
   * @return true when {@code low <= value <= high}
   */
  public boolean contains(double value) {
    return value >= low && value <= high;
  }
}
