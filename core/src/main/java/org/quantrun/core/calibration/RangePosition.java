package org.quantrun.core.calibration;

/** Where a predicted concentration lies relative to the concentrations of the fitted standards. */
public enum RangePosition {
  /** Below the lowest fitted standard: extrapolated downwards. */
  BELOW_RANGE,
  /** Between the lowest and the highest fitted standard, ends included. */
  IN_RANGE,
  /** Above the highest fitted standard: over range. */
  ABOVE_RANGE
}
