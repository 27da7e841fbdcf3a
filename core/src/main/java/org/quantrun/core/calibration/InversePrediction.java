package org.quantrun.core.calibration;

import java.util.OptionalDouble;

/**
 * A concentration predicted from a measured signal, with its standard error and confidence
 * interval.
 *
 * <p>The interval covers the scatter of the calibration only (the fit and the m measurements of
 * the unknown); it is not the measurement uncertainty of a result.
 *
 * @param y0 the mean signal of the unknown
 * @param m the number of independent measurements averaged into y0
 * @param confidence the two-sided confidence level of the interval, e.g. 0.95
 * @param status whether a concentration was found
 * @param x0 the predicted concentration; empty when {@link PredictionStatus#NO_ROOT_IN_RANGE}
 * @param sX0 standard error of x0 by the delta method; empty when not estimable (no degrees of
 *     freedom) or no concentration was found
 * @param t the Student t factor t(1 - alpha/2, dof); empty when dof = 0
 * @param halfWidth confidence half-width t * s_x0; empty when not estimable
 * @param position where x0 lies relative to the fitted standards (for {@code NO_ROOT_IN_RANGE},
 *     where the signal lies relative to the signals the curve gives over the range)
 * @param nearestRoot for a quadratic without a root in range, the real root nearest to the range
 *     (an extrapolation, useful to suggest a dilution); empty otherwise
 */
public record InversePrediction(
    double y0,
    int m,
    double confidence,
    PredictionStatus status,
    OptionalDouble x0,
    OptionalDouble sX0,
    OptionalDouble t,
    OptionalDouble halfWidth,
    RangePosition position,
    OptionalDouble nearestRoot) {

  /** Whether x0 was found and lies within the fitted standards' range. */
  public boolean inRange() {
    return status == PredictionStatus.QUANTIFIED && position == RangePosition.IN_RANGE;
  }
}
