package org.quantrun.core.method;

import org.quantrun.core.Token;

/** How reported values are rounded to their significant figures. */
public enum RoundingRule implements Token {
  /** Round half to even (the default). */
  HALF_EVEN("half-even"),
  /** Round half away from zero. */
  HALF_UP("half-up");

  private final String token;

  RoundingRule(String token) {
    this.token = token;
  }

  /** {@inheritDoc} */
  @Override
  public String token() {
    return token;
  }
}
