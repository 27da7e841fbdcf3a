package org.quantrun.core.method.prep;

import java.util.Optional;
import org.quantrun.core.method.ConcentrationUnit;
import org.quantrun.core.method.PrepSheetLayout;
import org.quantrun.core.method.SolidsBasis;

/**
 * One prepared sample of a prep sheet.
 *
 * @param line the 1-based line of the sheet the row starts on
 * @param sampleId the sample ID, as the run's export spells it
 * @param prepBatch the prep batch the sample was prepared in
 * @param dilutionFactor the further dilution of the digest, at least 1
 * @param sampleMass the mass of sample taken, g, positive
 * @param finalVolume the final volume of the digest, mL, positive
 * @param solidsFraction the solids (dry matter) fraction, in (0, 1], when the sheet gives one
 */
public record PrepSheetRow(
    int line,
    String sampleId,
    String prepBatch,
    double dilutionFactor,
    double sampleMass,
    double finalVolume,
    Optional<Double> solidsFraction) {

  /**
   * Turns a concentration measured in the digest into one per mass of sample:
   * {@code ug/g = ug/L * DF * V[L] / m[g]}, then into the layout's report unit, divided by the
   * solids fraction for dry-weight results.
   *
   * @param value the concentration in the digest solution
   * @param unit its per-volume unit
   * @param layout the method's prep-sheet layout (report unit and basis)
   * @return the result in {@code layout.reportUnit()}, or empty when the basis is dry weight and
   *     this row has no solids fraction
   * @throws IllegalArgumentException if {@code unit} is not per volume
   */
  public Optional<Double> toSampleBasis(double value, ConcentrationUnit unit, PrepSheetLayout layout) {
    double ugPerL = unit.convert(value, ConcentrationUnit.UG_PER_L);
    double ugPerG = ugPerL * dilutionFactor * (finalVolume / 1000.0) / sampleMass;
    double asReceived = ConcentrationUnit.UG_PER_G.convert(ugPerG, layout.reportUnit());
    if (layout.basis() == SolidsBasis.AS_RECEIVED) {
      return Optional.of(asReceived);
    }
    return solidsFraction.map(f -> asReceived / f);
  }
}
