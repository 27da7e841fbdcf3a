package org.quantrun.runner.output;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import java.io.IOException;
import java.io.InputStream;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.HashSet;
import java.util.List;
import java.util.Set;
import java.util.regex.Pattern;
import java.util.stream.Stream;
import org.apache.commons.csv.CSVFormat;
import org.apache.commons.csv.CSVParser;
import org.apache.commons.csv.CSVRecord;
import org.jsoup.Jsoup;
import org.jsoup.nodes.Attribute;
import org.jsoup.nodes.Document;
import org.jsoup.nodes.Element;
import org.junit.jupiter.api.DisplayName;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.ValueSource;
import org.quantrun.runner.CommandRun;

/**
 * Hostile exports through the real {@code quantrun process}: run ids and file names never steer
 * where results are written, and sample ids from a corpus of hostile strings (test resource
 * {@code hostile-strings.txt}) are neutralised in every CSV file, escaped in report.html and kept
 * exactly in run.json.
 */
class HostileExportTest {

  static final Path DEMO = Path.of("../demo-data/run-R2611A-long.csv");
  static final String METHOD = "../config-examples/demo-R2611A.yaml";
  static final String PROFILE = "../config-examples/importers/long-csv.yaml";
  /** Safe folder names: letters, digits, dot, hyphen, underscore; no leading dot or hyphen. */
  static final Pattern SAFE = Pattern.compile("[A-Za-z0-9_][A-Za-z0-9._-]*");
  static final Set<String> RESERVED = Set.of("CON", "PRN", "AUX", "NUL", "COM1", "LPT1");

  @TempDir Path dir;

  static List<String> hostileStrings() throws IOException {
    try (InputStream in = HostileExportTest.class.getResourceAsStream("hostile-strings.txt")) {
      return new String(in.readAllBytes(), StandardCharsets.UTF_8).lines()
          .filter(l -> !l.isEmpty() && !l.startsWith("#")).toList();
    }
  }

  private static String quoted(String cell) {
    return "\"" + cell.replace("\"", "\"\"") + "\"";
  }

  /** The demo export with the ids of regular samples replaced by {@code ids}, in order. */
  private static String withSampleIds(List<String> ids) throws IOException {
    List<String> slots = new ArrayList<>();
    for (int i = 1; i <= 20; i++) {
      if (i != 7) {
        slots.add(String.format("W2611-%03d", i));
      }
    }
    String text = Files.readString(DEMO);
    for (int i = 0; i < ids.size(); i++) {
      text = text.replace("," + slots.get(i) + ",", "," + quoted(ids.get(i)) + ",");
    }
    return text;
  }

  private CommandRun process(Path export) {
    return CommandRun.of("process", export.toString(), "--method", METHOD, "--profile", PROFILE,
        "--out", dir.resolve("out").toString());
  }

  /** Every file below the temp folder, relative to it. */
  private List<Path> allFiles() throws IOException {
    try (Stream<Path> s = Files.walk(dir)) {
      return s.filter(Files::isRegularFile).map(dir::relativize).sorted().toList();
    }
  }

  /** Checks that every output sits in one safe-named folder directly under out/. */
  private Path onlyResultsFolder() throws IOException {
    List<Path> outputs = allFiles().stream().filter(p -> p.startsWith("out")).toList();
    assertFalse(outputs.isEmpty(), "no results were written");
    Set<Path> folders = new HashSet<>();
    for (Path p : outputs) {
      assertEquals(3, p.getNameCount(), "an output outside out/FOLDER/: " + p);
      folders.add(p.getName(1));
    }
    assertEquals(1, folders.size(), folders.toString());
    String name = folders.iterator().next().toString();
    assertTrue(SAFE.matcher(name).matches(), name);
    assertFalse(RESERVED.contains(name.split("\\.")[0].toUpperCase(java.util.Locale.ROOT)), name);
    return dir.resolve("out").resolve(name);
  }

  @ParameterizedTest(name = "run id {0}")
  @ValueSource(strings = {"../../escape", "/etc/cron.d/x", "C:\\Windows\\System32\\drivers", "\\\\server\\share\\x",
      "CON", "nul.txt", "LPT1", "..", ".", "a/b/../../../c", "／etc／fullwidth", ".hidden", "-rf"})
  @DisplayName("a hostile run id gives one results folder with a safe name under --out, nothing elsewhere")
  void hostileRunIds(String runId) throws IOException {
    Path in = Files.createDirectory(dir.resolve("in"));
    Path export = in.resolve("export.csv");
    Files.writeString(export, "Run ID," + quoted(runId) + "\n" + Files.readString(DEMO));
    CommandRun r = process(export);
    assertTrue(r.exitCode() == 0 || r.exitCode() == 1, r.err());
    onlyResultsFolder();
    assertEquals(List.of(Path.of("in/export.csv")), allFiles().stream().filter(p -> !p.startsWith("out")).toList());
    assertFalse(Files.exists(dir.getParent().resolve("escape")));
  }

  @ParameterizedTest(name = "file {0}")
  @ValueSource(strings = {"CON.csv", "NUL.report.csv", "..csv", "a;b c&d.csv", "$(touch x).csv", "com1.txt", "ä̈é.csv"})
  @DisplayName("a hostile export file name gives one results folder with a safe name under --out")
  void hostileFileNames(String fileName) throws IOException {
    Path export = Files.createDirectory(dir.resolve("in")).resolve(fileName);
    Files.copy(DEMO, export);
    CommandRun r = process(export);
    assertTrue(r.exitCode() == 0 || r.exitCode() == 1, r.err());
    onlyResultsFolder();
  }

  @Test
  @DisplayName("hostile sample ids are neutralised in every CSV, escaped in report.html and kept exactly in run.json")
  void hostileSampleIdsThroughTheWriters() throws IOException {
    List<String> hostile = hostileStrings();
    assertEquals(19, hostile.size(), "the corpus has 19 strings, one per regular sample of the demo run");
    Path in = Files.createDirectory(dir.resolve("in"));
    Path export = in.resolve("hostile.csv");
    Files.writeString(export, withSampleIds(hostile));
    // the demo method, taking ids that match no rule as samples
    Path method = in.resolve("method.yaml");
    Files.writeString(method, Files.readString(Path.of(METHOD)).replace("unmatched: reject", "unmatched: sample"));
    CommandRun r = CommandRun.of("process", export.toString(), "--method", method.toString(), "--profile", PROFILE,
        "--out", dir.resolve("out").toString());
    assertTrue(r.exitCode() == 0 || r.exitCode() == 1, r.err());
    Path folder = onlyResultsFolder();
    List<String> expected = hostile.stream().map(String::strip).toList();

    // CSV: no cell a spreadsheet would run as a formula (common practice: OWASP's CSV injection advice)
    Pattern number = Pattern.compile("[-+]?(\\d+\\.?\\d*|\\.\\d+)([eE][-+]?\\d+)?");
    Set<String> sampleCells = new HashSet<>();
    try (Stream<Path> csvs = Files.list(folder)) {
      for (Path csv : csvs.filter(p -> p.toString().endsWith(".csv")).toList()) {
        try (CSVParser p = CSVParser.parse(Files.readString(csv), CSVFormat.RFC4180)) {
          for (CSVRecord rec : p) {
            for (String cell : rec) {
              if (!cell.isEmpty() && "=+-@\t\r".indexOf(cell.charAt(0)) >= 0) {
                assertTrue(number.matcher(cell).matches(), csv.getFileName() + ": formula-like cell " + cell);
              }
              sampleCells.add(cell);
            }
          }
        }
      }
    }
    for (String s : expected) {
      assertTrue(sampleCells.contains(s) || sampleCells.contains("'" + s), "sample id lost from the CSV files: " + s);
    }

    // HTML: the strings are text, never markup (common practice: OWASP's output-encoding rules)
    Document doc = Jsoup.parse(folder.resolve("report.html").toFile(), "UTF-8");
    assertEquals(0, doc.select("script, iframe, object, embed, img, svg[onload], a[href^=javascript]").stream()
        .filter(e -> !e.tagName().equals("svg")).count(), "injected elements in the report");
    for (Element e : doc.getAllElements()) {
      for (Attribute a : e.attributes()) {
        assertFalse(a.getKey().toLowerCase(java.util.Locale.ROOT).startsWith("on"), "event attribute " + a + " on " + e.tagName());
      }
    }
    assertEquals(1, doc.select("h1").size(), "an injected heading");
    String text = doc.body().text();
    for (String s : expected) {
      assertTrue(text.contains(s.replace('\t', ' ').replaceAll("\\s+", " ")), "sample id not shown as text in the report: " + s);
    }

    // JSON: the ids exactly as in the export
    JsonNode json = new ObjectMapper().readTree(folder.resolve("run.json").toFile());
    Set<String> jsonTexts = new HashSet<>();
    json.findValues("sample_id").forEach(n -> jsonTexts.add(n.asText()));
    for (String s : expected) {
      assertTrue(jsonTexts.contains(s), "sample id changed in run.json: " + s);
    }
  }
}
