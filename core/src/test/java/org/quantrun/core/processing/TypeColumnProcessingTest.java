package org.quantrun.core.processing;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;
import static org.quantrun.core.processing.RunBuilder.r;
import static org.quantrun.core.processing.RunProcessorScenarioTest.PB;
import static org.quantrun.core.processing.RunProcessorScenarioTest.result;
import static org.quantrun.core.processing.RunProcessorScenarioTest.yaml;

import java.util.Optional;
import org.junit.jupiter.api.DisplayName;
import org.junit.jupiter.api.Test;
import org.quantrun.core.method.Method;
import org.quantrun.core.method.SampleRole;
import org.quantrun.core.model.InjectionRecord;
import org.quantrun.core.model.RunResult;

/**
 * {@code identification.type-column}: the type of each injection is read from the export column the
 * method names (METHOD-REFERENCE.md, identification), not from whatever column the importer takes
 * as the sample type by its own aliases. Invented runs with an exact calibration: blank 100,
 * standards 10 / 50 / 100 ug/L at 300 / 1100 / 2100, so after the blank is subtracted a signal of
 * 260 is 8 ug/L (hand-computed). The sample IDs match no ID rule of the method (which rejects
 * unmatched injections), so only the type column can give them their roles.
 */
class TypeColumnProcessingTest {

  /** The scenario method with a type column {@code Kind} and its values; {@code order} as given. */
  private static Method kindMethod(String order, String unmatched) {
    return RunBuilder.method(yaml("", "", "1").replace("  unmatched: reject",
        "  unmatched: " + unmatched + "\n  order: " + order + "\n  type-column: Kind\n"
            + "  type-values: {B: calibration-blank, QC1: icv, QC2: ccv, UNK: sample}"));
  }

  /** Blank, S1..S3 (standards by the ID rule, which gives their level), then an ICV: all by {@code Kind} but the standards. */
  private static RunBuilder run(String source, String... columns) {
    return new RunBuilder(source).columns(columns)
        .cell("Kind", "B").inject("first", PB, r(100, 100, 100))
        .inject("S1", PB, r(300, 300, 300))
        .inject("S2", PB, r(1100, 1100, 1100))
        .inject("S3", PB, r(2100, 2100, 2100))
        .cell("Kind", "QC1").inject("second", PB, r(1100, 1100, 1100));
  }

  private static InjectionRecord record(RunResult res, String sampleId) {
    return res.injections().stream().filter(i -> i.sampleId().equals(sampleId)).findFirst().orElseThrow();
  }

  /** {@link #run}, then a sample 'third' (Kind UNK) and a CCV 'fourth' (Kind as given), processed rules-first. */
  private static RunResult sampleAndCcv(String source, String kindHeader, String ccvKind) {
    return RunProcessor.process(run(source, "Sample", "Element", "Intensity", kindHeader)
        .cell("Kind", "UNK").inject("third", PB, r(260, 260, 260))
        .cell("Kind", ccvKind).inject("fourth", PB, r(1100, 1100, 1100)).build(), kindMethod("rules-first", "reject"),
        Optional.empty());
  }

  @Test
  @DisplayName("a type column that is no alias of the sample type ('Kind') gives each injection its role")
  void kindDrivesIdentification() {
    RunResult res = sampleAndCcv("run-T1.csv", "Kind", "QC2");
    assertEquals(SampleRole.CALIBRATION_BLANK, record(res, "first").role());
    assertEquals(SampleRole.ICV, record(res, "second").role());
    assertEquals("type column 'QC1'", record(res, "second").identifiedBy());
    assertEquals(SampleRole.SAMPLE, record(res, "third").role());
    assertEquals(SampleRole.CCV, record(res, "fourth").role());
    // the blank is subtracted and the curve is y = 20 x: 260 -> 8 ug/L
    assertEquals(8.0, result(res, "third").value().getAsDouble(), 1e-9);
  }

  @Test
  @DisplayName("when the importer also found a sample type by its aliases, the method's named column decides")
  void namedColumnWinsOverTheDetectedType() {
    // the detected types are values the mapping has, but the wrong ones: were they read, the blank
    // would be a CCV and the sample an ICV
    RunBuilder b = new RunBuilder("run-T2.csv").columns("Sample", "Type", "Element", "Intensity", "Kind")
        .type("QC2").cell("Kind", "B").inject("first", PB, r(100, 100, 100))
        .inject("S1", PB, r(300, 300, 300))
        .inject("S2", PB, r(1100, 1100, 1100))
        .inject("S3", PB, r(2100, 2100, 2100))
        .type("B").cell("Kind", "QC1").inject("second", PB, r(1100, 1100, 1100))
        .type("QC1").cell("Kind", "UNK").inject("third", PB, r(260, 260, 260))
        .type("UNK").cell("Kind", "QC2").inject("fourth", PB, r(1100, 1100, 1100));
    RunResult res = RunProcessor.process(b.build(), kindMethod("type-column-first", "reject"), Optional.empty());
    assertEquals(SampleRole.CALIBRATION_BLANK, record(res, "first").role());
    assertEquals(SampleRole.ICV, record(res, "second").role());
    assertEquals(SampleRole.SAMPLE, record(res, "third").role());
    assertEquals("type column 'UNK'", record(res, "third").identifiedBy());
    assertEquals(SampleRole.CCV, record(res, "fourth").role());
    // the standards keep their roles and levels from the rule (order type-column-first: a blank type cell gives no role)
    assertEquals(Optional.of("S2"), record(res, "S2").level());
  }

  @Test
  @DisplayName("a type column the export lacks refuses the run, naming the export, the key, the column and the export's columns")
  void missingTypeColumnIsRefused() {
    RunBuilder b = run("run-T3.csv", "Sample", "Type", "Element", "Intensity");
    ProcessingException e = assertThrows(ProcessingException.class,
        () -> RunProcessor.process(b.build(), kindMethod("rules-first", "reject"), Optional.empty()));
    assertEquals("run-T3.csv: the method's identification.type-column names the column 'Kind', which the export does"
        + " not have (its columns: 'Sample', 'Type', 'Element', 'Intensity')", e.getMessage());
  }

  @Test
  @DisplayName("the type column is found as header names are: letter case and separators do not matter")
  void columnNameMatchesLikeHeaders() {
    RunResult res = sampleAndCcv("run-T4.csv", " KIND ", "qc2");
    // type values are matched ignoring letter case, as before (InjectionClassifier)
    assertEquals(SampleRole.CCV, record(res, "fourth").role());
  }

  @Test
  @DisplayName("a type value the mapping lacks, or a blank cell, gives no role: the rules and identification.unmatched decide")
  void unmappedValueFallsBackToRulesAndUnmatched() {
    // METHOD-REFERENCE.md: type-values says what each value means; an injection nothing recognises
    // follows identification.unmatched
    RunBuilder reject = run("run-T5.csv", "Sample", "Element", "Intensity", "Kind")
        .cell("Kind", "SMP").inject("third", PB, r(260, 260, 260))
        .cell("Kind", "QC2").inject("fourth", PB, r(1100, 1100, 1100));
    ProcessingException e = assertThrows(ProcessingException.class,
        () -> RunProcessor.process(reject.build(), kindMethod("rules-first", "reject"), Optional.empty()));
    assertEquals("run-T5.csv: 1 injection matches no identification rule and the method rejects those: 6 'third'"
        + " (add a rule, or set identification.unmatched: sample)", e.getMessage());

    RunResult res = RunProcessor.process(run("run-T6.csv", "Sample", "Element", "Intensity", "Kind")
        .cell("Kind", "SMP").inject("third", PB, r(260, 260, 260))
        .cell("Kind", "").inject("X7", PB, r(260, 260, 260))
        .cell("Kind", "QC2").inject("fourth", PB, r(1100, 1100, 1100)).build(), kindMethod("rules-first", "sample"),
        Optional.empty());
    assertEquals(SampleRole.SAMPLE, record(res, "third").role());
    assertEquals("no rule matched: taken as a sample", record(res, "third").identifiedBy());
    // a blank cell: the ID rule 'X\d+' decides
    assertEquals(SampleRole.SAMPLE, record(res, "X7").role());
    assertTrue(record(res, "X7").identifiedBy().startsWith("rule "), record(res, "X7").identifiedBy());
  }

  @Test
  @DisplayName("order decides when the rules and the type column both give a role")
  void orderDecides() {
    // METHOD-REFERENCE.md, identification.order: which source decides when both give a role.
    // 'CCV2' matches the rule 'CCV\d*' (ccv) while its Kind cell says UNK (sample).
    RunBuilder b = run("run-T7.csv", "Sample", "Element", "Intensity", "Kind")
        .cell("Kind", "UNK").inject("X1", PB, r(260, 260, 260))
        .cell("Kind", "QC2").inject("CCV1", PB, r(1100, 1100, 1100))
        .cell("Kind", "UNK").inject("CCV2", PB, r(1100, 1100, 1100));
    RunResult rulesFirst = RunProcessor.process(b.build(), kindMethod("rules-first", "reject"), Optional.empty());
    assertEquals(SampleRole.CCV, record(rulesFirst, "CCV2").role());
    RunResult typeFirst = RunProcessor.process(b.build(), kindMethod("type-column-first", "reject"), Optional.empty());
    assertEquals(SampleRole.SAMPLE, record(typeFirst, "CCV2").role());
    assertEquals("type column 'UNK'", record(typeFirst, "CCV2").identifiedBy());
  }

  @Test
  @DisplayName("the method asks the importer for its type column, before the level and factor columns")
  void methodNamesTheColumn() {
    Method m = RunBuilder.method(yaml("", "", "1").replace("dilution: {default-factor: 1}",
        "dilution: {default-factor: 1, factor-column: Dil}").replace("  unmatched: reject",
        "  unmatched: reject\n  level-column: Level\n  type-column: Kind\n  type-values: {B: calibration-blank}"));
    assertEquals(java.util.List.of("Kind", "Level", "Dil"), m.injectionColumns());
  }
}
