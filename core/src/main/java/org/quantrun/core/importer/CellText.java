package org.quantrun.core.importer;

import java.util.Objects;
import java.util.OptionalDouble;

/**
 * The text of one per-injection column of the export (a column the method names, such as a
 * dilution factor or a standard's level; see {@link ImportSettings#injectionColumns()}), as one
 * injection gave it.
 *
 * @param text the cell's text, stripped of surrounding spaces; empty for a blank cell
 * @param number the text read as a number with the import profile's decimal and thousands
 *     separators; empty when the text is blank or not a finite number in that format
 * @param numberFormat how numbers were read, for messages (e.g. {@code decimal separator ',', no
 *     thousands separator})
 * @param position where the text was read (line and column); the injection's first row when every
 *     row left the cell blank
 */
public record CellText(String text, OptionalDouble number, String numberFormat, SourcePosition position) {

  /**
   * Checks for nulls.
   *
   * @param text the cell's text, stripped of surrounding spaces; empty for a blank cell
   * @param number the text read as a number, if it is one
   * @param numberFormat how numbers were read, for messages
   * @param position where the text was read
   */
  public CellText {
    Objects.requireNonNull(text, "text");
    Objects.requireNonNull(number, "number");
    Objects.requireNonNull(numberFormat, "numberFormat");
    Objects.requireNonNull(position, "position");
  }

  /** @return whether the cell is blank */
  public boolean isBlank() {
    return text.isEmpty();
  }
}
