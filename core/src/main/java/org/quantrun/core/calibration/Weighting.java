package org.quantrun.core.calibration;

import java.util.Arrays;
import java.util.stream.Collectors;
import org.quantrun.core.Token;

/**
 * How the calibration points are weighted in the least-squares fit.
 *
 * <p>Weights are always normalised so that they sum to the number of points n; the coefficients do
 * not depend on the normalisation, the weighted s_y/x does.
 */
public enum Weighting implements Token {
  /** Ordinary least squares: every point counts the same. */
  NONE("none"),
  /** w = 1/x: signal variance proportional to concentration. */
  INVERSE_X("1/x"),
  /** w = 1/x^2: signal SD proportional to concentration. */
  INVERSE_X_SQUARED("1/x2"),
  /** w = 1/y: signal variance proportional to signal. */
  INVERSE_Y("1/y"),
  /** w = 1/y^2: signal SD proportional to signal. */
  INVERSE_Y_SQUARED("1/y2"),
  /** w = 1/s^2 from each point's own standard deviation. */
  INVERSE_VARIANCE("1/s2");

  private final String label;

  Weighting(String label) {
    this.label = label;
  }

  /** The name used in method files and on the command line, e.g. {@code 1/x2}. */
  @Override
  public String token() {
    return label;
  }

  /** Whether the weight of a point depends on its concentration x. */
  public boolean usesX() {
    return this == INVERSE_X || this == INVERSE_X_SQUARED;
  }

  /** Whether the weight of a point depends on its signal y. */
  public boolean usesY() {
    return this == INVERSE_Y || this == INVERSE_Y_SQUARED;
  }

  /** Whether each point must carry its own standard deviation. */
  public boolean needsSd() {
    return this == INVERSE_VARIANCE;
  }

  /**
   * The un-normalised weight for a value v: x for the x-based weightings, y for the y-based ones,
   * the standard deviation for {@link #INVERSE_VARIANCE}; 1 for {@link #NONE}.
   */
  double rawWeight(double v) {
    switch (this) {
      case NONE:
        return 1.0;
      case INVERSE_X:
      case INVERSE_Y:
        return 1.0 / v;
      case INVERSE_X_SQUARED:
      case INVERSE_Y_SQUARED:
      case INVERSE_VARIANCE:
        return 1.0 / (v * v);
      default:
        throw new AssertionError(this);
    }
  }

  /**
   * The weighting named by {@code label}; accepts the method-file labels and the spelled-out
   * forms {@code 1/x^2}, {@code 1/y^2}, {@code 1/s^2}.
   *
   * @throws IllegalArgumentException naming the unknown label and the known ones
   */
  public static Weighting fromLabel(String label) {
    String l = label.trim().replace("^", "").replace(" ", "");
    for (Weighting w : values()) {
      if (w.label.equalsIgnoreCase(l)) {
        return w;
      }
    }
    throw new IllegalArgumentException(
        "unknown weighting '" + label + "' (expected: " + knownLabels() + ")");
  }

  /** The known labels, comma separated, for messages. */
  public static String knownLabels() {
    return Arrays.stream(values()).map(Weighting::token).collect(Collectors.joining(", "));
  }

  @Override
  public String toString() {
    return label;
  }
}
