package org.quantrun.importer.fixedwidth;

import com.code_intelligence.jazzer.junit.FuzzTest;
import java.util.List;
import org.quantrun.core.importer.ImportSettings;
import org.quantrun.importer.testkit.FuzzChecks;

/**
 * Fuzz test of the fixed-width importer. {@code mvn verify} replays the seeds (the demo exports,
 * copied in by the build) and every earlier finding (in {@code src/test/resources}); a campaign
 * is started as DEVELOPERS.md says. Each input is read with one of the settings: the defaults or one of the
 * two example profiles of fixed-width reports, picked by the input's length (so a seed keeps its bytes).
 */
class FixedWidthFuzzTest {

  private static final List<ImportSettings> SETTINGS = FuzzChecks.defaultsAndExampleProfiles(
      "fixed-width-report.yaml", "fixed-width-columns.yaml");

  @FuzzTest(maxDuration = "30m", maxExecutions = 1_000_000)
  void readsAnyBytes(byte[] input) {
    FuzzChecks.readOrImportError(new FixedWidthImporter(), input, List.of(SETTINGS.get(input.length % SETTINGS.size())));
  }
}
