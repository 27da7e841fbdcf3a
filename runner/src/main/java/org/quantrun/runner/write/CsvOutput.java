package org.quantrun.runner.write;

import java.io.IOException;
import java.io.StringWriter;
import java.io.UncheckedIOException;
import java.io.Writer;
import java.util.List;
import org.apache.commons.csv.CSVFormat;
import org.apache.commons.csv.CSVPrinter;
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
   * @param table the table
   * @param out where the text goes (the caller closes it)
   * @throws IOException if writing fails
   */
  public static void write(Table table, Writer out) throws IOException {
    // not closed here: closing the printer would close the caller's writer
    CSVPrinter printer = new CSVPrinter(out, CSVFormat.RFC4180);
    printer.printRecord(table.columns().stream().map(SpreadsheetSafe::cell).toList());
    String[] cells = new String[table.columns().size()];
    for (List<Cell> row : table.rows()) {
      for (int i = 0; i < cells.length; i++) {
        Cell c = row.get(i);
        cells[i] = c instanceof Cell.Text t ? SpreadsheetSafe.cell(t.text()) : c.plain();
      }
      printer.printRecord((Object[]) cells);
    }
    printer.flush();
  }
}
