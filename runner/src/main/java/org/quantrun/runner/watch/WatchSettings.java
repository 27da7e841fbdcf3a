package org.quantrun.runner.watch;

import java.nio.file.Path;
import java.time.Duration;
import java.util.List;
import java.util.Optional;

/**
 * Everything {@code quantrun watch} needs to know, from the command line or a watch
 * configuration file. Relative paths are already resolved.
 *
 * @param inbox the drop folder
 * @param out the folder the results folders go into
 * @param archive where processed inputs go, in a folder per day ({@code INBOX/archive} by default)
 * @param failed where inputs that could not be processed go ({@code INBOX/failed} by default)
 * @param state the service's own folder: journal, status file, log, work area ({@code OUT/.watch} by default)
 * @param routes which method processes which file; the first route that takes a file wins
 * @param quietPeriod how long a file's size and modification time must stay the same before it is taken
 * @param marker a companion-file suffix (e.g. {@code .ready}): {@code NAME.ready} beside {@code NAME}
 *     means NAME is complete; empty when not used
 * @param markerOnly when true, only files with a marker are taken (the quiet period alone is not enough)
 * @param ignore extra file-name globs to leave alone, beyond the built-in ones
 * @param pollInterval how often the inbox is listed, whatever change events say
 * @param useChangeEvents whether to ask the file system for change events as well as polling
 * @param workers how many files are processed at once
 * @param reprocess whether content that was already processed is processed again
 * @param statusInterval how often the status file is rewritten at the least
 * @param logMaxBytes the size at which the watch log is rolled over
 * @param logFiles how many rolled-over logs are kept
 * @param untilIdle whether to stop once the inbox holds nothing more to take
 */
public record WatchSettings(Path inbox, Path out, Path archive, Path failed, Path state, List<Route> routes,
    Duration quietPeriod, Optional<String> marker, boolean markerOnly, List<String> ignore, Duration pollInterval,
    boolean useChangeEvents, int workers, boolean reprocess, Duration statusInterval, long logMaxBytes, int logFiles,
    boolean untilIdle) {

  /** The default quiet period. */
  public static final Duration DEFAULT_QUIET = Duration.ofSeconds(2);
  /** The default polling interval. */
  public static final Duration DEFAULT_POLL = Duration.ofSeconds(1);
  /** The default status interval. */
  public static final Duration DEFAULT_STATUS = Duration.ofSeconds(1);
  /** The default log size before roll-over: 10 MB. */
  public static final long DEFAULT_LOG_BYTES = 10L * 1024 * 1024;
  /** The default number of rolled-over logs kept. */
  public static final int DEFAULT_LOG_FILES = 5;

  /** Copies the lists and checks the numbers. */
  public WatchSettings {
    inbox = inbox.toAbsolutePath().normalize();
    out = out.toAbsolutePath().normalize();
    archive = archive.toAbsolutePath().normalize();
    failed = failed.toAbsolutePath().normalize();
    state = state.toAbsolutePath().normalize();
    routes = List.copyOf(routes);
    ignore = List.copyOf(ignore);
    if (routes.isEmpty()) {
      throw new IllegalArgumentException("at least one route is needed");
    }
    if (workers < 1) {
      throw new IllegalArgumentException("workers must be at least 1");
    }
    if (markerOnly && marker.isEmpty()) {
      throw new IllegalArgumentException("marker-only needs a marker suffix");
    }
  }

  /**
   * The default number of workers: the number of processor cores.
   *
   * @return at least 1
   */
  public static int defaultWorkers() {
    return Math.max(1, Runtime.getRuntime().availableProcessors());
  }

  /** @return the journal file */
  Path journal() {
    return state.resolve("journal.jsonl");
  }

  /** @return the status file */
  Path statusFile() {
    return state.resolve("status.json");
  }

  /** @return the work area: a folder per file in progress, on the output folder's file system */
  Path work() {
    return out.resolve(".watch-work");
  }

  /** @return the lock file that keeps a second service off the same folders */
  Path lockFile() {
    return state.resolve("lock");
  }

  /** @return the watch log */
  Path logFile() {
    return state.resolve("logs").resolve("watch.log");
  }
}
