package org.quantrun.runner.processing;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.Optional;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.DisplayName;
import org.junit.jupiter.api.Test;
import org.quantrun.core.importer.ImportException;
import org.quantrun.core.importer.RawRun;
import org.quantrun.core.method.Method;
import org.quantrun.core.method.MethodException;
import org.quantrun.core.method.MethodLoader;
import org.quantrun.core.method.ResultFlag;
import org.quantrun.core.model.CalibrationStatus;
import org.quantrun.core.model.QcCheck;
import org.quantrun.core.model.QcKind;
import org.quantrun.core.model.RunResult;
import org.quantrun.core.model.RunVerdict;
import org.quantrun.core.qc.Verdict;
import org.quantrun.core.processing.RunProcessor;
import org.quantrun.runner.plugins.ImporterPlugins;
import org.quantrun.runner.plugins.RunFileImport;

/** The demo run, in each of its three dialects, through the whole processor. */
class DemoRunProcessingTest {
  static final Path DEMO = Path.of("../demo-data");
  static final Path EXAMPLES = Path.of("../config-examples");
  static Method method;
  static RunFileImport importer;

  @BeforeAll
  static void setUp() throws IOException, MethodException {
    method = MethodLoader.load(Files.readString(EXAMPLES.resolve("demo-R2611A.yaml"), StandardCharsets.UTF_8),
        "demo-R2611A.yaml");
    importer = new RunFileImport(ImporterPlugins.load(Path.of("target/plugins")).selection());
  }

  static RunResult process(String export, String profile) throws ImportException {
    RawRun run = importer.read(DEMO.resolve(export), RunFileImport.loadProfile(EXAMPLES.resolve("importers").resolve(profile)));
    return RunProcessor.process(run, method, Optional.empty());
  }

  @Test
  @DisplayName("the three dialects of the demo run give the same results, value for value")
  void dialectsAgree() throws ImportException {
    RunResult longCsv = process("run-R2611A-long.csv", "long-csv.yaml");
    RunResult wide = process("run-R2611A-wide.txt", "wide-semicolon.yaml");
    RunResult report = process("run-R2611A-report.txt", "fixed-width-report.yaml");
    // demo-data/README.md: 38 injections, 6 of them calibration solutions (blank and 5 standards), 15 lines
    assertEquals((38 - 6) * 15, longCsv.results().size());
    for (RunResult other : List.of(wide, report)) {
      assertEquals(longCsv.results().size(), other.results().size());
      for (int i = 0; i < longCsv.results().size(); i++) {
        var a = longCsv.results().get(i);
        var b = other.results().get(i);
        assertEquals(a.sampleId() + a.analyteKey(), b.sampleId() + b.analyteKey());
        assertEquals(a.value(), b.value(), a.sampleId() + " " + a.analyteKey());
        assertEquals(a.reported(), b.reported());
        assertEquals(a.flags(), b.flags());
      }
      assertEquals(longCsv.qc(), other.qc());
      assertEquals(longCsv.verdict(), other.verdict());
    }
  }

  @Test
  @DisplayName("the demo run calibrates every line, passes its QC, and asks to rerun the over-range iron sample")
  void demoRunOutcome() throws ImportException {
    RunResult r = process("run-R2611A-long.csv", "long-csv.yaml");
    assertEquals(15, r.calibrations().size());
    r.calibrations().forEach(c -> assertEquals(CalibrationStatus.ACCEPTED, c.status(), c.analyteKey() + " " + c.reasons()));
    List<QcCheck> failed = r.qc().stream().filter(q -> q.verdict() == Verdict.FAILED).toList();
    assertEquals(List.of(), failed);
    // demo-data/README.md: the ICV holds 200 ug/L of each analyte (Fe 2000) made up from a second
    // source; the generator's drift and noise keep recoveries within a few percent.
    r.qc().stream().filter(q -> q.check() == QcKind.ICV).forEach(q ->
        assertEquals(100, q.result().getAsDouble(), 5, q.analyteKey()));
    // demo-data/README.md: W2611-004 holds Pb near 38 ug/L.
    var pb = r.results().stream().filter(a -> a.sampleId().equals("W2611-004") && a.analyteKey().equals("Pb 220.353"))
        .findFirst().orElseThrow();
    assertEquals(38, pb.value().getAsDouble(), 2.5);
    // demo-data/README.md: the instrument wrote OVER for every Fe reading of W2611-013.
    var fe = r.results().stream().filter(a -> a.sampleId().equals("W2611-013") && a.analyte().equals("Fe"))
        .findFirst().orElseThrow();
    assertTrue(fe.flags().contains(ResultFlag.OVER_RANGE));
    assertTrue(r.reruns().stream().anyMatch(q -> q.sampleId().equals("W2611-013") && q.analyteKey().equals("Fe 259.940")));
    assertEquals(RunVerdict.RERUNS_NEEDED, r.verdict());
    assertEquals("run-R2611A-long", r.run().runId(), "an export without a run id in its metadata is named by its file");
  }
}
