package org.quantrun.importer.delimited;

import java.io.BufferedReader;
import java.io.IOException;
import java.io.InputStream;
import java.io.UncheckedIOException;
import java.util.Iterator;
import java.util.List;
import java.util.Locale;
import java.util.Optional;
import java.util.regex.Pattern;
import org.apache.commons.csv.CSVFormat;
import org.apache.commons.csv.CSVParser;
import org.apache.commons.csv.CSVRecord;
import org.pf4j.Extension;
import org.quantrun.core.importer.ImportException;
import org.quantrun.core.importer.ImportSettings;
import org.quantrun.core.importer.RawRun;
import org.quantrun.core.importer.RunImporter;
import org.quantrun.core.importer.SourcePosition;
import org.quantrun.core.importer.TableRunAssembler;
import org.quantrun.core.importer.TextInput;

/**
 * Reads delimited text exports: comma, semicolon, tab or pipe (detected or set), quoted fields,
 * decimal comma and thousands separators, any charset {@link TextInput} handles, metadata lines
 * before the header, long or wide layout, footer and summary rows skipped by the profile's rules.
 * Parsing is done by Apache Commons CSV; the table is turned into a run by
 * {@link TableRunAssembler}.
 */
@Extension
public final class DelimitedImporter implements RunImporter {

  /** The importer id. */
  public static final String ID = "delimited";

  private static final int SNIFF_CHARS = 64 * 1024;
  private static final Pattern KNOWN_HEADER_WORD = Pattern.compile(
      "(?i)\\b(sample|solution|analyte|element|intensity|signal|counts|wavelength|mass)\\b");

  @Override
  public String id() {
    return ID;
  }

  @Override
  public String description() {
    return "Delimited text exports (comma, semicolon, tab, pipe), long or wide layout";
  }

  @Override
  public double detect(String fileName, byte[] head) {
    String text = TextInput.headText(head);
    if (text.isBlank()) {
      return 0;
    }
    Optional<DelimiterSniffer.Result> r =
        DelimiterSniffer.sniff(text, head.length >= DETECT_HEAD_BYTES, '"', true);
    if (r.isEmpty() || r.get().fields() < 3 || r.get().agreeingLines() < 2) {
      return 0;
    }
    double c = 0.5;
    String name = fileName.toLowerCase(Locale.ROOT);
    if (name.endsWith(".csv") || name.endsWith(".tsv") || name.endsWith(".tab")) {
      c += 0.2;
    }
    if (KNOWN_HEADER_WORD.matcher(text).find()) {
      c += 0.2;
    }
    if (r.get().agreeingLines() * 2 >= r.get().lines()) {
      c += 0.05;
    }
    return Math.min(c, 0.95);
  }

  @Override
  public RawRun read(InputStream in, ImportSettings settings, String sourceName) throws ImportException {
    if (settings.delimiter().isPresent() && settings.delimiter().get() == settings.decimalSeparator()) {
      throw new ImportException(sourceName, SourcePosition.UNKNOWN, "the import profile gives '"
          + settings.decimalSeparator() + "' as both delimiter and decimal separator");
    }
    if (settings.delimiter().isPresent() && settings.delimiter().equals(settings.groupingSeparator())) {
      throw new ImportException(sourceName, SourcePosition.UNKNOWN, "the import profile gives '"
          + settings.delimiter().get() + "' as both delimiter and thousands separator");
    }
    TextInput text = TextInput.open(in, settings, sourceName);
    BufferedReader reader = new BufferedReader(text, SNIFF_CHARS + 1024);
    char delimiter;
    String head;
    try {
      head = head(reader, sourceName);
      delimiter = settings.delimiter().isPresent() ? settings.delimiter().get() : sniff(head, settings);
    } catch (IOException e) {
      throw text.problem(e, text.line());
    }
    CSVFormat format = CSVFormat.DEFAULT.builder()
        .setDelimiter(delimiter)
        .setQuote(settings.quote())
        .setIgnoreEmptyLines(false)
        .setAllowMissingColumnNames(true)
        .setTrim(false)
        .get();
    TableRunAssembler table = new TableRunAssembler(sourceName, ID, settings);
    boolean patterns = !settings.skipPatterns().isEmpty() || settings.endPattern().isPresent();
    String joiner = String.valueOf(delimiter);
    long lineBefore = 0;
    try (CSVParser parser = CSVParser.builder().setReader(reader).setFormat(format).get()) {
      Iterator<CSVRecord> records = parser.iterator();
      int searched = 0;
      while (true) {
        CSVRecord record;
        try {
          if (!records.hasNext()) {
            break;
          }
          record = records.next();
        } catch (UncheckedIOException | IllegalStateException e) {
          throw parseProblem(text, e, (int) lineBefore + 1);
        }
        int line = (int) lineBefore + 1;
        lineBefore = parser.getCurrentLineNumber();
        List<String> cells = java.util.Arrays.asList(record.values());
        if (!table.hasHeader()) {
          if (++searched > settings.headerSearchLines()) {
            throw noHeader(table, head, delimiter, settings);
          }
          if (!table.tryHeader(cells, columns(cells.size()), line)) {
            table.metadataLine(cells, line);
          }
          continue;
        }
        if (patterns && !cells.isEmpty() && settings.rulesMayMatch(cells.get(0))) {
          String raw = String.join(joiner, cells);
          if (settings.ends(raw)) {
            break;
          }
          if (settings.skips(raw)) {
            continue;
          }
        }
        table.row(cells, line);
      }
    } catch (IOException | UncheckedIOException e) {
      throw parseProblem(text, e, (int) lineBefore + 1);
    }
    if (!table.hasHeader() && lineBefore == 0) {
      throw new ImportException(sourceName, SourcePosition.UNKNOWN, "the file is empty");
    }
    if (!table.hasHeader()) {
      throw noHeader(table, head, delimiter, settings);
    }
    return table.finish();
  }

  /** Turns a parser failure into the import error, in words for the technician. */
  private static ImportException parseProblem(TextInput text, Exception e, int line) {
    ImportException p = text.problem(e, line);
    String m = p.problem();
    String plain;
    if (m.contains("EOF reached before encapsulated token finished")) {
      plain = "a quoted field is not closed before the end of the file";
    } else if (m.contains("Invalid character between encapsulated token and delimiter")) {
      plain = "text after the closing quote of a field (a quote inside a field must be doubled)";
    } else {
      return p;
    }
    return new ImportException(p.sourceName(), p.position(), plain, e);
  }

  /** The first characters of the text, for the delimiter; the reader is reset to where it was. */
  private static String head(BufferedReader reader, String sourceName) throws IOException, ImportException {
    reader.mark(SNIFF_CHARS);
    char[] buf = new char[SNIFF_CHARS];
    int n = 0;
    int r;
    while (n < buf.length && (r = reader.read(buf, n, buf.length - n)) > 0) {
      n += r;
    }
    reader.reset();
    String head = new String(buf, 0, n);
    if (head.isBlank()) {
      throw new ImportException(sourceName, SourcePosition.UNKNOWN, "the file is empty");
    }
    return head;
  }

  private static Optional<Character> sniffed(String head, ImportSettings settings) {
    return DelimiterSniffer.sniff(head, head.length() == SNIFF_CHARS, settings.quote(), settings.decimalSeparator() != ',')
        .map(DelimiterSniffer.Result::delimiter);
  }

  private static char sniff(String head, ImportSettings settings) {
    return sniffed(head, settings).orElse(settings.decimalSeparator() == ',' ? ';' : ',');
  }

  /**
   * The error for a text without a header; when the profile fixes a delimiter that the lines do
   * not look separated by, it says which one they look separated by.
   */
  private static ImportException noHeader(TableRunAssembler table, String head, char delimiter, ImportSettings settings) {
    ImportException e = table.noHeaderError();
    if (settings.delimiter().isEmpty()) {
      return e;
    }
    Optional<Character> seen = sniffed(head, settings);
    if (seen.isEmpty() || seen.get() == delimiter) {
      return e;
    }
    return new ImportException(e.sourceName(), e.position(), e.problem() + "; the import profile sets the delimiter "
        + DelimiterSniffer.describe(delimiter) + ", but the lines look separated by " + DelimiterSniffer.describe(seen.get())
        + " (delimiter: auto detects it)", e);
  }

  private static int[] columns(int n) {
    int[] c = new int[n];
    for (int i = 0; i < n; i++) {
      c[i] = i + 1;
    }
    return c;
  }
}
