package org.quantrun.importer.delimited;

import java.util.ArrayList;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import java.util.Optional;

/**
 * Guesses the delimiter of a text table among tab, semicolon, pipe and comma from its first lines:
 * the true delimiter occurs the same number of times (outside quotes) on most lines of the table.
 * Among candidates scoring at least half the best, the first in that order wins, because a
 * semicolon or tab file often holds decimal commas but a comma file seldom holds semicolons.
 */
final class DelimiterSniffer {

  static final char[] CANDIDATES = {'\t', ';', '|', ','};

  private DelimiterSniffer() {}

  /**
   * A delimiter in words for messages.
   *
   * @param c the delimiter
   * @return {@code tab}, or the character in quotes
   */
  static String describe(char c) {
    return c == '\t' ? "tab" : "'" + c + "'";
  }

  /**
   * @param text the first part of the text
   * @param truncated whether the text was cut (its last line is then ignored)
   * @param quote the quote character
   * @param allowComma whether comma is a candidate (not when the decimal separator is a comma)
   * @return the delimiter and how many lines agree on it, or empty when no candidate fits
   */
  static Optional<Result> sniff(String text, boolean truncated, char quote, boolean allowComma) {
    List<String> lines = new ArrayList<>(List.of(text.split("\r\n|\n|\r", -1)));
    if (truncated && lines.size() > 1) {
      lines.remove(lines.size() - 1);
    }
    lines.removeIf(String::isBlank);
    if (lines.size() > 200) {
      lines = lines.subList(0, 200);
    }
    Result best = null;
    List<Result> results = new ArrayList<>();
    for (char c : CANDIDATES) {
      if (c == ',' && !allowComma) {
        continue;
      }
      Map<Integer, Integer> counts = new HashMap<>();
      for (String l : lines) {
        int n = count(l, c, quote);
        if (n > 0) {
          counts.merge(n, 1, Integer::sum);
        }
      }
      int mode = 0;
      int agree = 0;
      for (Map.Entry<Integer, Integer> e : counts.entrySet()) {
        if (e.getValue() > agree || (e.getValue() == agree && e.getKey() > mode)) {
          mode = e.getKey();
          agree = e.getValue();
        }
      }
      if (agree > 0) {
        Result r = new Result(c, mode + 1, agree, lines.size());
        results.add(r);
        if (best == null || r.agreeingLines() > best.agreeingLines()) {
          best = r;
        }
      }
    }
    if (best == null) {
      return Optional.empty();
    }
    for (Result r : results) {
      if (r.agreeingLines() * 2 >= best.agreeingLines()) {
        return Optional.of(r);
      }
    }
    return Optional.of(best);
  }

  private static int count(String line, char c, char quote) {
    int n = 0;
    boolean quoted = false;
    for (int i = 0; i < line.length(); i++) {
      char ch = line.charAt(i);
      if (ch == quote) {
        quoted = !quoted;
      } else if (ch == c && !quoted) {
        n++;
      }
    }
    return n;
  }

  /**
   * @param delimiter the delimiter
   * @param fields fields per line on the agreeing lines
   * @param agreeingLines lines with that field count
   * @param lines non-blank lines looked at
   */
  record Result(char delimiter, int fields, int agreeingLines, int lines) {}
}
