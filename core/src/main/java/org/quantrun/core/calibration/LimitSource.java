package org.quantrun.core.calibration;

import org.quantrun.core.Token;

/** Where a detection or quantitation limit came from. */
public enum LimitSource implements Token {
  /** The method's validated per-analyte limits (MDL, reporting limit). */
  METHOD("method"),
  /** Replicate blanks measured in the run: 3 and 10 s_blank / slope. */
  RUN_BLANKS("run-blanks"),
  /** The run's calibration: 3.3 and 10 s0 / slope at zero. */
  CALIBRATION("calibration");

  private final String label;

  LimitSource(String label) {
    this.label = label;
  }

  /** The name used in output files, e.g. {@code blank-replicates}. */
  @Override
  public String token() {
    return label;
  }

  @Override
  public String toString() {
    return label;
  }
}
