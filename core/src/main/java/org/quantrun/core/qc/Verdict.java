package org.quantrun.core.qc;

import org.quantrun.core.Token;

/** The outcome of one QC check. */
public enum Verdict implements Token {
  /** The check was judged and lies within its window. */
  PASSED("passed"),
  /** The check was judged and lies outside its window. */
  FAILED("failed"),
  /** The rule does not apply to these values (the reason says why); neither a pass nor a failure. */
  NOT_EVALUATED("not evaluated");

  private final String label;

  Verdict(String label) {
    this.label = label;
  }

  /** The word used in output files: {@code passed}, {@code failed}, {@code not evaluated}. */
  @Override
  public String token() {
    return label;
  }

  @Override
  public String toString() {
    return label;
  }
}
