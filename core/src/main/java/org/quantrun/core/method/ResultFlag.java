package org.quantrun.core.method;

import org.quantrun.core.Token;

/** The flags quantrun puts on a result; the method may map each to the lab's own qualifier code. */
public enum ResultFlag implements Token {
  /** Below the detection limit. */
  BELOW_LOD("below-lod"),
  /** Between the detection and the quantification limit. */
  ESTIMATED("estimated"),
  /** Above the calibrated or working range beyond its tolerance. */
  OVER_RANGE("over-range"),
  /** Negative: reported as below the LOD, the signed value kept. */
  NEGATIVE("negative"),
  /** Below the lowest fitted standard: the curve was extrapolated downwards. */
  EXTRAPOLATED("extrapolated"),
  /** A quadratic curve does not reach the signal inside the calibrated range. */
  NO_ROOT_IN_RANGE("no-root-in-range"),
  /** The analyte line has no calibration in the run (no standards measured it). */
  NOT_CALIBRATED("not-calibrated"),
  /** No reading of the injection was valid for this line. */
  NO_VALID_READINGS("no-valid-readings"),
  /** Strongly negative: possible over-correction of the blank. */
  OVER_CORRECTION("over-correction"),
  /** The calibration of the analyte failed its acceptance rules. */
  CALIBRATION_FAILED("calibration-failed"),
  /** The ICV of the analyte failed: the calibration was not verified. */
  ICV_FAILED("icv-failed"),
  /** The ICB of the analyte failed. */
  ICB_FAILED("icb-failed"),
  /** A bracketing CCV of the analyte failed. */
  CCV_FAILED("ccv-failed"),
  /** A bracketing CCB of the analyte failed. */
  CCB_FAILED("ccb-failed"),
  /** The method blank of the prep batch exceeded its limit. */
  METHOD_BLANK_FAILED("method-blank-failed"),
  /** The method blank of the prep batch was subtracted. */
  METHOD_BLANK_SUBTRACTED("method-blank-subtracted"),
  /** The LCS of the prep batch failed its recovery window. */
  LCS_FAILED("lcs-failed"),
  /** The duplicate pair failed its RPD or difference limit. */
  DUPLICATE_FAILED("duplicate-failed"),
  /** The matrix spike (or its duplicate) failed its recovery window or RPD. */
  SPIKE_FAILED("spike-failed"),
  /** The spike was not judged (background above the ratio rule). */
  SPIKE_NOT_EVALUATED("spike-not-evaluated"),
  /** The serial dilution differed by more than its limit. */
  SERIAL_DILUTION_FAILED("serial-dilution-failed"),
  /** The internal standard recovery was outside its window. */
  INTERNAL_STANDARD_FAILED("internal-standard-failed"),
  /** The readings of the injection scatter above the %RSD limit. */
  REPLICATE_RSD_HIGH("replicate-rsd-high"),
  /** Measured right after an over-range injection and above the quantification limit. */
  CARRY_OVER_SUSPECT("carry-over-suspect");

  private final String token;

  ResultFlag(String token) {
    this.token = token;
  }

  /** {@inheritDoc} */
  @Override
  public String token() {
    return token;
  }
}
