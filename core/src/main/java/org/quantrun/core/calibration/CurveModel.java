package org.quantrun.core.calibration;

import java.util.Arrays;
import java.util.Locale;
import java.util.stream.Collectors;
import org.quantrun.core.Token;

/**
 * The calibration curve: how the signal y depends on the concentration x.
 *
 * <p>Each model is a polynomial in x; {@link #powers()} lists the powers of x it has, in the order
 * its coefficients are reported (c0, c1, c2 are the coefficients of x^0, x^1, x^2).
 */
public enum CurveModel implements Token {
  /** Straight line with intercept: y = c0 + c1 x; two parameters. */
  LINEAR("linear", 0, 1),
  /** Straight line through the origin: y = c1 x; one parameter (single-point calibration is its n = 1 case). */
  THROUGH_ZERO("through-zero", 1),
  /** Second-order polynomial: y = c0 + c1 x + c2 x^2; three parameters. */
  QUADRATIC("quadratic", 0, 1, 2);

  private final String label;
  private final int[] powers;

  CurveModel(String label, int... powers) {
    this.label = label;
    this.powers = powers;
  }

  /** The name used in method files and on the command line, e.g. {@code through-zero}. */
  @Override
  public String token() {
    return label;
  }

  /** The number of fitted parameters p. */
  public int parameterCount() {
    return powers.length;
  }

  /** The powers of x the model has, ascending (a fresh copy). */
  public int[] powers() {
    return powers.clone();
  }

  /** Whether the model has a term in x^power. */
  public boolean hasTerm(int power) {
    for (int p : powers) {
      if (p == power) {
        return true;
      }
    }
    return false;
  }

  /** Whether the model has an intercept term (c0). */
  public boolean hasIntercept() {
    return powers[0] == 0;
  }

  /**
   * The model named by {@code label} (case-insensitive).
   *
   * @throws IllegalArgumentException naming the unknown label and the known ones
   */
  public static CurveModel fromLabel(String label) {
    for (CurveModel m : values()) {
      if (m.label.equalsIgnoreCase(label.trim())) {
        return m;
      }
    }
    throw new IllegalArgumentException(
        "unknown curve '" + label + "' (expected: " + knownLabels() + ")");
  }

  /** The known labels, comma separated, for messages. */
  public static String knownLabels() {
    return Arrays.stream(values()).map(CurveModel::token).collect(Collectors.joining(", "));
  }

  @Override
  public String toString() {
    return label.toLowerCase(Locale.ROOT);
  }
}
