package org.quantrun.core.importer;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.InputStream;
import java.util.List;
import org.junit.jupiter.api.DisplayName;
import org.junit.jupiter.api.Test;

class ImporterSelectionTest {

  record Fixed(String id, double confidence) implements RunImporter {
    @Override
    public String description() {
      return "test importer " + id;
    }

    @Override
    public double detect(String fileName, byte[] head) {
      return confidence;
    }

    @Override
    public RawRun read(InputStream in, ImportSettings settings, String sourceName) {
      return new RawRun(sourceName, id, List.of(), List.of());
    }
  }

  static final byte[] HEAD = new byte[10];

  @Test
  @DisplayName("an importer is picked by id")
  void byId() throws ImportException {
    ImporterSelection s = new ImporterSelection(List.of(new Fixed("a", 0.1), new Fixed("b", 0.9)));
    assertEquals("a", s.select("a", "run.csv", HEAD).id());
  }

  @Test
  @DisplayName("an unknown id is an error listing the installed importers")
  void unknownId() {
    ImporterSelection s = new ImporterSelection(List.of(new Fixed("a", 0.1), new Fixed("b", 0.9)));
    ImportException e = assertThrows(ImportException.class, () -> s.select("c", "run.csv", HEAD));
    assertEquals("run.csv: importer 'c' is not installed (installed: a, b)", e.getMessage());
  }

  @Test
  @DisplayName("auto picks the highest detection confidence")
  void autoPicksHighest() throws ImportException {
    ImporterSelection s = new ImporterSelection(List.of(new Fixed("a", 0.4), new Fixed("b", 0.9), new Fixed("c", 0.2)));
    assertEquals("b", s.select(ImportSettings.AUTO, "run.csv", HEAD).id());
  }

  @Test
  @DisplayName("a tie for the highest confidence is an error naming both importers")
  void tieIsAnError() {
    ImporterSelection s = new ImporterSelection(List.of(new Fixed("a", 0.7), new Fixed("b", 0.7), new Fixed("c", 0.1)));
    ImportException e = assertThrows(ImportException.class, () -> s.select("auto", "run.csv", HEAD));
    assertTrue(e.getMessage().contains("'a' and 'b'"), e.getMessage());
  }

  @Test
  @DisplayName("when nothing recognises the file, auto is an error; a detector that throws counts as 0")
  void nothingDetects() {
    RunImporter throwing = new RunImporter() {
      @Override
      public String id() {
        return "t";
      }

      @Override
      public String description() {
        return "throws on detect";
      }

      @Override
      public double detect(String fileName, byte[] head) {
        throw new IllegalStateException("bad detector");
      }

      @Override
      public RawRun read(InputStream in, ImportSettings settings, String sourceName) {
        throw new UnsupportedOperationException();
      }
    };
    ImporterSelection s = new ImporterSelection(List.of(new Fixed("a", 0), throwing));
    assertThrows(ImportException.class, () -> s.select("auto", "run.csv", HEAD));
  }

  @Test
  @DisplayName("two importers with the same id are refused")
  void duplicateIds() {
    assertThrows(IllegalArgumentException.class, () -> new ImporterSelection(List.of(new Fixed("a", 0), new Fixed("a", 1))));
  }
}
