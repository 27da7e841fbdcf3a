package org.quantrun.runner.generate;

import java.io.IOException;
import java.io.Writer;
import java.nio.charset.Charset;
import java.nio.charset.StandardCharsets;
import java.time.LocalDateTime;
import java.time.format.DateTimeFormatter;
import java.util.Locale;

/**
 * The export dialects the generator writes, each matching one of the bundled import profiles
 * (config-examples/importers): the same readings, three ways.
 */
enum Dialect {
  /** Comma-separated, a row per injection x line x reading; profile long-csv.yaml. */
  LONG("long", "csv", "long-csv.yaml", StandardCharsets.UTF_8),
  /** Semicolon-separated, decimal comma, a row per reading, metadata preamble; profile wide-semicolon.yaml. */
  WIDE("wide", "txt", "wide-semicolon.yaml", Charset.forName("windows-1252")),
  /** Fixed-width text report, a block per injection; profile fixed-width-report.yaml. */
  FIXED("fixed", "txt", "fixed-width-report.yaml", StandardCharsets.UTF_8);

  private static final DateTimeFormatter ISO = DateTimeFormatter.ofPattern("yyyy-MM-dd HH:mm:ss", Locale.ROOT);
  private static final DateTimeFormatter DOTTED = DateTimeFormatter.ofPattern("dd.MM.yyyy HH:mm:ss", Locale.ROOT);
  /** Seconds between injections. */
  private static final int INJECTION_SECONDS = 160;

  final String token;
  final String extension;
  final String profile;
  final Charset charset;

  Dialect(String token, String extension, String profile, Charset charset) {
    this.token = token;
    this.extension = extension;
    this.profile = profile;
    this.charset = charset;
  }

  static Dialect of(String token) {
    for (Dialect d : values()) {
      if (d.token.equalsIgnoreCase(token)) {
        return d;
      }
    }
    throw new IllegalArgumentException("unknown dialect '" + token + "' (expected: long, wide, fixed)");
  }

  /** Writes the run in this dialect. */
  void write(SyntheticRun run, LocalDateTime start, Writer w) throws IOException {
    switch (this) {
      case LONG:
        writeLong(run, start, w);
        break;
      case WIDE:
        writeWide(run, start, w);
        break;
      default:
        writeFixed(run, start, w);
        break;
    }
  }

  private static String time(LocalDateTime start, int sequence, DateTimeFormatter f) {
    return start.plusSeconds((long) INJECTION_SECONDS * (sequence - 1)).format(f);
  }

  private static void writeLong(SyntheticRun run, LocalDateTime start, Writer w) throws IOException {
    w.write("Seq,Sample ID,Type,Acquired,Element,Wavelength,Rep,Intensity,Unit,Remark\n");
    long count = 0;
    StringBuilder b = new StringBuilder(256);
    for (SyntheticRun.Shot s : run.shots) {
      String t = time(start, s.sequence(), ISO);
      for (int k = 0; k < run.lines.size(); k++) {
        SyntheticRun.Line l = run.lines.get(k);
        double[] r = s.readings()[k];
        for (int i = 0; i < r.length; i++) {
          b.setLength(0);
          b.append(s.sequence()).append(',').append(s.sampleId()).append(',').append(s.type()).append(',').append(t)
              .append(',').append(l.element()).append(',').append(l.wavelength()).append(',').append(i + 1).append(',')
              .append(num(r[i])).append(",cps,\n");
          w.write(b.toString());
          count++;
        }
      }
    }
    w.write("End of data," + count + " readings\n");
  }

  private static void writeWide(SyntheticRun run, LocalDateTime start, Writer w) throws IOException {
    w.write("Laboratory;Kestrel Brook Water Laboratory\nInstrument;ICP-OES bench 2\nRun;" + run.runId + "\n");
    w.write("Started;" + start.format(DOTTED) + "\nSignal unit;cps\n\n");
    StringBuilder b = new StringBuilder(1024);
    b.append("Seq;Sample;Kind;Time;Rep");
    for (SyntheticRun.Line l : run.lines) {
      b.append(';').append(l.label()).append(" [cps]");
    }
    w.write(b.append('\n').toString());
    for (SyntheticRun.Shot s : run.shots) {
      String t = time(start, s.sequence(), DOTTED);
      int reps = s.readings()[0].length;
      for (int i = 0; i < reps; i++) {
        b.setLength(0);
        b.append(s.sequence()).append(';').append(s.sampleId()).append(';').append(s.type()).append(';').append(t)
            .append(';').append(i + 1);
        for (int k = 0; k < run.lines.size(); k++) {
          b.append(';').append(num(s.readings()[k][i]).replace('.', ','));
        }
        w.write(b.append('\n').toString());
      }
    }
    w.write("\nSummary;" + run.shots.size() + " injections;" + run.lines.size() + " lines\n");
  }

  private static void writeFixed(SyntheticRun run, LocalDateTime start, Writer w) throws IOException {
    w.write("KESTREL BROOK WATER LABORATORY  -  ICP-OES RUN REPORT\n");
    w.write("Run:        " + run.runId + "\nInstrument: ICP-OES bench 2\nStarted:    " + start.format(ISO) + "\n\n");
    int reps = run.shots.get(0).readings()[0].length;
    StringBuilder head = new StringBuilder(String.format(Locale.ROOT, "%-14s  %-4s", "Line", "Unit"));
    StringBuilder rule = new StringBuilder("--------------  ----");
    for (int i = 1; i <= reps; i++) {
      head.append(String.format(Locale.ROOT, "  %11s", "Reading " + i));
      rule.append("  -----------");
    }
    head.append(String.format(Locale.ROOT, "  %11s  %9s  %s", "Mean", "SD", "Remark"));
    rule.append("  -----------  ---------  ----------------");
    for (SyntheticRun.Shot s : run.shots) {
      w.write(String.format(Locale.ROOT, "Injection %3d   Sample: %-17s Type: %-8s Time: %s%n", s.sequence(), s.sampleId(),
          s.type(), time(start, s.sequence(), ISO)));
      w.write(head + "\n" + rule + "\n");
      for (int k = 0; k < run.lines.size(); k++) {
        double[] r = s.readings()[k];
        StringBuilder b = new StringBuilder(String.format(Locale.ROOT, "%-14s  %-4s", run.lines.get(k).label(), "cps"));
        double mean = 0;
        for (double v : r) {
          b.append(String.format(Locale.ROOT, "  %11s", num(v)));
          mean += v / r.length;
        }
        double ss = 0;
        for (double v : r) {
          ss += (v - mean) * (v - mean);
        }
        double sd = r.length > 1 ? Math.sqrt(ss / (r.length - 1)) : 0;
        b.append(String.format(Locale.ROOT, "  %11.1f  %9.2f", mean, sd));
        w.write(b.append('\n').toString());
      }
      w.write("\n");
    }
    w.write("End of report: " + run.shots.size() + " injections\n");
  }

  /** A reading rounded to 0.1, in its shortest decimal form (e.g. 1234.5). */
  private static String num(double v) {
    if (Math.abs(v) < 1e7) {
      String t = Double.toString(v);
      return t.indexOf('.') < 0 ? t + ".0" : t;
    }
    return String.format(Locale.ROOT, "%.1f", v);
  }
}
