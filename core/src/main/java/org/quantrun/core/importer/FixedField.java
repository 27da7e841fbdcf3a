package org.quantrun.core.importer;

import java.util.Objects;

/**
 * One field of a fixed-width record: a name (a column name, mapped like a delimited header) and
 * its character span.
 *
 * @param name the field name, e.g. {@code Sample} or {@code sample_id}
 * @param start the 1-based first character column
 * @param width the number of characters (the last field may run past it to the end of the line)
 */
public record FixedField(String name, int start, int width) {

  /**
   * Checks the parts.
   *
   * @param name the field name, e.g. {@code Sample} or {@code sample_id}
   * @param start the 1-based first character column
   * @param width the number of characters (the last field may run past it to the end of the line)
   * @throws IllegalArgumentException if the name is blank, start below 1 or width below 1
   */
  public FixedField {
    Objects.requireNonNull(name, "name");
    if (name.isBlank() || start < 1 || width < 1) {
      throw new IllegalArgumentException(
          "a fixed field needs a name, start >= 1 and width >= 1, got " + name + " " + start + " " + width);
    }
  }
}
