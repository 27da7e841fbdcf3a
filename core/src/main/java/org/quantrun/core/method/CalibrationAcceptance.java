package org.quantrun.core.method;

import java.util.Optional;

/**
 * When a calibration is accepted. At most one of {@code minR} and {@code minR2} is given.
 *
 * @param minR smallest accepted correlation coefficient r
 * @param minR2 smallest accepted coefficient of determination r^2
 * @param maxBackCalcError largest accepted % error of a standard back-calculated on the curve
 * @param maxBackCalcErrorLowest the same for the lowest standard level
 * @param overRangeTolerance how far above the highest standard (percent of it) a result may lie
 *     before it is flagged over-range
 */
public record CalibrationAcceptance(
    Optional<Double> minR,
    Optional<Double> minR2,
    double maxBackCalcError,
    double maxBackCalcErrorLowest,
    double overRangeTolerance) {}
