package org.quantrun.core.importer;

import java.util.List;
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
 */
public record Injection(
    int sequence,
    String sampleId,
    Optional<String> sampleType,
    Optional<String> timestamp,
    List<LineReadings> lines,
    SourcePosition position) {

  /**
   * Copies the list and checks the parts.
   *
   * @param sequence the 1-based position in the run: the exported sequence number when the export has one, otherwise the order of appearance
   * @param sampleId the sample id as exported, e.g. {@code W2611-007-DUP}; never blank
   * @param sampleType the sample type the export gives (e.g. {@code STD}, {@code QC}), if any; classifying samples is the method's job, not the importer's
   * @param timestamp the acquisition time stamp as exported (text, unparsed), if any
   * @param lines what each analyte line gave, in export order (one entry per analyte line)
   * @param position where the injection's first row was read
   * @throws IllegalArgumentException if the sample id is blank or the sequence is below 1
   */
  public Injection {
    Objects.requireNonNull(sampleId, "sampleId");
    Objects.requireNonNull(sampleType, "sampleType");
    Objects.requireNonNull(timestamp, "timestamp");
    lines = List.copyOf(lines);
    Objects.requireNonNull(position, "position");
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
}
