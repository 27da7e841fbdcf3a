package org.quantrun.core.calibration;

import java.util.OptionalDouble;

/**
 * One calibration point: a standard's concentration x, its signal y and, optionally, the standard
 * deviation of that signal (needed for 1/s^2 weighting).
 *
 * @param x concentration of the standard
 * @param y signal (usually the mean of the injection's readings)
 * @param sd standard deviation of the signal, when known
 */
public record CalibrationPoint(double x, double y, OptionalDouble sd) {

  /** Null-safe canonical constructor; values are checked by the fit, which can name the point. */
  public CalibrationPoint {
    sd = sd == null ? OptionalDouble.empty() : sd;
  }

  /** A point without a standard deviation. */
  public static CalibrationPoint of(double x, double y) {
    return new CalibrationPoint(x, y, OptionalDouble.empty());
  }

  /** A point with the standard deviation of its signal. */
  public static CalibrationPoint of(double x, double y, double sd) {
    return new CalibrationPoint(x, y, OptionalDouble.of(sd));
  }
}
