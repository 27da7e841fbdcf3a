package org.quantrun.runner.watch;

import ch.qos.logback.classic.Level;
import ch.qos.logback.classic.LoggerContext;
import ch.qos.logback.classic.encoder.PatternLayoutEncoder;
import ch.qos.logback.classic.spi.ILoggingEvent;
import ch.qos.logback.core.rolling.FixedWindowRollingPolicy;
import ch.qos.logback.core.rolling.RollingFileAppender;
import ch.qos.logback.core.rolling.SizeBasedTriggeringPolicy;
import ch.qos.logback.core.util.FileSize;
import java.nio.file.Path;
import org.slf4j.LoggerFactory;

/**
 * The watch service's own log file, rolled over by size: {@code watch.log}, then {@code
 * watch.1.log} (newest) to {@code watch.N.log} (oldest); older ones are deleted.
 */
final class WatchLog {
  private WatchLog() {}

  /**
   * Sends the watch service's log events (INFO and above) to a size-rolled file instead of the console.
   *
   * @param file the log file
   * @param maxBytes the size that starts a new file
   * @param keep how many rolled-over files are kept
   * @return a handle that detaches the log again
   */
  static AutoCloseable start(Path file, long maxBytes, int keep) {
    if (!(LoggerFactory.getILoggerFactory() instanceof LoggerContext ctx)) {
      return () -> { };
    }
    String name = file.getFileName().toString();
    String stem = name.endsWith(".log") ? name.substring(0, name.length() - 4) : name;
    RollingFileAppender<ILoggingEvent> appender = new RollingFileAppender<>();
    appender.setContext(ctx);
    appender.setName("watch-log");
    appender.setFile(file.toString());
    FixedWindowRollingPolicy rolling = new FixedWindowRollingPolicy();
    rolling.setContext(ctx);
    rolling.setParent(appender);
    rolling.setFileNamePattern(file.resolveSibling(stem + ".%i.log").toString());
    rolling.setMinIndex(1);
    rolling.setMaxIndex(Math.max(1, keep));
    rolling.start();
    SizeBasedTriggeringPolicy<ILoggingEvent> trigger = new SizeBasedTriggeringPolicy<>();
    trigger.setContext(ctx);
    trigger.setMaxFileSize(new FileSize(maxBytes));
    // look at the size at most every 100 ms (logback's default waits a minute between looks)
    trigger.setCheckIncrement(ch.qos.logback.core.util.Duration.buildByMilliseconds(100));
    trigger.start();
    PatternLayoutEncoder encoder = new PatternLayoutEncoder();
    encoder.setContext(ctx);
    encoder.setPattern("%d{yyyy-MM-dd'T'HH:mm:ss.SSSXXX} %-5level [%thread] %logger{0} - %msg%n");
    encoder.start();
    appender.setRollingPolicy(rolling);
    appender.setTriggeringPolicy(trigger);
    appender.setEncoder(encoder);
    appender.start();
    // the service's events reach the console through the command already: the file only
    ch.qos.logback.classic.Logger logger = ctx.getLogger(WatchLog.class.getPackageName());
    Level before = logger.getLevel();
    boolean additive = logger.isAdditive();
    logger.setLevel(Level.INFO);
    logger.setAdditive(false);
    logger.addAppender(appender);
    return () -> {
      logger.detachAppender(appender);
      logger.setLevel(before);
      logger.setAdditive(additive);
      appender.stop();
    };
  }
}
