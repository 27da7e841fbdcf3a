package org.quantrun.core.model;

import java.util.Collections;
import java.util.LinkedHashMap;
import java.util.Map;

/**
 * What was processed, with what.
 *
 * @param runId the run's id: from the export's metadata when it names one, else from the source name
 * @param sourceName the export's name as read
 * @param importerId the importer that read it
 * @param methodId the method's id
 * @param methodVersion the method's version
 * @param metadata the export's run metadata, first value per key, in export order
 */
public record RunInfo(
    String runId, String sourceName, String importerId, String methodId, String methodVersion,
    Map<String, String> metadata) {

  /** Copies the metadata. */
  public RunInfo {
    metadata = Collections.unmodifiableMap(new LinkedHashMap<>(metadata));
  }
}
