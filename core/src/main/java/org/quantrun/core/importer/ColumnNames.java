package org.quantrun.core.importer;

import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Set;

/**
 * The canonical column (field) names an importer maps export headers to, and the built-in
 * aliases for them. Profiles add aliases of their own ({@link ImportSettings#columnAliases()}).
 *
 * <p>Header texts are compared after {@link #normalise normalising}: lower case, with runs of
 * spaces, underscores, hyphens and dots turned into one space, so {@code "Sample_ID"},
 * {@code "sample id"} and {@code "SAMPLE-ID"} are the same name.
 */
public final class ColumnNames {

  /** Position of the injection in the run (a whole number). */
  public static final String SEQUENCE = "sequence";
  /** The sample id. */
  public static final String SAMPLE_ID = "sample_id";
  /** The sample type the export gives. */
  public static final String SAMPLE_TYPE = "sample_type";
  /** The acquisition time stamp. */
  public static final String TIMESTAMP = "timestamp";
  /** The analyte (element symbol) alone. */
  public static final String ANALYTE = "analyte";
  /** The line or mass alone. */
  public static final String LINE = "line";
  /** Analyte and line in one field, e.g. {@code Cd 228.802}. */
  public static final String ANALYTE_LINE = "analyte_line";
  /** The unit. */
  public static final String UNIT = "unit";
  /** The replicate number (used for ordering only). */
  public static final String REPLICATE = "replicate";
  /** A single replicate reading per row. */
  public static final String READING = "reading";
  /** The reported mean. */
  public static final String MEAN = "mean";
  /** The reported standard deviation. */
  public static final String SD = "sd";
  /** An instrument remark or flag text. */
  public static final String REMARK = "remark";

  /** Every canonical name. */
  public static final Set<String> ALL =
      Set.of(SEQUENCE, SAMPLE_ID, SAMPLE_TYPE, TIMESTAMP, ANALYTE, LINE, ANALYTE_LINE, UNIT,
          REPLICATE, READING, MEAN, SD, REMARK);

  /** Built-in aliases per canonical name (common practice; our own list), normalised. */
  public static final Map<String, List<String>> DEFAULT_ALIASES = defaults();

  private ColumnNames() {}

  private static Map<String, List<String>> defaults() {
    Map<String, List<String>> m = new LinkedHashMap<>();
    m.put(SEQUENCE, List.of("sequence", "seq", "seq no", "seq nr", "run order", "position", "injection no", "injection"));
    m.put(SAMPLE_ID, List.of("sample id", "sample", "sample name", "solution", "label"));
    m.put(SAMPLE_TYPE, List.of("sample type", "type", "solution type"));
    m.put(TIMESTAMP, List.of("timestamp", "time stamp", "time", "date time", "datetime", "acquired", "acquisition time"));
    m.put(ANALYTE, List.of("analyte", "element"));
    m.put(LINE, List.of("line", "wavelength", "wavelength nm", "mass", "m z", "isotope"));
    m.put(ANALYTE_LINE, List.of("analyte line", "element line", "channel"));
    m.put(UNIT, List.of("unit", "units"));
    m.put(REPLICATE, List.of("replicate", "rep", "replicate no", "reading no"));
    m.put(READING, List.of("reading", "signal", "intensity", "counts", "value", "absorbance"));
    m.put(MEAN, List.of("mean", "average", "mean signal", "mean intensity"));
    m.put(SD, List.of("sd", "stdev", "std dev", "standard deviation", "s d"));
    m.put(REMARK, List.of("remark", "remarks", "flag", "flags", "comment", "note"));
    return Map.copyOf(m);
  }

  /**
   * Normalises a header text for comparison.
   *
   * @param header the header text
   * @return lower case, trimmed, separators collapsed to single spaces, the words of a name in
   *     camel case apart ({@code SampleID} is {@code sample id})
   */
  public static String normalise(String header) {
    StringBuilder sb = new StringBuilder(header.length());
    boolean space = false;
    for (int i = 0; i < header.length(); i++) {
      char c = header.charAt(i);
      if (c == '\uFEFF') {
        continue;
      }
      if (Character.isWhitespace(c) || c == '_' || c == '-' || c == '.' || c == '/' || c == '(' || c == ')'
          || c == '[' || c == ']' || c == ':' || c == '#') {
        space = sb.length() > 0;
      } else {
        if (space || (sb.length() > 0 && wordStart(header, i))) {
          sb.append(' ');
          space = false;
        }
        sb.append(Character.toLowerCase(c));
      }
    }
    return sb.toString().toLowerCase(Locale.ROOT);
  }

  /**
   * Whether the capital at {@code i} starts a word of a name written in camel case: after a small
   * letter ({@code sampleId}, {@code DateTime}), or ending a run of capitals before a small letter
   * ({@code IDNumber}).
   */
  private static boolean wordStart(String s, int i) {
    if (i == 0 || !Character.isUpperCase(s.charAt(i))) {
      return false;
    }
    char before = s.charAt(i - 1);
    if (Character.isLowerCase(before)) {
      return true;
    }
    return Character.isUpperCase(before) && i + 1 < s.length() && Character.isLowerCase(s.charAt(i + 1));
  }
}
