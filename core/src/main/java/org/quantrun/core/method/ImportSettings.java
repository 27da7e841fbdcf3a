package org.quantrun.core.method;

import java.util.Map;
import java.util.Optional;

/**
 * How the export of a run is read.
 *
 * @param importer the importer id, or {@value #AUTO} to let the importers detect the export
 * @param profile an import-profile file, relative to the method file (the runner resolves it)
 * @param settings free-form importer settings, name to value, unmodifiable, in file order
 */
public record ImportSettings(String importer, Optional<String> profile, Map<String, String> settings) {

  /** The importer id that asks for detection. */
  public static final String AUTO = "auto";

  /**
   * Copies the settings into an unmodifiable map.
   *
   * @param importer the importer id, or {@value #AUTO} to let the importers detect the export
   * @param profile an import-profile file, relative to the method file (the runner resolves it)
   * @param settings free-form importer settings, name to value, unmodifiable, in file order
   */
  public ImportSettings {
    settings = Collections2.orderedCopy(settings);
  }

  /**
   * Whether the importer is to be detected.
   *
   * @return true when {@link #importer()} is {@value #AUTO}
   */
  public boolean detect() {
    return AUTO.equals(importer);
  }
}
