package org.quantrun.core.processing;

import java.math.BigDecimal;
import java.math.MathContext;
import java.math.RoundingMode;

/** Numbers in traces and messages: six significant figures, no trailing zeros, no exponent below 1e9. */
final class Text {
  private Text() {}

  static String num(double v) {
    if (!Double.isFinite(v)) {
      return Double.toString(v);
    }
    if (v == 0) {
      return "0";
    }
    double a0 = Math.abs(v);
    if (a0 >= 1e-3 && a0 < 1e9) {
      // fast path: round to six significant figures in binary, print the shortest decimal form
      int exponent = (int) Math.floor(Math.log10(a0));
      double scale = Math.pow(10, 5 - exponent);
      double r = Math.rint(v * scale) / scale;
      String t = Double.toString(r);
      if (t.indexOf('E') < 0 && t.length() <= 12) {
        return t.endsWith(".0") ? t.substring(0, t.length() - 2) : t;
      }
    }
    BigDecimal b = BigDecimal.valueOf(v).round(new MathContext(6, RoundingMode.HALF_EVEN)).stripTrailingZeros();
    double a = Math.abs(v);
    return a >= 1e-6 && a < 1e9 ? b.toPlainString() : b.toString();
  }
}
