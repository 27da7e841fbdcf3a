package org.quantrun.core.processing;

/**
 * The run cannot be processed with this method: an injection nobody recognises when the method
 * rejects such injections, a standard whose level cannot be told, a prep sheet that does not fit.
 * The message is one line for the technician and names the source, the injection and what to do.
 */
public final class ProcessingException extends RuntimeException {
  private static final long serialVersionUID = 1L;

  /** A processing error with its one-line message. */
  public ProcessingException(String message) {
    super(message);
  }
}
