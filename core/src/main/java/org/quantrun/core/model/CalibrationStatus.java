package org.quantrun.core.model;

import org.quantrun.core.Token;

/** Whether an analyte line's calibration may be used to report results. */
public enum CalibrationStatus implements Token {
  /** The fit met every acceptance rule of the method. */
  ACCEPTED("accepted"),
  /** The fit failed an acceptance rule, or could not be made; its samples are not reportable. */
  REJECTED("rejected");

  private final String token;

  CalibrationStatus(String token) {
    this.token = token;
  }

  @Override
  public String token() {
    return token;
  }
}
