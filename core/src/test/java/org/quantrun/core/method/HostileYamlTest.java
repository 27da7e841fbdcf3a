package org.quantrun.core.method;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.Collections;
import org.junit.jupiter.api.DisplayName;
import org.junit.jupiter.api.Nested;
import org.junit.jupiter.api.Test;
import org.quantrun.core.importer.ImportException;
import org.quantrun.core.importer.ImportProfiles;

/**
 * Hostile YAML, in method files and in import profiles alike: an alias bomb, deep nesting, a huge
 * scalar, a duplicate key, a recursive alias and type confusion each give one clear message that
 * names the file (and, where there is one, the line and the key), never a stack trace, a hang or
 * an exhausted memory.
 */
class HostileYamlTest {

  static final String BASE = Fixtures.resource("base-method.yaml");

  /** common practice: the "billion laughs" expansion, nine aliases per level, ten levels. */
  static String aliasBomb() {
    StringBuilder sb = new StringBuilder("a0: &a0 [lol, lol, lol, lol, lol, lol, lol, lol, lol]\n");
    for (int i = 1; i <= 9; i++) {
      sb.append("a").append(i).append(": &a").append(i).append(" [")
          .append(String.join(", ", Collections.nCopies(9, "*a" + (i - 1)))).append("]\n");
    }
    return sb.toString();
  }

  static String deep(String key, int levels) {
    return key + ": " + "[".repeat(levels) + "]".repeat(levels) + "\n";
  }

  @Nested
  @DisplayName("a method file")
  class MethodFiles {

    private String refused(String text) {
      MethodException e = assertThrows(MethodException.class, () -> MethodLoader.load(text, "hostile.yaml"));
      assertTrue(e.getMessage().startsWith("hostile.yaml"), e.getMessage());
      return e.getMessage();
    }

    @Test
    @DisplayName("with an alias bomb is refused, naming aliases")
    void aliasBomb() {
      assertTrue(refused(HostileYamlTest.aliasBomb()).contains("more than 20 aliases"));
    }

    @Test
    @DisplayName("nested deeper than the limit is refused, naming the nesting")
    void deepNesting() {
      assertTrue(refused(deep("analytes", 200)).contains("nests deeper than"));
    }

    @Test
    @DisplayName("with a huge scalar inside the size limit is refused at the scalar, naming its length limit")
    void hugeScalar() {
      String text = BASE.replaceFirst("(?m)^method:\\n", "method:\n  description: " + "x".repeat(200_000) + "\n");
      String m = refused(text);
      assertTrue(m.matches("hostile\\.yaml:\\d+:16: method\\.description: the value is longer than "
          + MethodLoader.MAX_SCALAR_CHARACTERS + " characters .*"), m);
    }

    @Test
    @DisplayName("with a key given twice is refused, naming the key and both lines")
    void duplicateKey() {
      String text = BASE.replaceFirst("(?m)^  significant-figures: 3$", "  significant-figures: 3\n  significant-figures: 4");
      String m = refused(text);
      assertTrue(m.contains("reporting.significant-figures") && m.contains("appears twice"), m);
    }

    @Test
    @DisplayName("with a recursive alias (a list holding itself) is refused, not followed forever")
    void recursiveAlias() {
      String m = refused(BASE.replaceFirst("(?m)^  significant-figures: 3$", "  significant-figures: &loop [*loop]"));
      assertTrue(m.contains("refers to itself"), m);
    }

    @Test
    @DisplayName("with a list where a number belongs is refused, naming the key and what was expected")
    void listWhereANumberBelongs() {
      String m = refused(BASE.replaceFirst("(?m)^    frequency: 10$", "    frequency: [10, 20]"));
      assertTrue(m.contains("qc.ccv.frequency") && m.contains("is a list") && m.contains("a whole number"), m);
    }

    // found by MethodLoaderFuzzTest (input kept in its Inputs folder): SnakeYAML threw IllegalArgumentException
    @Test
    @DisplayName("with a malformed tag escape ('!%1') is refused as invalid YAML")
    void malformedTagEscape() {
      assertTrue(refused("!%1").contains("is not valid YAML"));
    }

    @Test
    @DisplayName("with a mapping where a text belongs is refused, naming the key")
    void mappingWhereATextBelongs() {
      String m = refused(BASE.replaceFirst("(?m)^  significant-figures: 3$", "  significant-figures: {a: 1}"));
      assertTrue(m.contains("reporting.significant-figures") && m.contains("is a mapping"), m);
    }
  }

  @Nested
  @DisplayName("an import profile")
  class Profiles {

    private ImportException refused(String text) {
      ImportException e = assertThrows(ImportException.class, () -> ImportProfiles.parse(text, "hostile.yaml"));
      assertTrue(e.getMessage().startsWith("hostile.yaml"), e.getMessage());
      return e;
    }

    @Test
    @DisplayName("with an alias bomb is refused, naming aliases")
    void aliasBomb() {
      String m = refused(HostileYamlTest.aliasBomb()).getMessage();
      assertTrue(m.contains("more than " + ImportProfiles.MAX_ALIASES + " aliases"), m);
    }

    @Test
    @DisplayName("nested deeper than the limit is refused, naming the nesting")
    void deepNesting() {
      String m = refused(deep("options", 200)).getMessage();
      assertTrue(m.contains("nests deeper than " + ImportProfiles.MAX_DEPTH), m);
    }

    @Test
    @DisplayName("with a huge scalar inside the size limit is refused at the scalar")
    void hugeScalar() {
      ImportException e = refused("layout: long\nend_of_table: " + "a".repeat(100_000) + "\n");
      assertEquals("hostile.yaml:2:15: end_of_table: the value is longer than " + ImportProfiles.MAX_SCALAR_CHARACTERS
          + " characters", e.getMessage());
    }

    @Test
    @DisplayName("with a key given twice is refused, naming the key and its line")
    void duplicateKey() {
      assertEquals("hostile.yaml:2:1: quote: duplicate key", refused("quote: \"'\"\nquote: '\"'\n").getMessage());
    }

    @Test
    @DisplayName("with a recursive alias is refused, not followed forever")
    void recursiveAlias() {
      String m = refused("skip_rows: &loop [*loop]\n").getMessage();
      assertTrue(m.contains("refers to itself"), m);
    }

    @Test
    @DisplayName("with a list where a number belongs is refused, naming the key and what was expected")
    void listWhereANumberBelongs() {
      ImportException e = refused("header_search_lines: [10, 20]\n");
      assertTrue(e.getMessage().startsWith("hostile.yaml:1:1: header_search_lines: expected a whole number from 1 to 100000"),
          e.getMessage());
    }

    @Test
    @DisplayName("with a malformed tag escape ('!%1') is refused as invalid YAML")
    void malformedTagEscape() {
      assertTrue(refused("importer: !%1 x\n").getMessage().contains("not valid YAML"));
    }

    @Test
    @DisplayName("with a list where one character belongs, or a number too large, is refused naming the key")
    void otherTypeConfusion() {
      assertTrue(refused("delimiter: [',', ';']\n").getMessage().contains("delimiter: expected a text"));
      assertTrue(refused("max_line_length: 99999999999999999999\n").getMessage().contains("max_line_length: number out of range"));
      assertTrue(refused("fields: {name: x}\n").getMessage().contains("fields: expected a list"));
    }
  }
}
