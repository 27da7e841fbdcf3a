package org.quantrun.core.method.prep;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.Optional;
import org.junit.jupiter.api.DisplayName;
import org.junit.jupiter.api.Test;
import org.quantrun.core.method.ConcentrationUnit;
import org.quantrun.core.method.MethodException;
import org.quantrun.core.method.MethodLoader;
import org.quantrun.core.method.MethodProblem;
import org.quantrun.core.method.PrepSheetLayout;
import org.quantrun.core.method.SolidsBasis;

class PrepSheetParserTest {

  static final PrepSheetLayout LAYOUT = new PrepSheetLayout("Sample", "Batch", "DF", "Mass", "Volume", Optional.of("Solids"),
      ConcentrationUnit.MG_PER_KG, SolidsBasis.DRY_WEIGHT);
  static final String HEADER = "Sample,Batch,Mass,Volume,DF,Solids\n";

  static Path examples() {
    Path base = Path.of(System.getProperty("basedir", ".")).toAbsolutePath();
    for (Path p = base; p != null; p = p.getParent()) {
      if (Files.isRegularFile(p.resolve("config-examples/soil-prep-sheet.csv"))) {
        return p.resolve("config-examples");
      }
    }
    throw new IllegalStateException("config-examples not found");
  }

  @Test
  @DisplayName("the example prep sheet parses with the soil method's layout and groups its prep batches")
  void exampleSheetParses() throws IOException, MethodException {
    PrepSheetLayout layout = MethodLoader.load(Files.readString(examples().resolve("soil-digest-mg-per-kg.yaml")), "soil.yaml")
        .dilution().prepSheet().orElseThrow();
    PrepSheet sheet = PrepSheetParser.parse(Files.readString(examples().resolve("soil-prep-sheet.csv")), "soil-prep-sheet.csv", layout);
    assertEquals(11, sheet.rows().size());
    assertEquals(List.of("P0417", "P0418"), sheet.batches());
    assertEquals(7, sheet.batch("P0417").size());
    PrepSheetRow blank = sheet.row("DB-0417").orElseThrow();
    assertEquals(Optional.empty(), blank.solidsFraction(), "a method blank has no solids");
    assertEquals(2, blank.line());
    assertEquals(2.0, sheet.row("SO-1102").orElseThrow().dilutionFactor());
  }

  @Test
  @DisplayName("a digest result becomes mg/kg by ug/L x DF x V[L] / m[g], and dry weight divides by the solids fraction")
  void convertsToSampleBasis() throws MethodException {
    // hand-computed with the mass balance (common practice): 100 ug/L x 2 x 0.050 L / 0.500 g = 20 ug/g = 20 mg/kg
    PrepSheetRow row = PrepSheetParser.parse(HEADER + "S1,B1,0.500,50,2,0.8\n", "p.csv", LAYOUT).rows().get(0);
    PrepSheetLayout asReceived = new PrepSheetLayout("Sample", "Batch", "DF", "Mass", "Volume", Optional.of("Solids"),
        ConcentrationUnit.MG_PER_KG, SolidsBasis.AS_RECEIVED);
    assertEquals(20.0, row.toSampleBasis(100, ConcentrationUnit.UG_PER_L, asReceived).orElseThrow(), 1e-9);
    assertEquals(25.0, row.toSampleBasis(100, ConcentrationUnit.UG_PER_L, LAYOUT).orElseThrow(), 1e-9); // 20 / 0.8
    assertEquals(25.0, row.toSampleBasis(0.1, ConcentrationUnit.MG_PER_L, LAYOUT).orElseThrow(), 1e-9);
    PrepSheetLayout ugPerKg = new PrepSheetLayout("Sample", "Batch", "DF", "Mass", "Volume", Optional.empty(),
        ConcentrationUnit.UG_PER_KG, SolidsBasis.AS_RECEIVED);
    assertEquals(20000.0, row.toSampleBasis(100, ConcentrationUnit.UG_PER_L, ugPerKg).orElseThrow(), 1e-6);
    PrepSheetRow noSolids = PrepSheetParser.parse(HEADER + "S1,B1,0.5,50,1,\n", "p.csv", LAYOUT).rows().get(0);
    assertEquals(Optional.empty(), noSolids.toSampleBasis(100, ConcentrationUnit.UG_PER_L, LAYOUT));
  }

  // found by PrepSheetFuzzTest (inputs kept in its Inputs folder): repeated empty headings made the
  // heading count smaller than the heading line, and a row of that many fields read past its end
  @Test
  @DisplayName("with repeated empty headings, a row shorter than the heading line is refused naming both field counts")
  void repeatedEmptyHeadingsDoNotHideAShortRow() {
    String text = ",," + HEADER + "S-1,P1,0.5,50,1,0.9\n";
    MethodException e = assertThrows(MethodException.class, () -> PrepSheetParser.parse(text, "prep.csv", LAYOUT));
    assertEquals("prep.csv:2:1: row has 6 fields but the heading line has 8 (expected 8 fields)", e.getMessage());
  }

  @Test
  @DisplayName("every bad field is reported in one pass with its line, column and heading")
  void badFieldsAreReportedTogether() {
    String text = HEADER
        + "S1,B1,0.5,50,1,0.8\n"
        + "S2,B1,\"0,498\",50,1,0.8\n"
        + "S3,B1,0.5,0,1,0.8\n"
        + "S1,B1,0.5,50,1,0.8\n"
        + "S4,B1,0.5,50,0.5,1.2\n"
        + "S5,,0.5,50,1,0.8\n";
    MethodException e = assertThrows(MethodException.class, () -> PrepSheetParser.parse(text, "prep.csv", LAYOUT));
    List<String> lines = e.problems().stream().map(MethodProblem::toString).toList();
    assertEquals(List.of(
        "prep.csv:3:3: Mass: '0,498' is not a number (expected a mass in g > 0)",
        "prep.csv:4:4: Volume: value 0 is out of range (expected a volume in mL > 0)",
        "prep.csv:5:1: Sample: sample 'S1' is listed twice (first on line 2) (expected one row per sample)",
        "prep.csv:6:5: DF: value 0.5 is out of range (expected a number >= 1)",
        "prep.csv:6:6: Solids: value 1.2 is out of range (expected a fraction > 0 and <= 1)",
        "prep.csv:7:2: Batch: is empty (expected a value)"), lines);
  }

  @Test
  @DisplayName("a missing column is named together with the headings the method expects")
  void missingColumnIsNamed() {
    MethodException e = assertThrows(MethodException.class,
        () -> PrepSheetParser.parse("Sample,Batch,Weight,Volume,DF,Solids\nS1,B1,0.5,50,1,0.8\n", "prep.csv", LAYOUT));
    assertEquals(1, e.problems().size());
    assertTrue(e.getMessage().startsWith("prep.csv:1:1: Mass: column is missing from the heading line (expected the headings the method names: "),
        e.getMessage());
  }

  @Test
  @DisplayName("a row with the wrong number of fields, an empty sheet and a byte-order mark are handled")
  void shapeProblems() throws MethodException {
    MethodException e = assertThrows(MethodException.class, () -> PrepSheetParser.parse(HEADER + "S1,B1,0.5\n", "prep.csv", LAYOUT));
    assertTrue(e.getMessage().contains("prep.csv:2:1: row has 3 fields but the heading line has 6"), e.getMessage());
    assertTrue(assertThrows(MethodException.class, () -> PrepSheetParser.parse("", "prep.csv", LAYOUT)).getMessage().contains("empty"));
    assertEquals(1, PrepSheetParser.parse("\uFEFF" + HEADER + "S1,B1,0.5,50,1,0.8\n", "prep.csv", LAYOUT).rows().size());
    assertEquals(1, PrepSheetParser.parse(HEADER + "\nS1,B1,0.5,50,1,0.8\n\n", "prep.csv", LAYOUT).rows().size(), "blank lines skipped");
  }

  @Test
  @DisplayName("numbers in hexadecimal, NaN or with a type suffix are refused")
  void onlyPlainNumbers() {
    for (String bad : List.of("NaN", "0x1p3", "5d", "Infinity")) {
      MethodException e = assertThrows(MethodException.class,
          () -> PrepSheetParser.parse(HEADER + "S1,B1," + bad + ",50,1,0.8\n", "prep.csv", LAYOUT));
      assertTrue(e.getMessage().contains("'" + bad + "' is not a number"), e.getMessage());
    }
  }
}
