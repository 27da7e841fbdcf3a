package org.quantrun.core.importer;

import java.util.List;
import java.util.Objects;
import java.util.Optional;

/**
 * What one injection gave for one analyte line: the replicate readings in export order, the
 * mean and SD the instrument reported (if exported), the unit and any instrument remark.
 *
 * @param analyteLine the analyte line
 * @param unit the signal or concentration unit as exported (e.g. {@code cps}), if any
 * @param replicates the replicate readings in export order; may be empty when only a mean is given.
 *     An unmodifiable list, stored compactly: it makes each {@link Reading} when asked for it, equal
 *     to the one given (a run may hold millions)
 * @param reportedMean the mean the instrument reported, if exported
 * @param reportedSd the standard deviation the instrument reported, if exported
 * @param remark an instrument remark or flag text for this line, if any
 * @param position where the first item for this line was read
 */
public record LineReadings(
    AnalyteLine analyteLine,
    Optional<String> unit,
    List<Reading> replicates,
    Optional<Reading> reportedMean,
    Optional<Reading> reportedSd,
    Optional<String> remark,
    SourcePosition position) {

  /**
   * Copies the list (into a compact form: see {@code replicates()}) and checks for nulls.
   *
   * @param analyteLine the analyte line
   * @param unit the signal or concentration unit as exported (e.g. {@code cps}), if any
   * @param replicates the replicate readings in export order; may be empty when only a mean is given
   * @param reportedMean the mean the instrument reported, if exported
   * @param reportedSd the standard deviation the instrument reported, if exported
   * @param remark an instrument remark or flag text for this line, if any
   * @param position where the first item for this line was read
   */
  public LineReadings {
    Objects.requireNonNull(analyteLine, "analyteLine");
    Objects.requireNonNull(unit, "unit");
    replicates = ReadingList.copyOf(replicates);
    Objects.requireNonNull(reportedMean, "reportedMean");
    Objects.requireNonNull(reportedSd, "reportedSd");
    Objects.requireNonNull(remark, "remark");
    Objects.requireNonNull(position, "position");
  }
}
