package org.quantrun.runner.write;

import java.io.IOException;
import java.io.StringWriter;
import java.io.UncheckedIOException;
import java.nio.charset.StandardCharsets;
import java.util.ArrayList;
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
    try (CSVPrinter printer = new CSVPrinter(out, CSVFormat.RFC4180)) {
      printer.printRecord(table.columns().stream().map(SpreadsheetSafe::cell).toList());
      for (List<Cell> row : table.rows()) {
        List<String> cells = new ArrayList<>(row.size());
        for (Cell c : row) {
          cells.add(c instanceof Cell.Text t ? SpreadsheetSafe.cell(t.text()) : c.plain());
        }
        printer.printRecord(cells);
      }
    } catch (IOException e) {
      throw new UncheckedIOException(e);
    }
    return out.toString();
  }

  /**
   * The table as UTF-8 bytes of CSV text.
   *
   * @param table the table
   * @return the bytes
   */
  public static byte[] bytes(Table table) {
    return text(table).getBytes(StandardCharsets.UTF_8);
  }
}
