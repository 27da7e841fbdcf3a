package org.quantrun.core.method;

import java.util.Optional;

/**
 * One problem found in a method file (or a prep sheet), with where it is.
 *
 * @param source the file name the text was loaded as
 * @param line 1-based line, or 0 when the problem concerns the whole file
 * @param column 1-based column, or 0 when the problem concerns the whole file
 * @param path the key path, e.g. {@code analytes[3].curve} (list indices from 0), or empty
 * @param message what is wrong
 * @param expected what was expected instead, when that can be said
 */
public record MethodProblem(String source, int line, int column, String path, String message, Optional<String> expected) {

  /**
   * The problem as one line: {@code FILE:LINE:COL: key.path: message (expected ...)}.
   *
   * @return the formatted problem
   */
  @Override
  public String toString() {
    StringBuilder sb = new StringBuilder(source);
    if (line > 0) {
      sb.append(':').append(line).append(':').append(column);
    }
    sb.append(": ");
    if (!path.isEmpty()) {
      sb.append(path).append(": ");
    }
    sb.append(message);
    expected.ifPresent(e -> sb.append(" (expected ").append(e).append(')'));
    return sb.toString();
  }
}
