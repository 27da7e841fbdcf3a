package org.quantrun.runner.watch;

import java.nio.file.Path;
import java.time.Duration;
import java.util.ArrayList;
import java.util.List;
import java.util.Optional;

/**
 * The watch settings while they are gathered from a configuration file and the command line
 * (the command line wins); {@link #build()} checks them and fills in the defaults.
 */
final class WatchDraft {
  Path inbox;
  Path out;
  Path archive;
  Path failed;
  Path state;
  Duration quiet;
  Duration poll;
  Duration statusInterval;
  String marker;
  Boolean markerOnly;
  Boolean changeEvents;
  Boolean reprocess;
  Integer workers;
  Integer logFiles;
  Long logMaxBytes;
  List<String> ignore;
  List<Route> routes;
  boolean untilIdle;

  /**
   * The settings.
   *
   * @return the settings
   * @throws WatchConfigException if something needed is missing or does not fit
   */
  WatchSettings build() throws WatchConfigException {
    List<String> problems = new ArrayList<>();
    if (inbox == null) {
      problems.add("no inbox: name the folder to watch (INBOX, or 'inbox' in the watch configuration)");
    }
    if (out == null) {
      problems.add("no output folder: give --out DIR (or 'out' in the watch configuration)");
    }
    if (routes == null || routes.isEmpty()) {
      problems.add("no method: give --method M.yaml, or routes in a watch configuration (--config)");
    }
    if (Boolean.TRUE.equals(markerOnly) && (marker == null || marker.isEmpty())) {
      problems.add("marker-only needs a marker suffix (e.g. --marker .ready)");
    }
    if (marker != null && (marker.isEmpty() || marker.contains("/") || marker.contains("\\"))) {
      problems.add("marker: '" + marker + "' is not a usable file-name suffix (expected e.g. .ready or .done)");
    }
    if (!problems.isEmpty()) {
      throw new WatchConfigException(problems);
    }
    Path in = inbox.toAbsolutePath().normalize();
    Path o = out.toAbsolutePath().normalize();
    if (in.equals(o) || o.startsWith(in)) {
      throw new WatchConfigException("the output folder " + o + " must not be the inbox or inside it");
    }
    return new WatchSettings(in, o,
        archive == null ? in.resolve("archive") : archive,
        failed == null ? in.resolve("failed") : failed,
        state == null ? o.resolve(".watch") : state,
        routes,
        quiet == null ? WatchSettings.DEFAULT_QUIET : quiet,
        Optional.ofNullable(marker),
        Boolean.TRUE.equals(markerOnly),
        ignore == null ? List.of() : ignore,
        poll == null ? WatchSettings.DEFAULT_POLL : poll,
        changeEvents == null || changeEvents,
        workers == null ? WatchSettings.defaultWorkers() : workers,
        Boolean.TRUE.equals(reprocess),
        statusInterval == null ? WatchSettings.DEFAULT_STATUS : statusInterval,
        logMaxBytes == null ? WatchSettings.DEFAULT_LOG_BYTES : logMaxBytes,
        logFiles == null ? WatchSettings.DEFAULT_LOG_FILES : logFiles,
        untilIdle);
  }
}
