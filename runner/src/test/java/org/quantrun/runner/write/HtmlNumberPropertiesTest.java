package org.quantrun.runner.write;

import static org.junit.jupiter.api.Assertions.assertEquals;

import java.math.BigDecimal;
import java.math.MathContext;
import java.math.RoundingMode;
import net.jqwik.api.Arbitraries;
import net.jqwik.api.Arbitrary;
import net.jqwik.api.Combinators;
import net.jqwik.api.ForAll;
import net.jqwik.api.Property;
import net.jqwik.api.Provide;
import net.jqwik.api.constraints.DoubleRange;
import net.jqwik.api.constraints.IntRange;

/**
 * The report's display numbers ({@link Html#number(double)}) are exactly what {@link BigDecimal}
 * gives: the exact binary value rounded half-even to five significant figures, trailing zeros
 * stripped, {@code toPlainString()} for magnitudes from 1e-4 to 1e7 and {@code toString()} beyond
 * (the rule of the Java platform's {@code BigDecimal}, its reference documentation).
 */
class HtmlNumberPropertiesTest {

  /** The display rule written with {@link BigDecimal}, the way the report has always formatted. */
  static String reference(double value) {
    if (!Double.isFinite(value)) {
      return "";
    }
    if (value == 0) {
      return "0";
    }
    BigDecimal d = new BigDecimal(value).round(new MathContext(5, RoundingMode.HALF_EVEN)).stripTrailingZeros();
    double abs = Math.abs(value);
    return abs >= 1e-4 && abs < 1e7 ? d.toPlainString() : d.toString();
  }

  private static void same(double value) {
    assertEquals(reference(value), Html.number(value), () -> "for " + value + " (bits " + Double.doubleToRawLongBits(value) + ")");
  }

  @Property(tries = 20000)
  void anyBitPattern(@ForAll("anyDouble") double value) {
    same(value);
  }

  @Property(tries = 20000)
  void everydayMagnitudes(@ForAll @DoubleRange(min = -1e9, max = 1e9) double value, @ForAll @IntRange(min = -12, max = 12) int shift) {
    same(value * Math.pow(10, shift));
  }

  /** Numbers written with six figures ending in 5, the halfway cases, and their neighbours one ulp away. */
  @Property(tries = 20000)
  void halfwayCases(@ForAll("halfway") double value) {
    same(value);
    same(Math.nextUp(value));
    same(Math.nextDown(value));
    same(-value);
  }

  /** Numbers around a power of ten and around 9.9999x, where the exponent of the result changes. */
  @Property(tries = 5000)
  void exponentBoundaries(@ForAll @IntRange(min = -30, max = 30) int exponent, @ForAll @IntRange(min = -3, max = 3) int ulps,
      @ForAll("boundaryMantissa") String mantissa) {
    double v = Double.parseDouble(mantissa + "e" + exponent);
    for (int i = 0; i < Math.abs(ulps); i++) {
      v = ulps > 0 ? Math.nextUp(v) : Math.nextDown(v);
    }
    same(v);
  }

  @Property(tries = 2000)
  void smallWholeNumbersAndSimpleFractions(@ForAll @IntRange(min = -2_000_000, max = 2_000_000) int n,
      @ForAll @IntRange(min = 0, max = 8) int decimals) {
    same(n / Math.pow(10, decimals));
    same(Double.parseDouble(n + "e-" + decimals));
  }

  @Property(tries = 10)
  void specialValues(@ForAll("special") double value) {
    same(value);
  }

  @Provide
  Arbitrary<Double> anyDouble() {
    return Arbitraries.longs().map(Double::longBitsToDouble).filter(Double::isFinite);
  }

  @Provide
  Arbitrary<Double> halfway() {
    return Combinators.combine(Arbitraries.integers().between(10000, 99999), Arbitraries.integers().between(-25, 25))
        .as((digits, exponent) -> Double.parseDouble(digits + "5e" + exponent));
  }

  @Provide
  Arbitrary<String> boundaryMantissa() {
    return Arbitraries.of("1", "1.00005", "1.000049999", "9.9999", "9.99995", "9.999949999", "9.99996", "9.9999499999999");
  }

  @Provide
  Arbitrary<Double> special() {
    return Arbitraries.of(0.0, -0.0, Double.MIN_VALUE, -Double.MIN_VALUE, Double.MIN_NORMAL, Double.MAX_VALUE, -Double.MAX_VALUE,
        1e-4, 9.99995e-5, 1e7, 9999999.5, 9999950.0, 0.5, 12345.5, 1e22, 1e23, 1e-18, 1e-19);
  }
}
