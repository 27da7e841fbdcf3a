package org.quantrun.runner;

/**
 * Bad input to a command (a file that cannot be read, a value that is not a number). The message
 * is one line, written for the person running the command, and already names the file, line and
 * column where they are known: {@code points.csv:5:2: y "1,2.3" is not a number}.
 */
public final class InputException extends RuntimeException {
  private static final long serialVersionUID = 1L;

  /** An input error with its one-line message. */
  public InputException(String message) {
    super(message);
  }
}
