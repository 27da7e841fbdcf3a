package org.quantrun.core.importer;

import java.nio.charset.Charset;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.LinkedHashSet;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Objects;
import java.util.Optional;
import java.util.Set;
import java.util.regex.Pattern;

/**
 * How one export variant is laid out: an immutable value, built fluently from {@link #DEFAULT}
 * ({@code ImportSettings.DEFAULT.toBuilder().delimiter(';').decimalSeparator(',').build()}) or
 * from an import profile ({@link ImportProfiles}, {@link #fromMap}).
 *
 * <p>Each importer uses the settings that concern it and ignores the rest: the delimited importer
 * uses the delimiter, quote and table settings; the fixed-width importer the fields and record
 * patterns; both use the text, number, column and row settings. Third-party importers read their
 * own keys from {@link #options()}.
 */
public final class ImportSettings {

  /** The id that asks for the importer with the highest detection confidence. */
  public static final String AUTO = "auto";

  /** Texts that mean "no value" by default (compared ignoring case; common practice, our list). */
  public static final Set<String> DEFAULT_INVALID_MARKERS =
      Set.of("OVER", "UNDER", "----", "---", "--", "-", "n/a", "na", "nan", "#####");

  /**
   * Default wide-layout header pattern: an element symbol, an optional line or mass, an optional
   * unit in brackets and an optional statistic ({@code mean}, {@code sd}, {@code rsd}, {@code rep 2}),
   * e.g. {@code Cd 228.802 [cps]}, {@code Pb208 mean}; with a decimal comma {@code Cd 228,802 [cps]}
   * (read as line {@code 228.802}).
   */
  public static final Pattern DEFAULT_WIDE_PATTERN = Pattern.compile(
      "(?<analyte>[A-Z][a-z]?)[ _]?(?<line>\\d+(?:[.,]\\d+)?)?(?:\\s*[\\[(](?<unit>[^\\])]+)[\\])])?"
          + "(?:[ _]+(?<stat>(?i:mean|sd|rsd|rep ?\\d+)))?");

  /** Default pattern for several replicate columns in one long-layout row ({@code Rep 1}, {@code Reading_2}). */
  public static final Pattern DEFAULT_REPLICATE_PATTERN =
      Pattern.compile("(?i)(?:rep|replicate|reading|read)[ _#-]*(?<n>\\d+)");

  /**
   * Default largest export accepted, in bytes (256 MiB). A long-layout export of a large run
   * (2,000 injections x 70 analyte lines x 3 replicates) is about 25 MB; a usual one 1 to 3 MB.
   */
  public static final long DEFAULT_MAX_FILE_BYTES = 256L << 20;
  /** Default most injections in one export (a large run has about 2,000). */
  public static final int DEFAULT_MAX_INJECTIONS = 200_000;
  /** Default most distinct analyte lines in one export (a large method has about 100). */
  public static final int DEFAULT_MAX_ANALYTE_LINES = 10_000;

  /** The defaults: auto-detected charset and delimiter, long layout, decimal point. */
  public static final ImportSettings DEFAULT = new Builder().build();

  private final String importer;
  private final Optional<Charset> charset;
  private final Optional<Character> delimiter;
  private final char quote;
  private final char decimalSeparator;
  private final Optional<Character> groupingSeparator;
  private final Layout layout;
  private final Map<String, List<String>> columnAliases;
  private final List<String> requiredColumns;
  private final Pattern wideColumnPattern;
  private final Pattern replicateColumnPattern;
  private final List<Pattern> skipPatterns;
  private final Optional<Pattern> endPattern;
  /** The literal start each skip and end rule requires of a row, or null when a rule requires none. */
  private final List<String> ruleStarts;
  private final Set<String> invalidMarkers;
  private final boolean unreadableTextInvalid;
  private final int headerSearchLines;
  private final int maxLineLength;
  private final long maxFileBytes;
  private final int maxInjections;
  private final int maxAnalyteLines;
  private final List<FixedField> fixedFields;
  private final List<Pattern> contextPatterns;
  private final Optional<Pattern> dataRecordPattern;
  private final Map<String, String> options;
  private final List<String> injectionColumns;

  private ImportSettings(Builder b) {
    importer = b.importer;
    charset = b.charset;
    delimiter = b.delimiter;
    quote = b.quote;
    decimalSeparator = b.decimalSeparator;
    groupingSeparator = b.groupingSeparator;
    layout = b.layout;
    Map<String, List<String>> aliases = new LinkedHashMap<>();
    b.columnAliases.forEach((k, v) -> aliases.put(k, List.copyOf(v)));
    columnAliases = Map.copyOf(aliases);
    requiredColumns = List.copyOf(b.requiredColumns);
    wideColumnPattern = b.wideColumnPattern;
    replicateColumnPattern = b.replicateColumnPattern;
    skipPatterns = List.copyOf(b.skipPatterns);
    endPattern = b.endPattern;
    List<String> starts = new ArrayList<>();
    for (Pattern p : skipPatterns) {
      starts.add(requiredStart(p));
    }
    endPattern.ifPresent(p -> starts.add(requiredStart(p)));
    ruleStarts = starts.contains(null) ? null : List.copyOf(starts);
    Set<String> markers = new LinkedHashSet<>();
    b.invalidMarkers.forEach(m -> markers.add(m.strip().toLowerCase(Locale.ROOT)));
    invalidMarkers = Set.copyOf(markers);
    unreadableTextInvalid = b.unreadableTextInvalid;
    headerSearchLines = b.headerSearchLines;
    maxLineLength = b.maxLineLength;
    maxFileBytes = b.maxFileBytes;
    maxInjections = b.maxInjections;
    maxAnalyteLines = b.maxAnalyteLines;
    fixedFields = List.copyOf(b.fixedFields);
    contextPatterns = List.copyOf(b.contextPatterns);
    dataRecordPattern = b.dataRecordPattern;
    options = Map.copyOf(b.options);
    injectionColumns = List.copyOf(b.injectionColumns);
  }

  /**
   * A builder starting from these settings.
   *
   * @return the builder
   */
  public Builder toBuilder() {
    return new Builder(this);
  }

  /**
   * Settings from a profile's plain map (as YAML gives it). Keys are those of the
   * {@code config-examples/importers} profiles: {@code importer, charset, delimiter, quote,
   * decimal_separator, grouping_separator, layout, columns, required_columns, wide_column_pattern,
   * replicate_column_pattern, skip_rows, end_of_table, invalid_markers, unreadable_text_is_invalid,
   * header_search_lines, max_line_length, max_file_bytes, max_injections, max_analyte_lines, fields,
   * context_records, data_records, options}.
   * Keys starting with {@code x_} and the key {@code description} are ignored.
   *
   * @param map the profile
   * @param sourceName the profile's name for messages
   * @param positions where each key path (e.g. {@code fields[2].start}) is, for messages
   * @return the settings
   * @throws ImportException naming the key (and its position, when known) for any bad value
   */
  public static ImportSettings fromMap(
      Map<String, ?> map, String sourceName, java.util.function.Function<String, SourcePosition> positions)
      throws ImportException {
    return new SettingsMapReader(sourceName, positions).read(map);
  }

  /**
   * Settings from a plain map, without positions.
   *
   * @param map the profile
   * @param sourceName the profile's name for messages
   * @return the settings
   * @throws ImportException naming the key for any bad value
   * @see #fromMap(Map, String, java.util.function.Function)
   */
  public static ImportSettings fromMap(Map<String, ?> map, String sourceName) throws ImportException {
    return fromMap(map, sourceName, k -> SourcePosition.UNKNOWN);
  }

  /** @return the importer id to use, or {@value #AUTO} (default) */
  public String importer() {
    return importer;
  }

  /** @return the text encoding; empty (default) means detect: BOM, else UTF-8 if valid, else Windows-1252 */
  public Optional<Charset> charset() {
    return charset;
  }

  /** @return the field delimiter; empty (default) means detect among comma, semicolon, tab and pipe */
  public Optional<Character> delimiter() {
    return delimiter;
  }

  /** @return the quote character (default {@code "}) */
  public char quote() {
    return quote;
  }

  /** @return the decimal separator, {@code .} (default) or {@code ,} */
  public char decimalSeparator() {
    return decimalSeparator;
  }

  /** @return the thousands separator allowed between groups of three digits; empty (default) means none */
  public Optional<Character> groupingSeparator() {
    return groupingSeparator;
  }

  /** @return the table layout (default {@link Layout#LONG}) */
  public Layout layout() {
    return layout;
  }

  /**
   * Extra header names per canonical column name ({@link ColumnNames}), tried before the built-in
   * aliases.
   *
   * @return canonical name to header names (as written in the export)
   */
  public Map<String, List<String>> columnAliases() {
    return columnAliases;
  }

  /**
   * The canonical columns a header line must have; empty (default) means the layout's default:
   * long {@code sample_id, analyte, reading} (analyte also satisfied by {@code analyte_line},
   * reading by {@code mean} or replicate columns); wide {@code sample_id} and one analyte column.
   *
   * @return the required columns
   */
  public List<String> requiredColumns() {
    return requiredColumns;
  }

  /**
   * The header pattern of an analyte column in wide layout, matched against the whole header
   * text. Named groups: {@code analyte} (required), {@code line}, {@code unit}, {@code stat}
   * ({@code mean}, {@code sd}, {@code rsd} is ignored, anything else is a replicate).
   *
   * @return the pattern (default {@link #DEFAULT_WIDE_PATTERN})
   */
  public Pattern wideColumnPattern() {
    return wideColumnPattern;
  }

  /** @return the header pattern of replicate columns in a long-layout row (default {@link #DEFAULT_REPLICATE_PATTERN}) */
  public Pattern replicateColumnPattern() {
    return replicateColumnPattern;
  }

  /** @return patterns of rows to skip after the header (found anywhere in the row's text), e.g. summary rows */
  public List<Pattern> skipPatterns() {
    return skipPatterns;
  }

  /** @return a pattern of the row that ends the table (it and all after it are footer); empty means none */
  public Optional<Pattern> endPattern() {
    return endPattern;
  }

  /** @return texts that mean "no value", lower case (default {@link #DEFAULT_INVALID_MARKERS}); empty cells always do */
  public Set<String> invalidMarkers() {
    return invalidMarkers;
  }

  /**
   * Whether any other text where a number belongs becomes an invalid reading too. Default
   * {@code false}: such text is an import error, because it usually means a wrong profile
   * (e.g. a decimal comma not declared).
   *
   * @return the flag
   */
  public boolean unreadableTextInvalid() {
    return unreadableTextInvalid;
  }

  /** @return how many leading lines are searched for the header (default 200) */
  public int headerSearchLines() {
    return headerSearchLines;
  }

  /** @return the longest line accepted, in characters (default 1,048,576); longer is an import error */
  public int maxLineLength() {
    return maxLineLength;
  }

  /**
   * The largest export accepted; a longer one is an import error, not an exhausted memory.
   *
   * @return bytes (default {@link #DEFAULT_MAX_FILE_BYTES})
   */
  public long maxFileBytes() {
    return maxFileBytes;
  }

  /**
   * The most injections an export may hold; more is an import error.
   *
   * @return the limit (default {@link #DEFAULT_MAX_INJECTIONS})
   */
  public int maxInjections() {
    return maxInjections;
  }

  /**
   * The most distinct analyte lines an export may hold; more is an import error.
   *
   * @return the limit (default {@link #DEFAULT_MAX_ANALYTE_LINES})
   */
  public int maxAnalyteLines() {
    return maxAnalyteLines;
  }

  /** @return fixed-width data fields; empty (default) means find them from a header with an underline row */
  public List<FixedField> fixedFields() {
    return fixedFields;
  }

  /**
   * Fixed-width context record patterns: a line matching one sets the injection fields named by
   * its groups ({@code sequence}, {@code sampleId}, {@code sampleType}, {@code timestamp}; Java group
   * names allow letters and digits only) for
   * the data records after it.
   *
   * @return the patterns (default none)
   */
  public List<Pattern> contextPatterns() {
    return contextPatterns;
  }

  /** @return fixed-width: only lines matching this are data records; empty (default) means every other line */
  public Optional<Pattern> dataRecordPattern() {
    return dataRecordPattern;
  }

  /**
   * Whether a row (its text) is to be skipped by one of the {@linkplain #skipPatterns() skip rules}.
   *
   * @param rowText the row's text
   * @return {@code true} to skip it
   */
  public boolean skips(String rowText) {
    for (Pattern p : skipPatterns) {
      if (p.matcher(rowText).find()) {
        return true;
      }
    }
    return false;
  }

  /**
   * Whether a row (its text) ends the table by the {@linkplain #endPattern() end rule}.
   *
   * @param rowText the row's text
   * @return {@code true} when it and all rows after it are footer
   */
  public boolean ends(String rowText) {
    return endPattern.isPresent() && endPattern.get().matcher(rowText).find();
  }

  /**
   * Whether a skip or end rule could match a row that starts with {@code firstCell}: {@code false}
   * only when every rule is anchored ({@code ^} and literal text, as in {@code ^End of data}) and
   * the row cannot start with any of those texts, so an importer need not build the row's text.
   *
   * @param firstCell the row's first cell as read (the row's text starts with it)
   * @return {@code false} when no rule can match the row
   */
  public boolean rulesMayMatch(String firstCell) {
    if (skipPatterns.isEmpty() && endPattern.isEmpty()) {
      return false;
    }
    if (ruleStarts == null) {
      return true;
    }
    for (String start : ruleStarts) {
      // a start longer than the first cell may run on into the next cells
      if (firstCell.startsWith(start) || start.startsWith(firstCell)) {
        return true;
      }
    }
    return false;
  }

  /**
   * The literal text a pattern requires at the start of the input: after a leading {@code ^}, the
   * letters, digits, spaces and {@code , ; : _ - / #} up to the first other character (less the
   * last one when a quantifier follows it); null when there is none, or the pattern has flags or an
   * alternative ({@code |}).
   */
  static String requiredStart(Pattern p) {
    String r = p.pattern();
    if (p.flags() != 0 || !r.startsWith("^") || r.indexOf('|') >= 0) {
      return null;
    }
    int end = 1;
    while (end < r.length() && isPlain(r.charAt(end))) {
      end++;
    }
    if (end < r.length() && "?*{".indexOf(r.charAt(end)) >= 0) {
      end--;
    }
    return end > 1 ? r.substring(1, end) : null;
  }

  private static boolean isPlain(char c) {
    return Character.isLetterOrDigit(c) || " ,;:_-/#".indexOf(c) >= 0;
  }

  /** @return free options for third-party importers */
  public Map<String, String> options() {
    return options;
  }

  /**
   * The export columns whose text every injection carries ({@link Injection#columns()}): the
   * columns a method names per injection, such as a dilution factor or a standard's level. They
   * are matched to the header as other column names are ({@link ColumnNames#normalise}); a column
   * the export lacks is left out of every injection, and the run's {@link RawRun#columns()} show
   * what the export has.
   *
   * @return the column names, in order (default none)
   */
  public List<String> injectionColumns() {
    return injectionColumns;
  }

  @Override
  public boolean equals(Object o) {
    return o instanceof ImportSettings s && key().equals(s.key());
  }

  @Override
  public int hashCode() {
    return key().hashCode();
  }

  @Override
  public String toString() {
    return "ImportSettings" + key();
  }

  private List<Object> key() {
    return List.of(importer, charset, delimiter, quote, decimalSeparator, groupingSeparator, layout,
        columnAliases, requiredColumns, wideColumnPattern.pattern(), replicateColumnPattern.pattern(),
        skipPatterns.stream().map(Pattern::pattern).toList(), endPattern.map(Pattern::pattern),
        invalidMarkers, unreadableTextInvalid, headerSearchLines, maxLineLength, maxFileBytes, maxInjections,
        maxAnalyteLines, fixedFields,
        contextPatterns.stream().map(Pattern::pattern).toList(), dataRecordPattern.map(Pattern::pattern),
        options, injectionColumns);
  }

  /** Builds {@link ImportSettings}; every method returns the builder. Not thread-safe. */
  public static final class Builder {
    private String importer = AUTO;
    private Optional<Charset> charset = Optional.empty();
    private Optional<Character> delimiter = Optional.empty();
    private char quote = '"';
    private char decimalSeparator = '.';
    private Optional<Character> groupingSeparator = Optional.empty();
    private Layout layout = Layout.LONG;
    private Map<String, List<String>> columnAliases = new LinkedHashMap<>();
    private List<String> requiredColumns = new ArrayList<>();
    private Pattern wideColumnPattern = DEFAULT_WIDE_PATTERN;
    private Pattern replicateColumnPattern = DEFAULT_REPLICATE_PATTERN;
    private List<Pattern> skipPatterns = new ArrayList<>();
    private Optional<Pattern> endPattern = Optional.empty();
    private Set<String> invalidMarkers = new LinkedHashSet<>(DEFAULT_INVALID_MARKERS);
    private boolean unreadableTextInvalid;
    private int headerSearchLines = 200;
    private int maxLineLength = 1 << 20;
    private long maxFileBytes = DEFAULT_MAX_FILE_BYTES;
    private int maxInjections = DEFAULT_MAX_INJECTIONS;
    private int maxAnalyteLines = DEFAULT_MAX_ANALYTE_LINES;
    private List<FixedField> fixedFields = new ArrayList<>();
    private List<Pattern> contextPatterns = new ArrayList<>();
    private Optional<Pattern> dataRecordPattern = Optional.empty();
    private Map<String, String> options = new LinkedHashMap<>();
    private List<String> injectionColumns = new ArrayList<>();

    private Builder() {}

    private Builder(ImportSettings s) {
      importer = s.importer;
      charset = s.charset;
      delimiter = s.delimiter;
      quote = s.quote;
      decimalSeparator = s.decimalSeparator;
      groupingSeparator = s.groupingSeparator;
      layout = s.layout;
      columnAliases = new LinkedHashMap<>(s.columnAliases);
      requiredColumns = new ArrayList<>(s.requiredColumns);
      wideColumnPattern = s.wideColumnPattern;
      replicateColumnPattern = s.replicateColumnPattern;
      skipPatterns = new ArrayList<>(s.skipPatterns);
      endPattern = s.endPattern;
      invalidMarkers = new LinkedHashSet<>(s.invalidMarkers);
      unreadableTextInvalid = s.unreadableTextInvalid;
      headerSearchLines = s.headerSearchLines;
      maxLineLength = s.maxLineLength;
      maxFileBytes = s.maxFileBytes;
      maxInjections = s.maxInjections;
      maxAnalyteLines = s.maxAnalyteLines;
      fixedFields = new ArrayList<>(s.fixedFields);
      contextPatterns = new ArrayList<>(s.contextPatterns);
      dataRecordPattern = s.dataRecordPattern;
      options = new LinkedHashMap<>(s.options);
      injectionColumns = new ArrayList<>(s.injectionColumns);
    }

    /**
     * @param id importer id or {@value ImportSettings#AUTO}
     * @return this builder
     */
    public Builder importer(String id) {
      if (id.isBlank()) {
        throw new IllegalArgumentException("importer id must not be blank");
      }
      importer = id.strip();
      return this;
    }

    /**
     * @param cs the charset
     * @return this builder
     */
    public Builder charset(Charset cs) {
      charset = Optional.of(cs);
      return this;
    }

    /** @return this builder, with the charset detected (BOM, else UTF-8 if valid, else Windows-1252) */
    public Builder detectCharset() {
      charset = Optional.empty();
      return this;
    }

    /**
     * @param d the delimiter
     * @return this builder
     */
    public Builder delimiter(char d) {
      if (d == '\n' || d == '\r') {
        throw new IllegalArgumentException("a line break cannot be the delimiter");
      }
      delimiter = Optional.of(d);
      return this;
    }

    /** @return this builder, with the delimiter detected */
    public Builder detectDelimiter() {
      delimiter = Optional.empty();
      return this;
    }

    /**
     * @param q the quote character
     * @return this builder
     */
    public Builder quote(char q) {
      quote = q;
      return this;
    }

    /**
     * @param sep {@code .} or {@code ,}
     * @return this builder
     */
    public Builder decimalSeparator(char sep) {
      if (sep != '.' && sep != ',') {
        throw new IllegalArgumentException("decimal separator must be '.' or ',', got '" + sep + "'");
      }
      decimalSeparator = sep;
      return this;
    }

    /**
     * @param sep the thousands separator
     * @return this builder
     */
    public Builder groupingSeparator(char sep) {
      if (Character.isDigit(sep) || sep == '-' || sep == '+' || Character.isLetter(sep)) {
        throw new IllegalArgumentException("grouping separator cannot be '" + sep + "'");
      }
      groupingSeparator = Optional.of(sep);
      return this;
    }

    /** @return this builder, with no thousands separator */
    public Builder noGroupingSeparator() {
      groupingSeparator = Optional.empty();
      return this;
    }

    /**
     * @param l the layout
     * @return this builder
     */
    public Builder layout(Layout l) {
      layout = Objects.requireNonNull(l);
      return this;
    }

    /**
     * Adds header names for a canonical column.
     *
     * @param canonical one of {@link ColumnNames#ALL}
     * @param names header names as written in the export
     * @return this builder
     */
    public Builder alias(String canonical, List<String> names) {
      if (!ColumnNames.ALL.contains(canonical)) {
        throw new IllegalArgumentException("unknown column '" + canonical + "' (expected one of "
            + String.join(", ", new java.util.TreeSet<>(ColumnNames.ALL)) + ")");
      }
      List<String> all = new ArrayList<>(columnAliases.getOrDefault(canonical, List.of()));
      all.addAll(names);
      columnAliases.put(canonical, all);
      return this;
    }

    /**
     * @param columns canonical names every header must have
     * @return this builder
     */
    public Builder requiredColumns(List<String> columns) {
      for (String c : columns) {
        if (!ColumnNames.ALL.contains(c)) {
          throw new IllegalArgumentException("unknown column '" + c + "'");
        }
      }
      requiredColumns = new ArrayList<>(columns);
      return this;
    }

    /**
     * @param p the wide-layout analyte column pattern; must have a group named {@code analyte}
     * @return this builder
     */
    public Builder wideColumnPattern(Pattern p) {
      if (!p.pattern().contains("?<analyte>")) {
        throw new IllegalArgumentException("the wide column pattern needs a group named 'analyte'");
      }
      wideColumnPattern = p;
      return this;
    }

    /**
     * @param p the replicate column pattern
     * @return this builder
     */
    public Builder replicateColumnPattern(Pattern p) {
      replicateColumnPattern = Objects.requireNonNull(p);
      return this;
    }

    /**
     * @param p a pattern of rows to skip
     * @return this builder
     */
    public Builder skip(Pattern p) {
      skipPatterns.add(Objects.requireNonNull(p));
      return this;
    }

    /**
     * @param p the pattern of the row that ends the table
     * @return this builder
     */
    public Builder endPattern(Pattern p) {
      endPattern = Optional.of(p);
      return this;
    }

    /** @return this builder, with no end rule */
    public Builder noEndPattern() {
      endPattern = Optional.empty();
      return this;
    }

    /**
     * @param markers the texts meaning "no value" (replaces the defaults)
     * @return this builder
     */
    public Builder invalidMarkers(Set<String> markers) {
      invalidMarkers = new LinkedHashSet<>(markers);
      return this;
    }

    /**
     * @param flag whether other unreadable text becomes an invalid reading instead of an error
     * @return this builder
     */
    public Builder unreadableTextInvalid(boolean flag) {
      unreadableTextInvalid = flag;
      return this;
    }

    /**
     * @param lines how many leading lines to search for the header (at least 1)
     * @return this builder
     */
    public Builder headerSearchLines(int lines) {
      if (lines < 1) {
        throw new IllegalArgumentException("header search lines must be >= 1");
      }
      headerSearchLines = lines;
      return this;
    }

    /**
     * @param chars the longest line accepted (at least 80)
     * @return this builder
     */
    public Builder maxLineLength(int chars) {
      if (chars < 80) {
        throw new IllegalArgumentException("max line length must be >= 80");
      }
      maxLineLength = chars;
      return this;
    }

    /**
     * @param bytes the largest export accepted (at least 1)
     * @return this builder
     */
    public Builder maxFileBytes(long bytes) {
      if (bytes < 1) {
        throw new IllegalArgumentException("max file bytes must be >= 1");
      }
      maxFileBytes = bytes;
      return this;
    }

    /**
     * @param injections the most injections an export may hold (at least 1)
     * @return this builder
     */
    public Builder maxInjections(int injections) {
      if (injections < 1) {
        throw new IllegalArgumentException("max injections must be >= 1");
      }
      maxInjections = injections;
      return this;
    }

    /**
     * @param lines the most distinct analyte lines an export may hold (at least 1)
     * @return this builder
     */
    public Builder maxAnalyteLines(int lines) {
      if (lines < 1) {
        throw new IllegalArgumentException("max analyte lines must be >= 1");
      }
      maxAnalyteLines = lines;
      return this;
    }

    /**
     * @param field a fixed-width data field, in order
     * @return this builder
     */
    public Builder fixedField(FixedField field) {
      fixedFields.add(Objects.requireNonNull(field));
      return this;
    }

    /**
     * @param p a fixed-width context record pattern with named groups
     * @return this builder
     */
    public Builder contextPattern(Pattern p) {
      contextPatterns.add(Objects.requireNonNull(p));
      return this;
    }

    /**
     * @param p fixed-width data records pattern
     * @return this builder
     */
    public Builder dataRecordPattern(Pattern p) {
      dataRecordPattern = Optional.of(p);
      return this;
    }

    /**
     * @param key option key
     * @param value option value
     * @return this builder
     */
    public Builder option(String key, String value) {
      options.put(Objects.requireNonNull(key), Objects.requireNonNull(value));
      return this;
    }

    /**
     * Adds an export column whose text every injection is to carry (once; a name already asked for,
     * compared as header names are, is not added again).
     *
     * @param name the column's name as the method gives it
     * @return this builder
     * @see ImportSettings#injectionColumns()
     */
    public Builder injectionColumn(String name) {
      if (ColumnNames.normalise(name).isEmpty()) {
        throw new IllegalArgumentException("an injection column needs a name, got '" + name + "'");
      }
      String n = ColumnNames.normalise(name);
      if (injectionColumns.stream().noneMatch(c -> ColumnNames.normalise(c).equals(n))) {
        injectionColumns.add(name.strip());
      }
      return this;
    }

    /** @return the settings */
    public ImportSettings build() {
      return new ImportSettings(this);
    }
  }
}
