package org.quantrun.core.importer;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import org.junit.jupiter.api.DisplayName;
import org.junit.jupiter.api.Test;

class ValueReaderTest {

  static ValueReader reader(char decimal, Character grouping) {
    ImportSettings.Builder b = ImportSettings.DEFAULT.toBuilder().decimalSeparator(decimal);
    if (grouping != null) {
      b.groupingSeparator(grouping);
    }
    return new ValueReader("run.csv", b.build());
  }

  @Test
  @DisplayName("plain, signed and exponent numbers read with a decimal point")
  void decimalPoint() throws ImportException {
    ValueReader r = reader('.', null);
    assertEquals(12.5, r.read("12.5", "x", 1, 1).value());
    assertEquals(-0.25, r.read(" -0.25 ", "x", 1, 1).value());
    assertEquals(1.5e4, r.read("1.5E+04", "x", 1, 1).value());
    assertEquals(7, r.read("+7", "x", 1, 1).value());
  }

  // common practice: continental exports write 1.234.567,5 for 1234567.5, with digit groups of
  // three (ISO 80000-1 allows a comma or a point as the decimal sign; from memory)
  @Test
  @DisplayName("decimal comma with thousands points reads; groups must have three digits")
  void decimalCommaAndGrouping() throws ImportException {
    ValueReader r = reader(',', '.');
    assertEquals(1234567.5, r.read("1.234.567,5", "x", 1, 1).value());
    assertEquals(12.25, r.read("12,25", "x", 1, 1).value());
    assertThrows(ImportException.class, () -> r.read("12.34,5", "x", 1, 1));
    assertThrows(ImportException.class, () -> r.read("1.5", "x", 1, 1));
    ValueReader us = reader('.', ',');
    assertEquals(1234.5, us.read("1,234.5", "x", 1, 1).value());
    assertThrows(ImportException.class, () -> us.read("12,5.3", "x", 1, 1));
  }

  @Test
  @DisplayName("a number in another common format is refused with the setting that would read it")
  void otherFormatIsNamed() {
    // common practice: the two number formats of exports, 1,462.2 and 1.462,2
    ValueReader r = reader('.', null);
    assertEquals("run.csv:3:8: Intensity \"1,462.2\" is not a number (decimal separator '.', no thousands separator); it"
        + " reads as a number with thousands separator ',' (grouping_separator in the import profile)",
        assertThrows(ImportException.class, () -> r.read("1,462.2", "Intensity", 3, 8)).getMessage());
    assertTrue(assertThrows(ImportException.class, () -> r.read("464,4", "Intensity", 3, 8)).getMessage()
        .endsWith("; it reads as a number with decimal separator ',' (decimal_separator in the import profile)"));
    assertTrue(assertThrows(ImportException.class, () -> r.read("1,462", "Intensity", 3, 8)).getMessage()
        .endsWith("; it reads as a number with thousands separator ',' (grouping_separator in the import profile), or with"
            + " decimal separator ',' (decimal_separator in the import profile)"));
    ValueReader eu = reader(',', null);
    assertTrue(assertThrows(ImportException.class, () -> eu.read("1.462,2", "Intensity", 3, 8)).getMessage()
        .endsWith("; it reads as a number with thousands separator '.' (grouping_separator in the import profile)"));
    // text that is no number in any format gets no suggestion
    assertTrue(assertThrows(ImportException.class, () -> r.read("19x9.8", "Intensity", 3, 8)).getMessage()
        .endsWith("(decimal separator '.', no thousands separator)"));
  }

  @Test
  @DisplayName("markers and empty cells become invalid readings with a reason and their position")
  void markers() throws ImportException {
    ValueReader r = reader('.', null);
    for (String s : new String[] {"OVER", "----", "n/a", "", "  "}) {
      Reading x = r.read(s, "x", 4, 9);
      assertFalse(x.isValid(), s);
      assertTrue(x.invalidReason().isPresent());
      assertEquals(new SourcePosition(4, 9), x.position());
      assertTrue(Double.isNaN(x.value()));
    }
  }

  @Test
  @DisplayName("other text is an import error naming line, column, column name and text, unless made invalid")
  void unreadableText() throws ImportException {
    ImportException e = assertThrows(ImportException.class, () -> reader('.', null).read("12,5.3", "intensity", 118, 4));
    assertTrue(e.getMessage().startsWith("run.csv:118:4: intensity \"12,5.3\" is not a number"), e.getMessage());
    ValueReader lenient = new ValueReader("run.csv", ImportSettings.DEFAULT.toBuilder().unreadableTextInvalid(true).build());
    assertFalse(lenient.read("12,5.3", "intensity", 1, 1).isValid());
  }

  @Test
  @DisplayName("NaN and Infinity texts are not numbers")
  void noNanOrInfinity() {
    ValueReader r = reader('.', null);
    assertThrows(ImportException.class, () -> r.read("Infinity", "x", 1, 1));
    assertThrows(ImportException.class, () -> r.read("1e999", "x", 1, 1));
    assertThrows(ImportException.class, () -> r.read("0x1p3", "x", 1, 1));
  }
}
