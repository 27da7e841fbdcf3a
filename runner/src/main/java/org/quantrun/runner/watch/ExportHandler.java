package org.quantrun.runner.watch;

import java.nio.file.Path;

/**
 * Processes one export for the watch service: imports it, processes it with its route's method
 * and writes its results folder. The service gives it a private work folder on the output
 * folder's file system; the handler publishes one complete results folder directly inside it (or
 * nothing), and the service then renames that folder into place. Implementations are used by
 * several workers at once and must be thread-safe.
 */
@FunctionalInterface
public interface ExportHandler {

  /**
   * Processes one export.
   *
   * @param export the export (read only, never changed or moved)
   * @param route the route that took it
   * @param workFolder an empty folder for this file alone; the results folder goes directly inside
   * @return what became of it
   * @throws RuntimeException for a fault of quantrun itself; the service reports it as an internal error
   */
  WatchOutcome handle(Path export, Route route, Path workFolder);
}
