package org.quantrun.core.calibration;

/** Where a detection or quantitation limit came from. */
public enum LimitSource {
  /** The method's validated per-analyte limits (MDL, reporting limit). */
  METHOD("method"),
  /** Replicates of the blank measured in the run: 3 and 10 s_blank / slope. */
  BLANK_REPLICATES("blank-replicates"),
  /** The run's calibration: 3.3 and 10 s0 / slope at zero. */
  CALIBRATION("calibration");

  private final String label;

  LimitSource(String label) {
    this.label = label;
  }

  /** The name used in output files, e.g. {@code blank-replicates}. */
  public String label() {
    return label;
  }

  @Override
  public String toString() {
    return label;
  }
}
