package org.quantrun.runner.write;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.security.MessageDigest;
import java.time.Clock;
import java.time.Instant;
import java.time.ZoneOffset;
import java.util.EnumSet;
import java.util.HexFormat;
import java.util.List;
import java.util.Optional;
import java.util.Set;
import java.util.stream.Collectors;
import java.util.stream.Stream;
import org.apache.commons.csv.CSVRecord;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.DisplayName;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.quantrun.core.calibration.CalibrationFit;
import org.quantrun.core.method.Method;
import org.quantrun.core.model.AnalyteResult;
import org.quantrun.core.model.CalibrationResult;
import org.quantrun.core.model.RunResult;

class ResultsFolderTest {
  static final Clock CLOCK = Clock.fixed(Instant.parse("2027-01-12T11:00:00Z"), ZoneOffset.UTC);
  static RunResult run;
  static Method method;
  @TempDir Path dir;

  @BeforeAll
  static void setUp() {
    run = InventedRun.run();
    method = InventedRun.method();
  }

  static Audit audit(Path input) throws IOException {
    return new Audit("test", "17", "analyst", "bench-pc", CLOCK.instant(),
        List.of(new Audit.InputFile("export", input.getFileName().toString(), input.toString(),
            org.quantrun.runner.output.Digests.sha256(input), Files.size(input))),
        new Audit.MethodRef("KBW-DW-OES-03", "3.1", "00"), List.of(new Audit.PluginRef("delimited", "1.0", "delimited",
            Optional.of("delimited.jar"))), "delimited", List.of("process", "x.csv"));
  }

  Path write(Set<OutputFormat> formats) throws IOException {
    Path input = dir.resolve("run-R2701B.csv");
    if (!Files.exists(input)) {
      Files.writeString(input, "abc");
    }
    return ResultsFolder.write(dir.resolve("out"), run, method, formats, audit(input), CLOCK, "test");
  }

  static List<CSVRecord> csv(Path file) throws IOException {
    return CsvFiles.records(file);
  }

  static List<String> header(Path file) throws IOException {
    return CsvFiles.header(file);
  }

  @Test
  @DisplayName("the folder is named from the run id and holds every output and the audit trail")
  void everyOutput() throws IOException {
    Path folder = write(EnumSet.allOf(OutputFormat.class));
    assertEquals("R2701B", folder.getFileName().toString());
    try (Stream<Path> s = Files.list(folder)) {
      assertEquals(Set.of("results.csv", "results-wide.csv", "calibration.csv", "calibration-levels.csv", "qc.csv",
          "reruns.csv", "run.json", "report.html", "audit.json"),
          s.map(p -> p.getFileName().toString()).collect(Collectors.toSet()));
    }
  }

  @Test
  @DisplayName("a second folder for the same run is NAME-2 and the first is left untouched")
  void neverOverwrites() throws IOException {
    Path first = write(EnumSet.of(OutputFormat.CSV));
    byte[] before = Files.readAllBytes(first.resolve("results.csv"));
    Path second = write(EnumSet.of(OutputFormat.CSV));
    assertEquals("R2701B-2", second.getFileName().toString());
    assertEquals(HexFormat.of().formatHex(before), HexFormat.of().formatHex(Files.readAllBytes(first.resolve("results.csv"))));
    try (Stream<Path> s = Files.list(dir.resolve("out"))) {
      assertEquals(List.of("R2701B", "R2701B-2"), s.map(p -> p.getFileName().toString()).sorted().toList(),
          "no staging folder is left behind");
    }
  }

  @Test
  @DisplayName("a run id from the export never steers where the folder goes; without a usable id the export's name is used")
  void hostileRunId() throws IOException {
    RunResult r = InventedRun.run();
    for (String[] c : new String[][] {{"../../escape", "escape"}, {"///", "run-R2701B"}}) {
      org.quantrun.core.model.RunInfo info = new org.quantrun.core.model.RunInfo(c[0], "run-R2701B.csv", "delimited", "m", "1",
          java.util.Map.of());
      RunResult hostile = new RunResult(info, r.injections(), r.calibrations(), r.results(), r.qc(), r.reruns(), r.verdict(),
          r.findings());
      Path input = dir.resolve("in.csv");
      Files.writeString(input, "x");
      Path folder = ResultsFolder.write(dir.resolve("out"), hostile, method, EnumSet.of(OutputFormat.CSV), audit(input), CLOCK, "t");
      assertEquals(dir.resolve("out"), folder.getParent());
      assertEquals(c[1], folder.getFileName().toString());
    }
  }

  @Test
  @DisplayName("--formats csv writes the CSV files and the audit trail only")
  void formatsChooseOutputs() throws IOException {
    Path folder = write(EnumSet.of(OutputFormat.CSV));
    assertTrue(Files.exists(folder.resolve("results.csv")));
    assertTrue(Files.exists(folder.resolve("audit.json")));
    assertFalse(Files.exists(folder.resolve("report.html")));
    assertFalse(Files.exists(folder.resolve("run.json")));
  }

  @Test
  @DisplayName("results.csv: the documented columns in order, one row per injection x line, full precision, RFC 4180 line ends")
  void resultsCsv() throws IOException {
    Path folder = write(EnumSet.of(OutputFormat.CSV));
    Path file = folder.resolve("results.csv");
    List<String> documented = List.of("run_id", "position", "sample_id", "sample_type", "analyte", "line", "value",
        "reported", "unit", "ci_half_width", "lod", "loq", "dilution_factor", "flags", "signal_mean", "signal_rsd_pct",
        "replicates", "limits_from");
    assertEquals(documented, header(file).subList(0, documented.size()));
    String text = Files.readString(file);
    // RFC 4180, section 2: records end with CRLF
    assertTrue(text.endsWith("\r\n"));
    assertEquals(text.split("\r\n", -1).length - 1, text.split("\n", -1).length - 1, "every line ends with CRLF");
    List<CSVRecord> rows = csv(file);
    assertEquals(run.results().size(), rows.size());
    for (int i = 0; i < rows.size(); i++) {
      AnalyteResult r = run.results().get(i);
      CSVRecord row = rows.get(i);
      assertEquals(r.value().isPresent() ? Double.toString(r.value().getAsDouble()) : "", row.get("value"));
      assertEquals(r.value().isPresent() ? r.value().getAsDouble() : Double.NaN,
          row.get("value").isEmpty() ? Double.NaN : Double.parseDouble(row.get("value")), 0.0, "full double precision");
      assertEquals(r.reported(), row.get("reported"));
      assertEquals(Integer.toString(r.position()), row.get("position"));
    }
    // the drinking-water method maps below-lod to its own code ND; other flags keep their names
    CSVRecord rejected = rows.stream().filter(r -> r.get("analyte").equals("Cd")).findFirst().get();
    assertEquals("calibration-failed", rejected.get("flags"));
    assertEquals("", rejected.get("value"), "an absent value is an empty cell");
    assertTrue(rows.stream().anyMatch(r -> r.get("flags").equals("OVR")), "over-range is written as the lab's code OVR");
  }

  @Test
  @DisplayName("text cells a spreadsheet would run as formulas are neutralised; numbers, negative ones too, are not")
  void formulaCellsNeutralised() throws IOException {
    Path folder = write(EnumSet.of(OutputFormat.CSV));
    List<CSVRecord> rows = csv(folder.resolve("results.csv"));
    List<CSVRecord> hostile = rows.stream().filter(r -> r.get("position").equals("11")).toList();
    assertFalse(hostile.isEmpty());
    for (CSVRecord r : hostile) {
      assertEquals("'" + InventedRun.FORMULA_ID, r.get("sample_id"));
    }
    assertEquals("'" + InventedRun.FORMULA_ID, csv(folder.resolve("reruns.csv")).get(1).get("sample_id"));
    CSVRecord negative = rows.stream().filter(r -> r.get("sample_id").equals("ICB") && r.get("analyte").equals("Pb"))
        .findFirst().get();
    assertTrue(negative.get("value").startsWith("-"), negative.get("value"));
    assertEquals(run.results().get(2).value().getAsDouble(), Double.parseDouble(negative.get("value")), 0.0,
        "a negative number is written as it is");
    assertEquals("ND;negative", negative.get("flags"), "flags joined by ';', below-lod by the lab's code ND");
  }

  @Test
  @DisplayName("calibration.csv: the documented columns, the fit's own coefficients, c2 empty for a straight line")
  void calibrationCsv() throws IOException {
    Path folder = write(EnumSet.of(OutputFormat.CSV));
    List<String> documented = List.of("analyte", "line", "curve", "weighting", "n", "dof", "c0", "c1", "c2", "se_c0",
        "se_c1", "se_c2", "s_yx", "r2", "lod", "loq", "status", "reason");
    assertEquals(documented, header(folder.resolve("calibration.csv")).subList(0, documented.size()));
    List<CSVRecord> rows = csv(folder.resolve("calibration.csv"));
    assertEquals(2, rows.size());
    for (int i = 0; i < 2; i++) {
      CalibrationResult c = run.calibrations().get(i);
      CalibrationFit f = c.fit().get();
      assertEquals(Double.toString(f.coefficient(1)), rows.get(i).get("c1"));
      assertEquals(Double.toString(f.coefficient(0)), rows.get(i).get("c0"));
      assertEquals("", rows.get(i).get("c2"));
      assertEquals("4", rows.get(i).get("n"));
      assertEquals("2", rows.get(i).get("dof"));
      assertEquals(c.status().token(), rows.get(i).get("status"));
    }
    assertEquals("STD-4 back-calculates 10.9 % off (limit 10 %)", rows.get(1).get("reason"));
    List<CSVRecord> levels = csv(folder.resolve("calibration-levels.csv"));
    assertEquals(8, levels.size());
    assertEquals("failed", levels.get(7).get("verdict"));
  }

  @Test
  @DisplayName("qc.csv: documented columns; verdicts are the words passed, failed, not evaluated")
  void qcCsv() throws IOException {
    Path folder = write(EnumSet.of(OutputFormat.CSV));
    List<String> documented = List.of("position", "sample_id", "check", "analyte", "measured", "expected", "result",
        "unit_of_result", "window_low", "window_high", "verdict");
    assertEquals(documented, header(folder.resolve("qc.csv")).subList(0, documented.size()));
    assertEquals(List.of("passed", "passed", "not evaluated", "failed"),
        csv(folder.resolve("qc.csv")).stream().map(r -> r.get("verdict")).toList());
    assertEquals(List.of("position", "sample_id", "analyte", "reason", "dilution"), header(folder.resolve("reruns.csv")));
    assertEquals("10", csv(folder.resolve("reruns.csv")).get(1).get("dilution"));
  }

  @Test
  @DisplayName("results-wide.csv: a row per injection, a column per reported analyte line holding the reported text")
  void wideCsv() throws IOException {
    Path folder = write(EnumSet.of(OutputFormat.CSV));
    assertEquals(List.of("run_id", "position", "sample_id", "sample_type", "Pb [ug/L]", "Cd [ug/L]"),
        header(folder.resolve("results-wide.csv")));
    List<CSVRecord> rows = csv(folder.resolve("results-wide.csv"));
    assertEquals(7, rows.size());
    for (AnalyteResult r : run.results()) {
      CSVRecord row = rows.stream().filter(w -> w.get("position").equals(Integer.toString(r.position()))).findFirst().get();
      assertEquals(r.reported(), row.get(r.analyte() + " [ug/L]"));
    }
  }

  @Test
  @DisplayName("run.json holds every table with the CSV's values, nulls for absent values, flags by name and traces")
  void runJson() throws IOException {
    Path folder = write(EnumSet.of(OutputFormat.CSV, OutputFormat.JSON));
    JsonNode root = new ObjectMapper().readTree(folder.resolve("run.json").toFile());
    assertEquals("quantrun-run", root.get("format").asText());
    assertEquals("reruns needed", root.get("verdict").asText());
    assertEquals("<b>J. Doe</b>", root.get("run").get("metadata").get("Analyst").asText());
    JsonNode results = root.get("results");
    List<CSVRecord> rows = csv(folder.resolve("results.csv"));
    assertEquals(rows.size(), results.size());
    for (int i = 0; i < rows.size(); i++) {
      JsonNode r = results.get(i);
      String csvValue = rows.get(i).get("value");
      if (csvValue.isEmpty()) {
        assertTrue(r.get("value").isNull());
      } else {
        assertEquals(Double.parseDouble(csvValue), r.get("value").asDouble(), 0.0);
      }
      assertEquals(run.results().get(i).trace().size(), r.get("trace").size());
    }
    assertEquals(InventedRun.FORMULA_ID, results.get(10).get("sample_id").asText(), "JSON text is not neutralised");
    assertEquals("calibration-failed", results.get(1).get("flag_names").get(0).asText());
    assertEquals(4, root.get("calibrations").get(0).get("levels").size());
    assertEquals(4, root.get("qc").size());
    assertEquals(2, root.get("reruns").size());
    assertEquals(12, root.get("injections").size());
  }

  @Test
  @DisplayName("audit.json: SHA-256 of the input, method, plugins, times, user, and the SHA-256 of every file written")
  void auditJson() throws Exception {
    Path folder = write(EnumSet.allOf(OutputFormat.class));
    JsonNode a = new ObjectMapper().readTree(folder.resolve("audit.json").toFile());
    // FIPS 180-2, appendix B.1: SHA-256("abc")
    assertEquals("ba7816bf8f01cfea414140de5dae2223b00361a396177a9cb410ff61f20015ad", a.get("inputs").get(0).get("sha256").asText());
    assertEquals("KBW-DW-OES-03", a.get("method").get("id").asText());
    assertEquals("delimited", a.get("plugins").get(0).get("plugin_id").asText());
    assertEquals("2027-01-12T11:00:00Z", a.get("started").asText());
    assertEquals("2027-01-12T11:00:00Z", a.get("finished").asText());
    assertEquals("analyst", a.get("user").asText());
    assertEquals(8, a.get("outputs").size());
    // the report is written beside the tables on a thread of its own; the trail lists it last all the same
    List<String> names = new java.util.ArrayList<>();
    a.get("outputs").forEach(o -> names.add(o.get("name").asText()));
    assertEquals(List.of("results.csv", "results-wide.csv", "calibration.csv", "calibration-levels.csv", "qc.csv",
        "reruns.csv", "run.json", "report.html"), names);
    for (JsonNode o : a.get("outputs")) {
      byte[] content = Files.readAllBytes(folder.resolve(o.get("name").asText()));
      assertEquals(HexFormat.of().formatHex(MessageDigest.getInstance("SHA-256").digest(content)), o.get("sha256").asText());
      assertEquals(content.length, o.get("bytes").asLong());
    }
  }
}
