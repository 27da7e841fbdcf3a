package org.quantrun.runner.process;

import java.util.Optional;
import org.quantrun.core.importer.RawRun;
import org.quantrun.core.method.Method;
import org.quantrun.core.method.prep.PrepSheet;
import org.quantrun.core.model.RunResult;

/** Turns an imported run into its result: core's run processor, or a stand-in in tests. */
@FunctionalInterface
public interface RunPipeline {

  /**
   * Processes one run.
   *
   * @param run the imported run
   * @param method the method
   * @param prep the prep sheet, if any
   * @return the result
   * @throws RunInputException for a run-level input error, with a one-line message for the technician
   */
  RunResult process(RawRun run, Method method, Optional<PrepSheet> prep);

  /** A run-level input error found while processing (the run does not fit the method). */
  final class RunInputException extends RuntimeException {
    private static final long serialVersionUID = 1L;

    /**
     * The error.
     *
     * @param message one line for the technician
     * @param cause the original exception
     */
    public RunInputException(String message, Throwable cause) {
      super(message, cause);
    }
  }
}
