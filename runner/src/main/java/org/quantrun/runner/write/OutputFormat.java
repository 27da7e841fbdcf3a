package org.quantrun.runner.write;

import java.util.Arrays;
import java.util.List;
import java.util.Locale;
import java.util.stream.Collectors;

/**
 * The outputs {@code --formats} can choose. {@code audit.json} is not among them: it is always
 * written, since it records what made the folder.
 */
public enum OutputFormat {
  /** {@code results.csv}, {@code results-wide.csv}, {@code calibration.csv}, {@code calibration-levels.csv}, {@code qc.csv}, {@code reruns.csv}. */
  CSV("csv", List.of("results.csv", "results-wide.csv", "calibration.csv", "calibration-levels.csv", "qc.csv", "reruns.csv")),
  /** {@code run.json}. */
  JSON("json", List.of("run.json")),
  /** {@code report.html}. */
  HTML("html", List.of("report.html"));

  private final String label;
  private final List<String> files;

  OutputFormat(String label, List<String> files) {
    this.label = label;
    this.files = files;
  }

  /**
   * The name on the command line.
   *
   * @return e.g. {@code csv}
   */
  public String label() {
    return label;
  }

  /**
   * The files this format writes.
   *
   * @return file names
   */
  public List<String> files() {
    return files;
  }

  /**
   * The format named on the command line.
   *
   * @param label {@code csv}, {@code json} or {@code html} (any case)
   * @return the format
   * @throws IllegalArgumentException naming the known formats
   */
  public static OutputFormat fromLabel(String label) {
    for (OutputFormat f : values()) {
      if (f.label.equals(label.trim().toLowerCase(Locale.ROOT))) {
        return f;
      }
    }
    throw new IllegalArgumentException("unknown format '" + label + "' (expected: "
        + Arrays.stream(values()).map(OutputFormat::label).collect(Collectors.joining(", ")) + ")");
  }
}
