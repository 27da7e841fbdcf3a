package org.quantrun.runner.watch;

import java.nio.file.Path;

/** What an {@link ExportHandler} made of one export. */
public sealed interface WatchOutcome {

  /**
   * The export was processed and its results folder is complete.
   *
   * @param folder the published results folder, directly inside the work folder
   * @param summary one line for the log, e.g. the run's id and verdict
   */
  record Processed(Path folder, String summary) implements WatchOutcome {}

  /**
   * The export could not be processed because of its content or the inputs around it.
   *
   * @param problem what was wrong, in plain words, naming file, line and column where known
   * @param advice what the technician can do about it
   */
  record Refused(String problem, String advice) implements WatchOutcome {}
}
