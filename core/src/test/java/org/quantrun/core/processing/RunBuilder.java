package org.quantrun.core.processing;

import java.util.ArrayList;
import java.util.List;
import java.util.Optional;
import org.quantrun.core.importer.AnalyteLine;
import org.quantrun.core.importer.Injection;
import org.quantrun.core.importer.LineReadings;
import org.quantrun.core.importer.MetadataEntry;
import org.quantrun.core.importer.RawRun;
import org.quantrun.core.importer.Reading;
import org.quantrun.core.importer.SourcePosition;
import org.quantrun.core.method.Method;
import org.quantrun.core.method.MethodException;
import org.quantrun.core.method.MethodLoader;

/** Builds small runs and methods for processor tests, as an importer would. */
final class RunBuilder {
  private final String source;
  private final List<Injection> injections = new ArrayList<>();
  private final List<MetadataEntry> metadata = new ArrayList<>();
  private int line = 2;
  private List<String> columns = List.of();
  private final java.util.Map<String, org.quantrun.core.importer.CellText> cells = new java.util.LinkedHashMap<>();
  private Optional<String> type = Optional.empty();
  private int nextSequence;

  RunBuilder(String source) {
    this.source = source;
  }

  RunBuilder meta(String key, String value) {
    metadata.add(new MetadataEntry(key, value, new SourcePosition(1, 1)));
    return this;
  }

  /** The export's column names, as an importer reports its header. */
  RunBuilder columns(String... names) {
    columns = List.of(names);
    return this;
  }

  /**
   * A per-injection cell of the next injection (every column named by {@link #columns} that is not
   * given is blank), read as a number with a decimal point (as the
   * delimited importer would with the default profile); column 9 of its first line.
   */
  RunBuilder cell(String column, String text) {
    org.quantrun.core.importer.ValueReader reader =
        new org.quantrun.core.importer.ValueReader(source, org.quantrun.core.importer.ImportSettings.DEFAULT);
    cells.put(column, new org.quantrun.core.importer.CellText(text.strip(), reader.number(text), reader.numberFormat(),
        new SourcePosition(line, 9)));
    return this;
  }

  /** The sample type the importer found for the next injection by its own column names (a {@code Type} column, say). */
  RunBuilder type(String text) {
    type = Optional.of(text);
    return this;
  }

  /** The sequence number the export gives the next injection (else its place in the run). */
  RunBuilder sequence(int n) {
    nextSequence = n;
    return this;
  }

  /** An injection whose lines are given as "Analyte line" followed by its readings. */
  RunBuilder inject(String sampleId, Object... lineThenReadings) {
    List<LineReadings> lines = new ArrayList<>();
    int first = line;
    int i = 0;
    while (i < lineThenReadings.length) {
      String[] al = ((String) lineThenReadings[i++]).split(" ", 2);
      double[] values = (double[]) lineThenReadings[i++];
      List<Reading> reps = new ArrayList<>();
      for (double v : values) {
        reps.add(Double.isNaN(v) ? Reading.invalid("instrument reported \"OVER\"", new SourcePosition(line, 8))
            : Reading.valid(v, new SourcePosition(line, 8)));
        line++;
      }
      lines.add(new LineReadings(AnalyteLine.of(al[0], al.length > 1 ? al[1] : ""), Optional.of("cps"), reps,
          Optional.empty(), Optional.empty(), Optional.empty(), new SourcePosition(first, 1)));
    }
    for (String c : columns) {
      if (!cells.containsKey(c)) {
        cell(c, "");
      }
    }
    injections.add(new Injection(nextSequence > 0 ? nextSequence : injections.size() + 1, sampleId, type, Optional.empty(),
        lines, new SourcePosition(first, 1), cells));
    nextSequence = 0;
    cells.clear();
    type = Optional.empty();
    return this;
  }

  RawRun build() {
    return new RawRun(source, "test", metadata, injections, columns);
  }

  static double[] r(double... v) {
    return v;
  }

  static Method method(String yaml) {
    try {
      return MethodLoader.load(yaml, "test.yaml");
    } catch (MethodException e) {
      throw new AssertionError(e.getMessage(), e);
    }
  }
}
