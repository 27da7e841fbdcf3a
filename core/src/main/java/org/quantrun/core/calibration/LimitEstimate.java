package org.quantrun.core.calibration;

/**
 * A limit of detection and a limit of quantitation, in concentration units of the measured
 * solution, with where they came from.
 *
 * @param lod limit of detection
 * @param loq limit of quantitation
 * @param signalSd the signal standard deviation the limits were derived from (s0 or s_blank), or
 *     NaN for limits given by the method
 * @param source where the limits came from
 */
public record LimitEstimate(double lod, double loq, double signalSd, LimitSource source) {}
