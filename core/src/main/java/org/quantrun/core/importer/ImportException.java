package org.quantrun.core.importer;

/**
 * The one exception an importer throws: the export cannot be read as a run. Its message is
 * written for the technician and always starts with the source name and, where known, the line
 * and column, e.g. {@code run.csv:118:4: intensity "12,5.3" is not a number}.
 *
 * <p>Values that cannot be read (such as {@code OVER} or {@code ----}) are <em>not</em> import
 * errors: they become invalid {@link Reading}s with a reason.
 */
public final class ImportException extends Exception {

  private static final long serialVersionUID = 1L;

  private final String sourceName;
  private final SourcePosition position;
  private final String problem;

  /**
   * Creates the exception.
   *
   * @param sourceName the file name (or other name) of the source, as given to the importer
   * @param position where the problem is; {@link SourcePosition#UNKNOWN} for a whole-source problem
   * @param problem what is wrong and, where useful, what was expected
   */
  public ImportException(String sourceName, SourcePosition position, String problem) {
    this(sourceName, position, problem, null);
  }

  /**
   * Creates the exception with a cause kept for the log (never shown to the user as a trace).
   *
   * @param sourceName the file name (or other name) of the source
   * @param position where the problem is
   * @param problem what is wrong and what was expected
   * @param cause the underlying exception, or {@code null}
   */
  public ImportException(String sourceName, SourcePosition position, String problem, Throwable cause) {
    super(format(sourceName, position, problem), cause);
    this.sourceName = sourceName;
    this.position = position;
    this.problem = problem;
  }

  private static String format(String sourceName, SourcePosition position, String problem) {
    String where = position.text();
    return where.isEmpty() ? sourceName + ": " + problem : sourceName + ":" + where + ": " + problem;
  }

  /**
   * The name of the source.
   *
   * @return the source name
   */
  public String sourceName() {
    return sourceName;
  }

  /**
   * Where the problem is.
   *
   * @return the position, {@link SourcePosition#UNKNOWN} when not known
   */
  public SourcePosition position() {
    return position;
  }

  /**
   * The problem without the source and position prefix.
   *
   * @return the bare problem text
   */
  public String problem() {
    return problem;
  }
}
