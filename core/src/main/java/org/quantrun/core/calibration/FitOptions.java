package org.quantrun.core.calibration;

import java.util.Objects;

/**
 * What to fit: the curve model and the weighting. An immutable value; change it with the
 * {@code with...} methods.
 *
 * <pre>{@code
 * FitOptions o = FitOptions.DEFAULT.withCurve(CurveModel.QUADRATIC).withWeighting(Weighting.INVERSE_X);
 * }</pre>
 *
 * @param curve the curve model
 * @param weighting the weighting of the points
 */
public record FitOptions(CurveModel curve, Weighting weighting) {

  /** Straight line with intercept, unweighted. */
  public static final FitOptions DEFAULT = new FitOptions(CurveModel.LINEAR, Weighting.NONE);

  /** Checks that neither part is missing. */
  public FitOptions {
    Objects.requireNonNull(curve, "curve");
    Objects.requireNonNull(weighting, "weighting");
  }

  /** The same options with another curve. */
  public FitOptions withCurve(CurveModel c) {
    return new FitOptions(c, weighting);
  }

  /** The same options with another weighting. */
  public FitOptions withWeighting(Weighting w) {
    return new FitOptions(curve, w);
  }
}
