package org.quantrun.core.method;

import org.quantrun.core.Token;

/** What method (preparation) blanks do to the results of their prep batch. */
public enum MethodBlankHandling implements Token {
  /** Method blanks are reported and judged, never subtracted (the default). */
  REPORT_ONLY("report-only"),
  /** The method blank of the prep batch is subtracted in concentration from its samples, and the result says so. */
  SUBTRACT("subtract");

  private final String token;

  MethodBlankHandling(String token) {
    this.token = token;
  }

  /** {@inheritDoc} */
  @Override
  public String token() {
    return token;
  }
}
