package org.quantrun.core.model;

import org.quantrun.core.Token;

/** The kinds of QC check. */
public enum QcKind implements Token {
  /** Initial calibration verification: recovery. */
  ICV("icv"),
  /** Low-level check standard: recovery. */
  LOW_CHECK("low-check"),
  /** Initial calibration blank: absolute result below its limit. */
  ICB("icb"),
  /** Continuing calibration verification: recovery. */
  CCV("ccv"),
  /** Continuing calibration blank: absolute result below its limit. */
  CCB("ccb"),
  /** Method (preparation) blank: absolute result below its limit. */
  METHOD_BLANK("method-blank"),
  /** Laboratory control sample: recovery. */
  LCS("lcs"),
  /** Sample duplicate: RPD or absolute difference. */
  DUPLICATE("duplicate"),
  /** Matrix spike: recovery. */
  SPIKE("spike"),
  /** Matrix spike duplicate: recovery, and RPD against the spike. */
  SPIKE_DUPLICATE("spike-duplicate"),
  /** Serial dilution: %D. */
  SERIAL_DILUTION("serial-dilution"),
  /** Internal standard recovery against the calibration blank. */
  INTERNAL_STANDARD("internal-standard"),
  /** Replicate readings: %RSD. */
  REPLICATE_RSD("replicate-rsd"),
  /** CCV frequency: at most so many real samples between CCVs (a run-level check). */
  CCV_FREQUENCY("ccv-frequency");

  private final String token;

  QcKind(String token) {
    this.token = token;
  }

  @Override
  public String token() {
    return token;
  }
}
