package org.quantrun.core.method;

import java.util.List;
import org.quantrun.core.calibration.LimitSource;

/**
 * Which limits results use, and how run-made limits are computed. The sources are tried in
 * order; the first that can give a limit for an analyte is used and named in the output.
 *
 * @param order the sources to try, in order, without repeats
 * @param minBlankReplicates fewest calibration-blank replicates that make run-blank limits
 * @param blankLodMultiplier LOD = this * s_blank / slope
 * @param blankLoqMultiplier LOQ = this * s_blank / slope
 * @param calibrationLodMultiplier LOD = this * s0 / slope
 * @param calibrationLoqMultiplier LOQ = this * s0 / slope
 */
public record LimitPolicy(
    List<LimitSource> order,
    int minBlankReplicates,
    double blankLodMultiplier,
    double blankLoqMultiplier,
    double calibrationLodMultiplier,
    double calibrationLoqMultiplier) {

  /**
   * Copies the order into an unmodifiable list.
   *
   * @param order the sources to try, in order, without repeats
   * @param minBlankReplicates fewest calibration-blank replicates that make run-blank limits
   * @param blankLodMultiplier LOD = this * s_blank / slope
   * @param blankLoqMultiplier LOQ = this * s_blank / slope
   * @param calibrationLodMultiplier LOD = this * s0 / slope
   * @param calibrationLoqMultiplier LOQ = this * s0 / slope
   */
  public LimitPolicy {
    order = List.copyOf(order);
  }
}
