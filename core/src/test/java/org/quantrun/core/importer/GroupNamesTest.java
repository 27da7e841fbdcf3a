package org.quantrun.core.importer;

import static org.junit.jupiter.api.Assertions.assertEquals;

import java.util.List;
import java.util.regex.Pattern;
import org.junit.jupiter.api.DisplayName;
import org.junit.jupiter.api.Test;

/**
 * The named groups read from a pattern's text. The syntax is the java.util.regex.Pattern
 * documentation's (named groups "(?&lt;name&gt;X)", lookbehinds "(?&lt;=X)" and "(?&lt;!X)",
 * non-capturing "(?:X)", escapes, "\Q...\E" quotes, character classes and their nesting); each
 * expected list is checked against a match of the pattern where one is cheap to make.
 */
class GroupNamesTest {

  private static List<String> names(String regex) {
    return GroupNames.of(Pattern.compile(regex));
  }

  @Test
  @DisplayName("the named groups in the order they open, nested ones too")
  void namedGroupsInOrder() {
    assertEquals(List.of("sequence", "sampleId", "Dil2"), names("^Inj (?<sequence>\\d+) (?<sampleId>\\S+)(?: Dil (?<Dil2>\\d+))?$"));
    assertEquals(List.of("outer", "inner"), names("(?<outer>a(?<inner>b)c)"));
    assertEquals(List.of(), names("plain (\\d+) text"));
    assertEquals("7", Pattern.compile("(?<outer>a(?<inner>\\d)c)").matcher("a7c").results().findFirst().orElseThrow().group(2));
  }

  @Test
  @DisplayName("escaped parentheses and backslashes, and quoted text, open no group")
  void escapes() {
    assertEquals(List.of("b"), names("\\(?<a>x\\) (?<b>y)"));
    assertEquals(List.of("b"), names("\\Q(?<a>x)\\E(?<b>y)"));
    // an escaped backslash leaves the parenthesis after it unescaped
    assertEquals(List.of("c"), names("\\\\(?<c>z)"));
    assertEquals(List.of(), names("\\Q(?<a>)"));
  }

  @Test
  @DisplayName("character classes, nested or with a leading ']', hide what they contain")
  void characterClasses() {
    assertEquals(List.of("real"), names("[(?<]fake>(?<real>x)"));
    assertEquals(List.of("real"), names("[](?<fake>](?<real>x)"));
    assertEquals(List.of("real"), names("[^](?<fake>](?<real>x)"));
    assertEquals(List.of("real"), names("[a-z&&[^(?<fake>]](?<real>x)"));
    assertEquals(List.of("real"), names("[\\](?<fake>](?<real>x)"));
    assertEquals(true, Pattern.compile("[(?<]fake>(?<real>x)").matcher("<fake>x").matches());
  }

  @Test
  @DisplayName("lookbehinds, lookaheads, non-capturing and flag groups are not named groups")
  void otherConstructs() {
    assertEquals(List.of("n"), names("(?<=Type: )(?<n>\\S+)(?<!X)(?=\\s)(?!Q)(?:a|b)(?i:c)(?>d)"));
    assertEquals(List.of(), names("(?<=a)b(?<!c)"));
  }

  @Test
  @DisplayName("a name only a COMMENTS-mode comment holds is not reported")
  void comments() {
    assertEquals(List.of("kept"), GroupNames.of(Pattern.compile("(?<kept>a) # (?<gone>b)", Pattern.COMMENTS)));
    assertEquals(List.of("kept"), GroupNames.of(Pattern.compile("(?<kept>a) # (?<gone>b)\n c", Pattern.COMMENTS)));
  }
}
