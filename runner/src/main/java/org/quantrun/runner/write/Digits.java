package org.quantrun.runner.write;

import com.fasterxml.jackson.core.io.schubfach.DoubleToDecimal;

/**
 * Numbers at full double precision, as the shortest decimal that reads back as the same double.
 *
 * <p>Java 17's {@link Double#toString(double)} sometimes prints a digit more than needed
 * ({@code 2.0E-3} is fine, but {@code 1.34711938801685296E17} where {@code 1.347119388016853E17}
 * reads back the same) and is several times slower. Jackson's Schubfach conversion, the algorithm
 * Java itself adopted for {@code Double.toString} from Java 19, gives the shortest form in the same
 * layout (plain from 10<sup>-3</sup> up to 10<sup>7</sup>, otherwise with an {@code E} exponent).
 */
public final class Digits {
  private Digits() {}

  /**
   * The shortest decimal text of {@code v} that parses back to {@code v}.
   *
   * @param v the number
   * @return its text, {@code NaN} or {@code Infinity} as {@link Double#toString(double)} prints them
   */
  public static String shortest(double v) {
    return DoubleToDecimal.toString(v);
  }
}
