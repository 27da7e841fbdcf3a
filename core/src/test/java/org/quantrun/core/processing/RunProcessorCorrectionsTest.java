package org.quantrun.core.processing;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;
import static org.quantrun.core.processing.RunBuilder.r;
import static org.quantrun.core.processing.RunProcessorScenarioTest.BLANK;
import static org.quantrun.core.processing.RunProcessorScenarioTest.PB;
import static org.quantrun.core.processing.RunProcessorScenarioTest.calibrated;
import static org.quantrun.core.processing.RunProcessorScenarioTest.checks;
import static org.quantrun.core.processing.RunProcessorScenarioTest.result;
import static org.quantrun.core.processing.RunProcessorScenarioTest.sig;
import static org.quantrun.core.processing.RunProcessorScenarioTest.yaml;

import java.util.List;
import java.util.Optional;
import org.junit.jupiter.api.DisplayName;
import org.junit.jupiter.api.Test;
import org.quantrun.core.method.Method;
import org.quantrun.core.method.ResultFlag;
import org.quantrun.core.method.prep.PrepSheet;
import org.quantrun.core.method.prep.PrepSheetParser;
import org.quantrun.core.model.AnalyteResult;
import org.quantrun.core.model.CalibrationStatus;
import org.quantrun.core.model.QcCheck;
import org.quantrun.core.model.QcKind;
import org.quantrun.core.model.RunResult;
import org.quantrun.core.qc.Verdict;

/** Internal standards, prep sheets, quadratic curves, several lines per analyte and replicate scatter. */
class RunProcessorCorrectionsTest {

  static final String IN = "In 115";

  static String isYaml() {
    return yaml(", internal-standard: In115", "", "1").replace("analytes:",
        "internal-standards:\n  - {name: In115, element: In, mass: 115}\nanalytes:");
  }

  @Test
  @DisplayName("an internal standard corrects each signal by its ratio to the calibration blank, and its recovery is checked")
  void internalStandard() {
    // domain.md section 5 (EPA 200.8 practice, from memory): corrected = signal x IS(blank) / IS(here);
    // recovery = IS(here) / IS(blank) x 100, window 60-125 % by default. The sample's IS is
    // suppressed to 80 %: its raw analyte signal 0.8 x (100 + 20 x 30) = 560 corrects back to 700,
    // that is 30 ug/L, as the blank-subtracted curve of the test gives (by hand).
    Method m = RunBuilder.method(isYaml());
    RunBuilder b = new RunBuilder("run-T.csv")
        .inject("BLK", PB, BLANK, IN, r(10000, 10000, 10000))
        .inject("S1", PB, sig(10), IN, r(10000, 10000, 10000))
        .inject("S2", PB, sig(50), IN, r(10000, 10000, 10000))
        .inject("S3", PB, sig(100), IN, r(10000, 10000, 10000))
        .inject("ICV", PB, sig(50), IN, r(10000, 10000, 10000))
        .inject("X1", PB, r(560, 560, 560), IN, r(8000, 8000, 8000))
        .inject("X2", PB, sig(20), IN, r(5000, 5000, 5000))
        .inject("CCV1", PB, sig(50), IN, r(10000, 10000, 10000));
    RunResult res = RunProcessor.process(b.build(), m, Optional.empty());
    AnalyteResult x1 = result(res, "X1");
    assertEquals(30.0, x1.value().getAsDouble(), 1e-6);
    assertFalse(x1.flags().contains(ResultFlag.INTERNAL_STANDARD_FAILED));
    List<QcCheck> is = checks(res, QcKind.INTERNAL_STANDARD);
    QcCheck x1Is = is.stream().filter(c -> c.sampleId().equals("X1")).findFirst().orElseThrow();
    assertEquals(80.0, x1Is.result().getAsDouble(), 1e-9);
    assertEquals(Verdict.PASSED, x1Is.verdict());
    QcCheck x2Is = is.stream().filter(c -> c.sampleId().equals("X2")).findFirst().orElseThrow();
    assertEquals(50.0, x2Is.result().getAsDouble(), 1e-9);
    assertEquals(Verdict.FAILED, x2Is.verdict(), "50 % is below the 60 % of the default window");
    assertTrue(result(res, "X2").flags().contains(ResultFlag.INTERNAL_STANDARD_FAILED));
    assertTrue(res.reruns().stream().anyMatch(q -> q.sampleId().equals("X2")));
  }

  @Test
  @DisplayName("a prep sheet turns solution results into mg/kg dry weight: ug/L x DF x V[L] / mass[g] / solids")
  void prepSheetMassBasis() {
    // domain.md section 5: mg/kg = ug/L x DF x V_final[L] / mass[g]; dry weight divides by the
    // solids fraction. 40 ug/L x 2 x 0.05 L / 0.5 g = 8 mg/kg as received; / 0.8 = 10 mg/kg dry (by hand).
    String y = yaml("", "", "1").replace("dilution: {default-factor: 1}", """
        dilution:
          default-factor: 1
          prep-sheet:
            columns: {sample-id: Sample, prep-batch: Batch, dilution-factor: DF, sample-mass: Mass_g,
                      final-volume: Volume_mL, solids-fraction: Solids}
            report-unit: mg/kg
            basis: dry-weight""");
    Method m = RunBuilder.method(y);
    PrepSheet sheet = parse("Sample,Batch,DF,Mass_g,Volume_mL,Solids\nX1,B1,2,0.5,50,0.8\nMB,B1,1,0.5,50,1\n");
    RunResult res = RunProcessor.process(calibrated().inject("ICV", PB, sig(50)).inject("MB", PB, sig(0.1))
        .inject("X1", PB, sig(40)).inject("CCV1", PB, sig(50)).build(), m, Optional.of(sheet));
    AnalyteResult x1 = result(res, "X1");
    double solution = x1.solutionConcentration().getAsDouble();
    assertEquals(solution * 2 * 0.05 / 0.5 / 0.8, x1.value().getAsDouble(), 1e-9);
    assertEquals(10.0, x1.value().getAsDouble(), 0.05);
    assertEquals("mg/kg", x1.unit());
    assertEquals(1.5 * 2 * 0.05 / 0.5 / 0.8, x1.lod().getAsDouble(), 1e-9, "limits take the same factor");
    assertEquals(Optional.of("B1"), res.injections().stream().filter(i -> i.sampleId().equals("X1")).findFirst()
        .orElseThrow().prepBatch());
  }

  static PrepSheet parse(String csv) {
    try {
      String y = yaml("", "", "1").replace("dilution: {default-factor: 1}", """
          dilution:
            prep-sheet:
              columns: {sample-id: Sample, prep-batch: Batch, dilution-factor: DF, sample-mass: Mass_g,
                        final-volume: Volume_mL, solids-fraction: Solids}
              report-unit: mg/kg
              basis: dry-weight""");
      return PrepSheetParser.parse(csv, "prep.csv", RunBuilder.method(y).dilution().prepSheet().get());
    } catch (org.quantrun.core.method.MethodException e) {
      throw new AssertionError(e.getMessage(), e);
    }
  }

  @Test
  @DisplayName("a quadratic that turns inside the calibrated range is rejected")
  void quadraticTurning() {
    Method m = RunBuilder.method(yaml(", curve: quadratic", "", "1"));
    RunResult res = RunProcessor.process(new RunBuilder("run-T.csv").inject("BLK", PB, BLANK)
        .inject("S1", PB, r(1100, 1100, 1100)).inject("S2", PB, r(1800, 1800, 1800)).inject("S3", PB, r(1200, 1200, 1200))
        .inject("ICV", PB, sig(50)).inject("CCV1", PB, sig(50)).build(), m, Optional.empty());
    assertEquals(CalibrationStatus.REJECTED, res.calibrations().get(0).status());
    assertTrue(res.calibrations().get(0).reasons().stream().anyMatch(r -> r.contains("not monotonic")));
  }

  @Test
  @DisplayName("an analyte on two lines reports the marked line and keeps the other as an alternate")
  void reportedAndAlternateLines() {
    String y = yaml(", report: true", "", "1").replace("analytes:\n", "analytes:\n  - {name: Pb, line: \"217.000\", mdl: 1.5, reporting-limit: 5}\n");
    Method m = RunBuilder.method(y);
    RunBuilder b = new RunBuilder("run-T.csv");
    for (String[] s : new String[][] {{"BLK", "0"}, {"S1", "10"}, {"S2", "50"}, {"S3", "100"}, {"ICV", "50"}, {"X1", "20"},
        {"CCV1", "50"}}) {
      double c = Double.parseDouble(s[1]);
      b.inject(s[0], PB, sig(c), "Pb 217.000", r(50 + 5 * c, 50 + 5 * c, 50 + 5 * c));
    }
    RunResult res = RunProcessor.process(b.build(), m, Optional.empty());
    List<AnalyteResult> x1 = res.results().stream().filter(a -> a.sampleId().equals("X1")).toList();
    assertEquals(2, x1.size());
    assertFalse(x1.stream().filter(a -> a.analyteKey().equals("Pb 217.000")).findFirst().orElseThrow().reportedLine());
    assertTrue(x1.stream().filter(a -> a.analyteKey().equals(PB)).findFirst().orElseThrow().reportedLine());
    assertEquals(20.0, x1.get(0).value().getAsDouble(), 1e-6, "both lines agree on noise-free data");
    assertEquals(20.0, x1.get(1).value().getAsDouble(), 1e-6);
  }

  @Test
  @DisplayName("scattered replicate readings above 10x the reporting limit are flagged")
  void replicateScatter() {
    // %RSD <= 5 % above 10x RL (50 here): readings 1700, 2100, 1900 have %RSD 10.5 % (by hand).
    RunResult res = RunProcessorScenarioTest.run(calibrated().inject("ICV", PB, sig(50))
        .inject("X1", PB, r(1700, 2100, 1900)).inject("X2", PB, r(600, 800, 700)).inject("CCV1", PB, sig(50)));
    AnalyteResult x1 = result(res, "X1");
    assertEquals(200 / 1900.0 * 100, x1.signalRsdPct().getAsDouble(), 1e-9);
    assertTrue(x1.flags().contains(ResultFlag.REPLICATE_RSD_HIGH));
    assertFalse(result(res, "X2").flags().contains(ResultFlag.REPLICATE_RSD_HIGH), "X2 (about 30, below 10x RL) is not judged, though at 14 %");
  }

  @Test
  @DisplayName("a failed ICV leaves every sample of the analyte unverified")
  void failedIcv() {
    RunResult res = RunProcessorScenarioTest.run(calibrated().inject("ICV", PB, sig(60))
        .inject("X1", PB, sig(20)).inject("CCV1", PB, sig(50)).inject("X2", PB, sig(20)).inject("CCV2", PB, sig(50)));
    assertEquals(Verdict.FAILED, checks(res, QcKind.ICV).get(0).verdict());
    assertTrue(result(res, "X1").flags().contains(ResultFlag.ICV_FAILED));
    assertTrue(result(res, "X2").flags().contains(ResultFlag.ICV_FAILED));
  }
}
