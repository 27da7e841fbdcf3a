package org.quantrun.core.method;

/**
 * The concentration range over which an analyte line may be reported, in the analyte's unit.
 *
 * @param low lowest reportable concentration, not negative
 * @param high highest reportable concentration, greater than {@code low}
 */
public record WorkingRange(double low, double high) {

  /**
   * Checks the range is ordered.
   *
   * @param low lowest reportable concentration, not negative
   * @param high highest reportable concentration, greater than {@code low}
   * @throws IllegalArgumentException if the ends are not ordered
   */
  public WorkingRange {
    if (!(low >= 0) || !(high > low) || !Double.isFinite(high)) {
      throw new IllegalArgumentException("working range must have 0 <= low < high, got " + low + ".." + high);
    }
  }
}
