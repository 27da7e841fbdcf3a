package org.quantrun.runner.process;

import java.util.Optional;
import org.quantrun.core.importer.RawRun;
import org.quantrun.core.method.Method;
import org.quantrun.core.method.prep.PrepSheet;
import org.quantrun.core.model.RunResult;
import org.quantrun.core.processing.ProcessingException;
import org.quantrun.core.processing.RunProcessor;

/** Core's run processor as the runner's pipeline; its run-level input errors become {@link RunInputException}. */
final class CorePipeline implements RunPipeline {
  static final CorePipeline INSTANCE = new CorePipeline();

  private CorePipeline() {}

  @Override
  public RunResult process(RawRun run, Method method, Optional<PrepSheet> prep) {
    try {
      return RunProcessor.process(run, method, prep);
    } catch (ProcessingException e) {
      throw new RunInputException(e.getMessage(), e);
    }
  }
}
