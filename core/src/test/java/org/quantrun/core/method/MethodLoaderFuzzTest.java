package org.quantrun.core.method;

import com.code_intelligence.jazzer.junit.FuzzTest;
import java.nio.charset.StandardCharsets;

/**
 * Fuzz test of the method loader: any text is a {@link Method} or a {@link MethodException}
 * with at least one problem naming the file, never another exception. {@code mvn verify} replays
 * the seeds (the example method files, copied in by the build) and every earlier finding (in
 * {@code src/test/resources}); a campaign is started as DEVELOPERS.md says.
 */
class MethodLoaderFuzzTest {

  @FuzzTest(maxDuration = "30m", maxExecutions = 1_000_000)
  void loadsOrRefuses(byte[] input) {
    String text = new String(input, StandardCharsets.UTF_8);
    try {
      MethodLoader.load(text, "fuzz.yaml");
    } catch (MethodException e) {
      for (MethodProblem p : e.problems()) {
        if (!p.toString().startsWith("fuzz.yaml")) {
          throw new IllegalStateException("a problem must name the file: " + p);
        }
      }
    }
  }
}
