package org.quantrun.core.method;

/**
 * The serial dilution test: %D = abs(U - f D) / U * 100, judged only when U is at least
 * {@code minMultipleOfRl} times the reporting limit.
 *
 * @param factor the dilution factor f of the serial dilution, greater than 1
 * @param maxDifference largest accepted %D
 * @param minMultipleOfRl multiple of the reporting limit from which %D is judged
 */
public record SerialDilutionRule(double factor, double maxDifference, double minMultipleOfRl) {}
