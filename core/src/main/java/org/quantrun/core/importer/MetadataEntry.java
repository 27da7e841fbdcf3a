package org.quantrun.core.importer;

import java.util.Objects;

/**
 * One key/value item of run metadata, e.g. from a preamble line {@code Operator;J. Okafor}.
 *
 * @param key the key as exported (trimmed); never blank
 * @param value the value as exported (trimmed); may be empty
 * @param position where it was read
 */
public record MetadataEntry(String key, String value, SourcePosition position) {

  /**
   * Checks the parts.
   *
   * @param key the key as exported (trimmed); never blank
   * @param value the value as exported (trimmed); may be empty
   * @param position where it was read
   * @throws IllegalArgumentException if the key is blank
   */
  public MetadataEntry {
    Objects.requireNonNull(key, "key");
    Objects.requireNonNull(value, "value");
    Objects.requireNonNull(position, "position");
    if (key.isBlank()) {
      throw new IllegalArgumentException("metadata key must not be blank");
    }
  }
}
