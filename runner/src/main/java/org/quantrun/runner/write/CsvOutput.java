package org.quantrun.runner.write;

import java.io.IOException;
import java.io.StringWriter;
import java.io.UncheckedIOException;
import java.io.Writer;
import java.util.List;
import org.quantrun.runner.output.SpreadsheetSafe;

/**
 * Writes a {@link Table} as CSV: RFC 4180 (comma, double quotes, CRLF line ends), UTF-8 without
 * a byte-order mark, a header row of column names. Numbers keep full double precision; an absent
 * value is an empty cell; text that a spreadsheet would run as a formula is neutralised by
 * {@link SpreadsheetSafe#cell(String)}, numbers are left untouched.
 */
public final class CsvOutput {
  private CsvOutput() {}

  /**
   * The table as CSV text.
   *
   * @param table the table
   * @return the CSV text
   */
  public static String text(Table table) {
    StringWriter out = new StringWriter();
    try {
      write(table, out);
    } catch (IOException e) {
      throw new UncheckedIOException(e);
    }
    return out.toString();
  }

  /**
   * Writes the table as CSV text.
   *
   * <p>Written here rather than through a CSV library's printer, cell by cell into a buffer, with the
   * quoting rule of RFC 4180 as Apache Commons CSV applies it ({@code CSVFormat.RFC4180}, quote mode
   * minimal), so the bytes are the same as that printer's: a cell is quoted when it is the empty
   * first cell of a row, starts with a character up to {@code #} (space, control characters, {@code
   * !}, {@code "}, {@code #}), holds a comma, a double quote, CR or LF, or ends with a character up to
   * a space; a double quote inside is doubled.
   *
   * @param table the table
   * @param out where the text goes (the caller closes it)
   * @throws IOException if writing fails
   */
  public static void write(Table table, Writer out) throws IOException {
    ChunkedText b = new ChunkedText(out);
    List<String> columns = table.columns();
    for (int i = 0; i < columns.size(); i++) {
      if (i > 0) {
        b.text.append(',');
      }
      quoted(b.text, SpreadsheetSafe.cell(columns.get(i)), i == 0);
    }
    b.text.append(CRLF);
    int width = columns.size();
    for (List<Cell> row : table.rows()) {
      StringBuilder t = b.text;
      for (int i = 0; i < width; i++) {
        if (i > 0) {
          t.append(',');
        }
        Cell c = row.get(i);
        if (c instanceof Cell.Num n) {
          // digits, a point, a minus sign or an exponent: never a character that needs quoting
          t.append(n.text());
        } else if (c instanceof Cell.Whole w) {
          t.append(w.value());
        } else if (c instanceof Cell.Text x) {
          quoted(t, SpreadsheetSafe.cell(x.text()), i == 0);
        } else {
          quoted(t, c.plain(), i == 0);
        }
      }
      t.append(CRLF);
      b.flushIfFull();
    }
    b.flush();
  }

  private static final String CRLF = "\r\n";

  /** Appends a cell, quoted when RFC 4180 as Commons CSV prints it (quote mode minimal) would quote it. */
  static void quoted(StringBuilder b, String value, boolean firstInRow) {
    int n = value.length();
    boolean quote;
    if (n == 0) {
      quote = firstInRow;
    } else if (value.charAt(0) <= '#') {
      quote = true;
    } else {
      quote = value.charAt(n - 1) <= ' ';
      for (int i = 0; i < n && !quote; i++) {
        char c = value.charAt(i);
        quote = c == '\n' || c == '\r' || c == '"' || c == ',';
      }
    }
    if (!quote) {
      b.append(value);
      return;
    }
    b.append('"');
    for (int i = 0; i < n; i++) {
      char c = value.charAt(i);
      if (c == '"') {
        b.append('"');
      }
      b.append(c);
    }
    b.append('"');
  }
}
