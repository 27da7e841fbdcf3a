package org.quantrun.core.method;

/** The weights of a weighted least-squares calibration fit. */
public enum Weighting implements MethodToken {
  /** Every fit point has the same weight. */
  NONE("none"),
  /** Weight 1/x. */
  INVERSE_X("1/x"),
  /** Weight 1/x^2. */
  INVERSE_X_SQUARED("1/x2"),
  /** Weight 1/y. */
  INVERSE_Y("1/y"),
  /** Weight 1/y^2. */
  INVERSE_Y_SQUARED("1/y2"),
  /** Weight 1/s^2, s the SD of the readings of the injection. */
  INVERSE_VARIANCE("1/s2");

  private final String token;

  Weighting(String token) {
    this.token = token;
  }

  /** {@inheritDoc} */
  @Override
  public String token() {
    return token;
  }
}
