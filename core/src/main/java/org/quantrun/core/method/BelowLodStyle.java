package org.quantrun.core.method;

import org.quantrun.core.Token;

/** How a result below the detection limit is written. */
public enum BelowLodStyle implements Token {
  /** As a less-than the detection limit times the dilution factor, e.g. < 0.50 (the default). */
  LESS_THAN_LOD("less-than-lod"),
  /** As its rounded value, flagged below-lod. */
  VALUE("value"),
  /** As the fixed text reporting.below-lod-text. */
  TEXT("text");

  private final String token;

  BelowLodStyle(String token) {
    this.token = token;
  }

  /** {@inheritDoc} */
  @Override
  public String token() {
    return token;
  }
}
