package org.quantrun.core.method;

/** A source of the detection and quantification limits that results use. */
public enum LimitSource implements MethodToken {
  /** The per-analyte limits the method gives (mdl, reporting-limit). */
  METHOD("method"),
  /** Replicate calibration blanks of the run (at least min-blank-replicates). */
  RUN_BLANKS("run-blanks"),
  /** The calibration of the run (s_y/x and slope). */
  CALIBRATION("calibration");

  private final String token;

  LimitSource(String token) {
    this.token = token;
  }

  /** {@inheritDoc} */
  @Override
  public String token() {
    return token;
  }
}
