package org.quantrun.core.importer;

import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.OptionalDouble;
import java.util.Set;
import java.util.regex.Pattern;

/**
 * Reads the text of one value into a {@link Reading}, honouring the decimal and thousands
 * separators and the invalid markers of the settings. Immutable and thread-safe.
 */
public final class ValueReader {

  private final String sourceName;
  private final char decimal;
  private final char grouping;
  private final boolean hasGrouping;
  private final Set<String> markers;
  private final boolean unreadableInvalid;

  /**
   * A reader for one source.
   *
   * @param sourceName the source name for messages
   * @param settings the import settings
   */
  public ValueReader(String sourceName, ImportSettings settings) {
    this.sourceName = sourceName;
    this.decimal = settings.decimalSeparator();
    this.hasGrouping = settings.groupingSeparator().isPresent();
    this.grouping = settings.groupingSeparator().orElse('\0');
    this.markers = settings.invalidMarkers();
    this.unreadableInvalid = settings.unreadableTextInvalid();
  }

  /**
   * Reads one value.
   *
   * @param raw the text as exported
   * @param what the column's name, for messages (e.g. {@code intensity})
   * @param line the 1-based line
   * @param column the 1-based column
   * @return a valid reading, or an invalid one for an empty cell, a marker such as {@code OVER},
   *     or (when the settings say so) other unreadable text
   * @throws ImportException for unreadable text when the settings do not make it invalid
   */
  public Reading read(String raw, String what, int line, int column) throws ImportException {
    String s = raw.strip();
    if (s.isEmpty()) {
      return new Reading(Double.NaN, java.util.Optional.of("no value (empty)"), line, column);
    }
    double v = parse(s);
    if (!Double.isNaN(v)) {
      return new Reading(v, java.util.Optional.empty(), line, column);
    }
    if (markers.contains(s.toLowerCase(Locale.ROOT))) {
      return new Reading(Double.NaN, java.util.Optional.of("instrument reported \"" + s + "\""), line, column);
    }
    if (unreadableInvalid) {
      return new Reading(Double.NaN, java.util.Optional.of("\"" + s + "\" is not a number"), line, column);
    }
    throw new ImportException(sourceName, new SourcePosition(line, column),
        what + " \"" + s + "\" is not a number" + hint() + otherFormat(s));
  }

  /**
   * For a text that is a number in another common format (thousands separated, or the other decimal
   * separator), the setting that reads it; else empty.
   */
  private String otherFormat(String s) {
    char other = decimal == '.' ? ',' : '.';
    String o = Pattern.quote(String.valueOf(other));
    String d = Pattern.quote(String.valueOf(decimal));
    List<String> ways = new ArrayList<>(2);
    if (!(hasGrouping && grouping == other) && s.matches("[+-]?\\d{1,3}(" + o + "\\d{3})+(" + d + "\\d*)?")) {
      ways.add("thousands separator '" + other + "' (grouping_separator in the import profile)");
    }
    if (s.matches("[+-]?\\d*" + o + "\\d+([eE][+-]?\\d+)?")) {
      ways.add("decimal separator '" + other + "' (decimal_separator in the import profile)");
    }
    return ways.isEmpty() ? "" : "; it reads as a number with " + String.join(", or with ", ways);
  }

  private String hint() {
    return " (" + numberFormat() + ")";
  }

  /**
   * How this reader reads numbers, in words for messages.
   *
   * @return e.g. {@code decimal separator ',', no thousands separator}
   */
  public String numberFormat() {
    return "decimal separator '" + decimal + "'"
        + (hasGrouping ? ", thousands separator '" + grouping + "'" : ", no thousands separator");
  }

  /**
   * Reads a text as a number in this format, without markers or errors.
   *
   * @param raw the text as exported
   * @return the finite value, or empty when the text is blank or not a number in this format
   */
  public OptionalDouble number(String raw) {
    String s = raw.strip();
    if (s.isEmpty()) {
      return OptionalDouble.empty();
    }
    double v = parse(s);
    return Double.isNaN(v) ? OptionalDouble.empty() : OptionalDouble.of(v);
  }

  /**
   * Parses a stripped text as a number.
   *
   * @param s the text
   * @return the value, or {@code NaN} when it is not a finite number in this format
   */
  double parse(String s) {
    int n = s.length();
    boolean plain = true;
    for (int i = 0; i < n; i++) {
      char c = s.charAt(i);
      if (!((c >= '0' && c <= '9') || c == '-' || c == '+' || c == 'e' || c == 'E' || (c == '.' && decimal == '.'))) {
        plain = false;
        break;
      }
    }
    if (plain) {
      return finite(s);
    }
    StringBuilder sb = new StringBuilder(n);
    int i = 0;
    if (i < n && (s.charAt(i) == '-' || s.charAt(i) == '+')) {
      sb.append(s.charAt(i++));
    }
    int digits = 0;
    int groupDigits = -1;
    while (i < n) {
      char c = s.charAt(i);
      if (c >= '0' && c <= '9') {
        sb.append(c);
        digits++;
        if (groupDigits >= 0) {
          groupDigits++;
        }
      } else if (hasGrouping && c == grouping) {
        if (digits == 0 || (groupDigits >= 0 && groupDigits != 3) || (groupDigits < 0 && digits > 3)) {
          return Double.NaN;
        }
        groupDigits = 0;
      } else {
        break;
      }
      i++;
    }
    if (groupDigits >= 0 && groupDigits != 3) {
      return Double.NaN;
    }
    if (i < n && s.charAt(i) == decimal) {
      sb.append('.');
      i++;
      while (i < n && s.charAt(i) >= '0' && s.charAt(i) <= '9') {
        sb.append(s.charAt(i++));
        digits++;
      }
    }
    if (digits == 0) {
      return Double.NaN;
    }
    if (i < n && (s.charAt(i) == 'e' || s.charAt(i) == 'E')) {
      sb.append('e');
      i++;
      if (i < n && (s.charAt(i) == '-' || s.charAt(i) == '+')) {
        sb.append(s.charAt(i++));
      }
      int exp = 0;
      while (i < n && s.charAt(i) >= '0' && s.charAt(i) <= '9') {
        sb.append(s.charAt(i++));
        exp++;
      }
      if (exp == 0) {
        return Double.NaN;
      }
    }
    return i == n ? finite(sb.toString()) : Double.NaN;
  }

  private static double finite(String s) {
    try {
      double v = Double.parseDouble(s);
      return Double.isFinite(v) ? v : Double.NaN;
    } catch (NumberFormatException e) {
      return Double.NaN;
    }
  }
}
