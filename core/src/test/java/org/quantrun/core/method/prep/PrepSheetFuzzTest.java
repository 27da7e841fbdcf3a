package org.quantrun.core.method.prep;

import com.code_intelligence.jazzer.junit.FuzzTest;
import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import org.quantrun.core.method.MethodException;
import org.quantrun.core.method.MethodLoader;
import org.quantrun.core.method.MethodProblem;
import org.quantrun.core.method.PrepSheetLayout;

/**
 * Fuzz test of the prep-sheet reader, with the layout of the soil example method: any text is a
 * sheet or a {@link MethodException} whose problems name the file, never another exception.
 * {@code mvn verify} replays the seeds (the example prep sheet, copied in by the build) and every
 * earlier finding; a campaign is started as DEVELOPERS.md says.
 */
class PrepSheetFuzzTest {

  private static final PrepSheetLayout LAYOUT = layout();

  private static PrepSheetLayout layout() {
    Path method = Path.of("../config-examples/soil-digest-mg-per-kg.yaml");
    try {
      return MethodLoader.load(Files.readString(method), method.getFileName().toString())
          .dilution().prepSheet().orElseThrow();
    } catch (IOException | MethodException e) {
      throw new IllegalStateException("the soil example method cannot be loaded: " + e.getMessage(), e);
    }
  }

  @FuzzTest(maxDuration = "30m", maxExecutions = 1_000_000)
  void parsesOrRefuses(byte[] input) {
    try {
      PrepSheetParser.parse(new String(input, StandardCharsets.UTF_8), "fuzz.csv", LAYOUT);
    } catch (MethodException e) {
      for (MethodProblem p : e.problems()) {
        if (!p.source().equals("fuzz.csv")) {
          throw new IllegalStateException("a problem must name the file: " + p);
        }
      }
    }
  }
}
