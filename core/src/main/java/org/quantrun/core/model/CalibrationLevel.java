package org.quantrun.core.model;

import java.util.Optional;
import java.util.OptionalDouble;
import org.quantrun.core.qc.Verdict;

/**
 * One fit point of a calibration, read back through the curve.
 *
 * @param level the standard level's name ({@code blank} for a blank fit point)
 * @param position the sequence position of the injection
 * @param x the nominal concentration
 * @param y the corrected signal fitted
 * @param sd the SD of the readings behind y, when there were at least two
 * @param weight the normalised weight in the fit
 * @param fitted the signal the curve gives at x
 * @param residual y - fitted
 * @param backCalculated the concentration the curve gives for y
 * @param percentError (backCalculated - x) / x * 100; empty at x = 0
 * @param verdict whether the point met the back-calculation limit
 * @param reason why not, when it did not
 */
public record CalibrationLevel(
    String level,
    int position,
    double x,
    double y,
    OptionalDouble sd,
    double weight,
    double fitted,
    double residual,
    OptionalDouble backCalculated,
    OptionalDouble percentError,
    Verdict verdict,
    Optional<String> reason) {}
