package org.quantrun.core.processing;

import java.math.BigDecimal;
import java.math.MathContext;
import java.math.RoundingMode;

/**
 * Rounds reported values to significant figures.
 *
 * <p>The value is first taken at its shortest decimal form (what {@link Double#toString(double)}
 * prints, so 0.15 is 0.15, not the binary 0.1499999...), then rounded with the method's rule; the
 * default is round half to even (ISO 80000-1, rule B), under which 2.25 becomes 2.2 and 2.35
 * becomes 2.4 at two figures. Trailing zeros that are significant are kept: 2.0 at two figures
 * prints as {@code 2.0}, 1200 at two figures as {@code 1200}.
 */
public final class SignificantFigures {
  private SignificantFigures() {}

  /** Rounds half to even. */
  public static String format(double value, int figures) {
    return format(value, figures, RoundingMode.HALF_EVEN);
  }

  /**
   * Rounds {@code value} to {@code figures} significant figures with {@code mode}.
   *
   * @throws IllegalArgumentException for a non-finite value or fewer than one figure
   */
  public static String format(double value, int figures, RoundingMode mode) {
    if (!Double.isFinite(value)) {
      throw new IllegalArgumentException("cannot round " + value);
    }
    if (figures < 1) {
      throw new IllegalArgumentException("significant figures must be 1 or more, was " + figures);
    }
    if (value == 0) {
      return figures == 1 ? "0" : "0." + "0".repeat(figures - 1);
    }
    BigDecimal rounded = BigDecimal.valueOf(value).round(new MathContext(figures, mode));
    int precision = rounded.precision();
    if (precision < figures) {
      rounded = rounded.setScale(rounded.scale() + (figures - precision), RoundingMode.UNNECESSARY);
    }
    if (rounded.scale() < 0) {
      rounded = rounded.setScale(0, RoundingMode.UNNECESSARY);
    }
    return rounded.toPlainString();
  }
}
