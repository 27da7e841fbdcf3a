/**
 * The method file: a lab's procedure for one kind of run (analytes, standards, blanks, sample
 * identification, dilution, limits, QC acceptance and reporting), loaded from YAML and validated
 * into immutable records. Entry point: {@link org.quantrun.core.method.MethodLoader}.
 */
package org.quantrun.core.method;
