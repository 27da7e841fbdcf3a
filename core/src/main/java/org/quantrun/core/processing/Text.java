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
    BigDecimal b = BigDecimal.valueOf(v).round(new MathContext(6, RoundingMode.HALF_EVEN)).stripTrailingZeros();
    double a = Math.abs(v);
    return a >= 1e-6 && a < 1e9 ? b.toPlainString() : b.toString();
  }
}
