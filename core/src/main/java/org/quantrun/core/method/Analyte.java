package org.quantrun.core.method;

import java.util.Optional;
import org.quantrun.core.calibration.CurveModel;
import org.quantrun.core.calibration.Weighting;

/**
 * One analyte line: an element (or other analyte) measured at one emission line or one mass.
 * An element measured at two lines or isotopes is two analyte lines of the same {@code name};
 * standards, check standards and spikes give concentrations per {@code name}.
 *
 * @param name the analyte, e.g. {@code Pb}
 * @param line the emission or absorption line as the export labels it (e.g. {@code 220.353})
 * @param mass the mass-to-charge ratio measured (ICP-MS), e.g. {@code 208}
 * @param unit the unit the line is calibrated and reported in (per volume of solution)
 * @param curve the calibration model
 * @param weighting the fit weights
 * @param fitPoints which standard points feed the fit
 * @param internalStandard the name of the internal standard that corrects this line
 * @param mdl the method detection limit, in {@code unit}
 * @param reportingLimit the reporting limit (LOQ override), in {@code unit}
 * @param workingRange the reportable range, in {@code unit}
 * @param report whether this is the line reported for an analyte measured on several lines
 *     (when no line of the analyte says so, the first listed is reported; the others are alternates)
 */
public record Analyte(
    String name,
    Optional<String> line,
    Optional<Integer> mass,
    ConcentrationUnit unit,
    CurveModel curve,
    Weighting weighting,
    FitPoints fitPoints,
    Optional<String> internalStandard,
    Optional<Double> mdl,
    Optional<Double> reportingLimit,
    Optional<WorkingRange> workingRange,
    boolean report) {

  /**
   * A label unique within the method: the name, then the line or mass when there is one (e.g.
   * {@code Pb 208}, {@code Cd 214.439}, {@code Hg}).
   *
   * @return the label
   */
  public String key() {
    return line.map(l -> name + " " + l).or(() -> mass.map(m -> name + " " + m)).orElse(name);
  }
}
