package org.quantrun.core.method;

import java.util.List;
import java.util.Optional;
import org.quantrun.core.Token;

/**
 * A concentration unit the method file may name: amount per volume of solution (what the
 * instrument is calibrated in) or amount per mass of sample (what a prep sheet turns results
 * into). {@code u} stands for micro; {@code µ} is accepted as a spelling of it.
 */
public enum ConcentrationUnit implements Token {
  /** Nanograms per litre. */
  NG_PER_L("ng/L", Dimension.PER_VOLUME, 1e-3),
  /** Micrograms per litre. */
  UG_PER_L("ug/L", Dimension.PER_VOLUME, 1),
  /** Milligrams per litre. */
  MG_PER_L("mg/L", Dimension.PER_VOLUME, 1e3),
  /** Nanograms per millilitre (equal to micrograms per litre). */
  NG_PER_ML("ng/mL", Dimension.PER_VOLUME, 1),
  /** Micrograms per millilitre (equal to milligrams per litre). */
  UG_PER_ML("ug/mL", Dimension.PER_VOLUME, 1e3),
  /** Micrograms per kilogram of sample. */
  UG_PER_KG("ug/kg", Dimension.PER_MASS, 1),
  /** Milligrams per kilogram of sample. */
  MG_PER_KG("mg/kg", Dimension.PER_MASS, 1e3),
  /** Nanograms per gram of sample (equal to micrograms per kilogram). */
  NG_PER_G("ng/g", Dimension.PER_MASS, 1),
  /** Micrograms per gram of sample (equal to milligrams per kilogram). */
  UG_PER_G("ug/g", Dimension.PER_MASS, 1e3);

  /** What a unit measures the amount against. */
  public enum Dimension {
    /** Amount per volume of solution; base unit ug/L. */
    PER_VOLUME,
    /** Amount per mass of sample; base unit ug/kg. */
    PER_MASS
  }

  private final String token;
  private final Dimension dimension;
  private final double toBase;

  ConcentrationUnit(String token, Dimension dimension, double toBase) {
    this.token = token;
    this.dimension = dimension;
    this.toBase = toBase;
  }

  /** {@inheritDoc} */
  @Override
  public String token() {
    return token;
  }

  /**
   * What this unit measures the amount against.
   *
   * @return per volume or per mass
   */
  public Dimension dimension() {
    return dimension;
  }

  /**
   * The factor that turns a value in this unit into the base unit of its dimension (ug/L for
   * per-volume units, ug/kg for per-mass units).
   *
   * @return the factor, positive
   */
  public double toBaseFactor() {
    return toBase;
  }

  /**
   * Converts a value from this unit into another unit of the same dimension.
   *
   * @param value the value in this unit
   * @param target the unit wanted
   * @return the value in {@code target}
   * @throws IllegalArgumentException if the dimensions differ
   */
  public double convert(double value, ConcentrationUnit target) {
    if (target.dimension != dimension) {
      throw new IllegalArgumentException("cannot convert " + token + " to " + target.token);
    }
    return value * toBase / target.toBase;
  }

  /**
   * Finds the unit spelt {@code text} (case-sensitive, {@code µ} read as {@code u}).
   *
   * @param text the spelling from a method file
   * @return the unit, or empty when the spelling is unknown
   */
  public static Optional<ConcentrationUnit> of(String text) {
    String t = text.strip().replace('µ', 'u').replace('μ', 'u');
    for (ConcentrationUnit u : values()) {
      if (u.token.equals(t)) {
        return Optional.of(u);
      }
    }
    return Optional.empty();
  }

  /**
   * The units of one dimension, in declaration order.
   *
   * @param dimension the dimension
   * @return its units
   */
  public static List<ConcentrationUnit> of(Dimension dimension) {
    return java.util.Arrays.stream(values()).filter(u -> u.dimension == dimension).toList();
  }
}
