package org.quantrun.runner.write;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import net.jqwik.api.Arbitraries;
import net.jqwik.api.Arbitrary;
import net.jqwik.api.ForAll;
import net.jqwik.api.Property;
import net.jqwik.api.Provide;
import org.junit.jupiter.api.Test;

/**
 * {@link Digits#shortest(double)} against the rules of the Java SE 19 {@code Double.toString}
 * specification: the text reads back as the same double, has no more digits than Java 17's
 * {@code Double.toString} (which is not always the shortest), and keeps its layout (plain from
 * 10^-3 up to 10^7, otherwise an exponent).
 */
class DigitsPropertiesTest {

  @Property(tries = 20_000)
  void readsBackAndIsNoLongerThanJava17(@ForAll("finite") double v) {
    String s = Digits.shortest(v);
    String java = Double.toString(v);
    assertEquals(v, Double.parseDouble(s), s);
    assertTrue(s.length() <= java.length(), s + " longer than " + java);
    assertEquals(java.indexOf('E') >= 0, s.indexOf('E') >= 0, s + " against " + java);
  }

  @Provide
  Arbitrary<Double> finite() {
    return Arbitraries.oneOf(
        Arbitraries.longs().map(Double::longBitsToDouble).filter(Double::isFinite),
        Arbitraries.doubles().between(-1e9, 1e9),
        Arbitraries.doubles().between(0, 1e-3).ofScale(12));
  }

  /** Examples of the layout rules in the Java SE API documentation of Double.toString. */
  @Test
  void layoutOfTheSpecification() {
    assertEquals("0.1", Digits.shortest(0.1));
    assertEquals("100.0", Digits.shortest(100));
    assertEquals("0.001", Digits.shortest(1e-3));
    assertEquals("1.0E-4", Digits.shortest(1e-4));
    assertEquals("9999999.0", Digits.shortest(9_999_999));
    assertEquals("1.0E7", Digits.shortest(1e7));
    assertEquals("-0.0", Digits.shortest(-0.0));
    assertEquals("NaN", Digits.shortest(Double.NaN));
    assertEquals("-Infinity", Digits.shortest(Double.NEGATIVE_INFINITY));
  }
}
