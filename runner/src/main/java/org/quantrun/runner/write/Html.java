package org.quantrun.runner.write;

import java.math.BigDecimal;
import java.math.MathContext;
import java.math.RoundingMode;

/** Small helpers for writing HTML text safely. */
public final class Html {
  private static final int DISPLAY_DIGITS = 5;

  private Html() {}

  /**
   * Escapes text for HTML element content and quoted attribute values: {@code & < > " '} become
   * character references, and control characters other than tab and line breaks become U+FFFD,
   * so text from an export is always shown as text ({@code <script>} shows as {@code <script>}).
   *
   * @param text any text
   * @return the escaped text
   */
  public static String escape(String text) {
    StringBuilder b = new StringBuilder(text.length() + 16);
    for (int i = 0; i < text.length(); i++) {
      char c = text.charAt(i);
      switch (c) {
        case '&' -> b.append("&amp;");
        case '<' -> b.append("&lt;");
        case '>' -> b.append("&gt;");
        case '"' -> b.append("&quot;");
        case '\'' -> b.append("&#39;");
        default -> {
          if (Character.isISOControl(c) && c != '\t' && c != '\n' && c != '\r') {
            b.append('\uFFFD');
          } else {
            b.append(c);
          }
        }
      }
    }
    return b.toString();
  }

  /**
   * A number for display: five significant figures, trailing zeros dropped, plain notation for
   * magnitudes from 1e-4 to 1e7 and scientific notation beyond. Files keep full precision; this is
   * only for reading.
   *
   * @param value a finite number
   * @return its display text
   */
  public static String number(double value) {
    if (!Double.isFinite(value)) {
      return "";
    }
    if (value == 0) {
      return "0";
    }
    BigDecimal d = new BigDecimal(value).round(new MathContext(DISPLAY_DIGITS, RoundingMode.HALF_EVEN)).stripTrailingZeros();
    double abs = Math.abs(value);
    return abs >= 1e-4 && abs < 1e7 ? d.toPlainString() : d.toString();
  }

  /**
   * A cell's display text, escaped: numbers by {@link #number(double)}, text as it is.
   *
   * @param c the cell
   * @return escaped display text (empty for an absent value)
   */
  public static String cell(Cell c) {
    if (c instanceof Cell.Num n) {
      return number(n.value());
    }
    return escape(c.plain());
  }
}
