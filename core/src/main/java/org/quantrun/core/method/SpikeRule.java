package org.quantrun.core.method;

import java.util.List;
import java.util.Map;
import org.quantrun.core.qc.Window;

/**
 * The matrix spike (and spike duplicate): recovery = (spiked - unspiked) / added * 100, not
 * judged when the unspiked result exceeds {@code maxBackgroundRatio} times the amount added.
 *
 * @param added analyte name to concentration added to the final solution, unmodifiable
 * @param exempt analyte names explicitly not spiked
 * @param recovery the accepted recovery, percent
 * @param maxBackgroundRatio unspiked / added above which the recovery is not evaluated
 * @param duplicate the rule for the spike / spike-duplicate pair
 */
public record SpikeRule(
    Map<String, Double> added, List<String> exempt, Window recovery, double maxBackgroundRatio, PairRule duplicate) {

  /**
   * Copies the collections into unmodifiable ones.
   *
   * @param added analyte name to concentration added to the final solution, unmodifiable
   * @param exempt analyte names explicitly not spiked
   * @param recovery the accepted recovery, percent
   * @param maxBackgroundRatio unspiked / added above which the recovery is not evaluated
   * @param duplicate the rule for the spike / spike-duplicate pair
   */
  public SpikeRule {
    added = Collections2.orderedCopy(added);
    exempt = List.copyOf(exempt);
  }
}
