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
    int n = text.length();
    int i = 0;
    while (i < n && plain(text.charAt(i))) {
      i++;
    }
    if (i == n) {
      return text;
    }
    StringBuilder b = new StringBuilder(n + 16);
    b.append(text, 0, i);
    escapeTo(b, text, i);
    return b.toString();
  }

  /**
   * Appends text escaped as by {@link #escape(String)}.
   *
   * @param b where the text goes
   * @param text any text
   */
  static void escape(StringBuilder b, String text) {
    int n = text.length();
    int i = 0;
    while (i < n && plain(text.charAt(i))) {
      i++;
    }
    b.append(text, 0, i);
    if (i < n) {
      escapeTo(b, text, i);
    }
  }

  private static boolean plain(char c) {
    return c >= ' ' ? c < 0x7f && c != '&' && c != '<' && c != '>' && c != '"' && c != '\'' : c == '\t' || c == '\n' || c == '\r';
  }

  private static void escapeTo(StringBuilder b, String text, int from) {
    for (int i = from; i < text.length(); i++) {
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
    StringBuilder b = new StringBuilder(16);
    number(b, value);
    return b.toString();
  }

  /**
   * Appends {@link #number(double)} of a finite, non-zero number.
   *
   * <p>The digits are those of the exact binary value rounded half-even to five significant
   * figures, as {@code new BigDecimal(value).round(new MathContext(5, HALF_EVEN))} gives them:
   * the value is scaled by an exact power of ten in one correctly rounded step (relative error at
   * most 2^-53), and whenever that error could decide the rounding (a fraction within 1e-7 of one
   * half) or the power of ten is not exact, the digits come from {@link BigDecimal} itself.
   */
  private static void number(StringBuilder b, double value) {
    double abs = Math.abs(value);
    int exp = (int) Math.floor(Math.log10(abs));
    long digits = -1;
    if (exp >= -18 && exp <= 22) {
      double scaled = scale(abs, DISPLAY_DIGITS - 1 - exp);
      if (scaled < 1e4) {
        exp--;
        scaled = scale(abs, DISPLAY_DIGITS - 1 - exp);
      } else if (scaled >= 1e5) {
        exp++;
        scaled = scale(abs, DISPLAY_DIGITS - 1 - exp);
      }
      double floor = Math.floor(scaled);
      double fraction = scaled - floor;
      if (scaled >= 1e4 && scaled < 1e5 && Math.abs(fraction - 0.5) > 1e-7) {
        digits = (long) floor + (fraction > 0.5 ? 1 : 0);
        if (digits == 100000) {
          digits = 10000;
          exp++;
        }
      }
    }
    if (digits < 0) {
      BigDecimal d = new BigDecimal(value).round(new MathContext(DISPLAY_DIGITS, RoundingMode.HALF_EVEN)).stripTrailingZeros();
      b.append(abs >= 1e-4 && abs < 1e7 ? d.toPlainString() : d.toString());
      return;
    }
    // digits has five figures, value = digits x 10^(exp - 4); drop trailing zeros as stripTrailingZeros does
    int figures = DISPLAY_DIGITS;
    while (digits % 10 == 0) {
      digits /= 10;
      figures--;
    }
    int scale = figures - 1 - exp; // value = digits x 10^-scale
    if (value < 0) {
      b.append('-');
    }
    boolean plain = abs >= 1e-4 && abs < 1e7 || scale >= 0 && exp >= -6;
    if (plain) {
      String u = Long.toString(digits);
      if (scale <= 0) {
        b.append(u);
        for (int i = 0; i < -scale; i++) {
          b.append('0');
        }
      } else if (scale >= figures) {
        b.append("0.");
        for (int i = 0; i < scale - figures; i++) {
          b.append('0');
        }
        b.append(u);
      } else {
        b.append(u, 0, figures - scale).append('.').append(u, figures - scale, figures);
      }
    } else {
      String u = Long.toString(digits);
      b.append(u.charAt(0));
      if (figures > 1) {
        b.append('.').append(u, 1, figures);
      }
      b.append('E').append(exp > 0 ? "+" : "").append(exp);
    }
  }

  private static final double[] POWERS = {
    1e0, 1e1, 1e2, 1e3, 1e4, 1e5, 1e6, 1e7, 1e8, 1e9, 1e10, 1e11, 1e12, 1e13, 1e14, 1e15, 1e16, 1e17, 1e18, 1e19,
    1e20, 1e21, 1e22};

  /** abs x 10^power in one correctly rounded operation; NaN when 10^power is not exact. */
  private static double scale(double abs, int power) {
    if (power >= 0) {
      return power < POWERS.length ? abs * POWERS[power] : Double.NaN;
    }
    return -power < POWERS.length ? abs / POWERS[-power] : Double.NaN;
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

  /**
   * Appends {@link #cell(Cell)}.
   *
   * @param b where the text goes
   * @param c the cell
   */
  static void cell(StringBuilder b, Cell c) {
    if (c instanceof Cell.Num n) {
      double v = n.value();
      if (!Double.isFinite(v)) {
        return;
      }
      if (v == 0) {
        b.append('0');
      } else {
        number(b, v);
      }
    } else if (c instanceof Cell.Text t) {
      escape(b, t.text());
    } else if (c instanceof Cell.Whole w) {
      b.append(w.value());
    } else if (c instanceof Cell.Bool x) {
      b.append(x.value());
    }
  }
}
