package org.quantrun.core.processing;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;
import static org.quantrun.core.processing.RunBuilder.r;

import java.util.List;
import java.util.Optional;
import org.junit.jupiter.api.DisplayName;
import org.junit.jupiter.api.Test;
import org.quantrun.core.calibration.LimitSource;
import org.quantrun.core.calibration.StudentT;
import org.quantrun.core.method.Method;
import org.quantrun.core.method.ResultFlag;
import org.quantrun.core.method.SampleRole;
import org.quantrun.core.model.AnalyteResult;
import org.quantrun.core.model.CalibrationStatus;
import org.quantrun.core.model.QcCheck;
import org.quantrun.core.model.QcKind;
import org.quantrun.core.model.RunResult;
import org.quantrun.core.model.RunVerdict;
import org.quantrun.core.qc.Verdict;

/**
 * Scenario tests of the run processor, each checked against values computed by hand (in the test,
 * independently of the engine) from the formulas of the trade: blank subtraction, the
 * least-squares straight line and the s_x0 formula (Miller and Miller, ch. 5, from memory),
 * dilution C_original = C_measured * DF, recovery = measured / true * 100, RPD, spike recovery,
 * serial-dilution %D and the bracketing rule (US EPA 200.7 / 6010 practice, from memory).
 */
class RunProcessorScenarioTest {

  /** A one-analyte method; {@code extra} replaces the marker lines to vary it. */
  static String yaml(String analyteExtra, String qcExtra, String dilution) {
    return """
        method: {id: T-1, version: "1", description: test, unit: ug/L}
        analytes:
          - {name: Pb, line: "220.353", mdl: 1.5, reporting-limit: 5 %s}
        standards:
          - {level: S1, concentrations: {Pb: 10}}
          - {level: S2, concentrations: {Pb: 50}}
          - {level: S3, concentrations: {Pb: 100}}
        blanks: {calibration-blank: subtract, method-blank: report-only}
        identification:
          rules:
            - {pattern: 'BLK', role: calibration-blank}
            - {pattern: '(S\\d)', role: standard, level: '$1'}
            - {pattern: 'ICV', role: icv}
            - {pattern: 'ICB', role: icb}
            - {pattern: 'CCV\\d*', role: ccv}
            - {pattern: 'CCB\\d*', role: ccb}
            - {pattern: 'MB', role: method-blank}
            - {pattern: 'LCS', role: lcs}
            - {pattern: '(X\\d+)-D', role: duplicate, of: '$1'}
            - {pattern: '(X\\d+)-S', role: spike, of: '$1'}
            - {pattern: '(X\\d+)-L', role: serial-dilution, of: '$1'}
            - {pattern: 'X\\d+', role: sample}
          unmatched: reject
        dilution: {default-factor: %s}
        limits: {order: [method]}
        qc:
          calibration: {min-r: 0.995, max-back-calc-error: 10, max-back-calc-error-lowest: 20, over-range-tolerance: 10}
          icv: {true-values: {Pb: 50}, recovery: {low: 90, high: 110}}
          ccv: {from-level: S2, recovery: {low: 90, high: 110}, frequency: 3 %s}
          lcs: {true-values: {Pb: 50}, recovery: {low: 80, high: 120}}
          matrix-spike: {added: {Pb: 40}, recovery: {low: 75, high: 125}, max-background-ratio: 4}
          serial-dilution: {factor: 5, max-difference: 10, min-multiple-of-rl: 2}
        reporting: {significant-figures: 3}
        """.formatted(analyteExtra, dilution, qcExtra);
  }

  static Method method() {
    return RunBuilder.method(yaml("", "", "1"));
  }

  static final String PB = "Pb 220.353";
  /** Blank readings: mean 100. */
  static final double[] BLANK = r(99, 101, 100);

  /** Signal of concentration c on the test's line: 100 (blank) + 20 c, as three readings. */
  static double[] sig(double c) {
    double y = 100 + 20 * c;
    return r(y * 0.999, y, y * 1.001);
  }

  /** A calibration with a little scatter: corrected points (10, 205), (50, 995), (100, 2008). */
  static RunBuilder calibrated() {
    return new RunBuilder("run-T.csv")
        .inject("BLK", PB, BLANK)
        .inject("S1", PB, r(305, 305, 305))
        .inject("S2", PB, r(1095, 1095, 1095))
        .inject("S3", PB, r(2108, 2108, 2108));
  }

  static RunResult run(RunBuilder b) {
    return RunProcessor.process(b.build(), method(), Optional.empty());
  }

  static AnalyteResult result(RunResult r, String sampleId) {
    return r.results().stream().filter(a -> a.sampleId().equals(sampleId)).findFirst().orElseThrow();
  }

  static List<QcCheck> checks(RunResult r, QcKind kind) {
    return r.qc().stream().filter(c -> c.check() == kind).toList();
  }

  @Test
  @DisplayName("a sample is blank-corrected, read off the straight line and multiplied by the dilution factor")
  void straightLineQuantitation() {
    Method m = RunBuilder.method(yaml("", "", "2"));
    RunResult res = RunProcessor.process(calibrated()
        .inject("ICV", PB, sig(50)).inject("X1", PB, r(1300, 1310, 1320)).inject("CCV1", PB, sig(50)).build(),
        m, Optional.empty());
    // By hand: blank = 100; points (10, 205), (50, 995), (100, 2008); least squares:
    double[] x = {10, 50, 100};
    double[] y = {205, 995, 2008};
    double xb = (10 + 50 + 100) / 3.0;
    double yb = (205 + 995 + 2008) / 3.0;
    double sxx = 0;
    double sxy = 0;
    for (int i = 0; i < 3; i++) {
      sxx += (x[i] - xb) * (x[i] - xb);
      sxy += (x[i] - xb) * (y[i] - yb);
    }
    double b = sxy / sxx;
    double a = yb - b * xb;
    double rss = 0;
    for (int i = 0; i < 3; i++) {
      rss += Math.pow(y[i] - a - b * x[i], 2);
    }
    double s = Math.sqrt(rss / 1);
    double y0 = 1310 - 100;
    double x0 = (y0 - a) / b;
    double sx0 = s / b * Math.sqrt(1 + 1.0 / 3 + Math.pow(y0 - yb, 2) / (b * b * sxx));
    AnalyteResult r = result(res, "X1");
    assertEquals(x0, r.solutionConcentration().getAsDouble(), 1e-9);
    assertEquals(2 * x0, r.value().getAsDouble(), 1e-9, "C_original = C_measured x DF");
    assertEquals(2 * StudentT.twoSided(0.95, 1) * sx0, r.ciHalfWidth().getAsDouble(), 1e-9);
    assertEquals(2 * 1.5, r.lod().getAsDouble(), 1e-12, "the method's MDL, times DF");
    assertEquals(2 * 5, r.loq().getAsDouble(), 1e-12);
    assertEquals(Optional.of(LimitSource.METHOD), r.limitsFrom());
    assertEquals(2.0, r.dilutionFactor(), 0);
    assertEquals(1310, r.signalMean().getAsDouble(), 1e-9);
    assertEquals(3, r.replicates());
    assertEquals(SignificantFiguresOf.three(2 * x0), r.reported());
    assertEquals(List.of(), r.flags());
    assertEquals(RunVerdict.IN_CONTROL, res.verdict(), res.findings().toString());
    assertEquals(CalibrationStatus.ACCEPTED, res.calibrations().get(0).status());
  }

  @Test
  @DisplayName("results below the LOD read '< LOD', between LOD and LOQ are estimated, strongly negative ones over-corrected")
  void reportingRules() {
    // domain.md section 8 conventions: "< LOD" (times DF), estimated between LOD and LOQ,
    // negative values kept signed and reported below LOD, below -LOD flagged.
    RunResult res = run(calibrated().inject("ICV", PB, sig(50))
        .inject("X1", PB, sig(0.5)).inject("X2", PB, sig(3)).inject("X3", PB, sig(-4)).inject("CCV1", PB, sig(50)));
    AnalyteResult low = result(res, "X1");
    assertEquals("< 1.50", low.reported());
    assertTrue(low.flags().contains(ResultFlag.BELOW_LOD));
    assertTrue(low.value().getAsDouble() > 0);
    AnalyteResult est = result(res, "X2");
    assertTrue(est.flags().contains(ResultFlag.ESTIMATED), est.flags().toString());
    assertFalse(est.flags().contains(ResultFlag.BELOW_LOD));
    AnalyteResult neg = result(res, "X3");
    assertTrue(neg.value().getAsDouble() < -1.5, "the signed value is kept");
    assertEquals("< 1.50", neg.reported());
    assertTrue(neg.flags().containsAll(List.of(ResultFlag.NEGATIVE, ResultFlag.BELOW_LOD, ResultFlag.OVER_CORRECTION)));
  }

  @Test
  @DisplayName("an over-range sample gets the smallest dilution that brings it under 80 % of the top standard, and the next sample is suspect of carry-over")
  void overRangeAndCarryOver() {
    // 250 against a top standard of 100: 250/2 = 125 > 80, 250/5 = 50 < 80 -> 1:5 (by hand).
    RunResult res = run(calibrated().inject("ICV", PB, sig(50))
        .inject("X1", PB, sig(250)).inject("X2", PB, sig(30)).inject("CCV1", PB, sig(50)));
    AnalyteResult over = result(res, "X1");
    assertTrue(over.flags().contains(ResultFlag.OVER_RANGE));
    assertEquals(5, over.suggestedDilution().getAsInt());
    AnalyteResult next = result(res, "X2");
    assertTrue(next.flags().contains(ResultFlag.CARRY_OVER_SUSPECT));
    assertEquals(5, res.reruns().stream().filter(q -> q.sampleId().equals("X1")).findFirst().orElseThrow()
        .dilution().getAsInt());
    assertTrue(res.reruns().stream().anyMatch(q -> q.sampleId().equals("X2") && q.reason().contains("carry-over")));
    assertEquals(RunVerdict.RERUNS_NEEDED, res.verdict());
  }

  @Test
  @DisplayName("readings the instrument could not give are left out with their reason; all of them OVER means over range")
  void invalidReadings() {
    RunResult res = run(calibrated().inject("ICV", PB, sig(50))
        .inject("X1", PB, r(1300, Double.NaN, 1320)).inject("X2", PB, r(Double.NaN, Double.NaN, Double.NaN))
        .inject("CCV1", PB, sig(50)));
    AnalyteResult one = result(res, "X1");
    assertEquals(2, one.replicates());
    assertEquals(1310, one.signalMean().getAsDouble(), 1e-9);
    assertTrue(one.trace().stream().anyMatch(t -> t.contains("left out") && t.contains("OVER")), one.trace().toString());
    AnalyteResult none = result(res, "X2");
    assertTrue(none.value().isEmpty());
    assertEquals("not reportable", none.reported());
    assertTrue(none.flags().contains(ResultFlag.OVER_RANGE));
  }

  @Test
  @DisplayName("a calibration failing its minimum r is rejected, and its samples are not reportable, never silently reported")
  void rejectedCalibration() {
    RunResult res = run(new RunBuilder("run-T.csv").inject("BLK", PB, BLANK)
        .inject("S1", PB, r(305, 305, 305)).inject("S2", PB, r(1900, 1900, 1900)).inject("S3", PB, r(2108, 2108, 2108))
        .inject("ICV", PB, sig(50)).inject("X1", PB, sig(20)).inject("CCV1", PB, sig(50)));
    assertEquals(CalibrationStatus.REJECTED, res.calibrations().get(0).status());
    assertTrue(res.calibrations().get(0).reasons().stream().anyMatch(r -> r.startsWith("r ") && r.contains("below the minimum 0.995")),
        res.calibrations().get(0).reasons().toString());
    AnalyteResult x = result(res, "X1");
    assertTrue(x.value().isEmpty());
    assertEquals("not reportable", x.reported());
    assertTrue(x.flags().contains(ResultFlag.CALIBRATION_FAILED));
    assertTrue(res.reruns().stream().anyMatch(q -> q.sampleId().equals("X1") && q.reason().startsWith("calibration rejected")));
    assertEquals(RunVerdict.OUT_OF_CONTROL, res.verdict(), "no reported line has an accepted calibration");
  }

  @Test
  @DisplayName("a lowest standard reading back more than 20 % off rejects the calibration")
  void backCalculationOfTheLowestStandard() {
    // Common practice (from memory): each standard within 10 %, the lowest within 20 %. By hand
    // (least squares on (10, 420), (50, 995), (100, 2008)): S1 reads back 27 % high, r = 0.9956.
    RunResult res = run(new RunBuilder("run-T.csv").inject("BLK", PB, BLANK)
        .inject("S1", PB, r(520, 520, 520)).inject("S2", PB, r(1095, 1095, 1095)).inject("S3", PB, r(2108, 2108, 2108))
        .inject("ICV", PB, sig(50)).inject("CCV1", PB, sig(50)));
    var cal = res.calibrations().get(0);
    assertEquals(CalibrationStatus.REJECTED, cal.status());
    assertEquals(Verdict.FAILED, cal.levels().get(0).verdict());
    assertTrue(cal.levels().get(0).percentError().getAsDouble() > 20);
    assertTrue(cal.reasons().stream().anyMatch(r -> r.contains("lowest standard")), cal.reasons().toString());
  }

  @Test
  @DisplayName("ICV and CCV recoveries are judged; a failed CCV marks the samples it brackets, for that analyte only")
  void bracketing() {
    // CCV recovery 90-110 % (EPA 200.7, from memory); CCV2 reads 60 against 50 = 120 % -> failed.
    RunResult res = run(calibrated().inject("ICV", PB, sig(51))
        .inject("X1", PB, sig(20)).inject("CCV1", PB, sig(50))
        .inject("X2", PB, sig(20)).inject("X3", PB, sig(20)).inject("CCV2", PB, sig(60))
        .inject("X4", PB, sig(20)).inject("CCV3", PB, sig(50)));
    List<QcCheck> ccv = checks(res, QcKind.CCV);
    assertEquals(List.of(Verdict.PASSED, Verdict.FAILED, Verdict.PASSED), ccv.stream().map(QcCheck::verdict).toList());
    assertEquals(120.0, ccv.get(1).result().getAsDouble(), 0.5);
    assertEquals(Verdict.PASSED, checks(res, QcKind.ICV).get(0).verdict());
    assertEquals(102.0, checks(res, QcKind.ICV).get(0).result().getAsDouble(), 0.5);
    assertFalse(result(res, "X1").flags().contains(ResultFlag.CCV_FAILED));
    assertTrue(result(res, "X2").flags().contains(ResultFlag.CCV_FAILED));
    assertTrue(result(res, "X3").flags().contains(ResultFlag.CCV_FAILED));
    assertTrue(result(res, "X4").flags().contains(ResultFlag.CCV_FAILED), "X4 follows the failed CCV");
    assertEquals(3, res.reruns().stream().filter(q -> q.reason().contains("CCV2")).count());
    assertEquals(RunVerdict.RERUNS_NEEDED, res.verdict());
  }

  @Test
  @DisplayName("non-detects stand after a high-biased CCV only when the method allows it")
  void nonDetectsAfterHighBias() {
    RunBuilder b = calibrated().inject("ICV", PB, sig(50))
        .inject("X1", PB, sig(0.2)).inject("X2", PB, sig(30)).inject("CCV1", PB, sig(60));
    RunResult strict = run(b);
    assertTrue(result(strict, "X1").flags().contains(ResultFlag.CCV_FAILED));
    Method lenient = RunBuilder.method(yaml("", ", non-detects-stand-after-high-bias: true", "1"));
    RunResult allowed = RunProcessor.process(b.build(), lenient, Optional.empty());
    assertFalse(result(allowed, "X1").flags().contains(ResultFlag.CCV_FAILED), "a non-detect stands");
    assertTrue(result(allowed, "X2").flags().contains(ResultFlag.CCV_FAILED), "a detect does not");
  }

  @Test
  @DisplayName("more real samples between CCVs than the method allows, or none after the last, fails the run")
  void ccvFrequency() {
    RunResult res = run(calibrated().inject("ICV", PB, sig(50))
        .inject("X1", PB, sig(20)).inject("X2", PB, sig(20)).inject("X3", PB, sig(20)).inject("X4", PB, sig(20))
        .inject("CCV1", PB, sig(50)).inject("X5", PB, sig(20)));
    assertEquals(RunVerdict.OUT_OF_CONTROL, res.verdict());
    List<QcCheck> f = checks(res, QcKind.CCV_FREQUENCY);
    assertEquals(2, f.size(), f.toString());
    assertTrue(res.findings().stream().anyMatch(s -> s.startsWith("4 real samples between ICV")), res.findings().toString());
    assertTrue(res.findings().stream().anyMatch(s -> s.contains("no closing CCV")), res.findings().toString());
    assertTrue(res.reruns().stream().anyMatch(q -> q.sampleId().equals("X5") && q.reason().contains("closing CCV")));
  }

  @Test
  @DisplayName("blanks are judged against the reporting limit; a failed CCB marks the samples it brackets")
  void blanks() {
    // ICB/CCB: |result| <= reporting limit (5 here); CCB1 reads 7 -> failed.
    RunResult res = run(calibrated().inject("ICV", PB, sig(50)).inject("ICB", PB, sig(0.3))
        .inject("X1", PB, sig(20)).inject("CCV1", PB, sig(50)).inject("CCB1", PB, sig(7)));
    assertEquals(Verdict.PASSED, checks(res, QcKind.ICB).get(0).verdict());
    assertEquals(Verdict.FAILED, checks(res, QcKind.CCB).get(0).verdict());
    assertTrue(result(res, "X1").flags().contains(ResultFlag.CCB_FAILED));
  }

  @Test
  @DisplayName("method blank and LCS apply to the samples of the batch")
  void methodBlankAndLcs() {
    // LCS recovery 80-120 % (SW-846, from memory): 65 against 50 = 130 % -> failed.
    RunResult res = run(calibrated().inject("ICV", PB, sig(50)).inject("MB", PB, sig(6)).inject("LCS", PB, sig(65))
        .inject("X1", PB, sig(20)).inject("CCV1", PB, sig(50)));
    assertEquals(Verdict.FAILED, checks(res, QcKind.METHOD_BLANK).get(0).verdict());
    QcCheck lcs = checks(res, QcKind.LCS).get(0);
    assertEquals(Verdict.FAILED, lcs.verdict());
    assertEquals(130.0, lcs.result().getAsDouble(), 0.5);
    assertTrue(result(res, "X1").flags().containsAll(List.of(ResultFlag.METHOD_BLANK_FAILED, ResultFlag.LCS_FAILED)));
  }

  @Test
  @DisplayName("a method blank is subtracted in concentration only when the method says so")
  void methodBlankSubtraction() {
    Method m = RunBuilder.method(yaml("", "", "1").replace("method-blank: report-only", "method-blank: subtract"));
    RunBuilder b = calibrated().inject("ICV", PB, sig(50)).inject("MB", PB, sig(2)).inject("X1", PB, sig(20))
        .inject("CCV1", PB, sig(50));
    RunResult plain = run(b);
    RunResult subtracted = RunProcessor.process(b.build(), m, Optional.empty());
    double mb = result(plain, "MB").value().getAsDouble();
    assertEquals(result(plain, "X1").value().getAsDouble() - mb, result(subtracted, "X1").value().getAsDouble(), 1e-9);
    assertTrue(result(subtracted, "X1").flags().contains(ResultFlag.METHOD_BLANK_SUBTRACTED));
  }

  @Test
  @DisplayName("duplicates, spikes and serial dilutions are judged by their rules")
  void pairs() {
    // Duplicate RPD <= 20 % from 5x RL (25): 40 vs 30 -> RPD 28.6 % -> failed (by hand).
    // Spike: (X1-S 66 - X1 40) / 40 added = 65 % -> failed (75-125 %).
    // Serial dilution 1:5: |40 - 5 * 8.6| / 40 = 7.5 % <= 10 -> passed.
    RunResult res = run(calibrated().inject("ICV", PB, sig(50))
        .inject("X1", PB, sig(40)).inject("X1-D", PB, sig(30)).inject("CCV1", PB, sig(50))
        .inject("X1-S", PB, sig(66)).inject("X1-L", PB, sig(8.6)).inject("CCV2", PB, sig(50)));
    QcCheck dup = checks(res, QcKind.DUPLICATE).get(0);
    assertEquals(Verdict.FAILED, dup.verdict());
    assertEquals(Math.abs(40 - 30) / 35.0 * 100, dup.result().getAsDouble(), 0.5);
    QcCheck spike = checks(res, QcKind.SPIKE).get(0);
    assertEquals(Verdict.FAILED, spike.verdict());
    assertEquals(65.0, spike.result().getAsDouble(), 1.0);
    QcCheck serial = checks(res, QcKind.SERIAL_DILUTION).get(0);
    assertEquals(Verdict.PASSED, serial.verdict(), serial.toString());
    assertEquals(7.5, serial.result().getAsDouble(), 1.0);
    assertTrue(result(res, "X1").flags().containsAll(List.of(ResultFlag.DUPLICATE_FAILED, ResultFlag.SPIKE_FAILED)));
  }

  @Test
  @DisplayName("a spike is not judged when the sample holds more than 4x the amount added")
  void spikeFourTimesRule() {
    RunResult res = run(calibrated().inject("ICV", PB, sig(50))
        .inject("X1", PB, sig(170)).inject("X1-S", PB, sig(200)).inject("CCV1", PB, sig(50)));
    QcCheck spike = checks(res, QcKind.SPIKE).get(0);
    assertEquals(Verdict.NOT_EVALUATED, spike.verdict());
    assertTrue(result(res, "X1").flags().contains(ResultFlag.SPIKE_NOT_EVALUATED));
  }

  @Test
  @DisplayName("an injection no rule recognises stops the run with one clear message when the method rejects those")
  void unmatched() {
    ProcessingException e = assertThrows(ProcessingException.class,
        () -> run(calibrated().inject("RINSE", PB, sig(0))));
    assertEquals("run-T.csv: 1 injection matches no identification rule and the method rejects those: 5 'RINSE' "
        + "(add a rule, or set identification.unmatched: sample)", e.getMessage());
  }

  @Test
  @DisplayName("the same inputs give equal results")
  void deterministic() {
    RunBuilder b = calibrated().inject("ICV", PB, sig(50)).inject("X1", PB, sig(20)).inject("CCV1", PB, sig(50));
    assertEquals(run(b), run(b));
  }

  @Test
  @DisplayName("injections get their roles, levels and parents")
  void classification() {
    RunResult res = run(calibrated().inject("ICV", PB, sig(50)).inject("X1", PB, sig(20)).inject("X1-D", PB, sig(20))
        .inject("CCV1", PB, sig(50)));
    var roles = res.injections().stream().map(i -> i.role()).toList();
    assertEquals(List.of(SampleRole.CALIBRATION_BLANK, SampleRole.STANDARD, SampleRole.STANDARD, SampleRole.STANDARD,
        SampleRole.ICV, SampleRole.SAMPLE, SampleRole.DUPLICATE, SampleRole.CCV), roles);
    assertEquals(Optional.of("S2"), res.injections().get(2).level());
    assertEquals(Optional.of("X1"), res.injections().get(6).parentSampleId());
  }

  /** Rounds like the reporting rules, by BigDecimal, for expected texts. */
  static final class SignificantFiguresOf {
    static String three(double v) {
      return new java.math.BigDecimal(Double.toString(v)).round(new java.math.MathContext(3, java.math.RoundingMode.HALF_EVEN))
          .toPlainString();
    }
  }
}
