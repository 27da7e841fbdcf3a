package org.quantrun.core.method;

import org.quantrun.core.Token;

/** Which source of sample identification wins when both give a role. */
public enum IdentificationOrder implements Token {
  /** The first matching ID rule decides; the type column only when no rule matches (the default). */
  RULES_FIRST("rules-first"),
  /** A mapped type-column value decides; ID rules only when the column gives none. */
  TYPE_COLUMN_FIRST("type-column-first");

  private final String token;

  IdentificationOrder(String token) {
    this.token = token;
  }

  /** {@inheritDoc} */
  @Override
  public String token() {
    return token;
  }
}
