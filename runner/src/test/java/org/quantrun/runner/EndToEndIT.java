package org.quantrun.runner;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.Random;
import java.util.concurrent.TimeUnit;
import java.util.stream.Stream;
import org.apache.commons.csv.CSVRecord;
import org.jsoup.Jsoup;
import org.jsoup.nodes.Document;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.DisplayName;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.quantrun.core.method.Analyte;
import org.quantrun.core.method.InternalStandard;
import org.quantrun.core.method.Method;
import org.quantrun.core.method.MethodLoader;
import org.quantrun.runner.write.CsvFiles;
import org.quantrun.runner.write.ResultTables;

/**
 * quantrun as a new user meets it: the packaged launcher ({@code ./quantrun} at the top of the
 * repository, running {@code runner/target/quantrun.jar} with {@code lib/} and {@code plugins/})
 * in a fresh folder, on every demo dialect and every config example. Runs in Maven's
 * integration-test phase, after {@code package}.
 */
class EndToEndIT {
  static final Path ROOT = Path.of("..").toAbsolutePath().normalize();
  static final Path LAUNCHER = ROOT.resolve("quantrun");
  static final Path EXAMPLES = ROOT.resolve("config-examples");
  static final Path DEMO = ROOT.resolve("demo-data");
  @TempDir Path work;

  record Run(int exit, String out, String err) {}

  @BeforeAll
  static void packaged() {
    assertTrue(Files.isRegularFile(ROOT.resolve("runner/target/quantrun.jar")), "run after mvn package");
    assertTrue(Files.isDirectory(ROOT.resolve("runner/target/lib")));
    assertTrue(Files.isDirectory(ROOT.resolve("runner/target/plugins")));
  }

  Run quantrun(String... args) throws IOException, InterruptedException {
    List<String> cmd = new ArrayList<>(List.of("sh", LAUNCHER.toString()));
    cmd.addAll(List.of(args));
    Path out = Files.createTempFile(work, "out", ".txt");
    Path err = Files.createTempFile(work, "err", ".txt");
    ProcessBuilder pb = new ProcessBuilder(cmd).directory(work.toFile()).redirectOutput(out.toFile()).redirectError(err.toFile());
    pb.environment().put("QUANTRUN_LOG_DIR", ROOT.resolve("runner/target/it-logs").toString());
    Process p = pb.start();
    assertTrue(p.waitFor(180, TimeUnit.SECONDS), "quantrun " + String.join(" ", args) + " finished in time");
    return new Run(p.exitValue(), Files.readString(out), Files.readString(err));
  }

  static void assertColumns(Path folder) throws IOException {
    assertEquals(ResultTables.RESULT_COLUMNS, CsvFiles.header(folder.resolve("results.csv")));
    assertEquals(ResultTables.CALIBRATION_COLUMNS, CsvFiles.header(folder.resolve("calibration.csv")));
    assertEquals(ResultTables.LEVEL_COLUMNS, CsvFiles.header(folder.resolve("calibration-levels.csv")));
    assertEquals(ResultTables.QC_COLUMNS, CsvFiles.header(folder.resolve("qc.csv")));
    assertEquals(ResultTables.RERUN_COLUMNS, CsvFiles.header(folder.resolve("reruns.csv")));
    assertEquals(ResultTables.WIDE_KEY_COLUMNS, CsvFiles.header(folder.resolve("results-wide.csv")).subList(0, 4));
    for (String f : List.of("run.json", "report.html", "audit.json")) {
      assertTrue(Files.size(folder.resolve(f)) > 0, f);
    }
  }

  /** The exit code a processed run must have, from its own files: 1 when qc.csv or calibration.csv shows a failure. */
  static int expectedExit(Path folder) throws IOException {
    boolean failed = CsvFiles.records(folder.resolve("qc.csv")).stream().anyMatch(r -> r.get("verdict").equals("failed"))
        || CsvFiles.records(folder.resolve("calibration.csv")).stream().anyMatch(r -> r.get("status").equals("rejected"));
    return failed ? 1 : 0;
  }

  static Path folderOf(Run r) {
    String line = r.out().lines().filter(l -> l.contains(" -> ")).findFirst().orElseThrow(() -> new AssertionError(r.out() + r.err()));
    return Path.of(line.substring(line.indexOf(" -> ") + 4).trim()).getParent();
  }

  @Test
  @DisplayName("--version names the version from the jar and the importers in plugins/")
  void version() throws Exception {
    Run r = quantrun("--version");
    assertEquals(0, r.exit(), r.err());
    assertTrue(r.out().lines().findFirst().orElse("").matches("quantrun \\d+\\.\\d+\\.\\d+.*"), r.out());
    assertTrue(r.out().contains("delimited") && r.out().contains("fixed-width"), r.out());
  }

  @Test
  @DisplayName("quantrun demo writes ./quantrun-demo/ and prints the report's path and the verdict")
  void demo() throws Exception {
    Run r = quantrun("demo");
    assertEquals(0, r.exit(), r.err());
    String report = r.out().lines().filter(l -> l.startsWith("report:")).findFirst().orElseThrow().substring(7).trim();
    assertTrue(report.startsWith("quantrun-demo/"), report);
    assertTrue(Files.isRegularFile(work.resolve(report)));
    assertTrue(r.out().lines().anyMatch(l -> l.matches("verdict: (in control|reruns needed|out of control) .*")), r.out());
    assertColumns(work.resolve(report).getParent());
    // the report's results table holds the same rows as results.csv
    Document doc = Jsoup.parse(work.resolve(report).toFile(), "UTF-8");
    List<CSVRecord> csv = CsvFiles.records(work.resolve(report).getParent().resolve("results.csv"));
    var rows = doc.select("table[data-table=results] tbody tr");
    assertEquals(csv.size(), rows.size());
    for (int i = 0; i < csv.size(); i++) {
      assertEquals(csv.get(i).get("sample_id"), rows.get(i).select("td").get(1).text());
      assertEquals(csv.get(i).get("reported"), rows.get(i).select("td").get(5).text());
    }
  }

  @Test
  @DisplayName("the three dialects of the demo run give the same results, calibrations, QC and reruns")
  void dialectsAgree() throws Exception {
    String[][] dialects = {{"run-R2611A-long.csv", "long-csv.yaml"}, {"run-R2611A-wide.txt", "wide-semicolon.yaml"},
        {"run-R2611A-report.txt", "fixed-width-report.yaml"}};
    List<Path> folders = new ArrayList<>();
    for (String[] d : dialects) {
      Run r = quantrun("process", DEMO.resolve(d[0]).toString(), "--method", EXAMPLES.resolve("demo-R2611A.yaml").toString(),
          "--profile", EXAMPLES.resolve("importers").resolve(d[1]).toString(), "--out", "out");
      Path folder = work.resolve(folderOf(r));
      assertColumns(folder);
      assertEquals(expectedExit(folder), r.exit(), d[0] + ": " + r.err());
      folders.add(folder);
    }
    for (String file : List.of("results.csv", "calibration.csv", "calibration-levels.csv", "qc.csv", "reruns.csv")) {
      List<List<String>> first = withoutRunId(CsvFiles.records(folders.get(0).resolve(file)));
      // demo-data/README.md: 38 injections x 15 lines, 6 of them the calibration blank and standards
      if (file.equals("results.csv")) {
        assertEquals(32 * 15, first.size());
      }
      for (int i = 1; i < folders.size(); i++) {
        assertEquals(first, withoutRunId(CsvFiles.records(folders.get(i).resolve(file))), file + " of " + dialects[i][0]);
      }
    }
  }

  static final Path CHROMIUM = Path.of("/usr/bin/chromium");

  /** Debian's chromium, headless, as root: the flags it needs and a fresh profile folder. */
  Run chromium(String... args) throws IOException, InterruptedException {
    Path profile = Files.createTempDirectory(work, "chromium-profile");
    List<String> cmd = new ArrayList<>(List.of(CHROMIUM.toString(), "--headless", "--no-sandbox", "--disable-gpu",
        "--disable-quic", "--no-first-run", "--disable-background-networking", "--disable-component-update", "--disable-sync",
        "--user-data-dir=" + profile));
    cmd.addAll(List.of(args));
    Path out = Files.createTempFile(work, "chromium", ".out");
    Path err = Files.createTempFile(work, "chromium", ".err");
    Process p = new ProcessBuilder(cmd).directory(work.toFile()).redirectOutput(out.toFile()).redirectError(err.toFile()).start();
    if (!p.waitFor(120, TimeUnit.SECONDS)) {
      p.destroyForcibly();
      throw new AssertionError("chromium did not finish in 120 s");
    }
    return new Run(p.exitValue(), Files.readString(out), Files.readString(err));
  }

  @Test
  @DisplayName("in a real browser (Debian chromium, when installed) the demo report's tables are those of the CSV files")
  void browserCheck() throws Exception {
    org.junit.jupiter.api.Assumptions.assumeTrue(Files.isExecutable(CHROMIUM), "chromium is not installed (.ci/run installs it)");
    Run demo = quantrun("demo");
    assertEquals(0, demo.exit(), demo.err());
    Path report = work.resolve(demo.out().lines().filter(l -> l.startsWith("report:")).findFirst().orElseThrow().substring(7).trim());
    Path folder = report.getParent();
    String url = report.toUri().toString();
    Run dom = chromium("--dump-dom", url);
    assertEquals(0, dom.exit(), dom.err());
    Document doc = Jsoup.parse(dom.out());
    org.quantrun.runner.write.HtmlReportTest.assertTableMatchesCsv(doc.selectFirst("table[data-table=results]"),
        CsvFiles.records(folder.resolve("results.csv")));
    org.quantrun.runner.write.HtmlReportTest.assertTableMatchesCsv(doc.selectFirst("table[data-table=qc]"),
        CsvFiles.records(folder.resolve("qc.csv")));
    assertEquals(CsvFiles.records(folder.resolve("calibration.csv")).size(), doc.select("section.calibration svg").size());
    Path png = work.resolve("report.png");
    Path pdf = work.resolve("report.pdf");
    assertEquals(0, chromium("--screenshot=" + png, "--window-size=1200,1600", url).exit());
    assertEquals(0, chromium("--no-pdf-header-footer", "--print-to-pdf=" + pdf, url).exit());
    byte[] head = Files.readAllBytes(png);
    assertTrue(head.length > 10_000 && head[1] == 'P' && head[2] == 'N' && head[3] == 'G', "a PNG screenshot");
    String pdfHead = new String(Files.readAllBytes(pdf), 0, 5, StandardCharsets.ISO_8859_1);
    assertEquals("%PDF-", pdfHead);
    assertTrue(Files.size(pdf) > 50_000, "a PDF of several pages");
  }

  static List<List<String>> withoutRunId(List<CSVRecord> rows) {
    List<List<String>> out = new ArrayList<>();
    for (CSVRecord r : rows) {
      List<String> cells = new ArrayList<>(r.toList());
      if (r.isMapped("run_id")) {
        cells.remove(0);
      }
      out.add(cells);
    }
    return out;
  }

  // ---------------------------------------------------------------- the config examples

  /**
   * One solution of a synthetic run: its sample id, exported type, what it holds, and its cells of
   * the columns the method reads per injection (a dilution factor, a standard's level; blank when
   * not given).
   */
  record Solution(String id, String type, Map<String, Double> conc, Map<String, String> cells) {
    Solution(String id, String type, Map<String, Double> conc) {
      this(id, type, conc, Map.of());
    }
  }

  static Map<String, Double> scaled(Map<String, Double> m, double f) {
    Map<String, Double> out = new HashMap<>();
    m.forEach((k, v) -> out.put(k, v * f));
    return out;
  }

  static Map<String, Double> plus(Map<String, Double> a, Map<String, Double> b) {
    Map<String, Double> out = new HashMap<>(a);
    b.forEach((k, v) -> out.merge(k, v, Double::sum));
    return out;
  }

  /**
   * A synthetic long-layout export for a method: every solution is measured on every analyte line
   * (and internal standard) with 3 readings; signal = 120 + k x concentration, k different per line,
   * 0.4 % reading noise from a fixed seed. Internal standards read 50,000 in every solution. The
   * type is in the third column, headed as the method's type column (else {@code Type}); the other
   * columns the method reads per injection come last, on every row of the injection.
   */
  static String export(Method m, List<Solution> sequence) {
    Optional<String> typeColumn = m.identification().typeColumn();
    List<String> others = m.injectionColumns().stream().filter(c -> typeColumn.isEmpty() || !c.equals(typeColumn.get())).toList();
    StringBuilder b = new StringBuilder("Seq,Sample ID," + typeColumn.orElse("Type") + ",Element,Line,Rep,Intensity,Unit");
    others.forEach(c -> b.append(',').append(c));
    b.append('\n');
    Random noise = new Random(20270112L);
    for (int s = 0; s < sequence.size(); s++) {
      Solution sol = sequence.get(s);
      StringBuilder cells = new StringBuilder();
      others.forEach(c -> cells.append(',').append(sol.cells().getOrDefault(c, "")));
      for (int a = 0; a < m.analytes().size(); a++) {
        Analyte an = m.analytes().get(a);
        double k = 40.0 + 17.0 * a;
        double truth = sol.conc().getOrDefault(an.name(), 0.0);
        for (int rep = 1; rep <= 3; rep++) {
          double y = (120 + k * truth) * (1 + 0.004 * noise.nextGaussian());
          b.append(s + 1).append(',').append(sol.id()).append(',').append(sol.type()).append(',').append(an.name()).append(',')
              .append(an.line().orElseGet(() -> an.mass().map(String::valueOf).orElse(""))).append(',').append(rep).append(',')
              .append(String.format(java.util.Locale.ROOT, "%.3f", y)).append(",cps").append(cells).append('\n');
        }
      }
      for (InternalStandard is : m.internalStandards()) {
        for (int rep = 1; rep <= 3; rep++) {
          b.append(s + 1).append(',').append(sol.id()).append(',').append(sol.type()).append(',').append(is.element()).append(',')
              .append(is.line().orElseGet(() -> is.mass().map(String::valueOf).orElse(""))).append(',').append(rep).append(',')
              .append(String.format(java.util.Locale.ROOT, "%.3f", 50000 * (1 + 0.004 * noise.nextGaussian()))).append(",cps")
              .append(cells).append('\n');
        }
      }
    }
    return b.toString();
  }

  static Method load(String example) throws Exception {
    return MethodLoader.load(Files.readString(EXAMPLES.resolve(example), StandardCharsets.UTF_8), example);
  }

  static Map<String, Double> level(Method m, String name) {
    return m.level(name).orElseThrow().concentrations();
  }

  /** Processes a synthetic run of an example through the launcher and checks the folder. */
  Path processExample(String example, List<Solution> seq, String... extra) throws Exception {
    Method m = load(example);
    Path export = work.resolve("synthetic-" + example.replace(".yaml", ".csv"));
    Files.writeString(export, export(m, seq));
    List<String> args = new ArrayList<>(List.of("process", export.toString(), "--method", EXAMPLES.resolve(example).toString(),
        "--out", "out"));
    args.addAll(List.of(extra));
    Run r = quantrun(args.toArray(new String[0]));
    Path folder = work.resolve(folderOf(r));
    assertColumns(folder);
    assertEquals(expectedExit(folder), r.exit(), example + ": " + r.err() + r.out());
    long calibrationInjections = seq.stream().filter(s -> s.type().matches("(?i)blank|cal|standard|calibration-blank")
        || s.id().equals("CB") || s.id().startsWith("STD-") || s.id().startsWith("CAL-")).count();
    assertEquals((seq.size() - calibrationInjections) * m.analytes().size(), CsvFiles.records(folder.resolve("results.csv")).size(),
        example + ": a row per non-calibration injection and analyte line");
    assertEquals(m.analytes().size(), CsvFiles.records(folder.resolve("calibration.csv")).size());
    for (CSVRecord c : CsvFiles.records(folder.resolve("calibration.csv"))) {
      assertEquals("accepted", c.get("status"), example + " " + c.get("analyte_key") + ": clean synthetic data calibrates");
    }
    return folder;
  }

  /** The reported value of one sample and analyte line, in the original sample. */
  static double value(Path folder, String sample, String analyteKey) throws IOException {
    return CsvFiles.records(folder.resolve("results.csv")).stream()
        .filter(r -> r.get("sample_id").equals(sample) && r.get("analyte_key").equals(analyteKey))
        .mapToDouble(r -> Double.parseDouble(r.get("value"))).findFirst().orElseThrow();
  }

  @Test
  @DisplayName("every config example passes quantrun check through the launcher")
  void examplesCheck() throws Exception {
    try (Stream<Path> s = Files.list(EXAMPLES)) {
      List<Path> methods = s.filter(p -> p.toString().endsWith(".yaml")).sorted().toList();
      assertTrue(methods.size() >= 4, methods.toString());
      for (Path m : methods) {
        Run r = quantrun("check", m.toString());
        assertEquals(0, r.exit(), m.getFileName() + ": " + r.err());
        assertTrue(r.out().contains("is a valid method"), r.out());
      }
    }
  }

  @Test
  @DisplayName("drinking-water example: a synthetic run processes, and a sample reads back its invented concentration")
  void drinkingWaterExample() throws Exception {
    Method m = load("drinking-water-trace-metals.yaml");
    Map<String, Double> sample = scaled(level(m, "S3"), 0.8);
    List<Solution> seq = new ArrayList<>(List.of(new Solution("CAL-BLK", "BLANK", Map.of())));
    for (String l : List.of("S1", "S2", "S3", "S4", "S5")) {
      seq.add(new Solution("CAL-" + l, "CAL", level(m, l)));
    }
    seq.addAll(List.of(new Solution("ICV", "QC1", m.qc().icv().trueValues()), new Solution("ICB", "", Map.of()),
        new Solution("PB-01", "", Map.of()), new Solution("LFB-01", "", m.qc().lcs().orElseThrow().trueValues()),
        new Solution("DW-2701-0001", "UNK", sample), new Solution("DW-2701-0001 D", "", sample),
        new Solution("DW-2701-0001 S", "", plus(sample, m.qc().spike().orElseThrow().added())),
        new Solution("DW-2701-0002", "UNK", scaled(sample, 0.5)),
        new Solution("DW-2701-0003", "UNK", scaled(sample, 0.2), Map.of("Dil", "5")),
        new Solution("CCV-1", "QC2", m.qc().ccv().standard().trueValues()), new Solution("CCB-1", "QB", Map.of())));
    Path folder = processExample("drinking-water-trace-metals.yaml", seq);
    // the invented truth: 0.8 x S3 = 40 ug/L of Pb; within 3 % (noise 0.4 % per reading; signal / slope, common practice)
    assertEquals(40.0, value(folder, "DW-2701-0001", "Pb 220.353"), 1.2);
    // the same sample diluted 1 + 4 before the run, its factor 5 in the export's Dil column:
    // 8 ug/L measured x 5 = 40 ug/L (domain.md, dilution)
    assertEquals(40.0, value(folder, "DW-2701-0003", "Pb 220.353"), 1.2);
  }

  @Test
  @DisplayName("ICP-MS example with internal standards: a synthetic run processes and reads back its concentration")
  void icpmsExample() throws Exception {
    Method m = load("icpms-water-internal-standards.yaml");
    Map<String, Double> sample = scaled(level(m, "S3"), 1.5);
    List<Solution> seq = new ArrayList<>(List.of(new Solution("CB", "", Map.of())));
    for (String l : List.of("S1", "S2", "S3", "S4", "S5", "T1")) {
      seq.add(new Solution("STD-" + l, "", level(m, l)));
    }
    seq.addAll(List.of(new Solution("ICV", "", m.qc().icv().trueValues()), new Solution("ICB", "", Map.of()),
        new Solution("MB-1", "", Map.of())));
    m.qc().lowCheck().ifPresent(l -> seq.add(new Solution("LCK", "", l.trueValues())));
    m.qc().lcs().ifPresent(l -> seq.add(new Solution("LCS-1", "", l.trueValues())));
    seq.addAll(List.of(new Solution("TW-101", "", sample), new Solution("TW-101-DUP", "", sample),
        new Solution("TW-102", "", scaled(sample, 0.2)),
        new Solution("CCV-1", "", m.qc().ccv().standard().trueValues()), new Solution("CCB-1", "", Map.of())));
    Path folder = processExample("icpms-water-internal-standards.yaml", seq);
    // the invented truth: 1.5 x S3 = 3 ug/L of Cd
    assertEquals(3.0, value(folder, "TW-101", "Cd 111"), 0.09);
  }

  @Test
  @DisplayName("soil example with its prep sheet: dry-weight mg/kg = ug/L x DF x V[L] / mass[g] / dry fraction")
  void soilExample() throws Exception {
    Method m = load("soil-digest-mg-per-kg.yaml");
    Map<String, Double> digest = scaled(level(m, "mid"), 0.5);
    // the standards' levels come from the export's Level column (identification.level-column)
    List<Solution> seq = new ArrayList<>(List.of(new Solution("CAL-BLK", "Blank", Map.of()),
        new Solution("STD-L", "Standard", level(m, "low"), Map.of("Level", "low")),
        new Solution("STD-M", "Standard", level(m, "mid"), Map.of("Level", "mid")),
        new Solution("STD-H", "Standard", level(m, "high"), Map.of("Level", "high")), new Solution("ICV", "ICV", m.qc().icv().trueValues()),
        new Solution("ICB", "ICB", Map.of()), new Solution("DB-0417", "", Map.of()),
        new Solution("CRM-0417", "", m.qc().lcs().orElseThrow().trueValues()),
        new Solution("SO-1101", "Sample", digest), new Solution("SO-1101/R", "", digest),
        new Solution("SO-1101/SP", "", plus(digest, m.qc().spike().orElseThrow().added())),
        new Solution("SO-1102", "Sample", scaled(digest, 0.3)), new Solution("SO-1103", "Sample", scaled(digest, 0.2)),
        new Solution("CCV", "CCV", m.qc().ccv().standard().trueValues()), new Solution("CCB", "CCB", Map.of())));
    Path folder = processExample("soil-digest-mg-per-kg.yaml", seq, "--prep", EXAMPLES.resolve("soil-prep-sheet.csv").toString());
    // SO-1101 holds 0.5 x mid = 50 ug/L of Cd in the digest: 50 x 1 x 0.050 L / 0.498 g / 0.731 (prep sheet) mg/kg
    // (common practice: mg/kg = ug/L x DF x V_final[L] / mass[g]; dry weight divides by the solids fraction)
    double expected = 50 * 1 * 0.050 / 0.498 / 0.731;
    double got = value(folder, "SO-1101", "Cd 228.802");
    assertEquals(expected, got, expected * 0.03, "got " + got + " mg/kg");
    assertTrue(CsvFiles.records(folder.resolve("results.csv")).stream().anyMatch(r -> r.get("unit").equals("mg/kg")));
    assertEquals(Optional.of("mg/kg"), CsvFiles.records(folder.resolve("results.csv")).stream()
        .filter(r -> r.get("sample_id").equals("SO-1101")).map(r -> r.get("unit")).findFirst());
  }
}
