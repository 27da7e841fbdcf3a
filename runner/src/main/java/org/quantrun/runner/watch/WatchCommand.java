package org.quantrun.runner.watch;

import java.io.PrintWriter;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.Clock;
import java.time.Duration;
import java.util.List;
import java.util.Optional;
import java.util.concurrent.Callable;
import org.quantrun.runner.Main;
import org.quantrun.runner.plugins.ImporterPlugins;
import org.quantrun.runner.plugins.PluginOptions;
import picocli.CommandLine;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Option;
import picocli.CommandLine.Parameters;

/**
 * {@code quantrun watch INBOX --method M.yaml --out DIR}, or {@code quantrun watch --config
 * WATCH.yaml}: processes every complete file dropped into the inbox, unattended, until stopped
 * (Ctrl-C or SIGTERM finish the files in progress first).
 */
@Command(
    name = "watch",
    mixinStandardHelpOptions = true,
    sortOptions = false,
    description = {
      "Watches a drop folder and processes every complete export put into it: its results folder goes to "
          + "DIR/<run>/, the export to INBOX/archive/YYYY-MM-DD/; an export that cannot be processed goes to "
          + "INBOX/failed/ beside <name>.error.txt saying what was wrong and what to do.",
      "",
      "Nothing is deleted or overwritten; a restart after a crash finishes each file exactly once. Runs "
          + "until stopped."
    },
    exitCodeListHeading = "%nExit codes:%n",
    exitCodeList = {
      "0:stopped (Ctrl-C or SIGTERM end with the JVM's own code), or --until-idle and nothing left",
      "2:bad usage or configuration: message on stderr, nothing touched"},
    footer = {"", "Caution: results need review by a qualified analyst; the lab's accredited method and local regulations govern."})
public final class WatchCommand implements Callable<Integer> {

  @Parameters(index = "0", arity = "0..1", paramLabel = "INBOX", description = "the drop folder (or 'inbox' in --config)")
  Path inbox;

  @Option(names = "--config", paramLabel = "WATCH.yaml",
      description = "watch configuration: folders, routes from sub-folders or file-name patterns to methods, timings")
  Path config;

  @Option(names = "--method", paramLabel = "M.yaml", description = "the method for every file (instead of routes)")
  Path method;

  @Option(names = "--profile", paramLabel = "PROFILE.yaml", description = "import profile, instead of the one the method names")
  Path profile;

  @Option(names = "--prep", paramLabel = "PREP.csv", description = "prep sheet for every file")
  Path prep;

  @Option(names = "--out", paramLabel = "DIR", description = "folder the results folders go into")
  Path out;

  @Option(names = "--archive", paramLabel = "DIR", description = "processed inputs (default: INBOX/archive)")
  Path archive;

  @Option(names = "--failed", paramLabel = "DIR", description = "inputs that could not be processed (default: INBOX/failed)")
  Path failed;

  @Option(names = "--state", paramLabel = "DIR", description = "journal, status.json and log (default: DIR/.watch)")
  Path state;

  @Option(names = "--quiet-period", paramLabel = "TIME", converter = DurationConverter.class,
      description = "how long size and modification time must stay the same (default: 2s)")
  Duration quiet;

  @Option(names = "--marker", paramLabel = "SUFFIX",
      description = "companion file that marks an export complete, e.g. .ready for NAME.ready")
  String marker;

  @Option(names = "--marker-only", description = "take only files whose marker is there")
  Boolean markerOnly;

  @Option(names = "--poll-interval", paramLabel = "TIME", converter = DurationConverter.class,
      description = "how often the inbox is listed, with or without change events (default: 1s)")
  Duration poll;

  @Option(names = "--poll-only", description = "do not use file-system change events (network shares)")
  boolean pollOnly;

  @Option(names = "--workers", paramLabel = "N", description = "files processed at once (default: the number of cores)")
  Integer workers;

  @Option(names = "--reprocess", description = "process content that was processed before again, instead of archiving it as a duplicate")
  boolean reprocess;

  @Option(names = "--ignore", paramLabel = "GLOB", split = ",", description = "more file names to leave alone, e.g. *.bak")
  List<String> ignore;

  @Option(names = "--status-interval", paramLabel = "TIME", converter = DurationConverter.class,
      description = "the status file is rewritten at least this often (default: 1s)")
  Duration statusInterval;

  @Option(names = "--log-max-size", paramLabel = "SIZE", converter = SizeConverter.class,
      description = "size at which the watch log rolls over (default: 10MB)")
  Long logMaxBytes;

  @Option(names = "--log-files", paramLabel = "N", description = "rolled-over logs kept (default: 5)")
  Integer logFiles;

  @Option(names = "--until-idle", description = "stop once nothing is left to take (for scheduled runs)")
  boolean untilIdle;

  @Mixin PluginOptions plugins;

  @CommandLine.Spec CommandLine.Model.CommandSpec spec;

  private final Clock clock;

  /** The command with the system clock in the local time zone (archive date folders are local dates). */
  public WatchCommand() {
    this(Clock.systemDefaultZone());
  }

  /**
   * The command with another clock (for tests).
   *
   * @param clock the clock
   */
  public WatchCommand(Clock clock) {
    this.clock = clock;
  }

  @Override
  public Integer call() {
    PrintWriter out = spec.commandLine().getOut();
    PrintWriter err = spec.commandLine().getErr();
    WatchSettings settings;
    ExportHandler handler;
    try {
      settings = settings();
      ImporterPlugins.Result loaded = plugins.load(spec);
      for (ImporterPlugins.Problem p : loaded.problems()) {
        err.println("quantrun: " + (p.source().endsWith(".jar") ? "plugin skipped: " : "") + p.text());
      }
      handler = new BatchExportHandler(settings.routes(), loaded, spec.commandLine().getParseResult().originalArgs(),
          Clock.systemUTC());
    } catch (WatchConfigException e) {
      e.lines().forEach(l -> err.println("quantrun watch: " + l));
      err.flush();
      return Main.EXIT_INPUT_ERROR;
    }
    WatchService service = new WatchService(settings, handler, clock, line -> {
      synchronized (out) {
        out.println(line);
        out.flush();
      }
    });
    Thread hook = new Thread(() -> {
      service.stop();
      try {
        service.awaitStopped(Duration.ofHours(1));
      } catch (InterruptedException e) {
        Thread.currentThread().interrupt();
      }
    }, "watch-stop");
    Runtime.getRuntime().addShutdownHook(hook);
    try (AutoCloseable log = WatchLog.start(settings.logFile(), settings.logMaxBytes(), settings.logFiles())) {
      out.println("quantrun watch: watching " + settings.inbox() + " -> " + settings.out() + " (status: "
          + settings.statusFile() + "); stop with Ctrl-C");
      out.flush();
      service.run();
      return 0;
    } catch (WatchConfigException e) {
      e.lines().forEach(l -> err.println("quantrun watch: " + l));
      err.flush();
      return Main.EXIT_INPUT_ERROR;
    } catch (Exception e) {
      err.println("quantrun watch: stopped by an error: " + e.getMessage());
      err.flush();
      return 3;
    } finally {
      try {
        Runtime.getRuntime().removeShutdownHook(hook);
      } catch (IllegalStateException e) {
        // shutting down already: the hook is running
      }
    }
  }

  WatchSettings settings() throws WatchConfigException {
    WatchDraft d = new WatchDraft();
    if (config != null) {
      WatchConfigFile.read(config, d);
    }
    if (method != null && config != null && d.routes != null) {
      throw new WatchConfigException("give either --method or routes in --config, not both");
    }
    if (inbox != null) {
      d.inbox = inbox;
    }
    if (out != null) {
      d.out = out;
    }
    if (method != null) {
      d.routes = List.of(Route.everything(method, Optional.ofNullable(profile), Optional.ofNullable(prep)));
    } else if (profile != null || prep != null) {
      throw new WatchConfigException("--profile and --prep go with --method; in a watch configuration give them per route");
    }
    d.archive = archive != null ? archive : d.archive;
    d.failed = failed != null ? failed : d.failed;
    d.state = state != null ? state : d.state;
    d.quiet = quiet != null ? quiet : d.quiet;
    d.poll = poll != null ? poll : d.poll;
    d.statusInterval = statusInterval != null ? statusInterval : d.statusInterval;
    d.marker = marker != null ? marker : d.marker;
    d.markerOnly = markerOnly != null ? markerOnly : d.markerOnly;
    d.changeEvents = pollOnly ? Boolean.FALSE : d.changeEvents;
    d.reprocess = reprocess ? Boolean.TRUE : d.reprocess;
    d.workers = workers != null ? workers : d.workers;
    d.ignore = ignore != null ? ignore : d.ignore;
    d.logMaxBytes = logMaxBytes != null ? logMaxBytes : d.logMaxBytes;
    d.logFiles = logFiles != null ? logFiles : d.logFiles;
    d.untilIdle = untilIdle;
    if (d.workers != null && d.workers < 1) {
      throw new WatchConfigException("--workers: expected at least 1");
    }
    WatchSettings s = d.build();
    if (Files.exists(s.inbox()) && !Files.isDirectory(s.inbox())) {
      throw new WatchConfigException("the inbox " + s.inbox() + " is not a folder");
    }
    if (Files.exists(s.out()) && !Files.isDirectory(s.out())) {
      throw new WatchConfigException("--out " + s.out() + ": is not a folder");
    }
    for (Route r : s.routes()) {
      if (!Files.isRegularFile(r.method())) {
        throw new WatchConfigException("method " + r.method() + (Files.exists(r.method()) ? ": is not a file" : ": no such file"));
      }
    }
    return s;
  }

  /** Reads durations such as 2s, 500ms, 1min. */
  static final class DurationConverter implements CommandLine.ITypeConverter<Duration> {
    @Override
    public Duration convert(String value) {
      return WatchConfigFile.parseDuration(value).orElseThrow(() ->
          new CommandLine.TypeConversionException("'" + value + "' is not a duration (expected e.g. 2s, 500ms or 1min)"));
    }
  }

  /** Reads sizes such as 10MB. */
  static final class SizeConverter implements CommandLine.ITypeConverter<Long> {
    @Override
    public Long convert(String value) {
      return WatchConfigFile.parseSize(value).orElseThrow(() ->
          new CommandLine.TypeConversionException("'" + value + "' is not a size (expected e.g. 10MB or 512KB, at least 1KB)"));
    }
  }
}
