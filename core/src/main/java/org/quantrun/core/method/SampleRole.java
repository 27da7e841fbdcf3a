package org.quantrun.core.method;

import org.quantrun.core.Token;

/** The part an injection plays in a run. */
public enum SampleRole implements Token {
  /** The calibration blank (concentration 0). */
  CALIBRATION_BLANK("calibration-blank"),
  /** A calibration standard of a named level. */
  STANDARD("standard"),
  /** Initial calibration verification (second-source standard). */
  ICV("icv"),
  /** Initial calibration blank. */
  ICB("icb"),
  /** Continuing calibration verification. */
  CCV("ccv"),
  /** Continuing calibration blank. */
  CCB("ccb"),
  /** Low-level check standard near the reporting limit. */
  LOW_CHECK("low-check"),
  /** Method (preparation) blank of a prep batch. */
  METHOD_BLANK("method-blank"),
  /** Laboratory control sample (spiked clean matrix). */
  LCS("lcs"),
  /** A real sample. */
  SAMPLE("sample"),
  /** A duplicate of another sample (named by the rule's of). */
  DUPLICATE("duplicate"),
  /** A matrix spike of another sample. */
  SPIKE("spike"),
  /** A matrix spike duplicate of another sample. */
  SPIKE_DUPLICATE("spike-duplicate"),
  /** A serial dilution of another sample. */
  SERIAL_DILUTION("serial-dilution"),
  /** An injection the run leaves out (rinse, conditioning). */
  IGNORE("ignore");

  private final String token;

  SampleRole(String token) {
    this.token = token;
  }

  /** {@inheritDoc} */
  @Override
  public String token() {
    return token;
  }
}
