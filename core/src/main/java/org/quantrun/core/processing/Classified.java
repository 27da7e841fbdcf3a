package org.quantrun.core.processing;

import java.util.Optional;
import org.quantrun.core.importer.Injection;
import org.quantrun.core.method.SampleRole;

/**
 * An injection with the role the method gave it.
 *
 * @param index the injection's index in the run (0-based)
 * @param injection the injection as imported
 * @param role its role
 * @param level for a standard, its level's name
 * @param parent for a duplicate, spike or serial dilution, the id of the sample it was made from
 * @param identifiedBy which rule gave the role, in plain words
 */
record Classified(
    int index, Injection injection, SampleRole role, Optional<String> level, Optional<String> parent,
    String identifiedBy) {

  int position() {
    return injection.sequence();
  }

  String sampleId() {
    return injection.sampleId();
  }

  /** A real sample for CCV frequency: samples, duplicates, spikes and serial dilutions. */
  boolean isRealSample() {
    return role == SampleRole.SAMPLE || role == SampleRole.DUPLICATE || role == SampleRole.SPIKE
        || role == SampleRole.SPIKE_DUPLICATE || role == SampleRole.SERIAL_DILUTION;
  }

  /** Prepared like a sample (its dilution and prep apply): real samples, method blanks and LCS. */
  boolean isPrepared() {
    return isRealSample() || role == SampleRole.METHOD_BLANK || role == SampleRole.LCS;
  }

  /** Calibration solutions (fitted, not quantified) and ignored injections. */
  boolean isCalibrationOrIgnored() {
    return role == SampleRole.CALIBRATION_BLANK || role == SampleRole.STANDARD || role == SampleRole.IGNORE;
  }
}
