package org.quantrun.importer.example;

import com.code_intelligence.jazzer.junit.FuzzTest;
import java.util.List;
import org.quantrun.core.importer.ImportSettings;
import org.quantrun.importer.testkit.FuzzChecks;

/**
 * Fuzz test of the example block importer. {@code mvn verify} replays the seeds (a block-format
 * sample and the demo exports) and every earlier finding; a campaign is started as DEVELOPERS.md
 * says.
 */
class BlockFuzzTest {

  @FuzzTest(maxDuration = "30m", maxExecutions = 1_000_000)
  void readsAnyBytes(byte[] input) {
    FuzzChecks.readOrImportError(new BlockImporter(), input, List.of(ImportSettings.DEFAULT));
  }
}
