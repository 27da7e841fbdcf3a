package org.quantrun.core.processing;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;
import static org.quantrun.core.processing.RunBuilder.r;
import static org.quantrun.core.processing.RunProcessorScenarioTest.PB;
import static org.quantrun.core.processing.RunProcessorScenarioTest.result;
import static org.quantrun.core.processing.RunProcessorScenarioTest.yaml;

import java.util.Optional;
import org.junit.jupiter.api.DisplayName;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.ValueSource;
import org.quantrun.core.method.Method;
import org.quantrun.core.method.MethodException;
import org.quantrun.core.method.prep.PrepSheet;
import org.quantrun.core.method.prep.PrepSheetParser;
import org.quantrun.core.model.AnalyteResult;
import org.quantrun.core.model.InjectionRecord;
import org.quantrun.core.model.RunResult;

/**
 * The export columns a method reads per injection: {@code dilution.factor-column} and
 * {@code identification.level-column}. Invented runs with an exact calibration: blank 100, standards
 * 10 / 50 / 100 ug/L at 300 / 1100 / 2100, so after the blank is subtracted the curve is y = 20 x and
 * a signal of 260 is 8 ug/L in the measured solution (hand-computed).
 */
class InjectionColumnsProcessingTest {

  /** Blank, S1..S3, ICV: lines 2 to 16 of the invented export (three readings, one line each). */
  private static RunBuilder calibratedExactly(String source) {
    return new RunBuilder(source).columns("Seq", "Sample", "Element", "Intensity", "Dil")
        .inject("BLK", PB, r(100, 100, 100))
        .inject("S1", PB, r(300, 300, 300))
        .inject("S2", PB, r(1100, 1100, 1100))
        .inject("S3", PB, r(2100, 2100, 2100))
        .inject("ICV", PB, r(1100, 1100, 1100));
  }

  private static Method factorMethod(String defaultFactor) {
    return RunBuilder.method(yaml("", "", "1").replace("dilution: {default-factor: 1}",
        "dilution: {default-factor: " + defaultFactor + ", factor-column: Dil}"));
  }

  @Test
  @DisplayName("the export's factor multiplies the result; a blank cell gets the default factor; the trace says which")
  void factorMultipliesTheResult() {
    RunResult res = RunProcessor.process(calibratedExactly("run-D1.csv")
        .cell("Dil", "10").inject("X1", PB, r(260, 260, 260))
        .cell("Dil", "").inject("X2", PB, r(260, 260, 260))
        .cell("Dil", "2.5").inject("X3", PB, r(260, 260, 260))
        .inject("CCV1", PB, r(1100, 1100, 1100)).build(), factorMethod("2"), Optional.empty());
    // domain.md, dilution: C_original = C_measured x DF; 8 ug/L measured in each solution
    AnalyteResult x1 = result(res, "X1");
    assertEquals(80.0, x1.value().getAsDouble(), 1e-9);
    assertEquals(10.0, x1.dilutionFactor());
    assertEquals(8.0, x1.solutionConcentration().getAsDouble(), 1e-9);
    assertTrue(x1.trace().contains("dilution factor 10 from the export's 'Dil' column"), x1.trace().toString());
    AnalyteResult x2 = result(res, "X2");
    assertEquals(16.0, x2.value().getAsDouble(), 1e-9, "blank cell: the method's default factor 2");
    assertTrue(x2.trace().contains("default dilution factor 2 (the export's 'Dil' column is blank)"), x2.trace().toString());
    assertEquals(20.0, result(res, "X3").value().getAsDouble(), 1e-9);
    InjectionRecord rec = res.injections().stream().filter(i -> i.sampleId().equals("X1")).findFirst().orElseThrow();
    assertEquals(10.0, rec.dilutionFactor());
    assertFalse(res.findings().stream().anyMatch(f -> f.contains("not applied")), res.findings().toString());
  }

  @Test
  @DisplayName("the limits scale with the export's factor as the value does")
  void limitsScaleWithTheFactor() {
    RunResult res = RunProcessor.process(calibratedExactly("run-D2.csv")
        .cell("Dil", "4").inject("X1", PB, r(260, 260, 260))
        .inject("CCV1", PB, r(1100, 1100, 1100)).build(), factorMethod("1"), Optional.empty());
    // the method's MDL 1.5 ug/L is the LOD in the solution; times DF 4 in the sample (domain.md section 8)
    assertEquals(6.0, result(res, "X1").lod().getAsDouble(), 1e-9);
  }

  @Test
  @DisplayName("a calibration check is measured as made: a factor in its cell is not applied and is named in the findings")
  void checksAreMeasuredAsMade() {
    RunResult res = RunProcessor.process(calibratedExactly("run-D3.csv")
        .inject("X1", PB, r(260, 260, 260))
        .cell("Dil", "5").inject("CCV1", PB, r(1100, 1100, 1100)).build(), factorMethod("1"), Optional.empty());
    assertEquals(50.0, result(res, "CCV1").value().getAsDouble(), 1e-9);
    assertTrue(res.findings().stream().anyMatch(f -> f.startsWith("injection 7 'CCV1' (ccv) has dilution factor 5 in the export's"
        + " 'Dil' column; it was not applied")), res.findings().toString());
  }

  @ParameterizedTest
  @ValueSource(strings = {"ten", "0", "-5", "n/a", "1,5", "1e999"})
  @DisplayName("a factor cell that is not a positive number refuses the run, naming file, line, column, key, text and what was expected")
  void badFactorIsRefused(String text) {
    RunBuilder b = calibratedExactly("run-D4.csv").cell("Dil", text).inject("X1", PB, r(260, 260, 260))
        .inject("CCV1", PB, r(1100, 1100, 1100));
    ProcessingException e = assertThrows(ProcessingException.class,
        () -> RunProcessor.process(b.build(), factorMethod("1"), Optional.empty()));
    // X1's first line is 17 (five injections of three lines from line 2); its cell is in column 9
    assertEquals("run-D4.csv:17:9: dilution.factor-column 'Dil' of injection 6 'X1' is \"" + text
        + "\": expected a positive number (decimal separator '.', no thousands separator), or a blank cell for the"
        + " method's default factor 1", e.getMessage());
  }

  @Test
  @DisplayName("a factor column the export lacks refuses the run, naming the export, the key, the column and the export's columns")
  void missingFactorColumnIsRefused() {
    RunBuilder b = calibratedExactly("run-D5.csv").columns("Seq", "Sample", "Element", "Intensity")
        .inject("X1", PB, r(260, 260, 260));
    ProcessingException e = assertThrows(ProcessingException.class,
        () -> RunProcessor.process(b.build(), factorMethod("1"), Optional.empty()));
    assertEquals("run-D5.csv: the method's dilution.factor-column names the column 'Dil', which the export does not have"
        + " (its columns: 'Seq', 'Sample', 'Element', 'Intensity')", e.getMessage());
  }

  @Test
  @DisplayName("the column is found as header names are: letter case and surrounding spaces do not matter")
  void columnNameMatchesLikeHeaders() {
    RunBuilder b = calibratedExactly("run-D6.csv").columns("Seq", "Sample", "Element", "Intensity", " DIL ")
        .cell("Dil", "3").inject("X1", PB, r(260, 260, 260)).inject("CCV1", PB, r(1100, 1100, 1100));
    RunResult res = RunProcessor.process(b.build(), factorMethod("1"), Optional.empty());
    assertEquals(24.0, result(res, "X1").value().getAsDouble(), 1e-9);
  }

  // ---- with a prep sheet

  private static final String PREP_DILUTION = "dilution: {default-factor: 3, factor-column: Dil, prep-sheet: {columns: {"
      + "sample-id: Sample, prep-batch: Batch, dilution-factor: DF, sample-mass: Mass, final-volume: Volume},"
      + " report-unit: mg/kg}}";

  @Test
  @DisplayName("with a prep sheet the export's factor is one more step: it multiplies the prep sheet's factor")
  void factorAndPrepSheetMultiply() throws MethodException {
    Method m = RunBuilder.method(yaml("", "", "1").replace("dilution: {default-factor: 1}", PREP_DILUTION));
    PrepSheet sheet = PrepSheetParser.parse("Sample,Batch,DF,Mass,Volume\nX1,P1,2,0.500,50\nX2,P1,2,0.500,50\n",
        "prep-D7.csv", m.dilution().prepSheet().orElseThrow());
    RunResult res = RunProcessor.process(calibratedExactly("run-D7.csv")
        .cell("Dil", "10").inject("X1", PB, r(260, 260, 260))
        .cell("Dil", "").inject("X2", PB, r(260, 260, 260))
        .inject("CCV1", PB, r(1100, 1100, 1100)).build(), m, Optional.of(sheet));
    // domain.md, dilution: mg/kg = ug/L x DF x V_final[L] / mass[g], DF the product of every step:
    // X1: 8 x (2 x 10) x 0.050 / 0.500 = 16; X2 (blank cell, a prep-sheet row): 8 x 2 x 0.050 / 0.500 = 1.6,
    // the default factor 3 being for injections with no other source
    AnalyteResult x1 = result(res, "X1");
    assertEquals(16.0, x1.value().getAsDouble(), 1e-9);
    assertEquals("mg/kg", x1.unit());
    assertEquals(20.0, x1.dilutionFactor());
    assertTrue(x1.trace().contains("dilution factor 10 from the export's 'Dil' column, times the prep sheet's 2: 20"),
        x1.trace().toString());
    assertEquals(1.6, result(res, "X2").value().getAsDouble(), 1e-9);
    assertEquals(2.0, result(res, "X2").dilutionFactor());
  }

  // ---- the level column

  private static Method levelMethod(boolean ruleGivesLevel) {
    String rule = ruleGivesLevel ? "- {pattern: '(S\\d)', role: standard, level: '$1'}" : "- {pattern: 'STD-.+', role: standard}";
    return RunBuilder.method(yaml("", "", "1").replace("- {pattern: '(S\\d)', role: standard, level: '$1'}", rule)
        .replace("  unmatched: reject", "  unmatched: reject\n  level-column: Level"));
  }

  private static RunBuilder byLevelColumn(String source, String a, String b, String c) {
    return new RunBuilder(source).columns("Sample", "Element", "Intensity", "Level")
        .inject("BLK", PB, r(100, 100, 100))
        .cell("Level", a).inject("STD-A", PB, r(300, 300, 300))
        .cell("Level", b).inject("STD-B", PB, r(1100, 1100, 1100))
        .cell("Level", c).inject("STD-C", PB, r(2100, 2100, 2100))
        .inject("ICV", PB, r(1100, 1100, 1100));
  }

  @Test
  @DisplayName("a standard's level comes from the export's level column (letter case ignored) and calibrates the line")
  void levelFromTheColumn() {
    RunResult res = RunProcessor.process(byLevelColumn("run-L1.csv", "S1", "s2", " S3 ")
        .inject("X1", PB, r(260, 260, 260)).inject("CCV1", PB, r(1100, 1100, 1100)).build(), levelMethod(false),
        Optional.empty());
    InjectionRecord b = res.injections().stream().filter(i -> i.sampleId().equals("STD-B")).findFirst().orElseThrow();
    assertEquals(Optional.of("S2"), b.level());
    assertTrue(b.identifiedBy().endsWith(", level from the export's 'Level' column"), b.identifiedBy());
    // exact points (10, 200), (50, 1000), (100, 2000) after the blank: 260 -> 8 ug/L
    assertEquals(8.0, result(res, "X1").value().getAsDouble(), 1e-9);
  }

  @Test
  @DisplayName("a standard whose level names no level of the method refuses the run, listing the defined levels")
  void unknownLevelIsRefused() {
    RunBuilder b = byLevelColumn("run-L2.csv", "S1", "S9", "S3");
    ProcessingException e = assertThrows(ProcessingException.class,
        () -> RunProcessor.process(b.build(), levelMethod(false), Optional.empty()));
    // STD-B is the third injection: lines 8 to 10
    assertEquals("run-L2.csv:8:9: identification.level-column 'Level' of injection 3 'STD-B' is \"S9\", which is not a"
        + " standard level of the method (expected one of: S1, S2, S3)", e.getMessage());
  }

  @Test
  @DisplayName("a blank level cell falls back to the rule's level; a cell that contradicts the rule refuses the run")
  void blankLevelFallsBackToTheRule() {
    RunBuilder ok = new RunBuilder("run-L3.csv").columns("Sample", "Element", "Intensity", "Level")
        .inject("BLK", PB, r(100, 100, 100))
        .cell("Level", "").inject("S1", PB, r(300, 300, 300))
        .cell("Level", "S2").inject("S2", PB, r(1100, 1100, 1100))
        .inject("S3", PB, r(2100, 2100, 2100))
        .inject("ICV", PB, r(1100, 1100, 1100)).inject("X1", PB, r(260, 260, 260)).inject("CCV1", PB, r(1100, 1100, 1100));
    RunResult res = RunProcessor.process(ok.build(), levelMethod(true), Optional.empty());
    assertEquals(Optional.of("S1"), res.injections().get(1).level());
    assertEquals(8.0, result(res, "X1").value().getAsDouble(), 1e-9);

    RunBuilder bad = new RunBuilder("run-L4.csv").columns("Sample", "Element", "Intensity", "Level")
        .inject("BLK", PB, r(100, 100, 100))
        .cell("Level", "S3").inject("S1", PB, r(300, 300, 300));
    ProcessingException e = assertThrows(ProcessingException.class,
        () -> RunProcessor.process(bad.build(), levelMethod(true), Optional.empty()));
    assertEquals("run-L4.csv: injection 2 'S1' is standard level 'S3' by the export's 'Level' column"
        + " (identification.level-column), but rule 2 '(S\\d)' gives level 'S1' (make the rule and the column agree,"
        + " or drop the rule's level)", e.getMessage());
  }

  @Test
  @DisplayName("a blank level cell with no other source of the level says to fill in the column")
  void blankLevelWithoutAnotherSource() {
    RunBuilder b = byLevelColumn("run-L5.csv", "S1", "", "S3");
    ProcessingException e = assertThrows(ProcessingException.class,
        () -> RunProcessor.process(b.build(), levelMethod(false), Optional.empty()));
    assertTrue(e.getMessage().startsWith("run-L5.csv: injection 3 'STD-B' is a standard"), e.getMessage());
    assertTrue(e.getMessage().endsWith("(fill in its 'Level' column, or add a level template to the standard rule)"),
        e.getMessage());
  }

  @Test
  @DisplayName("a level column the export lacks refuses the run, naming the key, the column and the export's columns")
  void missingLevelColumnIsRefused() {
    RunBuilder b = byLevelColumn("run-L6.csv", "S1", "S2", "S3").columns("Sample", "Element", "Intensity");
    ProcessingException e = assertThrows(ProcessingException.class,
        () -> RunProcessor.process(b.build(), levelMethod(false), Optional.empty()));
    assertEquals("run-L6.csv: the method's identification.level-column names the column 'Level', which the export does"
        + " not have (its columns: 'Sample', 'Element', 'Intensity')", e.getMessage());
  }
}
