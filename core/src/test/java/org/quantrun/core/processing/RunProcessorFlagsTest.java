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
import static org.quantrun.core.processing.RunProcessorScenarioTest.run;
import static org.quantrun.core.processing.RunProcessorScenarioTest.sig;
import static org.quantrun.core.processing.RunProcessorScenarioTest.yaml;

import java.util.List;
import java.util.Optional;
import org.junit.jupiter.api.DisplayName;
import org.junit.jupiter.api.Test;
import org.quantrun.core.method.Method;
import org.quantrun.core.method.ResultFlag;
import org.quantrun.core.model.AnalyteResult;
import org.quantrun.core.model.QcCheck;
import org.quantrun.core.model.QcKind;
import org.quantrun.core.model.RunResult;
import org.quantrun.core.qc.Verdict;

/**
 * The flags and QC rules the scenario tests leave out, each raised and not raised (rules as in
 * domain.md sections 6 and 8; windows are the test method's own).
 */
class RunProcessorFlagsTest {

  @Test
  @DisplayName("a result between the LOD and the lowest standard is flagged extrapolated; one inside the range is not")
  void extrapolated() {
    RunResult res = run(calibrated().inject("ICV", PB, sig(50)).inject("X1", PB, sig(6)).inject("X2", PB, sig(30))
        .inject("CCV1", PB, sig(50)));
    assertTrue(result(res, "X1").flags().contains(ResultFlag.EXTRAPOLATED), "6 lies below the lowest standard, 10");
    assertFalse(result(res, "X2").flags().contains(ResultFlag.EXTRAPOLATED));
  }

  @Test
  @DisplayName("a quadratic that never reaches a signal in range gives 'no root in range', not a number")
  void noRootInRange() {
    // y = 100 + 30 x - 0.1 x^2 (after the blank): it tops out at x = 150, signal 2350; 3000 is beyond it.
    Method m = RunBuilder.method(yaml(", curve: quadratic", "", "1").replace("max-back-calc-error: 10", "max-back-calc-error: 50"));
    RunBuilder b = new RunBuilder("run-T.csv").inject("BLK", PB, BLANK);
    for (double[] p : new double[][] {{1, 10}, {2, 50}, {3, 100}}) {
      double y = 100 + 30 * p[1] - 0.1 * p[1] * p[1];
      b.inject("S" + (int) p[0], PB, r(y + 100, y + 100, y + 100));
    }
    b.inject("ICV", PB, r(1450, 1450, 1450)).inject("X1", PB, r(3100, 3100, 3100)).inject("CCV1", PB, r(1350, 1350, 1350));
    RunResult res = RunProcessor.process(b.build(), m, Optional.empty());
    AnalyteResult x1 = result(res, "X1");
    assertTrue(x1.flags().contains(ResultFlag.NO_ROOT_IN_RANGE), x1.flags().toString());
    assertTrue(x1.value().isEmpty());
    assertTrue(res.reruns().stream().anyMatch(q -> q.sampleId().equals("X1")));
  }

  @Test
  @DisplayName("an analyte line the export lacks is 'not calibrated', and the run says which lines it has")
  void notCalibrated() {
    Method m = RunBuilder.method(yaml("", "", "1").replace("analytes:\n",
        "analytes:\n  - {name: Cd, line: \"228.802\", mdl: 0.5, reporting-limit: 1}\n").replace("{Pb: 10}", "{Pb: 10, Cd: 10}")
        .replace("{Pb: 50}", "{Pb: 50, Cd: 50}").replace("{Pb: 100}", "{Pb: 100, Cd: 100}")
        .replace("true-values: {Pb: 50}, recovery: {low: 90", "true-values: {Pb: 50, Cd: 50}, recovery: {low: 90")
        .replace("lcs: {true-values: {Pb: 50}", "lcs: {true-values: {Pb: 50, Cd: 50}")
        .replace("added: {Pb: 40}", "added: {Pb: 40, Cd: 40}"));
    RunResult res = RunProcessor.process(calibrated().inject("ICV", PB, sig(50)).inject("X1", PB, sig(20))
        .inject("CCV1", PB, sig(50)).build(), m, Optional.empty());
    AnalyteResult cd = res.results().stream().filter(a -> a.sampleId().equals("X1") && a.analyte().equals("Cd"))
        .findFirst().orElseThrow();
    assertTrue(cd.flags().contains(ResultFlag.NOT_CALIBRATED), cd.flags().toString());
    assertEquals("not reportable", cd.reported());
    assertTrue(res.findings().stream().anyMatch(f -> f.equals("the export has no line Cd 228.802 (it has: Pb 220.353)")),
        res.findings().toString());
  }

  @Test
  @DisplayName("a failed ICB marks the samples before the first CCB")
  void failedIcb() {
    RunResult res = run(calibrated().inject("ICV", PB, sig(50)).inject("ICB", PB, sig(8))
        .inject("X1", PB, sig(20)).inject("CCV1", PB, sig(50)).inject("CCB1", PB, sig(0.2))
        .inject("X2", PB, sig(20)).inject("CCV2", PB, sig(50)).inject("CCB2", PB, sig(0.1)));
    assertEquals(Verdict.FAILED, checks(res, QcKind.ICB).get(0).verdict());
    assertTrue(result(res, "X1").flags().contains(ResultFlag.ICB_FAILED));
    assertFalse(result(res, "X2").flags().contains(ResultFlag.ICB_FAILED));
  }

  @Test
  @DisplayName("a serial dilution differing by more than 10 % fails and flags its sample; a passing duplicate flags nothing")
  void serialDilutionFailsDuplicatePasses() {
    // |40 - 5 x 6| / 40 = 25 % > 10 % (by hand); duplicate 40 vs 38: RPD 5.1 % <= 20 %.
    RunResult res = run(calibrated().inject("ICV", PB, sig(50))
        .inject("X1", PB, sig(40)).inject("X1-D", PB, sig(38)).inject("X1-L", PB, sig(6)).inject("CCV1", PB, sig(50)));
    QcCheck serial = checks(res, QcKind.SERIAL_DILUTION).get(0);
    assertEquals(Verdict.FAILED, serial.verdict());
    assertEquals(25.0, serial.result().getAsDouble(), 1.0);
    assertTrue(result(res, "X1").flags().contains(ResultFlag.SERIAL_DILUTION_FAILED));
    assertEquals(Verdict.PASSED, checks(res, QcKind.DUPLICATE).get(0).verdict());
    assertFalse(result(res, "X1").flags().contains(ResultFlag.DUPLICATE_FAILED));
  }

  @Test
  @DisplayName("a low-level check and an MS/MSD pair are judged by recovery and RPD")
  void lowCheckAndSpikeDuplicate() {
    Method m = RunBuilder.method(yaml("", "", "1")
        .replace("  lcs:", "  low-check: {true-values: {Pb: 10}, recovery: {low: 70, high: 130}}\n  lcs:")
        .replace("- {pattern: 'X\\d+', role: sample}", "- {pattern: 'LLC', role: low-check}\n    - {pattern: '(X\\d+)-SD', role: spike-duplicate, of: '$1'}\n    - {pattern: 'X\\d+', role: sample}"));
    RunResult res = RunProcessor.process(calibrated().inject("ICV", PB, sig(50)).inject("LLC", PB, sig(6))
        .inject("X1", PB, sig(20)).inject("X1-S", PB, sig(58)).inject("X1-SD", PB, sig(60)).inject("CCV1", PB, sig(50))
        .build(), m, Optional.empty());
    QcCheck low = checks(res, QcKind.LOW_CHECK).get(0);
    assertEquals(Verdict.FAILED, low.verdict(), "6 of 10 is 60 %, below 70 %");
    List<QcCheck> msd = checks(res, QcKind.SPIKE_DUPLICATE);
    assertEquals(2, msd.size(), "its recovery and its RPD against the spike");
    assertTrue(msd.stream().allMatch(c -> c.verdict() == Verdict.PASSED), msd.toString());
    assertEquals(Verdict.PASSED, checks(res, QcKind.SPIKE).get(0).verdict(), "(58 - 20) / 40 = 95 %");
  }

  @Test
  @DisplayName("an injection without any valid reading of a line is not reportable for it, and its trace says why")
  void noValidReadings() {
    RunBuilder b = calibrated().inject("ICV", PB, sig(50)).inject("X1", "Cu 324.754", r(10, 11, 12))
        .inject("CCV1", PB, sig(50));
    RunResult res = run(b);
    AnalyteResult x1 = result(res, "X1");
    assertTrue(x1.flags().contains(ResultFlag.NO_VALID_READINGS), x1.flags().toString());
    assertEquals("not reportable", x1.reported());
    assertTrue(x1.trace().stream().anyMatch(t -> t.contains("the export has no reading of Pb 220.353")), x1.trace().toString());
  }

  @Test
  @DisplayName("every quantified result's trace names the fit, the blank and the factors used")
  void trace() {
    RunResult res = run(calibrated().inject("ICV", PB, sig(50)).inject("X1", PB, sig(20)).inject("CCV1", PB, sig(50)));
    List<String> t = result(res, "X1").trace();
    assertTrue(t.stream().anyMatch(s -> s.startsWith("calibration blank signal 100 subtracted")), t.toString());
    assertTrue(t.stream().anyMatch(s -> s.startsWith("read off the linear curve (weighting none, 3 points)")), t.toString());
    assertTrue(t.stream().anyMatch(s -> s.startsWith("x0 read off the curve")), t.toString());
   }
}
