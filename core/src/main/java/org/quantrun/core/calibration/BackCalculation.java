package org.quantrun.core.calibration;

import java.util.OptionalDouble;

/**
 * One calibration point read back through the fitted curve.
 *
 * @param x the nominal concentration of the standard
 * @param y its signal
 * @param weight its normalised weight (the weights of a fit sum to n)
 * @param fitted the signal the curve gives at x
 * @param residual y minus fitted
 * @param backCalculated the concentration the curve gives for y; empty if the curve does not reach
 *     y (a quadratic)
 * @param percentError (backCalculated - x) / x * 100; empty at x = 0, where it is undefined (judge
 *     a blank point by the absolute back-calculated value instead)
 */
public record BackCalculation(
    double x,
    double y,
    double weight,
    double fitted,
    double residual,
    OptionalDouble backCalculated,
    OptionalDouble percentError) {}
