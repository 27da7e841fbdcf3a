package org.quantrun.core.method;

import java.util.List;
import java.util.stream.Collectors;

/**
 * A method file (or prep sheet) that cannot be used. The message lists every problem found, one
 * per line, in file order.
 */
public final class MethodException extends Exception {

  private final transient List<MethodProblem> problems;

  /**
   * Creates the exception.
   *
   * @param problems the problems, at least one
   */
  public MethodException(List<MethodProblem> problems) {
    super(problems.stream().map(MethodProblem::toString).collect(Collectors.joining(System.lineSeparator())));
    if (problems.isEmpty()) {
      throw new IllegalArgumentException("a MethodException needs at least one problem");
    }
    this.problems = List.copyOf(problems);
  }

  /**
   * Every problem found.
   *
   * @return the problems, in file order, never empty
   */
  public List<MethodProblem> problems() {
    return problems;
  }
}
