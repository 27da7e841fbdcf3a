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
   * @throws IllegalArgumentException if {@code low < 0} or {@code low >= high}
   */
  public WorkingRange {
    if (!(low >= 0) || !(high > low) || !Double.isFinite(high)) {
      throw new IllegalArgumentException("working range must have 0 <= low < high, got " + low + ".." + high);
    }
  }
}
