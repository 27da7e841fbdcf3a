package org.quantrun.core.method;

import java.util.List;
import java.util.Map;
import java.util.Optional;
import org.quantrun.core.qc.Window;

/**
 * A check standard with known values (ICV, CCV, low-level check, LCS): true values per analyte
 * and the recovery window, measured / true * 100.
 *
 * @param trueValues analyte name to true concentration (analyte's unit), unmodifiable
 * @param exempt analyte names explicitly not checked by this standard
 * @param recovery the accepted recovery, percent
 */
public record CheckStandard(Map<String, Double> trueValues, List<String> exempt, Window recovery) {

  /**
   * Copies the collections into unmodifiable ones.
   *
   * @param trueValues analyte name to true concentration (analyte's unit), unmodifiable
   * @param exempt analyte names explicitly not checked by this standard
   * @param recovery the accepted recovery, percent
   */
  public CheckStandard {
    trueValues = Collections2.orderedCopy(trueValues);
    exempt = List.copyOf(exempt);
  }

  /**
   * The true value of one analyte.
   *
   * @param analyte the analyte name
   * @return its true value, or empty when the analyte is exempt
   */
  public Optional<Double> trueValue(String analyte) {
    return Optional.ofNullable(trueValues.get(analyte));
  }
}
