package org.quantrun.core.method;

import org.quantrun.core.Token;

/** The basis of mass-based results. */
public enum SolidsBasis implements Token {
  /** Per mass of sample as received (the default). */
  AS_RECEIVED("as-received"),
  /** Per mass of dry sample: the as-received result divided by the solids fraction. */
  DRY_WEIGHT("dry-weight");

  private final String token;

  SolidsBasis(String token) {
    this.token = token;
  }

  /** {@inheritDoc} */
  @Override
  public String token() {
    return token;
  }
}
