package org.quantrun.runner;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import ch.qos.logback.classic.Level;
import ch.qos.logback.classic.LoggerContext;
import ch.qos.logback.classic.spi.LoggingEvent;
import ch.qos.logback.core.Appender;
import ch.qos.logback.core.spi.FilterReply;
import org.junit.jupiter.api.DisplayName;
import org.junit.jupiter.api.Test;
import org.slf4j.LoggerFactory;
import org.slf4j.MarkerFactory;

class LogSetupTest {

  private static LoggingEvent event(Level level, boolean fileOnly) {
    LoggerContext ctx = (LoggerContext) LoggerFactory.getILoggerFactory();
    LoggingEvent e = new LoggingEvent("test", ctx.getLogger("org.quantrun.test"), level, "message", null, null);
    if (fileOnly) {
      e.addMarker(MarkerFactory.getMarker(LogSetup.FILE_ONLY));
    }
    return e;
  }

  @Test
  @DisplayName("the console gets warnings and errors, except those a command has already told the user (FILE_ONLY)")
  void consoleFilter() {
    LogSetup.ConsoleFilter f = new LogSetup.ConsoleFilter();
    assertEquals(FilterReply.NEUTRAL, f.decide(event(Level.WARN, false)));
    assertEquals(FilterReply.NEUTRAL, f.decide(event(Level.ERROR, false)));
    assertEquals(FilterReply.DENY, f.decide(event(Level.ERROR, true)));
    assertEquals(FilterReply.DENY, f.decide(event(Level.INFO, false)));
  }

  @Test
  @DisplayName("logging is set up in code: quantrun's loggers at INFO, PF4J's off, the root at WARN with console and file")
  void levelsAndAppenders() {
    LoggerContext ctx = (LoggerContext) LoggerFactory.getILoggerFactory();
    assertEquals(Level.INFO, ctx.getLogger("org.quantrun").getLevel());
    assertEquals(Level.OFF, ctx.getLogger("org.pf4j").getLevel());
    ch.qos.logback.classic.Logger root = ctx.getLogger(org.slf4j.Logger.ROOT_LOGGER_NAME);
    assertEquals(Level.WARN, root.getLevel());
    Appender<?> file = root.getAppender("FILE");
    assertTrue(file instanceof ch.qos.logback.core.rolling.RollingFileAppender<?> r
        && r.getFile().endsWith(LogSetup.FILE_NAME), String.valueOf(file));
    assertTrue(root.getAppender("STDERR") != null);
  }
}
