package org.quantrun.core.method;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.List;
import java.util.Optional;
import org.junit.jupiter.api.DisplayName;
import org.junit.jupiter.api.Test;
import org.quantrun.core.qc.Window;

class SmallPartsTest {

  @Test
  @DisplayName("concentration units convert within a dimension and refuse across dimensions")
  void unitsConvert() {
    // SI prefixes: 1 mg/L = 1000 ug/L, 1 ng/mL = 1 ug/L, 1 ug/g = 1 mg/kg (definitions)
    assertEquals(2500.0, ConcentrationUnit.MG_PER_L.convert(2.5, ConcentrationUnit.UG_PER_L), 1e-9);
    assertEquals(7.0, ConcentrationUnit.NG_PER_ML.convert(7, ConcentrationUnit.UG_PER_L), 1e-12);
    assertEquals(3.0, ConcentrationUnit.UG_PER_G.convert(3, ConcentrationUnit.MG_PER_KG), 1e-12);
    assertEquals(0.5, ConcentrationUnit.NG_PER_L.convert(500, ConcentrationUnit.UG_PER_L), 1e-12);
    assertThrows(IllegalArgumentException.class, () -> ConcentrationUnit.MG_PER_L.convert(1, ConcentrationUnit.MG_PER_KG));
    assertEquals(Optional.of(ConcentrationUnit.UG_PER_L), ConcentrationUnit.of("µg/L"));
    assertEquals(Optional.empty(), ConcentrationUnit.of("ppb"), "ppb is ambiguous (mass or volume) and not accepted");
  }

  @Test
  @DisplayName("a near misspelling gets a suggestion and a far one does not")
  void suggestions() {
    assertEquals(Optional.of("quadratic"), Suggestions.closest("quadratc", List.of("linear", "through-zero", "quadratic")));
    assertEquals(Optional.of("weighting"), Suggestions.closest("wieghting", List.of("weighting", "curve")));
    assertEquals(Optional.empty(), Suggestions.closest("banana", List.of("linear", "through-zero", "quadratic")));
    assertEquals(1, Suggestions.distance("ab", "ba"), "a transposition costs one edit");
  }

  @Test
  @DisplayName("an ID rule matches the whole ID and fills numbered and named groups")
  void idRules() {
    IdRule numbered = new IdRule("CAL-(\\d)", SampleRole.STANDARD, Optional.of("S$1"), Optional.empty());
    assertEquals("S3", IdRule.expand(numbered.level().orElseThrow(), numbered.match("CAL-3").orElseThrow()));
    assertEquals(Optional.empty(), numbered.match("CAL-3x"), "the whole ID must match");
    IdRule named = new IdRule("(?<parent>.+)-MS", SampleRole.SPIKE, Optional.empty(), Optional.of("${parent}"));
    assertEquals("GW 12", IdRule.expand(named.of().orElseThrow(), named.match("GW 12-MS").orElseThrow()));
    assertThrows(java.util.regex.PatternSyntaxException.class, () -> new IdRule("(", SampleRole.SAMPLE, Optional.empty(), Optional.empty()));
  }

  @Test
  @DisplayName("a window and a working range refuse to be upside down")
  void windowsAreOrdered() {
    assertThrows(IllegalArgumentException.class, () -> new Window(110, 90));
    assertThrows(IllegalArgumentException.class, () -> new WorkingRange(5, 5));
    assertTrue(new Window(90, 110).contains(110), "ends are included");
  }

  @Test
  @DisplayName("a problem prints as FILE:LINE:COL: key.path: message (expected ...)")
  void problemFormat() {
    MethodProblem p = new MethodProblem("m.yaml", 42, 7, "analytes[3].curve", "unknown value 'quadratc'", Optional.of("one of: linear"));
    assertEquals("m.yaml:42:7: analytes[3].curve: unknown value 'quadratc' (expected one of: linear)", p.toString());
    assertEquals("m.yaml: the file is empty", new MethodProblem("m.yaml", 0, 0, "", "the file is empty", Optional.empty()).toString());
    assertThrows(IllegalArgumentException.class, () -> new MethodException(List.of()));
  }
}
