package org.quantrun.core.calibration;

import java.util.Optional;
import org.apache.commons.math3.stat.descriptive.moment.StandardDeviation;

/**
 * Limits of detection and quantitation from a calibration or from blank replicates.
 *
 * <ul>
 *   <li>From the calibration (the ICH Q2 approach): LOD = 3.3 s0 / b, LOQ = 10 s0 / b, b the slope
 *       at zero concentration, s0 the signal SD near zero: s_y/x for an unweighted fit; for a
 *       weighted fit s_y/x,w / sqrt(w) with w the normalised weight of the lowest non-zero standard
 *       (the weighted s_y/x itself is not the SD at zero).
 *   <li>From n &gt;= 3 blank replicates: LOD = 3 s_blank / b, LOQ = 10 s_blank / b.
 * </ul>
 */
public final class DetectionLimits {
  /** Multiplier of s0 for the LOD from a calibration. */
  public static final double CALIBRATION_LOD_FACTOR = 3.3;
  /** Multiplier of s_blank for the LOD from blank replicates. */
  public static final double BLANK_LOD_FACTOR = 3.0;
  /** Multiplier of the SD for the LOQ, either way. */
  public static final double LOQ_FACTOR = 10.0;
  /** Fewest blank replicates that give a standard deviation worth using. */
  public static final int MIN_BLANK_REPLICATES = 3;

  private DetectionLimits() {}

  /**
   * LOD and LOQ from the calibration; empty when not estimable (no degrees of freedom).
   *
   * @param fit the calibration
   */
  public static Optional<LimitEstimate> fromCalibration(CalibrationFit fit) {
    if (fit.sYx().isEmpty()) {
      return Optional.empty();
    }
    double s0 = signalSdAtZero(fit);
    double slope = Math.abs(fit.slopeAt(0));
    return Optional.of(new LimitEstimate(
        CALIBRATION_LOD_FACTOR * s0 / slope, LOQ_FACTOR * s0 / slope, s0, LimitSource.CALIBRATION));
  }

  /**
   * The signal SD near zero, s0: s_y/x unweighted; weighted, s_y/x,w / sqrt(w) with w the mean
   * normalised weight of the points at the lowest non-zero concentration.
   *
   * @throws IllegalStateException if the fit has no degrees of freedom
   */
  public static double signalSdAtZero(CalibrationFit fit) {
    double s = fit.sYx().orElseThrow(() -> new IllegalStateException("s_y/x is not estimable (dof = 0)"));
    if (fit.weighting() == Weighting.NONE) {
      return s;
    }
    double lowest = Double.POSITIVE_INFINITY;
    for (CalibrationPoint pt : fit.points()) {
      if (pt.x() != 0 && Math.abs(pt.x()) < Math.abs(lowest)) {
        lowest = pt.x();
      }
    }
    double sumW = 0;
    int count = 0;
    for (BackCalculation b : fit.backCalculations()) {
      if (b.x() == lowest) {
        sumW += b.weight();
        count++;
      }
    }
    return s / Math.sqrt(sumW / count);
  }

  /**
   * LOD and LOQ from replicate signals of a blank.
   *
   * @param blankSignals at least three replicate blank signals
   * @param slope the calibration slope at zero (signal per concentration unit), not zero
   * @throws IllegalArgumentException with fewer than three replicates, a non-finite value or a zero
   *     slope
   */
  public static LimitEstimate fromBlankReplicates(double[] blankSignals, double slope) {
    if (blankSignals.length < MIN_BLANK_REPLICATES) {
      throw new IllegalArgumentException("limits from blank replicates need at least "
          + MIN_BLANK_REPLICATES + " replicates, got " + blankSignals.length);
    }
    for (double v : blankSignals) {
      if (!Double.isFinite(v)) {
        throw new IllegalArgumentException("blank replicate " + v + " is not a finite number");
      }
    }
    if (!(Double.isFinite(slope) && slope != 0)) {
      throw new IllegalArgumentException("slope " + slope + " cannot convert a signal SD to a limit");
    }
    double sd = new StandardDeviation(true).evaluate(blankSignals);
    double b = Math.abs(slope);
    return new LimitEstimate(BLANK_LOD_FACTOR * sd / b, LOQ_FACTOR * sd / b, sd, LimitSource.RUN_BLANKS);
  }
}
