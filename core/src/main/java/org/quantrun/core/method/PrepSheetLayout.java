package org.quantrun.core.method;

import java.util.Optional;

/**
 * The columns of a prep sheet (a CSV file with one row per prepared sample) and how its masses
 * and volumes turn solution results into results per mass of sample:
 * {@code result[reportUnit] = C[solution] * DF * finalVolume / sampleMass}, divided by the
 * solids fraction for dry-weight results. Masses are in grams, volumes in millilitres.
 *
 * @param sampleIdColumn column holding the sample ID (as the export spells it)
 * @param prepBatchColumn column holding the prep batch
 * @param dilutionFactorColumn column holding the further dilution factor of the digest
 * @param sampleMassColumn column holding the sample mass, g
 * @param finalVolumeColumn column holding the final volume of the digest, mL
 * @param solidsFractionColumn column holding the solids fraction (0 to 1)
 * @param reportUnit the per-mass unit results are reported in
 * @param basis as received or dry weight
 */
public record PrepSheetLayout(
    String sampleIdColumn,
    String prepBatchColumn,
    String dilutionFactorColumn,
    String sampleMassColumn,
    String finalVolumeColumn,
    Optional<String> solidsFractionColumn,
    ConcentrationUnit reportUnit,
    SolidsBasis basis) {}
