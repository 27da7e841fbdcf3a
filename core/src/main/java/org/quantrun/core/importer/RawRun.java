package org.quantrun.core.importer;

import java.util.LinkedHashSet;
import java.util.List;
import java.util.Objects;
import java.util.Optional;
import java.util.Set;

/**
 * A run as the instrument exported it, normalised but not interpreted: run metadata, then the
 * injections in sequence order with their readings per analyte line. Nothing here is classified,
 * averaged or calibrated; that is the method's job.
 *
 * <p>Two reads of the same bytes with the same settings give equal {@code RawRun}s.
 *
 * @param sourceName the name of the source as given to the importer (used in every message)
 * @param importerId the id of the importer that read it
 * @param metadata run metadata in export order (keys may repeat)
 * @param injections the injections in sequence order
 * @param columns the names of the export's columns as written (its header), in order; empty when
 *     the importer does not report them
 */
public record RawRun(
    String sourceName, String importerId, List<MetadataEntry> metadata, List<Injection> injections,
    List<String> columns) {

  /**
   * A run whose importer does not report the export's column names.
   *
   * @param sourceName the name of the source as given to the importer (used in every message)
   * @param importerId the id of the importer that read it
   * @param metadata run metadata in export order (keys may repeat)
   * @param injections the injections in sequence order
   */
  public RawRun(String sourceName, String importerId, List<MetadataEntry> metadata, List<Injection> injections) {
    this(sourceName, importerId, metadata, injections, List.of());
  }

  /**
   * Copies the lists and checks for nulls.
   *
   * @param sourceName the name of the source as given to the importer (used in every message)
   * @param importerId the id of the importer that read it
   * @param metadata run metadata in export order (keys may repeat)
   * @param injections the injections in sequence order
   * @param columns the names of the export's columns as written, in order
   */
  public RawRun {
    Objects.requireNonNull(sourceName, "sourceName");
    Objects.requireNonNull(importerId, "importerId");
    metadata = List.copyOf(metadata);
    injections = List.copyOf(injections);
    columns = List.copyOf(columns);
  }

  /**
   * Whether the export has a column of this name, compared as header names are
   * ({@link ColumnNames#normalise}).
   *
   * @param name the column's name
   * @return {@code true} when one of {@link #columns()} has that name
   */
  public boolean hasColumn(String name) {
    String n = ColumnNames.normalise(name);
    return columns.stream().anyMatch(c -> ColumnNames.normalise(c).equals(n));
  }

  /**
   * The first metadata value for a key, compared ignoring case.
   *
   * @param key the key
   * @return the value, or empty when the export has no such key
   */
  public Optional<String> metadataValue(String key) {
    return metadata.stream()
        .filter(m -> m.key().equalsIgnoreCase(key))
        .map(MetadataEntry::value)
        .findFirst();
  }

  /**
   * Every analyte line of the run, in order of first appearance.
   *
   * @return the analyte lines
   */
  public Set<AnalyteLine> analyteLines() {
    Set<AnalyteLine> out = new LinkedHashSet<>();
    for (Injection i : injections) {
      for (LineReadings l : i.lines()) {
        out.add(l.analyteLine());
      }
    }
    return out;
  }

  /**
   * The number of readings (replicates, reported means and SDs), valid or not.
   *
   * @return the count
   */
  public long readingCount() {
    long n = 0;
    for (Injection i : injections) {
      for (LineReadings l : i.lines()) {
        n += l.replicates().size();
        n += l.reportedMean().isPresent() ? 1 : 0;
        n += l.reportedSd().isPresent() ? 1 : 0;
      }
    }
    return n;
  }
}
