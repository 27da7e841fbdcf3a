package org.quantrun.importer.delimited;

import com.code_intelligence.jazzer.junit.FuzzTest;
import java.util.List;
import org.quantrun.core.importer.ImportSettings;
import org.quantrun.importer.testkit.FuzzChecks;

/**
 * Fuzz test of the delimited importer. {@code mvn verify} replays the seeds (the demo exports,
 * copied in by the build) and every earlier finding (in {@code src/test/resources}); a campaign
 * is started as DEVELOPERS.md says. Each input is read with one of the settings: the defaults or one of the
 * three example profiles of delimited exports, picked by the input's length (so a seed keeps its bytes).
 */
class DelimitedFuzzTest {

  private static final List<ImportSettings> SETTINGS = FuzzChecks.defaultsAndExampleProfiles(
      "long-csv.yaml", "wide-semicolon.yaml", "tab-renamed-columns.yaml");

  @FuzzTest(maxDuration = "30m", maxExecutions = 1_000_000)
  void readsAnyBytes(byte[] input) {
    FuzzChecks.readOrImportError(new DelimitedImporter(), input, List.of(SETTINGS.get(input.length % SETTINGS.size())));
  }
}
