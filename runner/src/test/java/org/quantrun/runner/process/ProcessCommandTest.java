package org.quantrun.runner.process;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.Clock;
import java.util.List;
import java.util.Set;
import java.util.stream.Collectors;
import java.util.stream.Stream;
import org.apache.commons.csv.CSVRecord;
import org.junit.jupiter.api.DisplayName;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.quantrun.core.model.CalibrationResult;
import org.quantrun.core.model.CalibrationStatus;
import org.quantrun.core.model.RunResult;
import org.quantrun.core.qc.Verdict;
import org.quantrun.runner.CommandRun;
import org.quantrun.runner.Main;
import org.quantrun.runner.write.InventedRun;
import org.quantrun.runner.write.CsvFiles;
import picocli.CommandLine;

class ProcessCommandTest {
  static final String DEMO = "../demo-data/run-R2611A-long.csv";
  static final String DEMO_METHOD = "../config-examples/demo-R2611A.yaml";
  static final String LONG_PROFILE = "../config-examples/importers/long-csv.yaml";
  @TempDir Path dir;

  /** Runs {@code quantrun ARGS} in this JVM with a stand-in pipeline for process and demo. */
  static CommandRun run(RunPipeline pipeline, String... args) {
    CommandLine.IFactory defaults = CommandLine.defaultFactory();
    CommandLine cl = Main.commandLine(new CommandLine.IFactory() {
      @Override
      @SuppressWarnings("unchecked")
      public <K> K create(Class<K> cls) throws Exception {
        if (cls == ProcessCommand.class) {
          return (K) new ProcessCommand(pipeline, Clock.systemUTC());
        }
        if (cls == DemoCommand.class) {
          return (K) new DemoCommand(pipeline, Clock.systemUTC());
        }
        return defaults.create(cls);
      }
    });
    return CommandRun.of(cl, args);
  }

  static RunResult inControl() {
    RunResult r = InventedRun.run();
    List<CalibrationResult> accepted = r.calibrations().stream().map(c -> new CalibrationResult(c.analyteKey(), c.analyte(),
        c.line(), c.reportedLine(), c.curve(), c.weighting(), c.unit(), c.fit(), CalibrationStatus.ACCEPTED, List.of(),
        c.levels(), c.limits(), c.blankSignal(), c.trace())).toList();
    return new RunResult(r.run(), r.injections(), accepted, r.results(),
        r.qc().stream().filter(q -> q.verdict() != Verdict.FAILED).toList(), List.of(), r.verdict(), List.of());
  }

  Set<String> names(Path folder) throws IOException {
    try (Stream<Path> s = Files.list(folder)) {
      return s.map(p -> p.getFileName().toString()).collect(Collectors.toSet());
    }
  }

  String out() {
    return dir.resolve("out").toString();
  }

  @Test
  @DisplayName("the demo export through the real processor: exit 0 exactly when qc.csv has no failure and no calibration is rejected")
  void demoThroughTheProcessor() throws IOException {
    CommandRun r = CommandRun.of("process", DEMO, "--method", DEMO_METHOD, "--profile", LONG_PROFILE, "--out", out());
    assertTrue(r.exitCode() == 0 || r.exitCode() == 1, r.err());
    Path folder = dir.resolve("out/run-R2611A-long");
    assertEquals(9, names(folder).size(), names(folder).toString());
    boolean qcFailed = CsvFiles.records(folder.resolve("qc.csv")).stream().anyMatch(q -> q.get("verdict").equals("failed"));
    boolean rejected = CsvFiles.records(folder.resolve("calibration.csv")).stream()
        .anyMatch(c -> c.get("status").equals("rejected"));
    assertEquals(qcFailed || rejected ? 1 : 0, r.exitCode());
    // demo-data/README.md: 38 injections x 15 analyte lines, 6 of them calibration injections (blank + 5 standards)
    assertEquals(32 * 15, CsvFiles.records(folder.resolve("results.csv")).size());
    assertEquals(15, CsvFiles.records(folder.resolve("calibration.csv")).size());
    assertTrue(r.out().contains("run-R2611A-long.csv: run run-R2611A-long: "), r.out());
    assertTrue(r.out().contains("report.html"), r.out());
    assertEquals("", r.err(), "no progress bar or noise when not on a terminal");
  }

  @Test
  @DisplayName("a failed QC check gives exit 1 with every output complete")
  void qcFailureExitsOne() throws IOException {
    CommandRun r = run((raw, m, p) -> InventedRun.run(), "process", DEMO, "--method", DEMO_METHOD, "--profile", LONG_PROFILE,
        "--out", out());
    assertEquals(1, r.exitCode(), r.err());
    assertEquals(9, names(dir.resolve("out/R2701B")).size());
    assertTrue(r.out().contains("reruns needed (2 QC failures)"), r.out());
  }

  @Test
  @DisplayName("checks that are not evaluated do not fail the run: exit 0")
  void notEvaluatedIsNotAFailure() {
    RunResult ok = inControl();
    assertTrue(ok.qc().stream().anyMatch(q -> q.verdict() == Verdict.NOT_EVALUATED));
    CommandRun r = run((raw, m, p) -> ok, "process", DEMO, "--method", DEMO_METHOD, "--profile", LONG_PROFILE, "--out", out());
    assertEquals(0, r.exitCode(), r.err());
  }

  @Test
  @DisplayName("bad usage or input exits 2 with one message and writes nothing")
  void badInputExitsTwoAndWritesNothing() throws IOException {
    Path broken = dir.resolve("broken.yaml");
    Files.writeString(broken, "method:\n  id: X\n  version: 1\nanalytes: nope\n");
    Path empty = dir.resolve("empty.csv");
    Files.writeString(empty, "");
    String[][] cases = {
      {"process", DEMO, "--method", "no-such-method.yaml", "--out", out()},
      {"process", DEMO, "--method", broken.toString(), "--out", out()},
      {"process", DEMO, "no-such-export.csv", "--method", DEMO_METHOD, "--out", out()},
      {"process", DEMO, "--method", DEMO_METHOD, "--prep", "../config-examples/soil-prep-sheet.csv", "--out", out()},
      {"process", DEMO, "--method", DEMO_METHOD, "--formats", "csv,pdf", "--out", out()},
      {"process", DEMO, "--method", DEMO_METHOD, "--profile", "no-such-profile.yaml", "--out", out()},
      {"process", "--method", DEMO_METHOD, "--out", out()},
      {"process", empty.toString(), "--method", DEMO_METHOD, "--profile", LONG_PROFILE, "--out", out()},
    };
    for (String[] c : cases) {
      CommandRun r = run((raw, m, p) -> InventedRun.run(), c);
      assertEquals(2, r.exitCode(), String.join(" ", c) + "\n" + r.err());
      assertFalse(r.err().isBlank(), String.join(" ", c));
      assertFalse(r.err().contains("\tat "), "no stack trace: " + r.err());
      assertFalse(Files.exists(dir.resolve("out")) && names(dir.resolve("out")).size() > 0, String.join(" ", c) + " wrote something");
    }
    CommandRun formats = run((raw, m, p) -> InventedRun.run(), cases[4]);
    assertTrue(formats.err().contains("expected: csv, json, html"), formats.err());
    CommandRun missing = run((raw, m, p) -> InventedRun.run(), cases[2]);
    assertTrue(missing.err().contains("no-such-export.csv: no such file"), missing.err());
    CommandRun prep = run((raw, m, p) -> InventedRun.run(), cases[3]);
    assertTrue(prep.err().contains("describes no prep sheet"), prep.err());
  }

  @Test
  @DisplayName("a run the processor refuses (a prep-sheet method without its prep sheet) exits 2 with core's message")
  void processorInputErrorExitsTwo() {
    CommandRun r = CommandRun.of("process", DEMO, "--method", "../config-examples/soil-digest-mg-per-kg.yaml", "--profile",
        LONG_PROFILE, "--out", out());
    assertEquals(2, r.exitCode(), r.err());
    assertTrue(r.err().contains("prep sheet"), r.err());
    assertFalse(Files.exists(dir.resolve("out/run-R2611A-long")));
  }

  @Test
  @DisplayName("an internal error exits 3 with one line, no stack trace, and no folder or staging left behind")
  void internalErrorExitsThree() throws IOException {
    CommandRun r = run((raw, m, p) -> {
      throw new IllegalStateException("invented bug");
    }, "process", DEMO, "--method", DEMO_METHOD, "--profile", LONG_PROFILE, "--out", out());
    assertEquals(3, r.exitCode());
    assertTrue(r.err().contains("internal error"), r.err());
    assertEquals(1, r.err().lines().count(), r.err());
    assertFalse(Files.exists(dir.resolve("out")) && !names(dir.resolve("out")).isEmpty());
  }

  @Test
  @DisplayName("running out of memory exits 3 with one line that names the heap limit and how to raise it, no folder left behind")
  void outOfMemoryExitsThree() throws IOException {
    CommandRun r = run((raw, m, p) -> {
      throw new OutOfMemoryError("Java heap space");
    }, "process", DEMO, "--method", DEMO_METHOD, "--profile", LONG_PROFILE, "--out", out());
    assertEquals(3, r.exitCode());
    assertEquals(1, r.err().lines().count(), r.err());
    assertTrue(r.err().contains("not enough memory (Java heap limit "), r.err());
    assertTrue(r.err().contains("QUANTRUN_JAVA_OPTS=-Xmx"), r.err());
    assertFalse(Files.exists(dir.resolve("out")) && !names(dir.resolve("out")).isEmpty());
  }

  @Test
  @DisplayName("several exports give a folder each; the same export twice never overwrites (NAME, NAME-2); the worst code wins")
  void severalExports() throws IOException {
    Path garbage = dir.resolve("garbage.csv");
    Files.writeString(garbage, "this is not an export\n");
    CommandRun r = CommandRun.of("process", DEMO, DEMO, garbage.toString(), "--method", DEMO_METHOD, "--profile", LONG_PROFILE,
        "--out", out(), "--formats", "csv");
    assertEquals(2, r.exitCode(), r.err());
    assertTrue(r.err().contains("garbage.csv"), r.err());
    assertEquals(Set.of("run-R2611A-long", "run-R2611A-long-2"), names(dir.resolve("out")));
    assertFalse(names(dir.resolve("out/run-R2611A-long")).contains("report.html"), "--formats csv");
    List<CSVRecord> a = CsvFiles.records(dir.resolve("out/run-R2611A-long/results.csv"));
    List<CSVRecord> b = CsvFiles.records(dir.resolve("out/run-R2611A-long-2/results.csv"));
    assertEquals(a.stream().map(CSVRecord::toList).toList(), b.stream().map(CSVRecord::toList).toList(), "same input, same output");
  }

  @Test
  @DisplayName("--help lists the four exit codes; --version names the version and the loaded importers")
  void helpAndVersion() {
    String help = CommandRun.of("process", "--help").out();
    for (String code : List.of("0 ", "1 ", "2 ", "3 ")) {
      assertTrue(help.contains("  " + code), help);
    }
    assertTrue(help.contains("QC check failed"), help);
    assertTrue(help.contains("qualified analyst"), help);
    assertTrue(CommandRun.of("--help").out().contains("internal error"));
    String version = CommandRun.of("--version").out();
    assertTrue(version.startsWith("quantrun "), version);
    assertTrue(version.contains("delimited"), version);
    assertTrue(version.contains("fixed-width"), version);
  }

  @Test
  @DisplayName("quantrun demo writes into its folder and prints the report's path and the run verdict")
  void demoCommand() throws IOException {
    Path demoOut = dir.resolve("quantrun-demo");
    CommandRun r = CommandRun.of("demo", "--out", demoOut.toString());
    assertEquals(0, r.exitCode(), r.err());
    String report = r.out().lines().filter(l -> l.startsWith("report:")).findFirst().orElseThrow().substring(7).trim();
    assertTrue(Files.isRegularFile(Path.of(report)), report);
    assertTrue(report.startsWith(demoOut.toString()), report);
    String verdict = r.out().lines().filter(l -> l.startsWith("verdict:")).findFirst().orElseThrow();
    assertTrue(verdict.matches("verdict: (in control|reruns needed|out of control) .*"), verdict);
    assertEquals(0, CommandRun.of("demo", "--out", demoOut.toString(), "--dialect", "wide").exitCode());
    assertEquals(2, names(demoOut).size(), "a second demo run is a second folder");
    assertEquals(2, CommandRun.of("demo", "--dialect", "xml").exitCode());
  }

  @Test
  @DisplayName("processing is logged in detail to the rolling log file")
  void logFile() throws IOException {
    CommandRun.of("process", DEMO, "--method", DEMO_METHOD, "--profile", LONG_PROFILE, "--out", out(), "--formats", "csv");
    Path log = Path.of(System.getProperty("quantrun.log.dir", "target/test-logs")).resolve("quantrun.log");
    assertTrue(Files.isRegularFile(log), log.toString());
    String text = Files.readString(log);
    assertTrue(text.contains("INFO") && text.contains("processing run-R2611A-long.csv with method KBW-DEMO-OES-01"), text);
  }
}
