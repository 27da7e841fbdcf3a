package org.quantrun.importer.fixedwidth;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;

import java.io.ByteArrayInputStream;
import java.nio.charset.StandardCharsets;
import java.util.List;
import java.util.Locale;
import java.util.OptionalDouble;
import org.junit.jupiter.api.DisplayName;
import org.junit.jupiter.api.Test;
import org.quantrun.core.importer.CellText;
import org.quantrun.core.importer.ImportException;
import org.quantrun.core.importer.ImportSettings;
import org.quantrun.core.importer.RawRun;
import org.quantrun.core.importer.SourcePosition;

/** The per-injection columns a method names, in a fixed-width report. Invented report. */
class InjectionColumnsTest {

  /** Columns start at 1, 6, 22, 36, 47 and 53 (widths 3, 14, 12, 9, 4 and two spaces between). */
  private static String row(String seq, String sample, String line, String reading, String dil, String level) {
    return String.format(Locale.ROOT, "%3s  %-14s  %-12s  %9s  %-4s  %s", seq, sample, line, reading, dil, level).stripTrailing()
        + "\n";
  }

  private static final String REPORT = "Invented lab listing\n\n"
      + row("Seq", "Sample", "Line", "Reading 1", "Dil", "Level")
      + row("---", "-".repeat(14), "-".repeat(12), "-".repeat(9), "----", "-----")
      + row("1", "CAL-BLK", "Cd 228.802", "101.5", "", "")
      + row("2", "STD-1", "Cd 228.802", "2201.0", "", "S1")
      + row("3", "W-101", "Cd 228.802", "512.0", "10", "")
      + row("3", "W-101", "Pb 220.353", "230.0", "10", "");

  private static final ImportSettings ASKED = ImportSettings.DEFAULT.toBuilder().alias("analyte_line", List.of("Line"))
      .injectionColumn("Dil").injectionColumn("level").build();

  private static RawRun read(String text) throws ImportException {
    return new FixedWidthImporter().read(new ByteArrayInputStream(text.getBytes(StandardCharsets.UTF_8)), ASKED, "run-F.txt");
  }

  @Test
  @DisplayName("each injection carries the asked columns' text once, with line and character column")
  void carriesTheColumns() throws ImportException {
    RawRun run = read(REPORT);
    assertEquals(List.of("Seq", "Sample", "Line", "Reading 1", "Dil", "Level"), run.columns());
    assertEquals(3, run.injections().size());
    // header on line 3, underline on line 4: data from line 5
    assertEquals(new CellText("S1", OptionalDouble.empty(), "decimal separator '.', no thousands separator",
        new SourcePosition(6, 53)), run.injections().get(1).column("Level").orElseThrow());
    CellText dil = run.injections().get(2).column("dil").orElseThrow();
    assertEquals(OptionalDouble.of(10), dil.number());
    assertEquals(new SourcePosition(7, 47), dil.position());
    assertEquals("", run.injections().get(0).column("Dil").orElseThrow().text());
  }

  @Test
  @DisplayName("rows of one injection that give different values are refused with file, line, column and both values")
  void disagreeingRowsAreRefused() {
    String text = REPORT.replace(row("3", "W-101", "Pb 220.353", "230.0", "10", ""), row("3", "W-101", "Pb 220.353", "230.0", "5", ""));
    ImportException e = assertThrows(ImportException.class, () -> read(text));
    assertEquals("run-F.txt:8:47: column 'Dil' of injection 3 'W-101' is \"5\" here but \"10\" on line 7 (a column read"
        + " per injection must give one value for the whole injection)", e.getMessage());
  }
}
