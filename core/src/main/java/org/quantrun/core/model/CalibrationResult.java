package org.quantrun.core.model;

import java.util.List;
import java.util.Optional;
import java.util.OptionalDouble;
import org.quantrun.core.calibration.CalibrationFit;
import org.quantrun.core.calibration.CurveModel;
import org.quantrun.core.calibration.LimitEstimate;
import org.quantrun.core.calibration.Weighting;

/**
 * One analyte line's calibration in the run and whether it was accepted.
 *
 * @param analyteKey the method's key of the analyte line, e.g. {@code Pb 220.353}
 * @param analyte the analyte name
 * @param line the line or mass, if the method names one
 * @param reportedLine whether this line is the one reported for the analyte (others are alternates)
 * @param curve the curve model
 * @param weighting the weighting
 * @param unit the concentration unit of the standards
 * @param fit the fit; empty when no fit could be made (the reasons say why)
 * @param status accepted or rejected
 * @param reasons why it was rejected (empty when accepted)
 * @param levels each fit point read back through the curve
 * @param limits the limits from this calibration (always shown, whatever results use)
 * @param blankSignal the mean calibration-blank signal subtracted from every signal, if subtracted
 * @param trace the corrections applied to the signals, in order, in plain words
 */
public record CalibrationResult(
    String analyteKey,
    String analyte,
    Optional<String> line,
    boolean reportedLine,
    CurveModel curve,
    Weighting weighting,
    String unit,
    Optional<CalibrationFit> fit,
    CalibrationStatus status,
    List<String> reasons,
    List<CalibrationLevel> levels,
    Optional<LimitEstimate> limits,
    OptionalDouble blankSignal,
    List<String> trace) {

  /** Copies the lists. */
  public CalibrationResult {
    reasons = List.copyOf(reasons);
    levels = List.copyOf(levels);
    trace = List.copyOf(trace);
  }
}
