package org.quantrun.runner.output;

import java.text.Normalizer;
import java.util.Locale;
import java.util.Set;

/**
 * Turns a name from an export (a run id, a sample id, a file name) into a safe name for a file
 * or folder: only letters, digits, {@code .}, {@code -} and {@code _}; no path separators, no
 * {@code ..}, no leading dot, no names reserved by Windows ({@code CON}, {@code NUL}, {@code COM1},
 * ...), at most 80 characters. The name never steers where a file is written.
 */
public final class SafeNames {
  private static final int MAX_LENGTH = 80;
  private static final Set<String> RESERVED = Set.of(
      "CON", "PRN", "AUX", "NUL", "COM1", "COM2", "COM3", "COM4", "COM5", "COM6", "COM7", "COM8", "COM9",
      "LPT1", "LPT2", "LPT3", "LPT4", "LPT5", "LPT6", "LPT7", "LPT8", "LPT9");

  private SafeNames() {}

  /**
   * A safe name for {@code raw}; {@code fallback} (itself safe) when nothing usable is left.
   */
  public static String of(String raw, String fallback) {
    String s = Normalizer.normalize(raw, Normalizer.Form.NFKD);
    StringBuilder b = new StringBuilder(s.length());
    for (int i = 0; i < s.length() && b.length() < MAX_LENGTH; i++) {
      char c = s.charAt(i);
      if (c < 128 && (Character.isLetterOrDigit(c) || c == '-' || c == '_' || c == '.')) {
        b.append(c);
      } else if (Character.getType(c) != Character.NON_SPACING_MARK) {
        b.append('_');
      }
    }
    String name = b.toString().replaceAll("\\.{2,}", ".").replaceAll("_{2,}", "_");
    name = name.replaceAll("^[._-]+", "").replaceAll("[._ ]+$", "");
    if (name.isEmpty()) {
      return fallback;
    }
    String stem = name.contains(".") ? name.substring(0, name.indexOf('.')) : name;
    if (RESERVED.contains(stem.toUpperCase(Locale.ROOT))) {
      name = "_" + name;
    }
    return name;
  }
}
