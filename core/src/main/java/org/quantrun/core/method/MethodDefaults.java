package org.quantrun.core.method;

import java.util.List;
import org.quantrun.core.calibration.CurveModel;
import org.quantrun.core.calibration.LimitSource;
import org.quantrun.core.calibration.Weighting;
import org.quantrun.core.qc.Window;

/**
 * The values the loader fills in for keys a method leaves out. Conventions are the ones quantrun
 * follows where labs differ; acceptance limits are examples of common published windows, recalled
 * from memory, never rules: every lab sets its own in the method file.
 */
public final class MethodDefaults {
  private MethodDefaults() {}

  /** Curve of an analyte line that names none. */
  public static final CurveModel CURVE = CurveModel.LINEAR;
  /** Weighting of an analyte line that names none. */
  public static final Weighting WEIGHTING = Weighting.NONE;
  /** Fit points: one per standard injection (its reading mean). */
  public static final FitPoints FIT_POINTS = FitPoints.INJECTION_MEANS;
  /** Calibration blank handling. */
  public static final CalibrationBlankHandling CALIBRATION_BLANK = CalibrationBlankHandling.SUBTRACT;
  /** Method blanks are reported, never silently subtracted. */
  public static final MethodBlankHandling METHOD_BLANK = MethodBlankHandling.REPORT_ONLY;
  /** Dilution factor of an injection with no other source. */
  public static final double DILUTION_FACTOR = 1.0;
  /** Limits: the method's own, else run blanks, else the calibration. */
  public static final List<LimitSource> LIMIT_ORDER = List.of(LimitSource.METHOD, LimitSource.RUN_BLANKS, LimitSource.CALIBRATION);
  /** Fewest blank replicates for run-blank limits. */
  public static final int MIN_BLANK_REPLICATES = 3;
  /** LOD = 3 s_blank / slope (IUPAC style, from memory). */
  public static final double BLANK_LOD_MULTIPLIER = 3.0;
  /** LOQ = 10 s_blank / slope (from memory). */
  public static final double BLANK_LOQ_MULTIPLIER = 10.0;
  /** LOD = 3.3 s0 / slope (ICH Q2, from memory). */
  public static final double CALIBRATION_LOD_MULTIPLIER = 3.3;
  /** LOQ = 10 s0 / slope (ICH Q2, from memory). */
  public static final double CALIBRATION_LOQ_MULTIPLIER = 10.0;
  /** Smallest r when the method names neither min-r nor min-r2 (common practice, from memory). */
  public static final double MIN_R = 0.995;
  /** Largest back-calculated error of a standard, percent (common practice, from memory). */
  public static final double MAX_BACK_CALC_ERROR = 10.0;
  /** Largest back-calculated error of the lowest standard, percent (common practice, from memory). */
  public static final double MAX_BACK_CALC_ERROR_LOWEST = 20.0;
  /** Percent above the highest standard before a result is over-range (common practice). */
  public static final double OVER_RANGE_TOLERANCE = 10.0;
  /** ICV recovery window, percent (EPA 200.7/200.8 style 90-110, from memory). */
  public static final Window ICV_RECOVERY = new Window(90, 110);
  /** CCV recovery window, percent (from memory). */
  public static final Window CCV_RECOVERY = new Window(90, 110);
  /** Most real samples between CCVs (from memory). */
  public static final int CCV_FREQUENCY = 10;
  /** Non-detects do not stand after a high-biased CCV unless the method says so. */
  public static final boolean NON_DETECTS_STAND_AFTER_HIGH_CCV = false;
  /** Low-level check recovery window, percent (from memory). */
  public static final Window LOW_CHECK_RECOVERY = new Window(70, 130);
  /** ICB/CCB limit as a fraction of the reporting limit (common practice). */
  public static final double CALIBRATION_BLANK_FRACTION = 1.0;
  /** Method blank limit as a fraction of the reporting limit (common practice). */
  public static final double METHOD_BLANK_FRACTION = 1.0;
  /** LCS recovery window, percent (SW-846 style 80-120, from memory). */
  public static final Window LCS_RECOVERY = new Window(80, 120);
  /** Duplicate rule: RPD <= 20 % from 5x the reporting limit, else difference <= 1 RL (from memory). */
  public static final PairRule DUPLICATE = new PairRule(20, 5, 1);
  /** Matrix spike recovery window, percent (SW-846 style 75-125, from memory). */
  public static final Window SPIKE_RECOVERY = new Window(75, 125);
  /** Spike not judged when the unspiked result exceeds 4 times the amount added (from memory). */
  public static final double SPIKE_MAX_BACKGROUND_RATIO = 4.0;
  /** Serial dilution: 1:5, %D <= 10 from 50x the reporting limit (from memory). */
  public static final SerialDilutionRule SERIAL_DILUTION = new SerialDilutionRule(5, 10, 50);
  /** Internal standard recovery window, percent (EPA 200.8 60-125, from memory). */
  public static final Window INTERNAL_STANDARD_RECOVERY = new Window(60, 125);
  /** Readings %RSD limit: 5 % from 10x the reporting limit (common practice). */
  public static final ReplicateRule REPLICATES = new ReplicateRule(5, 10);
  /** Significant figures of reported values (common practice). */
  public static final int SIGNIFICANT_FIGURES = 3;
  /** Round half to even (ISO 80000-1 rule B, from memory). */
  public static final RoundingRule ROUNDING = RoundingRule.HALF_EVEN;
  /** Below LOD: written as a less-than the LOD times the dilution factor. */
  public static final BelowLodStyle BELOW_LOD = BelowLodStyle.LESS_THAN_LOD;
  /** Between LOD and LOQ: the value, flagged estimated. */
  public static final BetweenLodLoqStyle BETWEEN_LOD_LOQ = BetweenLodLoqStyle.VALUE_ESTIMATED;
}
