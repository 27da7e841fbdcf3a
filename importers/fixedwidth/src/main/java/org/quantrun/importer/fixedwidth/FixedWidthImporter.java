package org.quantrun.importer.fixedwidth;

import java.io.BufferedReader;
import java.io.IOException;
import java.io.InputStream;
import java.io.UncheckedIOException;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Optional;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import org.pf4j.Extension;
import org.quantrun.core.importer.ColumnNames;
import org.quantrun.core.importer.ContextField;
import org.quantrun.core.importer.FixedField;
import org.quantrun.core.importer.GroupNames;
import org.quantrun.core.importer.ImportException;
import org.quantrun.core.importer.ImportSettings;
import org.quantrun.core.importer.RawRun;
import org.quantrun.core.importer.RunImporter;
import org.quantrun.core.importer.SourcePosition;
import org.quantrun.core.importer.TableRunAssembler;
import org.quantrun.core.importer.TextInput;

/**
 * Reads fixed-width text reports. Fields come from the settings (start column and width) or from
 * the first header line followed by an underline row (runs of {@code -} or {@code =}: each run is
 * a field, named by the header text above it). Context records (lines matching a
 * {@linkplain ImportSettings#contextPatterns() context pattern}) set the sequence, sample id, type
 * and time stamp for the data records after them (named groups {@code sequence}, {@code sampleId},
 * {@code sampleType}, {@code timestamp}); every named group of a context pattern, these four and any
 * other, is also a column of the run, which a method can read per injection (its value for the
 * records until the next context record, its position the context record's line and the group's
 * column); a {@linkplain ImportSettings#dataRecordPattern()
 * data record pattern} selects the data lines; skip and end rules apply as for delimited files.
 * Repeats of the header and underline (a report with a block per injection) are skipped.
 */
@Extension
public final class FixedWidthImporter implements RunImporter {

  /** The importer id. */
  public static final String ID = "fixed-width";

  private static final Pattern UNDERLINE = Pattern.compile("\\s*[-=]{2,}(\\s+[-=]{2,})*\\s*");
  private static final Pattern RUN = Pattern.compile("[-=]{2,}");
  private static final Pattern KNOWN_WORD = Pattern.compile(
      "(?i)\\b(sample|injection|analyte|element|line|reading|intensity|mean)\\b");

  @Override
  public String id() {
    return ID;
  }

  @Override
  public String description() {
    return "Fixed-width text reports (fields by column span or from an underlined header)";
  }

  @Override
  public double detect(String fileName, byte[] head) {
    String text = TextInput.headText(head);
    if (text.isBlank()) {
      return 0;
    }
    String[] lines = text.split("\r\n|\n|\r");
    int underlines = 0;
    for (int i = 1; i < lines.length; i++) {
      if (UNDERLINE.matcher(lines[i]).matches() && RUN.matcher(lines[i]).results().count() >= 3 && !lines[i - 1].isBlank()) {
        underlines++;
      }
    }
    if (underlines == 0) {
      return 0;
    }
    double c = 0.6;
    if (KNOWN_WORD.matcher(text).find()) {
      c += 0.2;
    }
    String name = fileName.toLowerCase(Locale.ROOT);
    if (name.endsWith(".txt") || name.endsWith(".prn") || name.endsWith(".rpt")) {
      c += 0.05;
    }
    return c;
  }

  @Override
  public RawRun read(InputStream in, ImportSettings given, String sourceName) throws ImportException {
    ImportSettings settings = given;
    if (given.requiredColumns().isEmpty() && !given.contextPatterns().isEmpty()) {
      // the sample id comes from the context records
      settings = given.toBuilder().requiredColumns(List.of(ColumnNames.ANALYTE, ColumnNames.READING)).build();
    }
    TextInput text = TextInput.open(in, settings, sourceName);
    BufferedReader reader = new BufferedReader(text, 64 * 1024);
    TableRunAssembler table = new TableRunAssembler(sourceName, ID, settings);
    List<List<String>> groups = new ArrayList<>();
    List<String> contextNames = new ArrayList<>();
    for (Pattern p : settings.contextPatterns()) {
      List<String> g = GroupNames.of(p);
      groups.add(g);
      contextNames.addAll(g);
    }
    table.contextColumns(contextNames);
    Context ctx = new Context();
    int[] starts = new int[0];
    String headerText = null;
    String pending = null;
    int pendingLine = 0;
    int lineNo = 0;
    int seen = 0;
    try {
      if (!settings.fixedFields().isEmpty()) {
        List<FixedField> f = settings.fixedFields();
        starts = f.stream().mapToInt(FixedField::start).toArray();
        if (!table.tryHeader(f.stream().map(FixedField::name).toList(), starts, 1)) {
          throw new ImportException(sourceName, SourcePosition.UNKNOWN,
              "the profile's fields lack a required column: " + table.noHeaderError().problem());
        }
      }
      String line;
      while ((line = reader.readLine()) != null) {
        lineNo++;
        seen++;
        if (table.hasHeader() && settings.ends(line)) {
          break;
        }
        if (context(settings, groups, line, lineNo, ctx)) {
          continue;
        }
        if (!table.hasHeader()) {
          if (lineNo > settings.headerSearchLines()) {
            throw table.noHeaderError();
          }
          if (pending != null && UNDERLINE.matcher(line).matches()) {
            int[] spanStarts = spans(line);
            List<String> names = names(pending, spanStarts);
            if (table.tryHeader(names, spanStarts, pendingLine)) {
              starts = spanStarts;
              headerText = pending.strip();
              pending = null;
              continue;
            }
          }
          if (pending != null) {
            table.metadataLine(List.of(pending), pendingLine);
          }
          pending = line.isBlank() ? null : line;
          pendingLine = lineNo;
          continue;
        }
        if (line.isBlank() || line.strip().equals(headerText) || UNDERLINE.matcher(line).matches() || settings.skips(line)) {
          continue;
        }
        if (settings.dataRecordPattern().isPresent() && !settings.dataRecordPattern().get().matcher(line).find()) {
          continue;
        }
        table.row(cells(line, starts, settings.fixedFields()), lineNo, ctx.sequence, ctx.sampleId, ctx.type, ctx.timestamp,
            ctx.fields);
      }
    } catch (IOException | UncheckedIOException e) {
      throw text.problem(e, lineNo + 1);
    }
    if (seen == 0) {
      throw new ImportException(sourceName, SourcePosition.UNKNOWN, "the file is empty");
    }
    return table.finish();
  }

  private static boolean context(ImportSettings settings, List<List<String>> groups, String line, int lineNo, Context ctx) {
    List<Pattern> patterns = settings.contextPatterns();
    for (int i = 0; i < patterns.size(); i++) {
      Matcher m = patterns.get(i).matcher(line);
      if (m.find()) {
        ctx.sequence = group(m, "sequence");
        ctx.sampleId = group(m, "sampleId");
        ctx.type = group(m, "sampleType");
        ctx.timestamp = group(m, "timestamp");
        ctx.fields = fields(m, groups.get(i), lineNo);
        return true;
      }
    }
    return false;
  }

  /** Every named group of a context record, by name: its text and where it was read. */
  private static Map<String, ContextField> fields(Matcher m, List<String> names, int lineNo) {
    if (names.isEmpty()) {
      return Map.of();
    }
    Map<String, ContextField> out = new LinkedHashMap<>();
    for (String name : names) {
      String text = m.group(name);
      out.put(name, text == null
          ? new ContextField("", SourcePosition.ofLine(lineNo))
          : new ContextField(text.strip(), new SourcePosition(lineNo, m.start(name) + 1)));
    }
    return out;
  }

  private static Optional<String> group(Matcher m, String name) {
    try {
      String g = m.group(name);
      return g == null || g.isBlank() ? Optional.empty() : Optional.of(g.strip());
    } catch (IllegalArgumentException e) {
      return Optional.empty();
    }
  }

  /** 1-based start columns of the runs of an underline row. */
  private static int[] spans(String underline) {
    return RUN.matcher(underline).results().mapToInt(r -> r.start() + 1).toArray();
  }

  private static List<String> names(String header, int[] starts) {
    List<String> names = new ArrayList<>(starts.length);
    for (int i = 0; i < starts.length; i++) {
      int from = starts[i] - 1;
      int to = i + 1 < starts.length ? starts[i + 1] - 1 : header.length();
      names.add(from >= header.length() ? "" : header.substring(from, Math.min(to, header.length())).strip());
    }
    return names;
  }

  private static List<String> cells(String line, int[] starts, List<FixedField> fields) {
    List<String> cells = new ArrayList<>(starts.length);
    for (int i = 0; i < starts.length; i++) {
      int from = starts[i] - 1;
      int to;
      if (!fields.isEmpty()) {
        to = i + 1 < starts.length ? from + fields.get(i).width() : line.length();
      } else {
        to = i + 1 < starts.length ? starts[i + 1] - 1 : line.length();
      }
      cells.add(from >= line.length() ? "" : line.substring(from, Math.min(Math.max(to, from), line.length())).strip());
    }
    return cells;
  }

  /** The injection fields the last context record set. */
  private static final class Context {
    Optional<String> sequence = Optional.empty();
    Optional<String> sampleId = Optional.empty();
    Optional<String> type = Optional.empty();
    Optional<String> timestamp = Optional.empty();
    Map<String, ContextField> fields = Map.of();
  }
}
