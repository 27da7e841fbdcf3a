package org.quantrun.core.model;

import java.util.List;
import java.util.Optional;
import java.util.OptionalDouble;
import java.util.OptionalInt;
import org.quantrun.core.calibration.LimitSource;
import org.quantrun.core.method.ResultFlag;
import org.quantrun.core.method.SampleRole;

/**
 * The result of one analyte line in one injection, in the original sample.
 *
 * <p>{@code value}, {@code ciHalfWidth}, {@code lod} and {@code loq} are in the original sample
 * (dilution and preparation factors applied), unrounded; {@code reported} is the text the
 * method's reporting rules give. A result that cannot be reported (its calibration was rejected,
 * no reading was valid) has an empty value and says why in {@code reported} and the trace.
 *
 * @param position the injection's sequence position
 * @param sampleId the sample id
 * @param role the injection's role
 * @param analyteKey the method's key of the analyte line
 * @param analyte the analyte name
 * @param line the line or mass, if any
 * @param reportedLine whether this line is the one reported for the analyte
 * @param value the concentration in the original sample, signed; empty when not quantified
 * @param reported the reported text, e.g. {@code "< 2.0"} or {@code "12.3"}
 * @param unit the unit of value, limits and half-width
 * @param ciHalfWidth confidence half-width of the calibration scatter (not the measurement uncertainty)
 * @param lod the limit of detection in the original sample
 * @param loq the limit of quantitation in the original sample
 * @param dilutionFactor every dilution and preparation factor applied, multiplied
 * @param flags the flags raised, in a fixed order
 * @param signalMean the mean of the valid readings (as measured, before corrections)
 * @param signalRsdPct their %RSD, when there were at least two
 * @param replicates how many valid readings went into the mean
 * @param limitsFrom where the limits came from
 * @param solutionConcentration the concentration in the measured solution, before dilution factors
 * @param suggestedDilution for an over-range result, the further dilution suggested
 * @param trace how the value was made, step by step, in plain words
 */
public record AnalyteResult(
    int position,
    String sampleId,
    SampleRole role,
    String analyteKey,
    String analyte,
    Optional<String> line,
    boolean reportedLine,
    OptionalDouble value,
    String reported,
    String unit,
    OptionalDouble ciHalfWidth,
    OptionalDouble lod,
    OptionalDouble loq,
    double dilutionFactor,
    List<ResultFlag> flags,
    OptionalDouble signalMean,
    OptionalDouble signalRsdPct,
    int replicates,
    Optional<LimitSource> limitsFrom,
    OptionalDouble solutionConcentration,
    OptionalInt suggestedDilution,
    List<String> trace) {

  /** Copies the lists. */
  public AnalyteResult {
    flags = List.copyOf(flags);
    trace = List.copyOf(trace);
  }
}
