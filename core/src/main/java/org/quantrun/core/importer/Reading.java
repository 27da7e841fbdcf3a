package org.quantrun.core.importer;

import java.util.Objects;
import java.util.Optional;
import java.util.OptionalDouble;

/**
 * One value from the export (a replicate signal, or a reported mean or SD), valid or not.
 *
 * <p>A reading the export gives as text that is not a number (such as {@code OVER}, {@code ----},
 * {@code n/a}, or an empty field) is <em>invalid</em>: its {@code value} is {@code NaN} and its
 * {@code invalidReason} says why. The record is kept compact (primitives, no per-reading source
 * name) because a run may hold millions of readings; the source name is in {@link RawRun}.
 *
 * @param value the value; {@code NaN} exactly when the reading is invalid
 * @param invalidReason why the reading has no value; empty for a valid reading
 * @param line the 1-based source line
 * @param column the 1-based source column (field number or character column)
 */
public record Reading(double value, Optional<String> invalidReason, int line, int column) {

  /**
   * Checks that the value and the reason agree.
   *
   * @param value the value; {@code NaN} exactly when the reading is invalid
   * @param invalidReason why the reading has no value; empty for a valid reading
   * @param line the 1-based source line
   * @param column the 1-based source column (field number or character column)
   * @throws IllegalArgumentException if a valid reading is not finite or an invalid one has a value
   */
  public Reading {
    Objects.requireNonNull(invalidReason, "invalidReason");
    if (invalidReason.isEmpty() && !Double.isFinite(value)) {
      throw new IllegalArgumentException("a valid reading needs a finite value, got " + value);
    }
    if (invalidReason.isPresent() && !Double.isNaN(value)) {
      throw new IllegalArgumentException("an invalid reading has no value");
    }
    if (line < 0 || column < 0) {
      throw new IllegalArgumentException("line and column must be >= 0");
    }
  }

  /**
   * A valid reading.
   *
   * @param value the finite value
   * @param position where it was read
   * @return the reading
   */
  public static Reading valid(double value, SourcePosition position) {
    return new Reading(value, Optional.empty(), position.line(), position.column());
  }

  /**
   * An invalid reading.
   *
   * @param reason why there is no value, e.g. {@code instrument reported "OVER"}
   * @param position where it was read
   * @return the reading
   */
  public static Reading invalid(String reason, SourcePosition position) {
    return new Reading(Double.NaN, Optional.of(reason), position.line(), position.column());
  }

  /**
   * Whether the reading has a value.
   *
   * @return {@code true} when valid
   */
  public boolean isValid() {
    return invalidReason.isEmpty();
  }

  /**
   * The value when valid.
   *
   * @return the value, or empty for an invalid reading
   */
  public OptionalDouble validValue() {
    return isValid() ? OptionalDouble.of(value) : OptionalDouble.empty();
  }

  /**
   * Where the reading was read.
   *
   * @return the source position
   */
  public SourcePosition position() {
    return new SourcePosition(line, column);
  }
}
