package org.quantrun.runner.process;

import java.util.Optional;
import org.quantrun.core.importer.RawRun;
import org.quantrun.core.method.Method;
import org.quantrun.core.method.prep.PrepSheet;
import org.quantrun.core.model.RunResult;

/** Core's run processor as the runner's pipeline. */
final class CorePipeline implements RunPipeline {
  static final CorePipeline INSTANCE = new CorePipeline();

  private CorePipeline() {}

  @Override
  public RunResult process(RawRun run, Method method, Optional<PrepSheet> prep) {
    throw new IllegalStateException("the run processor is not in this build yet");
  }
}
