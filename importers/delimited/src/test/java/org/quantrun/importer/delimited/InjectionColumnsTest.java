package org.quantrun.importer.delimited;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.ByteArrayInputStream;
import java.nio.charset.StandardCharsets;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.OptionalDouble;
import org.junit.jupiter.api.DisplayName;
import org.junit.jupiter.api.Test;
import org.quantrun.core.importer.AnalyteLine;
import org.quantrun.core.importer.CellText;
import org.quantrun.core.importer.ImportException;
import org.quantrun.core.importer.ImportSettings;
import org.quantrun.core.importer.Injection;
import org.quantrun.core.importer.Layout;
import org.quantrun.core.importer.RawRun;
import org.quantrun.core.importer.SourcePosition;

/** The per-injection columns a method names (a dilution factor, a standard's level), in long and wide layout. Invented exports. */
class InjectionColumnsTest {

  private static final ImportSettings ASKED =
      ImportSettings.DEFAULT.toBuilder().injectionColumn("dil").injectionColumn("LEVEL").build();

  /** Long layout: a row per injection, analyte line and replicate; lines 2 to 7 after the header. */
  private static final String LONG = """
      Seq,Sample ID,Element,Wavelength,Rep,Intensity,Dil, Level\s
      1,CAL-BLK,Cd,228.802,1,101.5,,
      1,CAL-BLK,Cd,228.802,2,99.5,,
      2,STD-1,Cd,228.802,1,2201.0,,S1
      2,STD-1,Cd,228.802,2,2199.0,,S1
      3,W-101,Cd,228.802,1,512.0,10,
      3,W-101,Cd,228.802,2,515.0,,
      """;

  private static RawRun read(String text, ImportSettings s) throws ImportException {
    return new DelimitedImporter().read(new ByteArrayInputStream(text.getBytes(StandardCharsets.UTF_8)), s, "run-C.csv");
  }

  @Test
  @DisplayName("long layout: each injection carries the asked columns' text once, found by name ignoring case and spaces")
  void longLayoutCarriesTheColumns() throws ImportException {
    RawRun run = read(LONG, ASKED);
    assertEquals(List.of("Seq", "Sample ID", "Element", "Wavelength", "Rep", "Intensity", "Dil", "Level"), run.columns());
    Injection blank = run.injections().get(0);
    assertEquals(new CellText("", OptionalDouble.empty(), "decimal separator '.', no thousands separator",
        new SourcePosition(2, 7)), blank.column("dil").orElseThrow(), "blank on every row: the first row's position");
    Injection std = run.injections().get(1);
    assertEquals("S1", std.column("LEVEL").orElseThrow().text());
    assertEquals(new SourcePosition(4, 8), std.column("Level").orElseThrow().position());
    CellText dil = run.injections().get(2).column("Dil").orElseThrow();
    assertEquals("10", dil.text());
    assertEquals(OptionalDouble.of(10), dil.number());
    assertEquals(new SourcePosition(6, 7), dil.position(), "a blank cell on a later row of the injection agrees");
    assertEquals(List.of("dil", "LEVEL"), List.copyOf(run.injections().get(2).columns().keySet()), "keyed as asked");
    // the readings are what they were without the columns
    assertEquals(2, run.injections().get(2).line(AnalyteLine.of("Cd", "228.802")).orElseThrow().replicates().size());
  }

  @Test
  @DisplayName("without asked columns the injections carry none, and the readings are the same")
  void nothingAskedNothingCarried() throws ImportException {
    RawRun plain = read(LONG, ImportSettings.DEFAULT);
    RawRun asked = read(LONG, ASKED);
    for (int i = 0; i < plain.injections().size(); i++) {
      assertEquals(Map.of(), plain.injections().get(i).columns());
      assertEquals(plain.injections().get(i).lines(), asked.injections().get(i).lines());
    }
  }

  @Test
  @DisplayName("long layout: rows of one injection that give different values are refused with file, line, column and both values")
  void disagreeingRowsAreRefused() {
    String text = LONG.replace("3,W-101,Cd,228.802,2,515.0,,", "3,W-101,Cd,228.802,2,515.0,5,");
    ImportException e = assertThrows(ImportException.class, () -> read(text, ASKED));
    assertEquals("run-C.csv:7:7: column 'Dil' of injection 3 'W-101' is \"5\" here but \"10\" on line 6 (a column read"
        + " per injection must give one value for the whole injection)", e.getMessage());
  }

  @Test
  @DisplayName("numbers are read with the profile's decimal separator; text that is no number keeps its text and no number")
  void decimalComma() throws ImportException {
    String text = """
        Sample;Element;Intensity;Dil
        W-201;Cd;101,5;2,5
        W-202;Cd;99,5;1.000,5
        W-203;Cd;99,5;ten
        """;
    ImportSettings s = ASKED.toBuilder().delimiter(';').decimalSeparator(',').build();
    RawRun run = read(text, s);
    assertEquals(OptionalDouble.of(2.5), run.injections().get(0).column("Dil").orElseThrow().number());
    CellText grouped = run.injections().get(1).column("Dil").orElseThrow();
    assertEquals(OptionalDouble.empty(), grouped.number(), "no thousands separator in this profile");
    assertEquals("decimal separator ',', no thousands separator", grouped.numberFormat());
    assertEquals("ten", run.injections().get(2).column("Dil").orElseThrow().text());
    assertEquals(OptionalDouble.empty(), run.injections().get(2).column("Dil").orElseThrow().number());
    assertEquals(Optional.empty(), run.injections().get(0).column("Level"), "the export has no Level column");
    assertEquals(List.of("Sample", "Element", "Intensity", "Dil"), run.columns());
  }

  @Test
  @DisplayName("an asked column given twice in the header is a duplicate header")
  void duplicateAskedColumn() {
    ImportException e = assertThrows(ImportException.class,
        () -> read("Sample,Element,Intensity,Dil,DIL\nW-1,Cd,1.0,2,2\n", ASKED));
    assertEquals("run-C.csv:1:5: duplicate header: columns 4 (\"Dil\") and 5 (\"DIL\") both give column 'dil'", e.getMessage());
  }

  @Test
  @DisplayName("wide layout, a row per replicate: an asked column that looks like an analyte column is read per injection")
  void wideLayout() throws ImportException {
    // "Df" would match the wide analyte pattern (an element-like symbol); asked for, it is a per-injection column
    String text = """
        Sample,Rep,Df,Cd 228.802,Pb 220.353
        W-1,1,5,100.0,200.0
        W-1,2,5,101.0,201.0
        W-2,1,,50.0,60.0
        """;
    ImportSettings s = ImportSettings.DEFAULT.toBuilder().layout(Layout.WIDE).injectionColumn("DF").build();
    RawRun run = read(text, s);
    assertEquals(2, run.injections().size());
    assertEquals(List.of(AnalyteLine.of("Cd", "228.802"), AnalyteLine.of("Pb", "220.353")), List.copyOf(run.analyteLines()));
    assertEquals(OptionalDouble.of(5), run.injections().get(0).column("Df").orElseThrow().number());
    assertEquals(new SourcePosition(2, 3), run.injections().get(0).column("Df").orElseThrow().position());
    assertTrue(run.injections().get(1).column("Df").orElseThrow().isBlank());

    ImportException e = assertThrows(ImportException.class, () -> read(text.replace("W-1,2,5,", "W-1,2,4,"), s));
    assertEquals("run-C.csv:3:3: column 'Df' of injection 1 'W-1' is \"4\" here but \"5\" on line 2 (a column read per"
        + " injection must give one value for the whole injection)", e.getMessage());
  }

  @Test
  @DisplayName("wide layout, a row per injection: each row's cell is its injection's")
  void wideRowPerInjection() throws ImportException {
    String text = """
        Sample;Level;Cd 228.802 mean;Pb 220.353 mean
        CAL-1;S1;1000,0;2000,0
        W-7;;50,0;60,0
        """;
    ImportSettings s = ImportSettings.DEFAULT.toBuilder().layout(Layout.WIDE).delimiter(';').decimalSeparator(',')
        .injectionColumn("level").build();
    RawRun run = read(text, s);
    assertEquals("S1", run.injections().get(0).column("level").orElseThrow().text());
    assertEquals("", run.injections().get(1).column("level").orElseThrow().text());
  }
}
