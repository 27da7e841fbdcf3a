package org.quantrun.runner.plugins;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.file.Path;
import java.util.List;
import org.junit.jupiter.api.DisplayName;
import org.junit.jupiter.api.Test;
import org.quantrun.core.importer.ImportException;
import org.quantrun.core.importer.ImportSettings;
import org.quantrun.core.importer.RawRun;

class RunFileImportTest {

  static final Path DEMO = Path.of("../demo-data");
  static final Path PROFILES = Path.of("../config-examples/importers");

  static RunFileImport service() {
    ImporterPlugins.Result r = ImporterPlugins.load(ImporterPluginsTest.BUILT);
    assertEquals(List.of(), r.problems());
    return new RunFileImport(r.selection());
  }

  @Test
  @DisplayName("each demo export reads with its profile through the plugin jars, all to the same 38 injections")
  void demoExportsReadWithProfiles() throws ImportException {
    RunFileImport s = service();
    String[][] pairs = {{"run-R2611A-long.csv", "long-csv.yaml"}, {"run-R2611A-wide.txt", "wide-semicolon.yaml"},
        {"run-R2611A-report.txt", "fixed-width-report.yaml"}};
    for (String[] p : pairs) {
      RawRun run = s.read(DEMO.resolve(p[0]), RunFileImport.loadProfile(PROFILES.resolve(p[1])));
      assertEquals(38, run.injections().size(), p[0]);
      assertEquals("CCB-3", run.injections().get(37).sampleId(), p[0]);
    }
  }

  @Test
  @DisplayName("auto picks delimited for the CSV and fixed-width for the text report")
  void autoPicksByContent() throws ImportException {
    RunFileImport s = service();
    assertEquals("delimited", s.importerFor(DEMO.resolve("run-R2611A-long.csv"), ImportSettings.DEFAULT).id());
    assertEquals("delimited", s.importerFor(DEMO.resolve("run-R2611A-wide.txt"), ImportSettings.DEFAULT).id());
    assertEquals("fixed-width", s.importerFor(DEMO.resolve("run-R2611A-report.txt"), ImportSettings.DEFAULT).id());
  }

  @Test
  @DisplayName("a missing file and a missing profile are import errors naming them")
  void missingFiles() {
    RunFileImport s = service();
    ImportException e = assertThrows(ImportException.class, () -> s.read(DEMO.resolve("nope.csv"), ImportSettings.DEFAULT));
    assertEquals("nope.csv: file not found", e.getMessage());
    ImportException p = assertThrows(ImportException.class, () -> RunFileImport.loadProfile(PROFILES.resolve("nope.yaml")));
    assertTrue(p.getMessage().startsWith("nope.yaml: "), p.getMessage());
  }
}
