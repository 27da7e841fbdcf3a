package org.quantrun.core.method;

import org.quantrun.core.Token;

/** Which points of the standards feed a calibration fit. */
public enum FitPoints implements Token {
  /** One point per standard injection: the mean of its readings (the default). */
  INJECTION_MEANS("injection-means"),
  /** Every individual reading of every standard injection (degrees of freedom are then optimistic). */
  READINGS("readings");

  private final String token;

  FitPoints(String token) {
    this.token = token;
  }

  /** {@inheritDoc} */
  @Override
  public String token() {
    return token;
  }
}
