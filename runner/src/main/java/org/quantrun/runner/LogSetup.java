package org.quantrun.runner;

import ch.qos.logback.classic.Level;
import ch.qos.logback.classic.Logger;
import ch.qos.logback.classic.LoggerContext;
import ch.qos.logback.classic.encoder.PatternLayoutEncoder;
import ch.qos.logback.classic.spi.Configurator;
import ch.qos.logback.classic.spi.ConfiguratorRank;
import ch.qos.logback.classic.spi.ILoggingEvent;
import ch.qos.logback.core.ConsoleAppender;
import ch.qos.logback.core.filter.Filter;
import ch.qos.logback.core.rolling.RollingFileAppender;
import ch.qos.logback.core.rolling.SizeAndTimeBasedRollingPolicy;
import ch.qos.logback.core.spi.ContextAwareBase;
import ch.qos.logback.core.spi.FilterReply;
import ch.qos.logback.core.util.FileSize;
import java.nio.file.Path;
import java.util.List;
import org.slf4j.Marker;

/**
 * quantrun's logging set-up, made in code rather than read from an XML file (parsing the XML costs
 * a command-line run a few hundred milliseconds of start-up). Logback finds it through {@code
 * META-INF/services}.
 *
 * <ul>
 *   <li>Console: concise. quantrun prints its own one-line messages; only warnings and errors that
 *       no command has already reported (events without the {@value #FILE_ONLY} marker) reach
 *       standard error, as one line each, never a stack trace.
 *   <li>Log file {@code quantrun.log}: detailed (time, level, thread, logger, message, stack
 *       traces), rolled daily and at 10 MB, 14 days and at most 200 MB kept. Its folder is the
 *       system property {@code quantrun.log.dir}, else the environment variable {@code
 *       QUANTRUN_LOG_DIR}, else {@code .quantrun/logs} in the user's home folder.
 *   <li>quantrun's own loggers at INFO, everything else at WARN, PF4J's off (quantrun reports
 *       plugin problems itself).
 * </ul>
 *
 * <p>A lab that wants its own logging names a logback XML file with the system property {@code
 * logback.configurationFile}; this set-up then steps aside.
 */
@ConfiguratorRank(ConfiguratorRank.CUSTOM_NORMAL_PRIORITY)
public final class LogSetup extends ContextAwareBase implements Configurator {

  /** The marker of events a command has already told the user about: they go to the log file only. */
  public static final String FILE_ONLY = "FILE_ONLY";

  /** The log file's name in its folder. */
  public static final String FILE_NAME = "quantrun.log";

  @Override
  public ExecutionStatus configure(LoggerContext ctx) {
    if (System.getProperty("logback.configurationFile") != null) {
      return ExecutionStatus.INVOKE_NEXT_IF_ANY;
    }
    ConsoleAppender<ILoggingEvent> console = new ConsoleAppender<>();
    console.setContext(ctx);
    console.setName("STDERR");
    console.setTarget("System.err");
    console.addFilter(new ConsoleFilter());
    console.setEncoder(encoder(ctx, "quantrun: %msg%n%nopex"));
    console.start();

    String dir = logDir().toString();
    RollingFileAppender<ILoggingEvent> file = new RollingFileAppender<>();
    file.setContext(ctx);
    file.setName("FILE");
    file.setFile(dir + "/" + FILE_NAME);
    SizeAndTimeBasedRollingPolicy<ILoggingEvent> rolling = new SizeAndTimeBasedRollingPolicy<>();
    rolling.setContext(ctx);
    rolling.setParent(file);
    rolling.setFileNamePattern(dir + "/quantrun-%d{yyyy-MM-dd}.%i.log.gz");
    rolling.setMaxFileSize(FileSize.valueOf("10MB"));
    rolling.setMaxHistory(14);
    rolling.setTotalSizeCap(FileSize.valueOf("200MB"));
    rolling.start();
    file.setRollingPolicy(rolling);
    file.setEncoder(encoder(ctx, "%d{yyyy-MM-dd'T'HH:mm:ss.SSSXXX} %-5level [%thread] %logger{36} - %msg%n"));
    file.start();

    ctx.getLogger("org.pf4j").setLevel(Level.OFF);
    ctx.getLogger("org.quantrun").setLevel(Level.INFO);
    Logger root = ctx.getLogger(Logger.ROOT_LOGGER_NAME);
    root.setLevel(Level.WARN);
    root.addAppender(console);
    root.addAppender(file);
    return ExecutionStatus.DO_NOT_INVOKE_NEXT_IF_ANY;
  }

  /**
   * The log folder: the system property {@code quantrun.log.dir}, else the environment variable
   * {@code QUANTRUN_LOG_DIR}, else {@code .quantrun/logs} in the user's home folder.
   *
   * @return the folder (it need not exist yet)
   */
  public static Path logDir() {
    String dir = System.getProperty("quantrun.log.dir");
    if (dir == null || dir.isBlank()) {
      dir = System.getenv("QUANTRUN_LOG_DIR");
    }
    if (dir == null || dir.isBlank()) {
      return Path.of(System.getProperty("user.home"), ".quantrun", "logs");
    }
    return Path.of(dir);
  }

  private static PatternLayoutEncoder encoder(LoggerContext ctx, String pattern) {
    PatternLayoutEncoder encoder = new PatternLayoutEncoder();
    encoder.setContext(ctx);
    encoder.setPattern(pattern);
    encoder.start();
    return encoder;
  }

  /** Lets through warnings and errors that carry no {@value #FILE_ONLY} marker. */
  static final class ConsoleFilter extends Filter<ILoggingEvent> {
    ConsoleFilter() {
      start();
    }

    @Override
    public FilterReply decide(ILoggingEvent event) {
      if (!event.getLevel().isGreaterOrEqual(Level.WARN)) {
        return FilterReply.DENY;
      }
      List<Marker> markers = event.getMarkerList();
      if (markers != null) {
        for (Marker m : markers) {
          if (m.contains(FILE_ONLY)) {
            return FilterReply.DENY;
          }
        }
      }
      return FilterReply.NEUTRAL;
    }
  }
}
