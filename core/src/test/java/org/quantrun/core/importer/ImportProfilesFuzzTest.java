package org.quantrun.core.importer;

import com.code_intelligence.jazzer.junit.FuzzTest;
import java.nio.charset.StandardCharsets;

/**
 * Fuzz test of the import-profile reader: any text is settings or an {@link ImportException}
 * naming the profile, never another exception. {@code mvn verify} replays the seeds (the example
 * profiles, copied in by the build) and every earlier finding; a campaign is started as
 * DEVELOPERS.md says.
 */
class ImportProfilesFuzzTest {

  @FuzzTest(maxDuration = "30m", maxExecutions = 1_000_000)
  void parsesOrRefuses(byte[] input) {
    try {
      ImportProfiles.parse(new String(input, StandardCharsets.UTF_8), "fuzz.yaml");
    } catch (ImportException e) {
      if (!e.getMessage().startsWith("fuzz.yaml") || e.problem().isBlank()) {
        throw new IllegalStateException("an import error must name the profile and the problem: " + e.getMessage());
      }
    }
  }
}
