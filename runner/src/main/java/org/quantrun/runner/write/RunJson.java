package org.quantrun.runner.write;

import com.fasterxml.jackson.core.JsonEncoding;
import com.fasterxml.jackson.core.JsonFactory;
import com.fasterxml.jackson.core.StreamWriteFeature;
import com.fasterxml.jackson.core.JsonGenerator;
import com.fasterxml.jackson.core.JsonStreamContext;
import com.fasterxml.jackson.core.SerializableString;
import com.fasterxml.jackson.core.io.SerializedString;
import com.fasterxml.jackson.core.util.MinimalPrettyPrinter;
import java.io.IOException;
import java.io.OutputStream;
import java.io.StringWriter;
import java.util.IdentityHashMap;
import java.util.List;
import org.quantrun.core.Token;
import org.quantrun.core.model.AnalyteResult;
import org.quantrun.core.model.CalibrationResult;
import org.quantrun.core.model.RunResult;

/**
 * Writes {@code run.json}: everything the CSV files hold, machine-readable, plus what CSV cannot
 * hold well (run metadata, findings, each result's flags by quantrun's own names and its trace,
 * each calibration's levels and trace). Each table becomes an array of objects keyed by the CSV
 * column names, one object per line; an absent value is {@code null}; numbers keep full double
 * precision. Written with Jackson's streaming generator, so a large run never needs the whole
 * document in memory.
 */
public final class RunJson {
  /** The value of the top-level {@code format} key. */
  public static final String FORMAT = "quantrun-run";
  /** The version of this layout; raised when a key changes meaning or is removed. */
  public static final int FORMAT_VERSION = 1;

  /**
   * Jackson's streaming core only: no object mapper, whose classes a single run would load for
   * nothing. Numbers are written as their shortest exact decimal ({@link Digits#shortest(double)}).
   */
  private static final JsonFactory FACTORY =
      JsonFactory.builder().enable(StreamWriteFeature.USE_FAST_DOUBLE_WRITER).build();
  private static final SerializedString FLAG_NAMES = new SerializedString("flag_names");
  private static final SerializedString TRACE = new SerializedString("trace");

  private RunJson() {}

  /**
   * Writes the run as JSON (UTF-8).
   *
   * @param run the processed run
   * @param tables its tables
   * @param out where the JSON goes (the caller closes it)
   * @throws IOException if writing fails
   */
  public static void write(RunResult run, ResultTables tables, OutputStream out) throws IOException {
    JsonGenerator g = FACTORY.createGenerator(out, JsonEncoding.UTF8);
    g.disable(JsonGenerator.Feature.AUTO_CLOSE_TARGET);
    g.setPrettyPrinter(new RecordPerLine());
    g.writeStartObject();
    head(g, run);
    array(g, "injections", tables.injections());
    calibrations(g, run, tables);
    results(g, run, tables);
    array(g, "results_wide", tables.resultsWide());
    array(g, "qc", tables.qc());
    array(g, "reruns", tables.reruns());
    g.writeEndObject();
    g.writeRaw('\n');
    g.flush();
  }

  // each part in a method of its own: short methods are compiled quickly, and the loops of one
  // part are not compiled again and again inside a long one

  private static void head(JsonGenerator g, RunResult run) throws IOException {
    g.writeStringField("format", FORMAT);
    g.writeNumberField("format_version", FORMAT_VERSION);
    g.writeObjectFieldStart("run");
    g.writeStringField("run_id", run.run().runId());
    g.writeStringField("source_name", run.run().sourceName());
    g.writeStringField("importer_id", run.run().importerId());
    g.writeStringField("method_id", run.run().methodId());
    g.writeStringField("method_version", run.run().methodVersion());
    g.writeObjectFieldStart("metadata");
    for (var e : run.run().metadata().entrySet()) {
      g.writeStringField(e.getKey(), e.getValue());
    }
    g.writeEndObject();
    g.writeEndObject();
    g.writeStringField("verdict", run.verdict().token());
    strings(g, "findings", run.findings());
  }

  private static void calibrations(JsonGenerator g, RunResult run, ResultTables tables) throws IOException {
    Table cal = tables.calibration();
    Table levels = tables.calibrationLevels();
    int key = levels.column("analyte_key");
    SerializableString[] calKeys = keys(cal);
    SerializableString[] levelKeys = keys(levels);
    g.writeArrayFieldStart("calibrations");
    for (int i = 0; i < run.calibrations().size(); i++) {
      CalibrationResult c = run.calibrations().get(i);
      g.writeStartObject();
      fields(g, calKeys, cal.rows().get(i));
      strings(g, "reasons", c.reasons());
      strings(g, "trace", c.trace());
      levels(g, levels, key, levelKeys, c.analyteKey());
      g.writeEndObject();
    }
    g.writeEndArray();
  }

  private static void levels(JsonGenerator g, Table levels, int key, SerializableString[] levelKeys, String analyteKey)
      throws IOException {
    g.writeArrayFieldStart("levels");
    for (List<Cell> row : levels.rows()) {
      if (row.get(key).plain().equals(analyteKey)) {
        g.writeStartObject();
        fields(g, levelKeys, row);
        g.writeEndObject();
      }
    }
    g.writeEndArray();
  }

  private static void results(JsonGenerator g, RunResult run, ResultTables tables) throws IOException {
    Table results = tables.results();
    SerializableString[] resultKeys = keys(results);
    SharedArrays arrays = new SharedArrays();
    g.writeArrayFieldStart("results");
    for (int i = 0; i < run.results().size(); i++) {
      AnalyteResult r = run.results().get(i);
      g.writeStartObject();
      fields(g, resultKeys, results.rows().get(i));
      g.writeFieldName(FLAG_NAMES);
      arrays.write(g, r.flags());
      g.writeFieldName(TRACE);
      arrays.write(g, r.trace());
      g.writeEndObject();
    }
    g.writeEndArray();
  }

  /**
   * Compact JSON with a line break after each top-level key and each record of a top-level array,
   * so that every record is one line.
   */
  private static final class RecordPerLine extends MinimalPrettyPrinter {
    private static final long serialVersionUID = 1L;

    private static boolean topLevelArray(JsonGenerator g) {
      JsonStreamContext c = g.getOutputContext();
      return c.inArray() && c.getParent() != null && c.getParent().inObject() && c.getParent().getParent() != null
          && c.getParent().getParent().inRoot();
    }

    private static boolean rootObject(JsonGenerator g) {
      JsonStreamContext c = g.getOutputContext();
      return c.inObject() && c.getParent() != null && c.getParent().inRoot();
    }

    @Override
    public void writeObjectEntrySeparator(JsonGenerator g) throws IOException {
      if (rootObject(g)) {
        g.writeRaw(",\n");
      } else {
        g.writeRaw(',');
      }
    }

    @Override
    public void beforeArrayValues(JsonGenerator g) throws IOException {
      if (topLevelArray(g)) {
        g.writeRaw('\n');
      }
    }

    @Override
    public void writeArrayValueSeparator(JsonGenerator g) throws IOException {
      if (topLevelArray(g)) {
        g.writeRaw(",\n");
      } else {
        g.writeRaw(',');
      }
    }

    @Override
    public void writeEndArray(JsonGenerator g, int values) throws IOException {
      if (topLevelArray(g) && values > 0) {
        g.writeRaw('\n');
      }
      g.writeRaw(']');
    }

    @Override
    public void writeEndObject(JsonGenerator g, int entries) throws IOException {
      if (rootObject(g)) {
        g.writeRaw('\n');
      }
      g.writeRaw('}');
    }
  }

  private static void array(JsonGenerator g, String key, Table table) throws IOException {
    SerializableString[] keys = keys(table);
    g.writeArrayFieldStart(key);
    for (List<Cell> row : table.rows()) {
      g.writeStartObject();
      fields(g, keys, row);
      g.writeEndObject();
    }
    g.writeEndArray();
  }

  /** The column names, each quoted and encoded once for the whole table. */
  private static SerializableString[] keys(Table table) {
    List<String> columns = table.columns();
    SerializableString[] keys = new SerializableString[columns.size()];
    for (int i = 0; i < keys.length; i++) {
      keys[i] = new SerializedString(columns.get(i));
    }
    return keys;
  }

  private static void fields(JsonGenerator g, SerializableString[] keys, List<Cell> row) throws IOException {
    for (int i = 0; i < keys.length; i++) {
      g.writeFieldName(keys[i]);
      Cell c = row.get(i);
      if (c instanceof Cell.Text t) {
        g.writeString(t.text());
      } else if (c instanceof Cell.Num n) {
        // the same digits as the CSV file's, made once (a finite number's text is a JSON number)
        g.writeNumber(n.text());
      } else if (c instanceof Cell.Whole w) {
        g.writeNumber(w.value());
      } else if (c instanceof Cell.Bool b) {
        g.writeBoolean(b.value());
      } else {
        g.writeNull();
      }
    }
  }

  private static void strings(JsonGenerator g, String key, List<String> values) throws IOException {
    g.writeArrayFieldStart(key);
    for (String v : values) {
      g.writeString(v);
    }
    g.writeEndArray();
  }

  /**
   * The flag and trace arrays of the results, each rendered once: a run's results share a few
   * instances of equal flag lists and traces, so each instance's JSON text is made on first use
   * and then copied as bytes (the same bytes the generator would write). Bounded: past {@link
   * #LIMIT} distinct instances, an array is written the ordinary way.
   */
  private static final class SharedArrays {
    private static final int LIMIT = 4096;
    private final IdentityHashMap<List<?>, SerializedString> rendered = new IdentityHashMap<>();

    void write(JsonGenerator g, List<?> values) throws IOException {
      SerializedString r = rendered.get(values);
      if (r == null) {
        if (rendered.size() >= LIMIT) {
          writeArray(g, values);
          return;
        }
        StringWriter text = new StringWriter();
        try (JsonGenerator one = FACTORY.createGenerator(text)) {
          writeArray(one, values);
        }
        r = new SerializedString(text.toString());
        rendered.put(values, r);
      }
      g.writeRawValue(r);
    }

    private static void writeArray(JsonGenerator g, List<?> values) throws IOException {
      g.writeStartArray();
      for (Object v : values) {
        g.writeString(v instanceof Token t ? t.token() : (String) v);
      }
      g.writeEndArray();
    }
  }

  /**
   * The shared streaming factory (the audit trail uses it too).
   *
   * @return the factory
   */
  static JsonFactory factory() {
    return FACTORY;
  }
}
