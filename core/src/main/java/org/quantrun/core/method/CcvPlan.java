package org.quantrun.core.method;

/**
 * The continuing calibration verification.
 *
 * @param standard true values and recovery window of the CCV
 * @param frequency most real samples (duplicates and spikes included) between two CCVs
 * @param nonDetectsStandAfterHighBias whether non-detects bracketed by a high-biased failed CCV
 *     still stand
 */
public record CcvPlan(CheckStandard standard, int frequency, boolean nonDetectsStandAfterHighBias) {}
