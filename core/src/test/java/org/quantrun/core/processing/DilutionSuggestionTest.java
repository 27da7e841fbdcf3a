package org.quantrun.core.processing;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;

class DilutionSuggestionTest {

  @ParameterizedTest(name = "{0} against a top standard of 100 needs {1}")
  @CsvSource({
    // Worked by hand from the rule "smallest of 2, 5, 10, ... that brings the result under 80 %
    // of the top standard" (the project's own rule, common practice).
    "81, 2",
    "159.9, 2",
    "160, 5",
    "399, 5",
    "400, 10",
    "7999, 100",
    "79999, 1000",
  })
  void smallestStepUnderEightyPercent(double measured, int expected) {
    assertEquals(expected, DilutionSuggestion.suggest(measured, 100, 0.8).getAsInt());
  }

  @ParameterizedTest(name = "{0} gets no suggestion")
  @CsvSource({"79.9", "80000", "1e7"})
  void noSuggestion(double measured) {
    assertTrue(DilutionSuggestion.suggest(measured, 100, 0.8).isEmpty());
  }
}
