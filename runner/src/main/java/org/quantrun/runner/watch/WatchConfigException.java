package org.quantrun.runner.watch;

import java.util.List;

/** A watch configuration (or a file it names) that cannot be used; each line is ready for standard error. */
public final class WatchConfigException extends Exception {
  private static final long serialVersionUID = 1L;
  private final List<String> lines;

  /**
   * The problems.
   *
   * @param lines one line per problem, at least one
   */
  public WatchConfigException(List<String> lines) {
    super(lines.get(0));
    this.lines = List.copyOf(lines);
  }

  /**
   * One problem.
   *
   * @param line the problem
   */
  public WatchConfigException(String line) {
    this(List.of(line));
  }

  /** @return one line per problem */
  public List<String> lines() {
    return lines;
  }
}
