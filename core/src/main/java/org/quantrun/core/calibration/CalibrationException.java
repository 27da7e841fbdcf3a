package org.quantrun.core.calibration;

/**
 * The calibration data cannot be fitted as asked: too few points, no spread in x, a value that is
 * not a finite number, or a weighting the data cannot carry. The message says what is wrong, which
 * point (numbered from 1 in the order given) and what to do about it.
 */
public final class CalibrationException extends RuntimeException {
  private static final long serialVersionUID = 1L;

  /** A calibration error with a message written for the analyst. */
  public CalibrationException(String message) {
    super(message);
  }
}
