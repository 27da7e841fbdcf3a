package org.quantrun.core.method;

import org.quantrun.core.Token;

/** How a result between the detection and the quantification limit is written. */
public enum BetweenLodLoqStyle implements Token {
  /** As its value, flagged estimated (the default). */
  VALUE_ESTIMATED("value-estimated"),
  /** As its value with no flag. */
  VALUE("value"),
  /** As a less-than the quantification limit times the dilution factor. */
  LESS_THAN_LOQ("less-than-loq");

  private final String token;

  BetweenLodLoqStyle(String token) {
    this.token = token;
  }

  /** {@inheritDoc} */
  @Override
  public String token() {
    return token;
  }
}
