package org.quantrun.core.importer;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.HashMap;
import java.util.HashSet;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.Set;
import java.util.TreeMap;
import java.util.TreeSet;
import java.util.regex.Matcher;
import java.util.regex.Pattern;

/**
 * Builds a {@link RawRun} from a table of text cells, whatever the text format: importers feed it
 * metadata, candidate header lines and data rows; it maps header names through the aliases,
 * finds the header by its required columns, reads long or wide layout, groups rows into
 * injections and readings per analyte line, and keeps each item's line and column.
 *
 * <p>Use one instance per read; not thread-safe. Rows belong to the same injection while the
 * injection key stays the same from one row to the next: the sequence number when there is a
 * sequence column; else, when there is a replicate column, the sample id (in wide layout a
 * replicate number that does not rise starts a new injection); else the sample id and time stamp.
 *
 * <p>The columns of {@link ImportSettings#injectionColumns()} that the header has are read once per
 * injection into {@link Injection#columns()}: a blank cell agrees with any value; two rows of one
 * injection with different texts are an import error naming line, column and both values.
 *
 * <p>An importer whose format gives injection fields on lines of their own (context records)
 * declares their names with {@link #contextColumns} and hands each row the fields of the record
 * before it: they are columns of the run ({@link RawRun#columns()}) and are read per injection like
 * header columns, the same name in the header and in a context record being one column that must
 * give one value.
 */
public final class TableRunAssembler {

  /** A header name with a unit in brackets after it: the name, then the unit. */
  private static final Pattern TRAILING_UNIT = Pattern.compile("(.*?\\S)\\s*[(\\[]\\s*([^()\\[\\]]*?)\\s*[)\\]]");
  private static final Pattern DECIMAL_COMMA_LINE = Pattern.compile("\\d+,\\d+");
  private static final Pattern ANALYTE_AND_LINE = Pattern.compile("([A-Z][a-z]?)\\s*[ _-]?\\s*(\\d.*)");
  /** Beside the default wide-column pattern: an isotope written mass first, "111Cd [ug/L]", "208Pb mean". */
  private static final Pattern WIDE_MASS_FIRST = Pattern.compile(
      "(?<line>\\d+)\\s*(?<analyte>[A-Z][a-z]?)(?:\\s*[\\[(](?<unit>[^\\])]+)[\\])])?"
          + "(?:[ _]+(?<stat>(?i:mean|sd|rsd|rep ?\\d+)))?");
  /** An analyte line written mass first, then the element, then anything (a cell mode): "111Cd [He]". */
  private static final Pattern MASS_FIRST = Pattern.compile("(\\d+)\\s*([A-Z][a-z]?)(?=$|[\\s\\[(])\\s*(.*)");

  private final String sourceName;
  private final String importerId;
  private final ImportSettings settings;
  private final ValueReader values;
  private final List<MetadataEntry> metadata = new ArrayList<>();
  private final List<Injection> injections = new ArrayList<>();
  private final Map<String, String> aliasToCanonical = new HashMap<>();
  /** The normalised header names the settings give for canonical columns: they win over built-in ones. */
  private final Set<String> settingsNames = new HashSet<>();
  private final Map<String, AnalyteLine> lineCache = new HashMap<>();
  /** Each unit text once: a large export repeats the same unit in every row. */
  private final Map<String, Optional<String>> units = new HashMap<>();

  private boolean hasHeader;
  private int headerLine;
  private List<String> headerNames = List.of();
  /** The header's cells as compared with a row that may repeat it (stripped, without a byte-order mark). */
  private String[] headerTexts = new String[0];
  private int[] headerColumns = new int[0];
  private final List<Integer> replicateColumns = new ArrayList<>();
  private final List<WideColumn> wideColumns = new ArrayList<>();

  private int bestCandidateLine;
  private int bestCandidateFound = -1;
  private int bestCandidateWidth;
  private String bestCandidateMissing = "";

  private String currentKey;
  private InjectionBuilder current;

  /** The per-injection columns asked for ({@link ImportSettings#injectionColumns()}), as asked and normalised. */
  private final String[] extraNames;
  private final String[] extraNorms;
  /** The cell index of each per-injection column in the header, -1 when the header lacks it. */
  private int[] colExtra = new int[0];
  private boolean anyExtra;
  private final String numberFormat;
  private List<String> exportColumns = List.of();
  /** The names of the fields context records give ({@link #contextColumns}), as declared. */
  private List<String> contextNames = List.of();
  /** Whether a context record may give each per-injection column. */
  private boolean[] ctxExtra;
  /** The context fields of the last row's record, resolved per per-injection column. */
  private Map<String, ContextField> lastContext;
  private ContextField[] lastResolved;
  private String[] lastResolvedNames;

  /**
   * An assembler for one read.
   *
   * @param sourceName the source name for messages and the run
   * @param importerId the id of the importer reading
   * @param settings the import settings
   */
  public TableRunAssembler(String sourceName, String importerId, ImportSettings settings) {
    this.sourceName = sourceName;
    this.importerId = importerId;
    this.settings = settings;
    this.values = new ValueReader(sourceName, settings);
    ColumnNames.DEFAULT_ALIASES.forEach((c, names) -> names.forEach(n -> aliasToCanonical.put(n, c)));
    ColumnNames.ALL.forEach(c -> aliasToCanonical.put(ColumnNames.normalise(c), c));
    settings.columnAliases().forEach((c, names) -> names.forEach(n -> aliasToCanonical.put(ColumnNames.normalise(n), c)));
    settings.columnAliases().values().forEach(names -> names.forEach(n -> settingsNames.add(ColumnNames.normalise(n))));
    extraNames = settings.injectionColumns().toArray(new String[0]);
    extraNorms = new String[extraNames.length];
    ctxExtra = new boolean[extraNames.length];
    for (int k = 0; k < extraNames.length; k++) {
      extraNorms[k] = ColumnNames.normalise(extraNames[k]);
    }
    numberFormat = values.numberFormat();
  }

  private int extraIndex(String norm) {
    for (int k = 0; k < extraNorms.length; k++) {
      if (extraNorms[k].equals(norm)) {
        return k;
      }
    }
    return -1;
  }

  /**
   * Declares the fields the importer's context records can give (their names as the format writes
   * them, such as the named groups of a context record pattern). Each is a column of the run:
   * {@link RawRun#columns()} lists the header's columns, then these (a name the header has, compared
   * as header names are, only once); and a per-injection column of the settings with one of these
   * names is read from the context fields given to
   * {@link #row(List, int, Optional, Optional, Optional, Optional, Map)}. Call before the header.
   *
   * @param names the field names
   * @throws IllegalStateException after the header was found
   */
  public void contextColumns(List<String> names) {
    if (hasHeader) {
      throw new IllegalStateException("context columns after the header");
    }
    List<String> out = new ArrayList<>();
    List<String> norms = new ArrayList<>();
    boolean[] asked = new boolean[extraNames.length];
    for (String n : names) {
      String norm = ColumnNames.normalise(n);
      if (norm.isEmpty() || norms.contains(norm)) {
        continue;
      }
      norms.add(norm);
      out.add(n.strip());
      int k = extraIndex(norm);
      if (k >= 0) {
        asked[k] = true;
      }
    }
    contextNames = List.copyOf(out);
    ctxExtra = asked;
  }

  /**
   * Records one item of run metadata (from a preamble line, say).
   *
   * @param key the key; blank keys are ignored
   * @param value the value
   * @param position where it was read
   */
  public void metadata(String key, String value, SourcePosition position) {
    String k = key.strip();
    if (k.endsWith(":") || k.endsWith("=")) {
      k = k.substring(0, k.length() - 1).strip();
    }
    if (!k.isEmpty()) {
      metadata.add(new MetadataEntry(k, value.strip(), position));
    }
  }

  /**
   * Records a preamble line of cells as metadata: the first non-empty cell is the key, the other
   * non-empty cells joined by a space the value; a single cell {@code key: value} or
   * {@code key=value} is split there.
   *
   * @param cells the cells
   * @param line the 1-based line
   */
  public void metadataLine(List<String> cells, int line) {
    List<String> parts = new ArrayList<>();
    for (String c : cells) {
      if (!c.isBlank()) {
        parts.add(c.strip());
      }
    }
    if (parts.isEmpty()) {
      return;
    }
    if (parts.size() == 1) {
      String p = parts.get(0);
      int at = indexOfSeparator(p);
      if (at > 0) {
        metadata(p.substring(0, at), p.substring(at + 1), SourcePosition.ofLine(line));
      } else {
        metadata(p, "", SourcePosition.ofLine(line));
      }
      return;
    }
    metadata(parts.get(0), String.join(" ", parts.subList(1, parts.size())), SourcePosition.ofLine(line));
  }

  private static int indexOfSeparator(String p) {
    int colon = p.indexOf(':');
    int eq = p.indexOf('=');
    if (colon < 0) {
      return eq;
    }
    return eq < 0 ? colon : Math.min(colon, eq);
  }

  /**
   * Whether the header has been found.
   *
   * @return {@code true} after a successful {@link #tryHeader}
   */
  public boolean hasHeader() {
    return hasHeader;
  }

  /**
   * Tries a line as the header: it is the header when it has every required column.
   *
   * @param names the header texts
   * @param columns the 1-based column of each text (field number or character column)
   * @param line the 1-based line
   * @return {@code true} if this line is the header
   * @throws ImportException if it is the header but two columns give the same field
   */
  public boolean tryHeader(List<String> names, int[] columns, int line) throws ImportException {
    Map<String, Integer> canon = new HashMap<>();
    List<Integer> reps = new ArrayList<>();
    List<WideColumn> wide = new ArrayList<>();
    // by the column of the second cell: the error names the first one in the line
    TreeMap<Integer, String> duplicates = new TreeMap<>();
    Map<String, Integer> wideKeys = new HashMap<>();
    Map<String, List<Integer>> candidates = new LinkedHashMap<>();
    String[] matched = new String[names.size()];
    Map<Integer, String> bracketUnits = new HashMap<>();
    int[] extra = new int[extraNames.length];
    Arrays.fill(extra, -1);
    List<String> present = new ArrayList<>(names.size());
    int known = 0;
    for (int i = 0; i < names.size(); i++) {
      String raw = names.get(i).replace("\uFEFF", "").strip();
      String norm = ColumnNames.normalise(raw);
      if (norm.isEmpty()) {
        continue;
      }
      present.add(raw);
      int x = extraIndex(norm);
      if (x >= 0) {
        if (extra[x] >= 0) {
          duplicates.putIfAbsent(columns[i], duplicateText(names, columns, extra[x], i, "column '" + extraNames[x] + "'"));
        } else {
          extra[x] = i;
        }
      }
      String c = aliasToCanonical.get(norm);
      matched[i] = norm;
      if (c == null) {
        // a name with its unit after it in brackets: "Intensity (cps)", "Signal [counts]"
        Matcher u = TRAILING_UNIT.matcher(raw);
        if (u.matches()) {
          String base = ColumnNames.normalise(u.group(1));
          c = aliasToCanonical.get(base);
          if (c != null) {
            matched[i] = base;
            bracketUnits.put(i, u.group(2));
          }
        }
      }
      if (c != null && (settings.layout() == Layout.LONG || isKeyField(c))) {
        known++;
        candidates.computeIfAbsent(c, k -> new ArrayList<>()).add(i);
        continue;
      }
      if (x >= 0) {
        // a column the method reads per injection is neither a replicate nor an analyte column
        continue;
      }
      if (settings.layout() == Layout.LONG) {
        if (settings.replicateColumnPattern().matcher(raw).matches()) {
          reps.add(i);
          known++;
        }
      } else {
        Matcher m = settings.wideColumnPattern().matcher(raw);
        if (!m.matches() && settings.wideColumnPattern() == ImportSettings.DEFAULT_WIDE_PATTERN) {
          m = WIDE_MASS_FIRST.matcher(raw);
        }
        if (m.matches()) {
          WideColumn w = wideColumn(m, i);
          known++;
          String key = w.analyteLine().label() + "|" + w.statText();
          Integer before = wideKeys.putIfAbsent(key, i);
          if (before != null) {
            duplicates.putIfAbsent(columns[i], duplicateText(names, columns, before, i, w.analyteLine().label()));
          }
          wide.add(w);
        }
      }
    }
    candidates.forEach((field, cells) -> choose(field, cells, names, matched, columns, canon, duplicates));
    List<String> missing = missing(canon, reps, wide);
    if (!missing.isEmpty()) {
      int found = known;
      if (found > bestCandidateFound && known >= 2) {
        bestCandidateFound = found;
        bestCandidateLine = line;
        bestCandidateWidth = columns.length == 0 ? 0 : columns[columns.length - 1] + 1;
        bestCandidateMissing = String.join(", ", missing);
      }
      return false;
    }
    if (!duplicates.isEmpty()) {
      Map.Entry<Integer, String> first = duplicates.firstEntry();
      throw new ImportException(sourceName, new SourcePosition(line, first.getKey()), first.getValue());
    }
    if (wide.stream().map(WideColumn::analyteLine).distinct().count() > settings.maxAnalyteLines()) {
      throw tooManyLines(line, 1);
    }
    hasHeader = true;
    colSample = index(canon, ColumnNames.SAMPLE_ID);
    colSeq = index(canon, ColumnNames.SEQUENCE);
    colType = index(canon, ColumnNames.SAMPLE_TYPE);
    colTime = index(canon, ColumnNames.TIMESTAMP);
    colUnit = index(canon, ColumnNames.UNIT);
    // without a unit column, the unit a reading (or mean) column gives in brackets after its name
    headerUnit = "";
    for (String f : List.of(ColumnNames.READING, ColumnNames.MEAN)) {
      Integer at = canon.get(f);
      if (headerUnit.isEmpty() && at != null) {
        headerUnit = bracketUnits.getOrDefault(at, "");
      }
    }
    colRemark = index(canon, ColumnNames.REMARK);
    colRep = index(canon, ColumnNames.REPLICATE);
    colAnalyte = index(canon, ColumnNames.ANALYTE);
    colLine = index(canon, ColumnNames.LINE);
    colAnalyteLine = index(canon, ColumnNames.ANALYTE_LINE);
    colReading = index(canon, ColumnNames.READING);
    colMean = index(canon, ColumnNames.MEAN);
    colSd = index(canon, ColumnNames.SD);
    replicateIndexes = reps.stream().mapToInt(Integer::intValue).toArray();
    colExtra = extra;
    for (int x : extra) {
      anyExtra |= x >= 0;
    }
    for (boolean c : ctxExtra) {
      anyExtra |= c;
    }
    exportColumns = List.copyOf(withContextNames(present));
    headerLine = line;
    headerNames = List.copyOf(names);
    headerTexts = names.stream().map(n -> n == null ? "" : n.replace("\uFEFF", "").strip()).toArray(String[]::new);
    headerColumns = columns.clone();
    replicateColumns.addAll(reps);
    wideColumns.addAll(wide);
    return true;
  }

  private List<String> withContextNames(List<String> present) {
    if (contextNames.isEmpty()) {
      return present;
    }
    List<String> out = new ArrayList<>(present);
    List<String> norms = new ArrayList<>();
    present.forEach(p -> norms.add(ColumnNames.normalise(p)));
    for (String c : contextNames) {
      if (!norms.contains(ColumnNames.normalise(c))) {
        out.add(c);
      }
    }
    return out;
  }

  private int colSample = -1;
  private int colSeq = -1;
  private int colType = -1;
  private int colTime = -1;
  private int colUnit = -1;
  /** The unit in brackets after the reading column's name, for an export without a unit column. */
  private String headerUnit = "";
  private int colRemark = -1;
  private int colRep = -1;
  private int colAnalyte = -1;
  private int colLine = -1;
  private int colAnalyteLine = -1;
  private int colReading = -1;
  private int colMean = -1;
  private int colSd = -1;
  private int[] replicateIndexes = new int[0];
  private String lastAnalyte = "";
  private String lastLineText = "";
  private AnalyteLine lastAnalyteLine;

  private static int index(Map<String, Integer> canon, String name) {
    Integer i = canon.get(name);
    return i == null ? -1 : i;
  }

  private static String duplicateText(List<String> names, int[] columns, int first, int second, String field) {
    return "duplicate header: columns " + columns[first] + " (\"" + names.get(first).strip() + "\") and "
        + columns[second] + " (\"" + names.get(second).strip() + "\") both give " + field;
  }

  /**
   * Chooses the header cell of a field among those whose names map to it: a name the settings give
   * ({@link ImportSettings#columnAliases()}) before a built-in one; the others are then plain
   * columns. Two cells of the same standing are a duplicate header.
   */
  private void choose(String field, List<Integer> cells, List<String> names, String[] matched, int[] columns,
      Map<String, Integer> canon, Map<Integer, String> duplicates) {
    List<Integer> best = cells.stream().filter(i -> settingsNames.contains(matched[i])).toList();
    if (best.isEmpty()) {
      best = cells;
    }
    canon.put(field, best.get(0));
    if (best.size() > 1) {
      int second = best.get(1);
      duplicates.putIfAbsent(columns[second], duplicateText(names, columns, best.get(0), second, field)
          + " (the import profile's columns." + field + " can name the one to read)");
    }
  }

  private static boolean isKeyField(String c) {
    return c.equals(ColumnNames.SEQUENCE) || c.equals(ColumnNames.SAMPLE_ID) || c.equals(ColumnNames.SAMPLE_TYPE)
        || c.equals(ColumnNames.TIMESTAMP) || c.equals(ColumnNames.REMARK) || c.equals(ColumnNames.UNIT)
        || c.equals(ColumnNames.REPLICATE);
  }

  private WideColumn wideColumn(Matcher m, int index) {
    String analyte = m.group("analyte");
    String line = group(m, "line");
    String unit = group(m, "unit");
    String stat = group(m, "stat").toLowerCase(java.util.Locale.ROOT);
    Stat s;
    if (stat.equals("mean") || stat.equals("avg") || stat.equals("average")) {
      s = Stat.MEAN;
    } else if (stat.equals("sd") || stat.equals("stdev")) {
      s = Stat.SD;
    } else if (stat.equals("rsd")) {
      s = Stat.IGNORED;
    } else {
      s = Stat.REPLICATE;
    }
    return new WideColumn(index, analyteLine(analyte, line), unit.isEmpty() ? Optional.empty() : Optional.of(unit), s,
        stat.isEmpty() ? "" : stat.replace(" ", ""));
  }

  private static String group(Matcher m, String name) {
    try {
      String g = m.group(name);
      return g == null ? "" : g.strip();
    } catch (IllegalArgumentException e) {
      return "";
    }
  }

  private List<String> missing(Map<String, Integer> canon, List<Integer> reps, List<WideColumn> wide) {
    List<String> required = settings.requiredColumns();
    if (required.isEmpty()) {
      required = settings.layout() == Layout.LONG
          ? List.of(ColumnNames.SAMPLE_ID, ColumnNames.ANALYTE, ColumnNames.READING)
          : List.of(ColumnNames.SAMPLE_ID);
    }
    List<String> out = new ArrayList<>();
    for (String r : required) {
      boolean ok = switch (r) {
        case ColumnNames.ANALYTE -> canon.containsKey(ColumnNames.ANALYTE) || canon.containsKey(ColumnNames.ANALYTE_LINE);
        case ColumnNames.READING -> canon.containsKey(ColumnNames.READING) || canon.containsKey(ColumnNames.MEAN) || !reps.isEmpty();
        default -> canon.containsKey(r);
      };
      if (!ok) {
        out.add(r + " (e.g. " + aliasesText(r) + ")");
      }
    }
    if (settings.layout() == Layout.WIDE && wide.isEmpty()) {
      out.add("an analyte column matching " + settings.wideColumnPattern().pattern());
    }
    return out;
  }

  private String aliasesText(String canonical) {
    TreeSet<String> names = new TreeSet<>(ColumnNames.DEFAULT_ALIASES.getOrDefault(canonical, List.of()));
    names.addAll(settings.columnAliases().getOrDefault(canonical, List.of()));
    if (canonical.equals(ColumnNames.ANALYTE)) {
      names.addAll(ColumnNames.DEFAULT_ALIASES.get(ColumnNames.ANALYTE_LINE));
    }
    return String.join(", ", names.stream().map(n -> "'" + n + "'").toList());
  }

  /**
   * The import error for a source whose header was never found: it names the line that came
   * closest and the columns it lacks.
   *
   * @return the error
   */
  public ImportException noHeaderError() {
    if (bestCandidateFound >= 0) {
      return new ImportException(sourceName, new SourcePosition(bestCandidateLine, Math.max(1, bestCandidateWidth)),
          "header has no column for " + bestCandidateMissing);
    }
    return new ImportException(sourceName, SourcePosition.UNKNOWN,
        "no header line with the required columns found (searched up to " + settings.headerSearchLines()
            + " lines; needs " + String.join("; ", missing(Map.of(), List.of(), List.of())) + ")");
  }

  /**
   * The 1-based column a cell index stands for (header column, or counted on past it).
   *
   * @param index the 0-based cell index
   * @return the column
   */
  private int column(int index) {
    return index < headerColumns.length ? headerColumns[index] : index + 1;
  }

  private static String cell(List<String> cells, int index) {
    if (index < 0 || index >= cells.size()) {
      return "";
    }
    String c = cells.get(index);
    return c == null ? "" : c;
  }

  private String name(int index) {
    return index < headerNames.size() ? headerNames.get(index).strip() : "column " + (index + 1);
  }

  /**
   * Adds one data row (after the header). Rows whose cells are all blank are ignored.
   *
   * @param cells the cells, in header order (missing trailing cells count as empty)
   * @param line the 1-based line
   * @throws ImportException for a bad row, naming line and column
   */
  public void row(List<String> cells, int line) throws ImportException {
    row(cells, line, Optional.empty(), Optional.empty(), Optional.empty(), Optional.empty());
  }

  /**
   * Adds one data row whose injection fields may come from context (e.g. a fixed-width report's
   * injection header line) rather than from cells.
   *
   * @param cells the cells, in header order
   * @param line the 1-based line
   * @param contextSequence the sequence text from context, if any
   * @param contextSampleId the sample id from context, if any
   * @param contextType the sample type from context, if any
   * @param contextTimestamp the time stamp from context, if any
   * @throws ImportException for a bad row, naming line and column
   */
  public void row(List<String> cells, int line, Optional<String> contextSequence, Optional<String> contextSampleId,
      Optional<String> contextType, Optional<String> contextTimestamp) throws ImportException {
    row(cells, line, contextSequence, contextSampleId, contextType, contextTimestamp, Map.of());
  }

  /**
   * Adds one data row whose injection fields may come from context, with the fields of its context
   * record by name (the names {@link #contextColumns} declared; a name it did not declare is not
   * read). A field named as a per-injection column of the settings gives that column's text for
   * the row's injection, as a cell would: a blank field agrees with any value, and a text that
   * differs from the one a header cell or another context record gave for the injection is an
   * import error naming line, column and both values. Pass the same map for the rows of one
   * record.
   *
   * @param cells the cells, in header order
   * @param line the 1-based line
   * @param contextSequence the sequence text from context, if any
   * @param contextSampleId the sample id from context, if any
   * @param contextType the sample type from context, if any
   * @param contextTimestamp the time stamp from context, if any
   * @param contextFields the fields of the row's context record by name; empty for none
   * @throws ImportException for a bad row, naming line and column
   */
  public void row(List<String> cells, int line, Optional<String> contextSequence, Optional<String> contextSampleId,
      Optional<String> contextType, Optional<String> contextTimestamp, Map<String, ContextField> contextFields)
      throws ImportException {
    if (!hasHeader) {
      throw new IllegalStateException("row before header");
    }
    boolean blank = true;
    for (String c : cells) {
      if (c != null && !c.isBlank()) {
        blank = false;
        break;
      }
    }
    if (blank || repeatsHeader(cells)) {
      return;
    }
    String sampleId = colSample >= 0 ? cell(cells, colSample).strip() : contextSampleId.orElse("").strip();
    if (sampleId.isEmpty()) {
      throw new ImportException(sourceName, new SourcePosition(line, colSample < 0 ? 0 : column(colSample)),
          "sample id is empty");
    }
    Optional<String> seqText = colSeq >= 0 ? nonBlank(cell(cells, colSeq)) : contextSequence.map(String::strip);
    String timestamp = colTime >= 0 ? cell(cells, colTime).strip() : contextTimestamp.orElse("").strip();
    String key;
    boolean restart = false;
    if (seqText.isPresent()) {
      key = seqText.get();
    } else if (colRep >= 0) {
      // a row per replicate: the time stamp changes from replicate to replicate; a replicate
      // number that does not rise starts a new injection of the same sample
      key = sampleId;
      if (settings.layout() == Layout.WIDE) {
        int rep = replicateNumber(cell(cells, colRep), line, column(colRep));
        restart = rep <= lastReplicate;
        lastReplicate = rep;
      }
    } else {
      key = timestamp.isEmpty() ? sampleId : sampleId + '\u0001' + timestamp;
    }
    if (current == null || restart || !key.equals(currentKey)) {
      closeInjection();
      if (injections.size() >= settings.maxInjections()) {
        throw new ImportException(sourceName, SourcePosition.ofLine(line), "the export has more than "
            + settings.maxInjections() + " injections (max_injections in the import profile)");
      }
      int sequence = injections.size() + 1;
      if (seqText.isPresent()) {
        sequence = sequence(seqText.get(), line, colSeq < 0 ? 0 : column(colSeq));
      }
      String type = colType >= 0 ? cell(cells, colType).strip() : contextType.orElse("").strip();
      current = new InjectionBuilder(sequence, sampleId, nonBlank(type), nonBlank(timestamp), SourcePosition.ofLine(line));
      currentKey = key;
      if (anyExtra) {
        current.extras = new String[colExtra.length];
        current.extraPositions = new SourcePosition[colExtra.length];
        current.extraFromContext = new boolean[colExtra.length];
        current.blankContext = new SourcePosition[colExtra.length];
      }
    }
    if (anyExtra) {
      contextCells(contextFields);
      extraCells(cells, line);
    }
    String rowUnit = colUnit >= 0 ? cell(cells, colUnit) : headerUnit;
    String remark = colRemark >= 0 ? cell(cells, colRemark) : "";
    if (settings.layout() == Layout.LONG) {
      longRow(cells, line, rowUnit, remark);
    } else {
      wideRow(cells, line, rowUnit, remark);
    }
  }

  /**
   * Whether a row is the header again, as exports printed page by page repeat it: every cell the
   * header's text (spaces around ignored), a cell past the header blank.
   */
  private boolean repeatsHeader(List<String> cells) {
    int probe = colSample >= 0 ? colSample : 0;
    if (probe >= headerTexts.length || !cell(cells, probe).strip().equals(headerTexts[probe])) {
      return false;
    }
    for (int i = 0; i < Math.max(cells.size(), headerTexts.length); i++) {
      String c = cell(cells, i).strip();
      if (!c.equals(i < headerTexts.length ? headerTexts[i] : "")) {
        return false;
      }
    }
    return true;
  }

  /** Takes the per-injection columns' text from a row: once per injection, the same on every row that gives it. */
  private void extraCells(List<String> cells, int line) throws ImportException {
    for (int k = 0; k < colExtra.length; k++) {
      int at = colExtra[k];
      if (at < 0) {
        continue;
      }
      String text = cell(cells, at).strip();
      if (!text.isEmpty()) {
        take(k, text, new SourcePosition(line, column(at)), name(at), false);
      }
    }
  }

  /** Takes the per-injection columns' text from the fields of a row's context record. */
  private void contextCells(Map<String, ContextField> fields) throws ImportException {
    if (fields.isEmpty()) {
      return;
    }
    if (fields != lastContext) {
      ContextField[] resolved = new ContextField[extraNames.length];
      String[] names = new String[extraNames.length];
      for (Map.Entry<String, ContextField> e : fields.entrySet()) {
        int k = extraIndex(ColumnNames.normalise(e.getKey()));
        if (k >= 0 && ctxExtra[k] && resolved[k] == null) {
          resolved[k] = e.getValue();
          names[k] = e.getKey().strip();
        }
      }
      lastContext = fields;
      lastResolved = resolved;
      lastResolvedNames = names;
    }
    for (int k = 0; k < lastResolved.length; k++) {
      ContextField f = lastResolved[k];
      if (f == null) {
        continue;
      }
      String text = f.text().strip();
      if (!text.isEmpty()) {
        take(k, text, f.position(), lastResolvedNames[k], true);
      } else if (current.blankContext[k] == null) {
        current.blankContext[k] = f.position();
      }
    }
  }

  /** Records the text of per-injection column k for the current injection, refusing a second, different text. */
  private void take(int k, String text, SourcePosition at, String name, boolean fromContext) throws ImportException {
    String before = current.extras[k];
    if (before == null) {
      current.extras[k] = text;
      current.extraPositions[k] = at;
      current.extraFromContext[k] = fromContext;
    } else if (!before.equals(text)) {
      String here = fromContext ? "\" in the context record here but " : "\" here but ";
      String earlier = current.extraFromContext[k]
          ? "the context record on line " + current.extraPositions[k].line() + " gives \"" + before + "\""
          : "\"" + before + "\" on line " + current.extraPositions[k].line();
      throw new ImportException(sourceName, at, "column '" + name + "' of injection " + current.sequence + " '"
          + current.sampleId + "' is \"" + text + here + earlier
          + " (a column read per injection must give one value for the whole injection)");
    }
  }

  private void longRow(List<String> cells, int line, String unit, String remark) throws ImportException {
    AnalyteLine al;
    int alCol = colAnalyte >= 0 ? colAnalyte : colAnalyteLine;
    if (colAnalyte >= 0) {
      String analyte = cell(cells, colAnalyte).strip();
      if (analyte.isEmpty()) {
        throw new ImportException(sourceName, new SourcePosition(line, column(colAnalyte)), "analyte is empty");
      }
      al = analyteLine(analyte, colLine < 0 ? "" : cell(cells, colLine).strip());
    } else {
      String text = cell(cells, colAnalyteLine).strip();
      if (text.isEmpty()) {
        throw new ImportException(sourceName, new SourcePosition(line, column(colAnalyteLine)), "analyte line is empty");
      }
      Matcher m = ANALYTE_AND_LINE.matcher(text);
      if (m.matches()) {
        al = analyteLine(m.group(1), m.group(2));
      } else {
        // ICP-MS labels write the mass first: "111Cd", "208Pb (He)"
        Matcher mass = MASS_FIRST.matcher(text);
        al = mass.matches() ? analyteLine(mass.group(2), (mass.group(1) + " " + mass.group(3)).strip()) : analyteLine(text, "");
      }
    }
    if (lineCache.size() > settings.maxAnalyteLines()) {
      throw tooManyLines(line, column(alCol));
    }
    LineBuilder lb = current.line(al, line, column(alCol));
    for (int r : replicateIndexes) {
      lb.replicates.add(values.read(cell(cells, r), name(r), line, column(r)));
    }
    if (colReading >= 0) {
      if (colRep >= 0) {
        replicateOnce(lb, cell(cells, colRep).strip(), line);
      }
      lb.replicates.add(values.read(cell(cells, colReading), name(colReading), line, column(colReading)));
    }
    if (colMean >= 0 && lb.mean.isEmpty() && !cell(cells, colMean).isBlank()) {
      lb.mean = Optional.of(values.read(cell(cells, colMean), name(colMean), line, column(colMean)));
    }
    if (colSd >= 0 && lb.sd.isEmpty() && !cell(cells, colSd).isBlank()) {
      lb.sd = Optional.of(values.read(cell(cells, colSd), name(colSd), line, column(colSd)));
    }
    lb.add(unit, remark, units);
  }

  /**
   * Refuses a replicate number given twice for one analyte line of an injection (a row exported
   * twice would count its reading twice in the mean).
   */
  private void replicateOnce(LineBuilder lb, String rep, int line) throws ImportException {
    if (rep.isEmpty()) {
      return;
    }
    if (lb.repLines == null) {
      lb.repLines = new HashMap<>(8);
    }
    Integer before = lb.repLines.putIfAbsent(rep, line);
    if (before != null) {
      throw new ImportException(sourceName, new SourcePosition(line, column(colRep)), "replicate " + rep + " of "
          + lb.analyteLine.label() + " is given twice for injection " + current.sequence + " '" + current.sampleId
          + "' (lines " + before + " and " + line + ")"
          + (colSeq < 0 ? "; without a sequence column, the rows of one sample up to the next sample are one injection" : ""));
    }
  }

  private void wideRow(List<String> cells, int line, String unit, String remark) throws ImportException {
    for (WideColumn w : wideColumns) {
      String text = cell(cells, w.index());
      LineBuilder lb = current.line(w.analyteLine(), line, column(w.index()));
      switch (w.stat()) {
        case REPLICATE -> lb.replicates.add(values.read(text, name(w.index()), line, column(w.index())));
        case MEAN -> {
          if (lb.mean.isEmpty() && !text.isBlank()) {
            lb.mean = Optional.of(values.read(text, name(w.index()), line, column(w.index())));
          }
        }
        case SD -> {
          if (lb.sd.isEmpty() && !text.isBlank()) {
            lb.sd = Optional.of(values.read(text, name(w.index()), line, column(w.index())));
          }
        }
        case IGNORED -> { }
        default -> throw new IllegalStateException();
      }
      lb.add(w.unit().isPresent() ? w.unit().get() : unit, remark, units);
    }
  }

  private int lastReplicate = Integer.MAX_VALUE;

  private int replicateNumber(String text, int line, int column) throws ImportException {
    String t = text.strip();
    if (t.isEmpty()) {
      return lastReplicate == Integer.MAX_VALUE ? 1 : lastReplicate + 1;
    }
    try {
      return Integer.parseInt(t);
    } catch (NumberFormatException e) {
      throw new ImportException(sourceName, new SourcePosition(line, column),
          "replicate \"" + t + "\" is not a whole number");
    }
  }

  private int sequence(String text, int line, int column) throws ImportException {
    try {
      int s = Integer.parseInt(text.strip());
      if (s >= 1) {
        return s;
      }
    } catch (NumberFormatException e) {
      // reported below
    }
    throw new ImportException(sourceName, new SourcePosition(line, column),
        "sequence \"" + text.strip() + "\" is not a whole number >= 1");
  }

  private ImportException tooManyLines(int line, int column) {
    return new ImportException(sourceName, new SourcePosition(line, column), "the export has more than "
        + settings.maxAnalyteLines() + " analyte lines (max_analyte_lines in the import profile)");
  }

  private AnalyteLine analyteLine(String analyte, String line) {
    if (lastAnalyteLine != null && analyte.equals(lastAnalyte) && line.equals(lastLineText)) {
      return lastAnalyteLine;
    }
    lastAnalyte = analyte;
    lastLineText = line;
    lastAnalyteLine = analyteLine0(analyte, line);
    return lastAnalyteLine;
  }

  private AnalyteLine analyteLine0(String analyte, String line) {
    String k = analyte + '\u0001' + line;
    AnalyteLine al = lineCache.get(k);
    if (al == null) {
      // a wavelength written with the export's decimal comma is the line a method writes with a point
      String l = settings.decimalSeparator() == ',' && DECIMAL_COMMA_LINE.matcher(line.strip()).matches()
          ? line.strip().replace(',', '.') : line;
      al = AnalyteLine.of(analyte, l);
      lineCache.put(k, al);
    }
    return al;
  }

  private static Optional<String> nonBlank(String s) {
    String t = s.strip();
    return t.isEmpty() ? Optional.empty() : Optional.of(t);
  }

  private void closeInjection() {
    if (current != null) {
      injections.add(current.build(extraColumns()));
      current = null;
    }
  }

  /** The current injection's per-injection columns, by the name as asked. */
  private Map<String, CellText> extraColumns() {
    if (!anyExtra) {
      return Map.of();
    }
    Map<String, CellText> out = new LinkedHashMap<>();
    for (int k = 0; k < colExtra.length; k++) {
      if (colExtra[k] < 0 && !ctxExtra[k]) {
        continue;
      }
      String text = current.extras[k] == null ? "" : current.extras[k];
      SourcePosition at;
      if (current.extraPositions[k] != null) {
        at = current.extraPositions[k];
      } else if (colExtra[k] >= 0) {
        at = new SourcePosition(current.position.line(), column(colExtra[k]));
      } else if (current.blankContext[k] != null) {
        at = current.blankContext[k];
      } else {
        at = SourcePosition.ofLine(current.position.line());
      }
      out.put(extraNames[k], new CellText(text, values.number(text), numberFormat, at));
    }
    return out;
  }

  /**
   * The run read so far, once every row is in.
   *
   * @return the run
   * @throws ImportException if no header was found or there were no data rows
   */
  public RawRun finish() throws ImportException {
    if (!hasHeader) {
      throw noHeaderError();
    }
    closeInjection();
    if (injections.isEmpty()) {
      throw new ImportException(sourceName, SourcePosition.ofLine(headerLine), "the header has no data rows after it");
    }
    return new RawRun(sourceName, importerId, metadata, injections, exportColumns);
  }

  private enum Stat { REPLICATE, MEAN, SD, IGNORED }

  private record WideColumn(int index, AnalyteLine analyteLine, Optional<String> unit, Stat stat, String statText) {}

  private static final class InjectionBuilder {
    final int sequence;
    final String sampleId;
    final Optional<String> type;
    final Optional<String> timestamp;
    final SourcePosition position;
    final Map<AnalyteLine, LineBuilder> lines = new LinkedHashMap<>();
    /** The text and position of each per-injection column, null until a row gives it. */
    String[] extras;
    SourcePosition[] extraPositions;
    /** Whether each text came from a context record; where a context record left each blank. */
    boolean[] extraFromContext;
    SourcePosition[] blankContext;

    InjectionBuilder(int sequence, String sampleId, Optional<String> type, Optional<String> timestamp,
        SourcePosition position) {
      this.sequence = sequence;
      this.sampleId = sampleId;
      this.type = type;
      this.timestamp = timestamp;
      this.position = position;
    }

    LineBuilder last;

    LineBuilder line(AnalyteLine al, int line, int column) {
      if (last != null && last.analyteLine == al) {
        return last;
      }
      last = lookup(al, line, column);
      return last;
    }

    private LineBuilder lookup(AnalyteLine al, int line, int column) {
      LineBuilder lb = lines.get(al);
      if (lb == null) {
        lb = new LineBuilder(al, new SourcePosition(line, column));
        lines.put(al, lb);
      }
      return lb;
    }

    Injection build(Map<String, CellText> columns) {
      List<LineReadings> out = new ArrayList<>(lines.size());
      for (LineBuilder lb : lines.values()) {
        out.add(lb.build());
      }
      return new Injection(sequence, sampleId, type, timestamp, out, position, columns);
    }
  }

  private static final class LineBuilder {
    final AnalyteLine analyteLine;
    final SourcePosition position;
    final List<Reading> replicates = new ArrayList<>(4);
    Optional<Reading> mean = Optional.empty();
    Optional<Reading> sd = Optional.empty();
    Optional<String> unit = Optional.empty();
    List<String> remarks = List.of();
    /** The line of each replicate number the rows gave, as written; null until a row gives one. */
    Map<String, Integer> repLines;

    LineBuilder(AnalyteLine analyteLine, SourcePosition position) {
      this.analyteLine = analyteLine;
      this.position = position;
    }

    void add(String u, String remark, Map<String, Optional<String>> units) {
      if (unit.isEmpty() && !u.isBlank()) {
        unit = units.computeIfAbsent(u.strip(), Optional::of);
      }
      if (!remark.isBlank()) {
        String r = remark.strip();
        if (!remarks.contains(r)) {
          List<String> all = new ArrayList<>(remarks);
          all.add(r);
          remarks = all;
        }
      }
    }

    LineReadings build() {
      Optional<String> remark = remarks.isEmpty() ? Optional.empty() : Optional.of(String.join("; ", remarks));
      return new LineReadings(analyteLine, unit, replicates, mean, sd, remark, position);
    }
  }
}
