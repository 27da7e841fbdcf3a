package org.quantrun.core.method;

/**
 * What blanks do to results.
 *
 * @param calibrationBlank how the calibration blank enters the calibration
 * @param methodBlank whether method blanks are only reported or subtracted in concentration
 */
public record BlankPolicy(CalibrationBlankHandling calibrationBlank, MethodBlankHandling methodBlank) {}
