package org.quantrun.core.method;

/**
 * The duplicate rule (also used for matrix spike duplicates): when both results are at least
 * {@code minMultipleOfRl} times the reporting limit, RPD = abs(a - b) / ((a + b) / 2) * 100 must
 * not exceed {@code maxRpd}; otherwise abs(a - b) must not exceed {@code lowLevelMaxDifference}
 * times the reporting limit.
 *
 * @param maxRpd largest accepted RPD, percent
 * @param minMultipleOfRl multiple of the reporting limit from which RPD is judged
 * @param lowLevelMaxDifference largest accepted difference below that, in reporting limits
 */
public record PairRule(double maxRpd, double minMultipleOfRl, double lowLevelMaxDifference) {}
