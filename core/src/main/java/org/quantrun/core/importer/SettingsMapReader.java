package org.quantrun.core.importer;

import java.nio.charset.Charset;
import java.nio.charset.IllegalCharsetNameException;
import java.nio.charset.UnsupportedCharsetException;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Optional;
import java.util.Set;
import java.util.TreeSet;
import java.util.function.Function;
import java.util.regex.Pattern;
import java.util.regex.PatternSyntaxException;

/** Turns a profile's plain map into {@link ImportSettings}, with messages naming the key. */
final class SettingsMapReader {

  static final Set<String> KEYS = Set.of("importer", "description", "charset", "delimiter", "quote",
      "decimal_separator", "grouping_separator", "layout", "columns", "required_columns",
      "wide_column_pattern", "replicate_column_pattern", "skip_rows", "end_of_table",
      "invalid_markers", "unreadable_text_is_invalid", "header_search_lines", "max_line_length",
      "max_file_bytes", "max_injections", "max_analyte_lines",
      "fields", "context_records", "data_records", "options");

  private final String source;
  private final Function<String, SourcePosition> positions;

  SettingsMapReader(String source, Function<String, SourcePosition> positions) {
    this.source = source;
    this.positions = positions;
  }

  ImportSettings read(Map<String, ?> map) throws ImportException {
    ImportSettings.Builder b = ImportSettings.DEFAULT.toBuilder();
    for (Map.Entry<String, ?> e : map.entrySet()) {
      String key = e.getKey();
      if (!KEYS.contains(key) && !key.startsWith("x_")) {
        throw error(key, "unknown key (expected one of " + String.join(", ", new TreeSet<>(KEYS)) + ")");
      }
    }
    try {
      if (map.containsKey("importer")) {
        b.importer(text(map, "importer"));
      }
      if (map.containsKey("charset")) {
        Optional<Charset> cs = charset(text(map, "charset"));
        if (cs.isPresent()) {
          b.charset(cs.get());
        } else {
          b.detectCharset();
        }
      }
      if (map.containsKey("delimiter")) {
        String d = text(map, "delimiter");
        if (d.equalsIgnoreCase("auto")) {
          b.detectDelimiter();
        } else {
          b.delimiter(oneChar("delimiter", d.equals("\\t") || d.equalsIgnoreCase("tab") ? "\t" : d));
        }
      }
      if (map.containsKey("quote")) {
        b.quote(oneChar("quote", text(map, "quote")));
      }
      if (map.containsKey("decimal_separator")) {
        b.decimalSeparator(oneChar("decimal_separator", text(map, "decimal_separator")));
      }
      if (map.containsKey("grouping_separator")) {
        String g = text(map, "grouping_separator");
        if (g.equalsIgnoreCase("none")) {
          b.noGroupingSeparator();
        } else {
          b.groupingSeparator(oneChar("grouping_separator", g));
        }
      }
      if (map.containsKey("layout")) {
        String l = text(map, "layout").toLowerCase(Locale.ROOT);
        switch (l) {
          case "long" -> b.layout(Layout.LONG);
          case "wide" -> b.layout(Layout.WIDE);
          default -> throw error("layout", "unknown value '" + l + "' (expected: long, wide)");
        }
      }
      if (map.containsKey("columns")) {
        Map<String, ?> cols = map(map, "columns");
        for (Map.Entry<String, ?> c : cols.entrySet()) {
          String k = "columns." + c.getKey();
          if (!ColumnNames.ALL.contains(c.getKey())) {
            throw error(k, "unknown column (expected one of " + String.join(", ", new TreeSet<>(ColumnNames.ALL)) + ")");
          }
          b.alias(c.getKey(), texts(k, c.getValue()));
        }
      }
      if (map.containsKey("required_columns")) {
        List<String> req = texts("required_columns", map.get("required_columns"));
        for (int i = 0; i < req.size(); i++) {
          if (!ColumnNames.ALL.contains(req.get(i))) {
            throw error("required_columns[" + i + "]", "unknown column '" + req.get(i) + "'");
          }
        }
        b.requiredColumns(req);
      }
      if (map.containsKey("wide_column_pattern")) {
        Pattern p = pattern("wide_column_pattern", text(map, "wide_column_pattern"));
        if (!p.pattern().contains("?<analyte>")) {
          throw error("wide_column_pattern", "needs a named group (?<analyte>...)");
        }
        b.wideColumnPattern(p);
      }
      if (map.containsKey("replicate_column_pattern")) {
        b.replicateColumnPattern(pattern("replicate_column_pattern", text(map, "replicate_column_pattern")));
      }
      if (map.containsKey("skip_rows")) {
        List<String> ps = texts("skip_rows", map.get("skip_rows"));
        for (int i = 0; i < ps.size(); i++) {
          b.skip(pattern("skip_rows[" + i + "]", ps.get(i)));
        }
      }
      if (map.containsKey("end_of_table")) {
        b.endPattern(pattern("end_of_table", text(map, "end_of_table")));
      }
      if (map.containsKey("invalid_markers")) {
        b.invalidMarkers(Set.copyOf(texts("invalid_markers", map.get("invalid_markers"))));
      }
      if (map.containsKey("unreadable_text_is_invalid")) {
        b.unreadableTextInvalid(bool(map, "unreadable_text_is_invalid"));
      }
      if (map.containsKey("header_search_lines")) {
        b.headerSearchLines(integer(map, "header_search_lines", 1, 100_000));
      }
      if (map.containsKey("max_line_length")) {
        b.maxLineLength(integer(map, "max_line_length", 80, 64 << 20));
      }
      if (map.containsKey("max_file_bytes")) {
        b.maxFileBytes(integer(map, "max_file_bytes", 1, Integer.MAX_VALUE));
      }
      if (map.containsKey("max_injections")) {
        b.maxInjections(integer(map, "max_injections", 1, 10_000_000));
      }
      if (map.containsKey("max_analyte_lines")) {
        b.maxAnalyteLines(integer(map, "max_analyte_lines", 1, 1_000_000));
      }
      if (map.containsKey("fields")) {
        Object f = map.get("fields");
        if (!(f instanceof List<?> list)) {
          throw error("fields", "expected a list of {name, start, width}");
        }
        for (int i = 0; i < list.size(); i++) {
          String k = "fields[" + i + "]";
          if (!(list.get(i) instanceof Map<?, ?> fm)) {
            throw error(k, "expected {name, start, width}");
          }
          @SuppressWarnings("unchecked")
          Map<String, ?> field = (Map<String, ?>) fm;
          for (String fk : field.keySet()) {
            if (!Set.of("name", "start", "width").contains(fk)) {
              throw error(k + "." + fk, "unknown key (expected: name, start, width)");
            }
          }
          b.fixedField(new FixedField(textAt(k + ".name", field.get("name")),
              intAt(k + ".start", field.get("start"), 1, 100_000),
              intAt(k + ".width", field.get("width"), 1, 100_000)));
        }
      }
      if (map.containsKey("context_records")) {
        List<String> ps = texts("context_records", map.get("context_records"));
        for (int i = 0; i < ps.size(); i++) {
          b.contextPattern(pattern("context_records[" + i + "]", ps.get(i)));
        }
      }
      if (map.containsKey("data_records")) {
        b.dataRecordPattern(pattern("data_records", text(map, "data_records")));
      }
      if (map.containsKey("options")) {
        for (Map.Entry<String, ?> o : map(map, "options").entrySet()) {
          b.option(o.getKey(), textAt("options." + o.getKey(), o.getValue()));
        }
      }
    } catch (IllegalArgumentException e) {
      throw new ImportException(source, SourcePosition.UNKNOWN, e.getMessage());
    }
    return b.build();
  }

  private ImportException error(String key, String problem) {
    return new ImportException(source, positions.apply(key), key + ": " + problem);
  }

  private String text(Map<String, ?> map, String key) throws ImportException {
    return textAt(key, map.get(key));
  }

  private String textAt(String key, Object v) throws ImportException {
    if (v instanceof String s) {
      return s;
    }
    if (v instanceof Number || v instanceof Boolean) {
      return v.toString();
    }
    throw error(key, v == null ? "a value is required" : "expected a text");
  }

  private List<String> texts(String key, Object v) throws ImportException {
    if (v instanceof String s) {
      return List.of(s);
    }
    if (!(v instanceof List<?> list)) {
      throw error(key, "expected a text or a list of texts");
    }
    java.util.ArrayList<String> out = new java.util.ArrayList<>();
    for (int i = 0; i < list.size(); i++) {
      out.add(textAt(key + "[" + i + "]", list.get(i)));
    }
    return out;
  }

  @SuppressWarnings("unchecked")
  private Map<String, ?> map(Map<String, ?> map, String key) throws ImportException {
    if (map.get(key) instanceof Map<?, ?> m) {
      return (Map<String, ?>) m;
    }
    throw error(key, "expected a mapping of keys to values");
  }

  private char oneChar(String key, String s) throws ImportException {
    if (s.length() != 1) {
      throw error(key, "expected exactly one character, got '" + s + "'");
    }
    return s.charAt(0);
  }

  private boolean bool(Map<String, ?> map, String key) throws ImportException {
    if (map.get(key) instanceof Boolean b) {
      return b;
    }
    throw error(key, "expected true or false");
  }

  private int integer(Map<String, ?> map, String key, int min, int max) throws ImportException {
    return intAt(key, map.get(key), min, max);
  }

  private int intAt(String key, Object v, int min, int max) throws ImportException {
    if (v instanceof Integer i && i >= min && i <= max) {
      return i;
    }
    throw error(key, "expected a whole number from " + min + " to " + max + (v == null ? "" : ", got '" + v + "'"));
  }

  private Pattern pattern(String key, String regex) throws ImportException {
    try {
      return Pattern.compile(regex);
    } catch (PatternSyntaxException e) {
      throw error(key, "not a valid regular expression: " + e.getDescription());
    }
  }

  private Optional<Charset> charset(String name) throws ImportException {
    if (name.equalsIgnoreCase("auto")) {
      return Optional.empty();
    }
    try {
      return Optional.of(Charset.forName(name));
    } catch (IllegalCharsetNameException | UnsupportedCharsetException e) {
      throw error("charset", "unknown charset '" + name + "' (e.g. UTF-8, UTF-16, windows-1252, auto)");
    }
  }
}
