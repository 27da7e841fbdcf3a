package org.quantrun.runner.write;

import static org.junit.jupiter.api.Assertions.assertEquals;

import java.io.IOException;
import java.io.StringWriter;
import java.util.ArrayList;
import java.util.List;
import net.jqwik.api.Arbitraries;
import net.jqwik.api.Arbitrary;
import net.jqwik.api.ForAll;
import net.jqwik.api.Property;
import net.jqwik.api.Provide;
import net.jqwik.api.constraints.IntRange;
import org.apache.commons.csv.CSVFormat;
import org.apache.commons.csv.CSVPrinter;
import org.junit.jupiter.api.Test;
import org.quantrun.runner.output.SpreadsheetSafe;

/**
 * {@link CsvOutput} writes the same bytes as Apache Commons CSV's printer with {@code
 * CSVFormat.RFC4180} (the library's own RFC 4180 format), cell for cell, for any text, number and
 * blank, including text that must be quoted or neutralised.
 */
class CsvOutputPropertiesTest {

  /** What Commons CSV prints for the table: the neutralised column names, then each row's cells. */
  private static String byCommonsCsv(Table table) throws IOException {
    StringWriter out = new StringWriter();
    CSVPrinter printer = new CSVPrinter(out, CSVFormat.RFC4180);
    printer.printRecord(table.columns().stream().map(SpreadsheetSafe::cell).toList());
    for (List<Cell> row : table.rows()) {
      List<String> cells = new ArrayList<>();
      for (Cell c : row) {
        cells.add(c instanceof Cell.Text t ? SpreadsheetSafe.cell(t.text()) : c.plain());
      }
      printer.printRecord(cells);
    }
    printer.flush();
    return out.toString();
  }

  @Property(tries = 3000)
  void sameBytesAsCommonsCsv(@ForAll("rows") List<List<Cell>> rows, @ForAll("names") List<String> names) throws IOException {
    int width = names.size();
    List<List<Cell>> fitted = new ArrayList<>();
    for (List<Cell> r : rows) {
      List<Cell> row = new ArrayList<>(r);
      while (row.size() < width) {
        row.add(Cell.BLANK);
      }
      fitted.add(row.subList(0, width));
    }
    Table t = new Table("t", names, fitted);
    assertEquals(byCommonsCsv(t), CsvOutput.text(t));
  }

  @Property(tries = 2000)
  void oneTextCell(@ForAll("text") String text, @ForAll @IntRange(min = 0, max = 2) int position) throws IOException {
    List<Cell> row = new ArrayList<>(List.of(Cell.of(1.5), Cell.of("x"), Cell.BLANK));
    row.set(position, Cell.of(text));
    Table t = new Table("t", List.of("a", "b", "c"), List.of(row));
    assertEquals(byCommonsCsv(t), CsvOutput.text(t));
  }

  @Test
  void largeTableAcrossBufferChunks() throws IOException {
    List<List<Cell>> rows = new ArrayList<>();
    for (int i = 0; i < 20_000; i++) {
      rows.add(List.of(Cell.of(i), Cell.of("sample \"" + i + "\", diluted"), Cell.of(i / 7.0), Cell.BLANK, Cell.of(i % 2 == 0)));
    }
    Table t = new Table("t", List.of("n", "id", "v", "blank", "even"), rows);
    assertEquals(byCommonsCsv(t), CsvOutput.text(t));
  }

  @Provide
  Arbitrary<String> text() {
    Arbitrary<Character> chars = Arbitraries.oneOf(
        Arbitraries.of(',', '"', '\r', '\n', ' ', '\t', '#', '!', '=', '+', '-', '@', '\'', ';', '\u0000', '\u001f', '\u00e9', '\u2013'),
        Arbitraries.chars().alpha(), Arbitraries.chars().numeric(), Arbitraries.chars());
    return chars.list().ofMaxSize(12).map(l -> {
      StringBuilder b = new StringBuilder();
      l.forEach(b::append);
      return b.toString();
    });
  }

  @Provide
  Arbitrary<List<String>> names() {
    return text().list().ofMinSize(1).ofMaxSize(6);
  }

  @Provide
  Arbitrary<List<List<Cell>>> rows() {
    Arbitrary<Cell> cell = Arbitraries.oneOf(
        text().map(Cell::of),
        Arbitraries.doubles().map(Cell::of),
        Arbitraries.longs().map(Double::longBitsToDouble).map(Cell::of),
        Arbitraries.longs().map(Cell::of),
        Arbitraries.of(true, false).map(Cell::of),
        Arbitraries.just(Cell.BLANK));
    return cell.list().ofMaxSize(6).list().ofMaxSize(8);
  }
}
