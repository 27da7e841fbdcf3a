package org.quantrun.core.processing;

import static org.junit.jupiter.api.Assertions.assertEquals;

import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;

class TextTest {
  @ParameterizedTest(name = "{0} prints as {1}")
  @CsvSource({
    // six significant figures, no trailing zeros (common practice for readable traces)
    "0.30000000000000004, 0.3",
    "1234567.89, 1234570",
    "-12.3456789, -12.3457",
    "100, 100",
    "0.000123456789, 0.000123457",
    "2.5e-9, 2.5E-9",
    "0, 0",
    "5e12, 5E+12",
  })
  void numbers(double v, String expected) {
    assertEquals(expected, Text.num(v));
  }
}
