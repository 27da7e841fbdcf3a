package org.quantrun.runner.output;

import java.util.regex.Pattern;

/**
 * Makes text cells safe to open in a spreadsheet. A cell whose text starts with {@code =}, {@code
 * +}, {@code -}, {@code @}, a tab, a carriage return or another control character would be run as
 * a formula by common spreadsheet programs (formula or CSV injection); such a cell gets a leading
 * apostrophe, which spreadsheets show as text. Text that is a plain number ({@code -0.25}, {@code
 * +3e-4}) is left untouched, so numeric columns stay numeric.
 */
public final class SpreadsheetSafe {
  private static final Pattern NUMBER = Pattern.compile("[-+]?(\\d+\\.?\\d*|\\.\\d+)([eE][-+]?\\d+)?");

  private SpreadsheetSafe() {}

  /** The cell text, neutralised if a spreadsheet would run it as a formula. */
  public static String cell(String text) {
    if (text.isEmpty()) {
      return text;
    }
    char c = text.charAt(0);
    boolean risky = c == '=' || c == '+' || c == '-' || c == '@' || Character.isISOControl(c);
    if (!risky || NUMBER.matcher(text).matches()) {
      return text;
    }
    return "'" + text;
  }
}
