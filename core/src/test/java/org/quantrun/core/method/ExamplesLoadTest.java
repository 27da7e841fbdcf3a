package org.quantrun.core.method;

import static org.junit.jupiter.api.Assertions.assertTrue;
import static org.junit.jupiter.api.Assertions.fail;

import java.nio.file.Path;
import java.util.List;
import java.util.stream.Stream;
import org.junit.jupiter.api.DisplayName;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.MethodSource;

class ExamplesLoadTest {

  static Stream<Path> examples() {
    return Fixtures.exampleMethods().stream();
  }

  @Test
  @DisplayName("config-examples holds at least three complete methods")
  void thereAreAtLeastThreeExamples() {
    List<Path> all = Fixtures.exampleMethods();
    assertTrue(all.size() >= 3, "found " + all);
  }

  @DisplayName("every example method in config-examples loads without a problem")
  @ParameterizedTest(name = "{0}")
  @MethodSource("examples")
  void everyExampleLoads(Path file) {
    try {
      Method m = MethodLoader.load(Fixtures.read(file), file.getFileName().toString());
      assertTrue(!m.analytes().isEmpty());
    } catch (MethodException e) {
      fail(e.getMessage());
    }
  }
}
