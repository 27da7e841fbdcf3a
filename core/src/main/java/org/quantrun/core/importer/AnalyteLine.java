package org.quantrun.core.importer;

import java.util.Objects;
import java.util.Optional;

/**
 * One measured channel of an analyte: the analyte (usually an element symbol) and, where the
 * instrument measures it on several, the emission line (e.g. {@code 228.802}) or mass
 * (e.g. {@code 111}).
 *
 * @param analyte the analyte as exported, e.g. {@code Cd}; never blank
 * @param line the line or mass as exported, if the export gives one
 */
public record AnalyteLine(String analyte, Optional<String> line) {

  /**
   * Checks the parts.
   *
   * @param analyte the analyte as exported, e.g. {@code Cd}; never blank
   * @param line the line or mass as exported, if the export gives one
   * @throws IllegalArgumentException if the analyte is blank or the line is present but blank
   */
  public AnalyteLine {
    Objects.requireNonNull(analyte, "analyte");
    Objects.requireNonNull(line, "line");
    if (analyte.isBlank()) {
      throw new IllegalArgumentException("analyte must not be blank");
    }
    if (line.isPresent() && line.get().isBlank()) {
      throw new IllegalArgumentException("line must not be blank when present");
    }
  }

  /**
   * An analyte line from two texts, the line being optional.
   *
   * @param analyte the analyte
   * @param line the line or mass; blank means none
   * @return the analyte line
   */
  public static AnalyteLine of(String analyte, String line) {
    String l = line == null ? "" : line.strip();
    return new AnalyteLine(analyte.strip(), l.isEmpty() ? Optional.empty() : Optional.of(l));
  }

  /**
   * A label for messages and reports: {@code "Cd 228.802"} or {@code "Cd"}.
   *
   * @return the label
   */
  public String label() {
    return line.map(l -> analyte + " " + l).orElse(analyte);
  }
}
