package org.quantrun.core.method;

import java.util.Map;
import java.util.Optional;

/**
 * One calibration level of a mixed standard. A level may be injected more than once in a run;
 * an analyte absent from {@code concentrations} is not calibrated with this level.
 *
 * @param name the level's name, e.g. {@code S3}
 * @param concentrations analyte name to concentration (in each analyte's unit), positive values,
 *     unmodifiable, in file order
 */
public record StandardLevel(String name, Map<String, Double> concentrations) {

  /**
   * Copies the concentrations into an unmodifiable map.
   *
   * @param name the level's name, e.g. {@code S3}
   * @param concentrations analyte name to concentration (in each analyte's unit), positive values, unmodifiable, in file order
   */
  public StandardLevel {
    concentrations = Collections2.orderedCopy(concentrations);
  }

  /**
   * The concentration of one analyte in this level.
   *
   * @param analyte the analyte name
   * @return its concentration, or empty when the level does not hold it
   */
  public Optional<Double> concentration(String analyte) {
    return Optional.ofNullable(concentrations.get(analyte));
  }
}
