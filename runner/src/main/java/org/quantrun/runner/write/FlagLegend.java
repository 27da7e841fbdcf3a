package org.quantrun.runner.write;

import org.quantrun.core.method.ResultFlag;

/** What each result flag means, in plain words, for the report's flags legend. */
public final class FlagLegend {
  private FlagLegend() {}

  /**
   * The meaning of a flag.
   *
   * @param flag the flag
   * @return one sentence for the reader of a report
   */
  public static String meaning(ResultFlag flag) {
    return switch (flag) {
      case BELOW_LOD -> "Below the limit of detection: reported as less than the LOD (times the dilution factor).";
      case ESTIMATED -> "Between the limits of detection and quantitation: the value is an estimate.";
      case OVER_RANGE -> "Above the calibrated or working range beyond its tolerance: dilute and measure again.";
      case NEGATIVE -> "Negative result: reported as below the LOD; the signed value is kept in the value column.";
      case EXTRAPOLATED -> "Below the lowest fitted standard: the curve was extrapolated downwards.";
      case NO_ROOT_IN_RANGE -> "The quadratic curve does not reach this signal inside the calibrated range.";
      case NOT_CALIBRATED -> "No standard of the run measured this analyte line: no calibration.";
      case NO_VALID_READINGS -> "No reading of the injection was valid for this line.";
      case OVER_CORRECTION -> "Strongly negative (below minus the LOD): the blank may have been over-corrected.";
      case CALIBRATION_FAILED -> "The calibration of this analyte line failed its acceptance rules.";
      case ICV_FAILED -> "The initial calibration verification (ICV) of this analyte failed: the calibration was not verified.";
      case ICB_FAILED -> "The initial calibration blank (ICB) of this analyte failed.";
      case CCV_FAILED -> "A bracketing continuing calibration verification (CCV) of this analyte failed.";
      case CCB_FAILED -> "A bracketing continuing calibration blank (CCB) of this analyte failed.";
      case METHOD_BLANK_FAILED -> "The method blank of the preparation batch exceeded its limit.";
      case METHOD_BLANK_SUBTRACTED -> "The method blank of the preparation batch was subtracted, as the method says.";
      case LCS_FAILED -> "The laboratory control sample (LCS) of the preparation batch failed its recovery window.";
      case DUPLICATE_FAILED -> "The sample duplicate failed its RPD or difference limit.";
      case SPIKE_FAILED -> "The matrix spike (or its duplicate) failed its recovery window or RPD.";
      case SPIKE_NOT_EVALUATED -> "The matrix spike was not judged: the sample holds too much of the analyte.";
      case SERIAL_DILUTION_FAILED -> "The serial dilution differed by more than its limit.";
      case INTERNAL_STANDARD_FAILED -> "The internal standard recovery was outside its window.";
      case REPLICATE_RSD_HIGH -> "The readings of the injection scatter above the %RSD limit.";
      case CARRY_OVER_SUSPECT -> "Measured right after an over-range injection and above the LOQ: possible carry-over.";
    };
  }
}
