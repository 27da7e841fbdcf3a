package org.quantrun.core.importer;

import java.util.Collections;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Objects;
import java.util.Optional;

/**
 * One injection (one aspiration of one solution) of the run, in sequence order.
 *
 * @param sequence the 1-based position in the run: the exported sequence number when the export
 *     has one, otherwise the order of appearance
 * @param sampleId the sample id as exported, e.g. {@code W2611-007-DUP}; never blank
 * @param sampleType the sample type the export gives (e.g. {@code STD}, {@code QC}), if any;
 *     classifying samples is the method's job, not the importer's
 * @param timestamp the acquisition time stamp as exported (text, unparsed), if any
 * @param lines what each analyte line gave, in export order (one entry per analyte line)
 * @param position where the injection's first row was read
 * @param columns the text of each per-injection column the import settings asked for
 *     ({@link ImportSettings#injectionColumns()}) and the export has, by the name as asked, in the
 *     order asked; empty when none was asked for
 */
public record Injection(
    int sequence,
    String sampleId,
    Optional<String> sampleType,
    Optional<String> timestamp,
    List<LineReadings> lines,
    SourcePosition position,
    Map<String, CellText> columns) {

  /**
   * An injection without per-injection columns (as before they existed).
   *
   * @param sequence the 1-based position in the run
   * @param sampleId the sample id as exported; never blank
   * @param sampleType the sample type the export gives, if any
   * @param timestamp the acquisition time stamp as exported, if any
   * @param lines what each analyte line gave, in export order
   * @param position where the injection's first row was read
   * @throws IllegalArgumentException if the sample id is blank or the sequence is below 1
   */
  public Injection(int sequence, String sampleId, Optional<String> sampleType, Optional<String> timestamp,
      List<LineReadings> lines, SourcePosition position) {
    this(sequence, sampleId, sampleType, timestamp, lines, position, Map.of());
  }

  /**
   * Copies the list and checks the parts.
   *
   * @param sequence the 1-based position in the run: the exported sequence number when the export has one, otherwise the order of appearance
   * @param sampleId the sample id as exported, e.g. {@code W2611-007-DUP}; never blank
   * @param sampleType the sample type the export gives (e.g. {@code STD}, {@code QC}), if any; classifying samples is the method's job, not the importer's
   * @param timestamp the acquisition time stamp as exported (text, unparsed), if any
   * @param lines what each analyte line gave, in export order (one entry per analyte line)
   * @param position where the injection's first row was read
   * @param columns the text of each per-injection column asked for, by the name as asked
   * @throws IllegalArgumentException if the sample id is blank or the sequence is below 1
   */
  public Injection {
    Objects.requireNonNull(sampleId, "sampleId");
    Objects.requireNonNull(sampleType, "sampleType");
    Objects.requireNonNull(timestamp, "timestamp");
    lines = List.copyOf(lines);
    Objects.requireNonNull(position, "position");
    columns = columns.isEmpty() ? Map.of() : Collections.unmodifiableMap(new LinkedHashMap<>(columns));
    if (sampleId.isBlank()) {
      throw new IllegalArgumentException("sample id must not be blank");
    }
    if (sequence < 1) {
      throw new IllegalArgumentException("sequence must be >= 1, got " + sequence);
    }
  }

  /**
   * The readings of one analyte line, if this injection has them.
   *
   * @param analyteLine the analyte line
   * @return its readings, or empty
   */
  public Optional<LineReadings> line(AnalyteLine analyteLine) {
    return lines.stream().filter(l -> l.analyteLine().equals(analyteLine)).findFirst();
  }

  /**
   * The text of a per-injection column, its name compared as header names are
   * ({@link ColumnNames#normalise}: letter case, surrounding spaces and separators ignored).
   *
   * @param name the column's name
   * @return its text for this injection, or empty when the export did not give the column
   */
  public Optional<CellText> column(String name) {
    CellText exact = columns.get(name);
    if (exact != null) {
      return Optional.of(exact);
    }
    String n = ColumnNames.normalise(name);
    return columns.entrySet().stream().filter(e -> ColumnNames.normalise(e.getKey()).equals(n))
        .map(Map.Entry::getValue).findFirst();
  }
}
