package org.quantrun.core.method;

/** The calibration model of an analyte line (the calibration engine may reconcile this with its own type). */
public enum CurveType implements MethodToken {
  /** Straight line y = c0 + c1 x. */
  LINEAR("linear"),
  /** Straight line through the origin, y = c1 x; a single standard is its one-point case. */
  THROUGH_ZERO("through-zero"),
  /** Second-order polynomial y = c0 + c1 x + c2 x^2, monotonic over the calibrated range. */
  QUADRATIC("quadratic");

  private final String token;

  CurveType(String token) {
    this.token = token;
  }

  /** {@inheritDoc} */
  @Override
  public String token() {
    return token;
  }
}
