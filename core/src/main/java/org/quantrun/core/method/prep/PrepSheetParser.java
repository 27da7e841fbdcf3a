package org.quantrun.core.method.prep;

import java.io.IOException;
import java.io.StringReader;
import java.io.UncheckedIOException;
import java.util.ArrayList;
import java.util.HashMap;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import org.apache.commons.csv.CSVFormat;
import org.apache.commons.csv.CSVParser;
import org.apache.commons.csv.CSVRecord;
import org.quantrun.core.method.MethodException;
import org.quantrun.core.method.MethodProblem;
import org.quantrun.core.method.PrepSheetLayout;

/**
 * Reads a prep sheet (comma-separated, first line the column headings) by the column names of a
 * method's {@link PrepSheetLayout}. Every problem is collected and thrown together; each names
 * the file, the line, the column number (1-based position of the field in its row) and the
 * column heading. Columns the layout does not name are ignored.
 */
public final class PrepSheetParser {

  private static final CSVFormat FORMAT = CSVFormat.DEFAULT.builder()
      .setTrim(true)
      .setIgnoreEmptyLines(true)
      .get();

  /** A plain decimal number: no hexadecimal, no NaN or Infinity, no type suffix. */
  private static final java.util.regex.Pattern PLAIN_NUMBER = java.util.regex.Pattern.compile("[-+]?(\\d+\\.?\\d*|\\.\\d+)([eE][-+]?\\d+)?");

  /** The largest prep sheet accepted, in characters (4 MiB; a sheet of 1,000 samples is about 60 KB). */
  public static final int MAX_CHARACTERS = 4 << 20;

  private PrepSheetParser() {}

  /**
   * Parses a prep sheet.
   *
   * @param text the whole CSV text
   * @param sourceName the file name to show in messages
   * @param layout the method's prep-sheet layout
   * @return the sheet
   * @throws MethodException listing every problem, when the sheet cannot be used
   */
  public static PrepSheet parse(String text, String sourceName, PrepSheetLayout layout) throws MethodException {
    if (text.length() > MAX_CHARACTERS) {
      throw new MethodException(List.of(new MethodProblem(sourceName, 0, 0, "", "the prep sheet is larger than "
          + MAX_CHARACTERS / (1 << 20) + " MiB and is refused", Optional.of("a prep sheet of at most " + MAX_CHARACTERS + " characters"))));
    }
    List<MethodProblem> problems = new ArrayList<>();
    List<PrepSheetRow> rows = new ArrayList<>();
    String body = text.startsWith("\uFEFF") ? text.substring(1) : text;
    try (CSVParser parser = CSVParser.parse(new StringReader(body), FORMAT)) {
      Map<String, Integer> header = null;
      int width = 0;
      Map<String, Integer> seen = new HashMap<>();
      long linesBefore = 0;
      for (CSVRecord record : parser) {
        int line = (int) linesBefore + 1;
        linesBefore = parser.getCurrentLineNumber();
        if (header == null) {
          header = header(record, line, sourceName, layout, problems);
          width = record.size();
          if (header == null) {
            break;
          }
          continue;
        }
        new RowReader(sourceName, line, record, header, width, problems).read(layout, seen).ifPresent(rows::add);
      }
      if (header == null && problems.isEmpty()) {
        problems.add(new MethodProblem(sourceName, 0, 0, "", "the prep sheet is empty", Optional.of("a heading line and one row per sample")));
      }
    } catch (IOException e) {
      throw new UncheckedIOException(e);
    } catch (IllegalStateException | UncheckedIOException e) {
      problems.add(new MethodProblem(sourceName, 0, 0, "", "the prep sheet is not valid CSV: " + e.getMessage(), Optional.of("comma-separated values")));
    }
    if (!problems.isEmpty()) {
      throw new MethodException(problems);
    }
    return new PrepSheet(sourceName, rows);
  }

  private static Map<String, Integer> header(CSVRecord record, int line, String source, PrepSheetLayout layout, List<MethodProblem> problems) {
    Map<String, Integer> index = new LinkedHashMap<>();
    for (int i = 0; i < record.size(); i++) {
      String h = record.get(i);
      if (index.containsKey(h) && !h.isEmpty()) {
        problems.add(new MethodProblem(source, line, i + 1, h, "heading appears twice", Optional.of("each heading once")));
      }
      index.putIfAbsent(h, i);
    }
    List<String> wanted = new ArrayList<>(List.of(layout.sampleIdColumn(), layout.prepBatchColumn(), layout.dilutionFactorColumn(),
        layout.sampleMassColumn(), layout.finalVolumeColumn()));
    layout.solidsFractionColumn().ifPresent(wanted::add);
    for (String w : wanted) {
      if (!index.containsKey(w)) {
        problems.add(new MethodProblem(source, line, 1, w, "column is missing from the heading line",
            Optional.of("the headings the method names: " + String.join(", ", wanted))));
      }
    }
    return problems.isEmpty() ? index : null;
  }

  /** Reads the fields of one row. */
  /** Reads one row; {@code width} is the number of fields of the heading line (empty headings may repeat). */
  private record RowReader(String source, int line, CSVRecord record, Map<String, Integer> header, int width,
      List<MethodProblem> problems) {

    Optional<PrepSheetRow> read(PrepSheetLayout layout, Map<String, Integer> seen) {
      int before = problems.size();
      if (record.size() != width) {
        problems.add(new MethodProblem(source, line, 1, "", "row has " + record.size() + " fields but the heading line has " + width,
            Optional.of(width + " fields")));
        return Optional.empty();
      }
      String id = text(layout.sampleIdColumn());
      String batch = text(layout.prepBatchColumn());
      double df = number(layout.dilutionFactorColumn(), 1, true, Double.MAX_VALUE, "a number >= 1").orElse(1.0);
      double mass = number(layout.sampleMassColumn(), 0, false, Double.MAX_VALUE, "a mass in g > 0").orElse(1.0);
      double volume = number(layout.finalVolumeColumn(), 0, false, Double.MAX_VALUE, "a volume in mL > 0").orElse(1.0);
      Optional<Double> solids = layout.solidsFractionColumn().flatMap(c -> field(c).isEmpty()
          ? Optional.empty() : number(c, 0, false, 1, "a fraction > 0 and <= 1"));
      if (!id.isEmpty()) {
        Integer first = seen.putIfAbsent(id, line);
        if (first != null) {
          problems.add(new MethodProblem(source, line, header.get(layout.sampleIdColumn()) + 1, layout.sampleIdColumn(),
              "sample '" + id + "' is listed twice (first on line " + first + ")", Optional.of("one row per sample")));
        }
      }
      if (problems.size() > before) {
        return Optional.empty();
      }
      return Optional.of(new PrepSheetRow(line, id, batch, df, mass, volume, solids));
    }

    private String field(String column) {
      return record.get(header.get(column));
    }

    private String text(String column) {
      String v = field(column);
      if (v.isEmpty()) {
        problems.add(new MethodProblem(source, line, header.get(column) + 1, column, "is empty", Optional.of("a value")));
      }
      return v;
    }

    private Optional<Double> number(String column, double min, boolean minInclusive, double max, String expected) {
      String v = field(column);
      try {
        if (!PLAIN_NUMBER.matcher(v).matches()) {
          throw new NumberFormatException(v);
        }
        double d = Double.parseDouble(v);
        if (Double.isFinite(d) && (minInclusive ? d >= min : d > min) && d <= max) {
          return Optional.of(d);
        }
        problems.add(new MethodProblem(source, line, header.get(column) + 1, column, "value " + v + " is out of range", Optional.of(expected)));
      } catch (NumberFormatException e) {
        problems.add(new MethodProblem(source, line, header.get(column) + 1, column,
            v.isEmpty() ? "is empty" : "'" + v + "' is not a number", Optional.of(expected)));
      }
      return Optional.empty();
    }
  }
}
