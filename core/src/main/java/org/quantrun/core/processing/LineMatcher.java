package org.quantrun.core.processing;

import java.util.Locale;
import java.util.Optional;
import org.quantrun.core.importer.AnalyteLine;

/**
 * Decides whether an exported analyte line is the one a method names: the same analyte (letter
 * case ignored) and the same line or mass, compared as numbers when both read as numbers ({@code
 * 220.353} and {@code 220.3530} agree), else as text. A method line without a line or mass matches
 * an exported line of that analyte that has none.
 */
final class LineMatcher {
  private LineMatcher() {}

  static boolean matches(String name, Optional<String> lineOrMass, AnalyteLine exported) {
    if (!exported.analyte().trim().equalsIgnoreCase(name.trim())) {
      return false;
    }
    if (lineOrMass.isEmpty()) {
      return exported.line().isEmpty();
    }
    if (exported.line().isEmpty()) {
      return false;
    }
    String a = lineOrMass.get().trim();
    String b = exported.line().get().trim();
    if (a.equalsIgnoreCase(b)) {
      return true;
    }
    try {
      return Double.parseDouble(a) == Double.parseDouble(b);
    } catch (NumberFormatException e) {
      return strip(a).equals(strip(b));
    }
  }

  /** "208Pb", "Pb208", "m/z 208" and "208" all name mass 208. */
  private static String strip(String s) {
    return s.toLowerCase(Locale.ROOT).replaceAll("[^0-9.]", "");
  }
}
