package org.quantrun.core.importer;

import java.util.ArrayList;
import java.util.List;
import java.util.regex.Pattern;

/**
 * The names of a regular expression's named capturing groups, in the order they open. Java 17 has
 * no API that lists them, so they are read from the pattern's text: a group {@code (?<name>...)}
 * whose name is an ASCII letter followed by ASCII letters or digits. Escaped characters
 * ({@code \(}), quoted text ({@code \Q...\E}) and character classes ({@code [(?<]}, also nested
 * ones and a {@code ]} that is the class's first character) are skipped; lookbehinds
 * ({@code (?<=}, {@code (?<!}) and other {@code (?} constructs are not named groups. Each name
 * found is then confirmed by compiling a back reference to it with the pattern, so a name is only
 * reported when the pattern really has that group (text in a {@code COMMENTS}-mode comment, say, is
 * not).
 */
public final class GroupNames {

  private GroupNames() {}

  /**
   * The named groups of a pattern.
   *
   * @param pattern the compiled pattern
   * @return the group names in the order they open; empty when it has none
   */
  public static List<String> of(Pattern pattern) {
    List<String> out = new ArrayList<>();
    for (String name : candidates(pattern.pattern())) {
      if (!out.contains(name) && confirmed(pattern, name)) {
        out.add(name);
      }
    }
    return List.copyOf(out);
  }

  /**
   * The names that open a group {@code (?<name>} in a pattern's text, outside escapes, quotes and
   * character classes; not checked against a compiled pattern.
   *
   * @param regex the pattern's text
   * @return the names in the order they open
   */
  static List<String> candidates(String regex) {
    List<String> out = new ArrayList<>();
    int n = regex.length();
    int i = 0;
    while (i < n) {
      int skipped = afterEscapeOrClass(regex, i);
      if (skipped != i) {
        i = skipped;
      } else if (regex.startsWith("(?<", i)) {
        int start = i + 3;
        int end = start;
        while (end < n && isAsciiLetterOrDigit(regex.charAt(end))) {
          end++;
        }
        if (end > start && isAsciiLetter(regex.charAt(start)) && end < n && regex.charAt(end) == '>') {
          out.add(regex.substring(start, end));
          i = end + 1;
        } else {
          i = start;
        }
      } else {
        i++;
      }
    }
    return out;
  }

  /** The index after an escape or a character class starting at {@code at}; {@code at} when neither does. */
  private static int afterEscapeOrClass(String regex, int at) {
    char c = regex.charAt(at);
    if (c == '\\') {
      return afterEscape(regex, at);
    }
    return c == '[' ? afterClass(regex, at) : at;
  }

  /** The index after an escape starting at {@code at} (a backslash): {@code \Q...\E} as a whole. */
  private static int afterEscape(String regex, int at) {
    if (at + 1 >= regex.length()) {
      return regex.length();
    }
    if (regex.charAt(at + 1) == 'Q') {
      int end = regex.indexOf("\\E", at + 2);
      return end < 0 ? regex.length() : end + 2;
    }
    return at + 2;
  }

  /** The index after a character class opening at {@code at}, nested classes included. */
  private static int afterClass(String regex, int at) {
    int n = regex.length();
    int i = at + 1;
    if (i < n && regex.charAt(i) == '^') {
      i++;
    }
    if (i < n && regex.charAt(i) == ']') {
      // a ']' first in a class is a literal
      i++;
    }
    while (i < n) {
      int skipped = afterEscapeOrClass(regex, i);
      if (skipped != i) {
        i = skipped;
      } else if (regex.charAt(i) == ']') {
        return i + 1;
      } else {
        i++;
      }
    }
    return n;
  }

  private static boolean confirmed(Pattern pattern, String name) {
    try {
      // a back reference to a group the pattern lacks does not compile (PatternSyntaxException)
      Pattern.compile("(?:" + pattern.pattern() + "\n)|\\k<" + name + ">", pattern.flags());
      return true;
    } catch (IllegalArgumentException e) {
      return false;
    }
  }

  private static boolean isAsciiLetter(char c) {
    return (c >= 'a' && c <= 'z') || (c >= 'A' && c <= 'Z');
  }

  private static boolean isAsciiLetterOrDigit(char c) {
    return isAsciiLetter(c) || (c >= '0' && c <= '9');
  }
}
