package org.quantrun.core.method;

/**
 * Limits of blanks, as a fraction of each analyte's reporting limit: a blank passes when
 * {@code abs(result) <= fraction * reporting limit}.
 *
 * @param calibrationBlankFraction the fraction for ICB and CCB
 * @param methodBlankFraction the fraction for method blanks
 */
public record BlankChecks(double calibrationBlankFraction, double methodBlankFraction) {}
