package org.quantrun.core.processing;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;

import java.math.RoundingMode;
import org.junit.jupiter.api.DisplayName;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;

class SignificantFiguresTest {

  @ParameterizedTest(name = "{0} to {1} figures is {2}")
  @CsvSource({
    // ISO 80000-1 annex B, rule B (round half to even), from memory: a 5 followed by nothing
    // rounds to the even neighbour.
    "2.25, 2, 2.2",
    "2.35, 2, 2.4",
    "0.15, 1, 0.2",
    "0.25, 1, 0.2",
    "12.5, 2, 12",
    "13.5, 2, 14",
    // ordinary rounding, common practice
    "12.3456, 3, 12.3",
    "0.0012349, 3, 0.00123",
    "1234.5678, 2, 1200",
    "-3.14159, 3, -3.14",
    // significant trailing zeros are kept
    "2, 2, 2.0",
    "0.1, 3, 0.100",
    "0, 3, 0.00",
  })
  void roundsHalfToEven(double value, int figures, String expected) {
    assertEquals(expected, SignificantFigures.format(value, figures));
  }

  @Test
  @DisplayName("half-up rounding is available when a method asks for it")
  void halfUp() {
    assertEquals("2.3", SignificantFigures.format(2.25, 2, RoundingMode.HALF_UP));
  }

  @Test
  @DisplayName("non-finite values and zero figures are refused")
  void refuses() {
    assertThrows(IllegalArgumentException.class, () -> SignificantFigures.format(Double.NaN, 2));
    assertThrows(IllegalArgumentException.class, () -> SignificantFigures.format(1, 0));
  }
}
