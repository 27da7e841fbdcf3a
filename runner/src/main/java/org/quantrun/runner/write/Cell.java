package org.quantrun.runner.write;

import java.util.Optional;
import java.util.OptionalDouble;
import java.util.OptionalInt;

/**
 * One cell of an output table: a text, a number, a whole number, or nothing. The same cells feed
 * the CSV files, {@code run.json} and the HTML report, so the three always agree.
 */
public sealed interface Cell {

  /** The empty cell: an absent value (an empty CSV cell, JSON {@code null}). */
  Cell BLANK = new Blank();

  /**
   * A text cell.
   *
   * @param text the text, never null
   */
  record Text(String text) implements Cell {}

  /**
   * A number, written with full double precision ({@link Digits#shortest(double)}). Its text is
   * made once, when first asked for, so the CSV file and {@code run.json} share it.
   */
  final class Num implements Cell {
    private final double value;
    /** The text, once made; a race only makes the same text twice. */
    private String text;

    /**
     * A number cell.
     *
     * @param value a finite number
     */
    public Num(double value) {
      this.value = value;
    }

    /**
     * The number.
     *
     * @return the value
     */
    public double value() {
      return value;
    }

    /**
     * The number's text, the shortest decimal that reads back as the same double.
     *
     * @return the text
     */
    public String text() {
      String t = text;
      if (t == null) {
        t = Digits.shortest(value);
        text = t;
      }
      return t;
    }

    @Override
    public boolean equals(Object o) {
      return o instanceof Num n && Double.compare(n.value, value) == 0;
    }

    @Override
    public int hashCode() {
      return Double.hashCode(value);
    }

    @Override
    public String toString() {
      return "Num[value=" + value + "]";
    }
  }

  /**
   * A whole number.
   *
   * @param value the number
   */
  record Whole(long value) implements Cell {}

  /**
   * A yes/no value, written {@code true} or {@code false}.
   *
   * @param value the value
   */
  record Bool(boolean value) implements Cell {}

  /** No value. */
  record Blank() implements Cell {}

  /**
   * A yes/no cell.
   *
   * @param value the value
   * @return the cell
   */
  static Cell of(boolean value) {
    return new Bool(value);
  }

  /**
   * A text cell.
   *
   * @param text the text
   * @return the cell
   */
  static Cell of(String text) {
    return new Text(text);
  }

  /**
   * A number cell; a value that is not finite is written as an absent value.
   *
   * @param value the number
   * @return the cell
   */
  static Cell of(double value) {
    return Double.isFinite(value) ? new Num(value) : BLANK;
  }

  /**
   * A whole-number cell.
   *
   * @param value the number
   * @return the cell
   */
  static Cell of(long value) {
    return new Whole(value);
  }

  /**
   * A number cell, or blank when absent.
   *
   * @param value the number, if any
   * @return the cell
   */
  static Cell of(OptionalDouble value) {
    return value.isPresent() ? of(value.getAsDouble()) : BLANK;
  }

  /**
   * A whole-number cell, or blank when absent.
   *
   * @param value the number, if any
   * @return the cell
   */
  static Cell of(OptionalInt value) {
    return value.isPresent() ? of(value.getAsInt()) : BLANK;
  }

  /**
   * A text cell, or blank when absent.
   *
   * @param text the text, if any
   * @return the cell
   */
  static Cell ofText(Optional<String> text) {
    return text.<Cell>map(Text::new).orElse(BLANK);
  }

  /**
   * The cell as plain text, the way a CSV file holds it before spreadsheet neutralising: numbers
   * by {@link Digits#shortest(double)}, an absent value as empty text.
   *
   * @return the text
   */
  default String plain() {
    if (this instanceof Text t) {
      return t.text();
    }
    if (this instanceof Num n) {
      return n.text();
    }
    if (this instanceof Whole w) {
      return Long.toString(w.value());
    }
    if (this instanceof Bool b) {
      return Boolean.toString(b.value());
    }
    return "";
  }
}
