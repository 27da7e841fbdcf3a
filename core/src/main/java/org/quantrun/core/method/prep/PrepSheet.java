package org.quantrun.core.method.prep;

import java.util.List;
import java.util.Optional;

/**
 * A parsed prep sheet.
 *
 * @param source the file name it was read as
 * @param rows its rows in file order, unique by sample ID
 */
public record PrepSheet(String source, List<PrepSheetRow> rows) {

  /**
   * Copies the rows into an unmodifiable list.
   *
   * @param source the file name it was read as
   * @param rows its rows in file order, unique by sample ID
   */
  public PrepSheet {
    rows = List.copyOf(rows);
  }

  /**
   * The row of one sample.
   *
   * @param sampleId the sample ID
   * @return its row, or empty when the sheet does not list it
   */
  public Optional<PrepSheetRow> row(String sampleId) {
    return rows.stream().filter(r -> r.sampleId().equals(sampleId)).findFirst();
  }

  /**
   * The rows of one prep batch, in file order.
   *
   * @param prepBatch the batch
   * @return its rows, possibly empty
   */
  public List<PrepSheetRow> batch(String prepBatch) {
    return rows.stream().filter(r -> r.prepBatch().equals(prepBatch)).toList();
  }

  /**
   * The prep batches, in order of first appearance.
   *
   * @return the batch names
   */
  public List<String> batches() {
    return rows.stream().map(PrepSheetRow::prepBatch).distinct().toList();
  }
}
