package org.quantrun.core.model;

import org.quantrun.core.Token;

/** The run's overall verdict. */
public enum RunVerdict implements Token {
  /** Every calibration was accepted and no QC check failed: the results may go to review. */
  IN_CONTROL("in control"),
  /** The run is usable, but some results must be rerun (see the rerun list). */
  RERUNS_NEEDED("reruns needed"),
  /** A run-level check failed (no accepted calibration, a failed ICV, a missing CCV): rerun the run. */
  OUT_OF_CONTROL("out of control");

  private final String token;

  RunVerdict(String token) {
    this.token = token;
  }

  @Override
  public String token() {
    return token;
  }
}
