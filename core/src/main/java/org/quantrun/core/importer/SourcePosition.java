package org.quantrun.core.importer;

/**
 * Where an item came from in its source file: a 1-based line and a 1-based column (for delimited
 * files the column is the field number, for fixed-width files the character column).
 *
 * <p>{@code 0} means "not known" for either part, e.g. a whole-file problem has line 0.
 *
 * @param line 1-based line number, or 0 when not known
 * @param column 1-based column, or 0 when not known
 */
public record SourcePosition(int line, int column) {

  /** The position of a problem that concerns the whole source (no line, no column). */
  public static final SourcePosition UNKNOWN = new SourcePosition(0, 0);

  /**
   * Checks the parts.
   *
   * @param line 1-based line number, or 0 when not known
   * @param column 1-based column, or 0 when not known
   * @throws IllegalArgumentException if a part is negative
   */
  public SourcePosition {
    if (line < 0 || column < 0) {
      throw new IllegalArgumentException("line and column must be >= 0, got " + line + ":" + column);
    }
  }

  /**
   * A position on a line, no column.
   *
   * @param line the 1-based line
   * @return the position
   */
  public static SourcePosition ofLine(int line) {
    return new SourcePosition(line, 0);
  }

  /**
   * The position as message text: {@code "118:4"}, {@code "118"} (no column) or {@code ""}.
   *
   * @return the text, empty when the line is not known
   */
  public String text() {
    if (line == 0) {
      return "";
    }
    return column == 0 ? Integer.toString(line) : line + ":" + column;
  }
}
