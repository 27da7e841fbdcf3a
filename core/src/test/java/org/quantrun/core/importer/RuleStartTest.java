package org.quantrun.core.importer;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertNull;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.List;
import java.util.regex.Pattern;
import net.jqwik.api.Arbitraries;
import net.jqwik.api.Arbitrary;
import net.jqwik.api.ForAll;
import net.jqwik.api.Property;
import net.jqwik.api.Provide;
import org.junit.jupiter.api.Test;

/**
 * The short cut importers take past skip and end rules ({@link ImportSettings#rulesMayMatch}): it may
 * only answer "no" for a row that no rule matches, by the rules of java.util.regex.Pattern.
 */
class RuleStartTest {

  @Test
  void literalStartsOfAnchoredPatterns() {
    assertEquals("End of data", ImportSettings.requiredStart(Pattern.compile("^End of data")));
    assertEquals("Total", ImportSettings.requiredStart(Pattern.compile("^Total\\s+\\d+")));
    // the last letter is optional under '?', required at least once under '+'
    assertEquals("Ab", ImportSettings.requiredStart(Pattern.compile("^Abc?")));
    assertEquals("Abc", ImportSettings.requiredStart(Pattern.compile("^Abc+")));
    assertNull(ImportSettings.requiredStart(Pattern.compile("End of data")), "not anchored");
    assertNull(ImportSettings.requiredStart(Pattern.compile("^End|^Total")), "alternatives");
    assertNull(ImportSettings.requiredStart(Pattern.compile("(?i)^end")), "embedded flags");
    assertNull(ImportSettings.requiredStart(Pattern.compile("^end", Pattern.CASE_INSENSITIVE)), "flags");
    assertNull(ImportSettings.requiredStart(Pattern.compile("^\\d")), "no literal text");
  }

  @Test
  void noRulesNeverMatch() {
    assertFalse(ImportSettings.DEFAULT.rulesMayMatch("End of data"));
  }

  @Test
  void anUnanchoredRuleMayMatchAnyRow() {
    ImportSettings s = ImportSettings.DEFAULT.toBuilder().endPattern(Pattern.compile("^End")).skip(Pattern.compile("total"))
        .build();
    assertTrue(s.rulesMayMatch("SMP-0001"));
  }

  @Property(tries = 3000)
  void neverSaysNoToARowARuleMatches(@ForAll("rules") List<String> rules, @ForAll("cells") List<String> cells) {
    ImportSettings.Builder b = ImportSettings.DEFAULT.toBuilder();
    for (int i = 0; i < rules.size(); i++) {
      if (i == 0) {
        b.endPattern(Pattern.compile(rules.get(i)));
      } else {
        b.skip(Pattern.compile(rules.get(i)));
      }
    }
    ImportSettings s = b.build();
    String row = String.join(",", cells);
    if (s.ends(row) || s.skips(row)) {
      assertTrue(s.rulesMayMatch(cells.get(0)), row + " matched by " + rules);
    }
  }

  @Provide
  Arbitrary<List<String>> rules() {
    return Arbitraries.of("^End of data", "^End", "^E", "^Total,", "^Total\\s*\\d+", "^Ab?", "^Ab+", "^A,B", "data$",
        "^#", "^-{3,}", "^\\s*$", "^End|^Sum").list().ofMinSize(1).ofMaxSize(3);
  }

  @Provide
  Arbitrary<List<String>> cells() {
    Arbitrary<String> cell = Arbitraries.oneOf(
        Arbitraries.of("End of data", "End", "E", "Total", "Total 12", "A", "Ab", "Abb", "B", "#", "---", "", " ",
            "SMP-0001", "data", "Sum"),
        Arbitraries.strings().withChars("EndTotaAb ,#-0123").ofMaxLength(8));
    return cell.list().ofMinSize(1).ofMaxSize(4);
  }
}
