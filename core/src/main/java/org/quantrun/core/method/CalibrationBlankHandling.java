package org.quantrun.core.method;

import org.quantrun.core.Token;

/** What the calibration blank does to the signals of an analyte. */
public enum CalibrationBlankHandling implements Token {
  /** The mean calibration-blank signal is subtracted from every signal; the blank is not a fit point (the default). */
  SUBTRACT("subtract"),
  /** The calibration blank is fitted as the point at concentration 0. */
  ZERO_POINT("zero-point"),
  /** The calibration blank is neither subtracted nor fitted. */
  NONE("none");

  private final String token;

  CalibrationBlankHandling(String token) {
    this.token = token;
  }

  /** {@inheritDoc} */
  @Override
  public String token() {
    return token;
  }
}
