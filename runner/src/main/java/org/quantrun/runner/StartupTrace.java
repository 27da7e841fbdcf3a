package org.quantrun.runner;

import java.io.PrintStream;
import java.util.ArrayList;
import java.util.List;
import java.util.Optional;

/**
 * Where a command-line run spends its time, phase by phase, for finding start-up costs. Off
 * unless the environment variable {@code QUANTRUN_TRACE_STARTUP} or the system property {@code
 * quantrun.trace.startup} is {@code 1} or {@code true}; then the phases are printed to standard
 * error when the command ends:
 *
 * <pre>
 * quantrun start-up trace (ms):    from the process start   phase
 *   Java started, trace class loaded                   70       70
 *   command line built (1 sub-command)                105       35
 *   ...
 * </pre>
 *
 * <p>Marks are cheap when tracing is off (one volatile read), so they may stay in the code.
 */
public final class StartupTrace {
  private static volatile boolean on = enabled();
  private static final long START_NANOS = System.nanoTime();
  private static final List<Mark> MARKS = new ArrayList<>();

  private record Mark(String phase, long nanos) {}

  private StartupTrace() {}

  private static boolean enabled() {
    String v = Optional.ofNullable(System.getProperty("quantrun.trace.startup")).orElse(System.getenv("QUANTRUN_TRACE_STARTUP"));
    return v != null && (v.equals("1") || v.equalsIgnoreCase("true"));
  }

  /**
   * Whether tracing is on.
   *
   * @return true when the phases are recorded
   */
  public static boolean on() {
    return on;
  }

  /** Turns tracing on from here (for tests). */
  static void turnOn() {
    on = true;
  }

  /**
   * Records that a phase has ended now.
   *
   * @param phase what was done, e.g. {@code "plugins loaded"}
   */
  public static void mark(String phase) {
    if (on) {
      synchronized (MARKS) {
        MARKS.add(new Mark(phase, System.nanoTime()));
      }
    }
  }

  /**
   * Prints the phases recorded so far (nothing when tracing is off).
   *
   * @param out where to print
   */
  public static void print(PrintStream out) {
    if (!on) {
      return;
    }
    // the JVM's own start time (exact to the millisecond; the operating system's process start
    // time is only exact to the second); read at the end, so it costs the phases nothing
    long uptimeMs = java.lang.management.ManagementFactory.getRuntimeMXBean().getUptime();
    long startOffsetMs = Math.max(0, uptimeMs - (System.nanoTime() - START_NANOS) / 1_000_000);
    List<Mark> marks;
    synchronized (MARKS) {
      marks = List.copyOf(MARKS);
    }
    out.println("quantrun start-up trace (ms):    from the process start   phase");
    out.printf("  %-40s %12d %8d%n", "Java started, trace class loaded", startOffsetMs, startOffsetMs);
    long previous = START_NANOS;
    for (Mark m : marks) {
      long since = (m.nanos() - START_NANOS) / 1_000_000 + startOffsetMs;
      out.printf("  %-40s %12d %8d%n", m.phase(), since, (m.nanos() - previous) / 1_000_000);
      previous = m.nanos();
    }
    out.flush();
  }
}
