package org.quantrun.runner.write;

import com.fasterxml.jackson.core.JsonProcessingException;
import com.fasterxml.jackson.databind.ObjectMapper;
import com.fasterxml.jackson.databind.SerializationFeature;
import com.fasterxml.jackson.databind.node.ArrayNode;
import com.fasterxml.jackson.databind.node.ObjectNode;
import java.nio.charset.StandardCharsets;
import java.util.List;
import org.quantrun.core.Token;
import org.quantrun.core.model.AnalyteResult;
import org.quantrun.core.model.CalibrationResult;
import org.quantrun.core.model.RunResult;

/**
 * Writes {@code run.json}: everything the CSV files hold, machine-readable, plus what CSV cannot
 * hold well (run metadata, findings, each result's flags by quantrun's own names and its trace,
 * each calibration's levels and trace). Each table becomes an array of objects keyed by the CSV
 * column names; an absent value is {@code null}; numbers keep full double precision.
 */
public final class RunJson {
  /** The value of the top-level {@code format} key. */
  public static final String FORMAT = "quantrun-run";
  /** The version of this layout; raised when a key changes meaning or is removed. */
  public static final int FORMAT_VERSION = 1;

  private static final ObjectMapper MAPPER = new ObjectMapper().enable(SerializationFeature.INDENT_OUTPUT);

  private RunJson() {}

  /**
   * The run as JSON.
   *
   * @param run the processed run
   * @param tables its tables
   * @return UTF-8 bytes of the JSON document
   */
  public static byte[] bytes(RunResult run, ResultTables tables) {
    ObjectNode root = MAPPER.createObjectNode();
    root.put("format", FORMAT);
    root.put("format_version", FORMAT_VERSION);
    ObjectNode info = root.putObject("run");
    info.put("run_id", run.run().runId());
    info.put("source_name", run.run().sourceName());
    info.put("importer_id", run.run().importerId());
    info.put("method_id", run.run().methodId());
    info.put("method_version", run.run().methodVersion());
    ObjectNode metadata = info.putObject("metadata");
    run.run().metadata().forEach(metadata::put);
    root.put("verdict", run.verdict().token());
    strings(root.putArray("findings"), run.findings());

    array(root, "injections", tables.injections());
    ArrayNode calibrations = array(root, "calibrations", tables.calibration());
    for (int i = 0; i < run.calibrations().size(); i++) {
      CalibrationResult c = run.calibrations().get(i);
      ObjectNode o = (ObjectNode) calibrations.get(i);
      strings(o.putArray("reasons"), c.reasons());
      strings(o.putArray("trace"), c.trace());
      ArrayNode levels = o.putArray("levels");
      int key = tables.calibrationLevels().column("analyte_key");
      for (List<Cell> row : tables.calibrationLevels().rows()) {
        if (row.get(key).plain().equals(c.analyteKey())) {
          levels.add(object(tables.calibrationLevels().columns(), row));
        }
      }
    }
    ArrayNode results = array(root, "results", tables.results());
    for (int i = 0; i < run.results().size(); i++) {
      AnalyteResult r = run.results().get(i);
      ObjectNode o = (ObjectNode) results.get(i);
      strings(o.putArray("flag_names"), r.flags().stream().map(Token::token).toList());
      strings(o.putArray("trace"), r.trace());
    }
    array(root, "results_wide", tables.resultsWide());
    array(root, "qc", tables.qc());
    array(root, "reruns", tables.reruns());
    try {
      return MAPPER.writeValueAsString(root).concat("\n").getBytes(StandardCharsets.UTF_8);
    } catch (JsonProcessingException e) {
      throw new IllegalStateException("cannot write run.json", e);
    }
  }

  private static ArrayNode array(ObjectNode root, String key, Table table) {
    ArrayNode a = root.putArray(key);
    for (List<Cell> row : table.rows()) {
      a.add(object(table.columns(), row));
    }
    return a;
  }

  static ObjectNode object(List<String> columns, List<Cell> row) {
    ObjectNode o = MAPPER.createObjectNode();
    for (int i = 0; i < columns.size(); i++) {
      put(o, columns.get(i), row.get(i));
    }
    return o;
  }

  private static void put(ObjectNode o, String key, Cell c) {
    if (c instanceof Cell.Text t) {
      o.put(key, t.text());
    } else if (c instanceof Cell.Num n) {
      o.put(key, n.value());
    } else if (c instanceof Cell.Whole w) {
      o.put(key, w.value());
    } else if (c instanceof Cell.Bool b) {
      o.put(key, b.value());
    } else {
      o.putNull(key);
    }
  }

  private static void strings(ArrayNode a, List<String> values) {
    values.forEach(a::add);
  }

  /** The shared mapper, configured for indented output. */
  static ObjectMapper mapper() {
    return MAPPER;
  }
}
