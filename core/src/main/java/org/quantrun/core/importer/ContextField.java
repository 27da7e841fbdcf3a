package org.quantrun.core.importer;

import java.util.Objects;

/**
 * One field of a context record: text that a line of its own gives for the injections after it
 * (such as a named group of a fixed-width report's context record pattern), rather than a cell of
 * the data rows. See {@link TableRunAssembler#contextColumns}.
 *
 * @param text the field's text; empty when the record leaves it blank
 * @param position where it was read: the context record's line, and the field's column when known
 */
public record ContextField(String text, SourcePosition position) {

  /**
   * Checks for nulls.
   *
   * @param text the field's text
   * @param position where it was read
   */
  public ContextField {
    Objects.requireNonNull(text, "text");
    Objects.requireNonNull(position, "position");
  }
}
