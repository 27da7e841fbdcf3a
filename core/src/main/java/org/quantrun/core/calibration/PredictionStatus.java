package org.quantrun.core.calibration;

/** Whether an inverse prediction found a concentration for the signal. */
public enum PredictionStatus {
  /** A concentration was found. */
  QUANTIFIED,
  /**
   * The curve does not reach the signal inside the calibrated range (a quadratic whose roots all
   * lie outside it, or none is real; a straight line with zero slope). This is a result, not an
   * error: the sample cannot be quantified on this calibration.
   */
  NO_ROOT_IN_RANGE
}
