package org.quantrun.core.method;

/**
 * The limit on the scatter of the readings of one injection: %RSD = SD / mean * 100 must not
 * exceed {@code maxRsd} when the mean is at least {@code minMultipleOfRl} times the reporting
 * limit.
 *
 * @param maxRsd largest accepted %RSD
 * @param minMultipleOfRl multiple of the reporting limit from which %RSD is judged
 */
public record ReplicateRule(double maxRsd, double minMultipleOfRl) {}
