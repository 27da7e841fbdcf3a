package org.quantrun.runner.write;

import java.util.ArrayList;
import java.util.List;

/**
 * A named table of cells: the shape shared by every CSV file, the arrays of {@code run.json} and
 * the tables of the HTML report.
 *
 * @param name the table's name, e.g. {@code results} (the CSV file is {@code NAME.csv})
 * @param columns the column names, in order
 * @param rows the rows, each exactly as long as {@code columns}
 */
public record Table(String name, List<String> columns, List<List<Cell>> rows) {

  /**
   * Copies the lists and checks every row's length.
   *
   * @param name the table's name
   * @param columns the column names
   * @param rows the rows
   */
  public Table {
    columns = List.copyOf(columns);
    List<List<Cell>> copy = new ArrayList<>(rows.size());
    for (List<Cell> r : rows) {
      if (r.size() != columns.size()) {
        throw new IllegalArgumentException(name + ": a row has " + r.size() + " cells for " + columns.size() + " columns");
      }
      copy.add(List.copyOf(r));
    }
    rows = List.copyOf(copy);
  }

  /**
   * The index of a column.
   *
   * @param column the column name
   * @return its index
   * @throws IllegalArgumentException if the table has no such column
   */
  public int column(String column) {
    int i = columns.indexOf(column);
    if (i < 0) {
      throw new IllegalArgumentException(name + " has no column " + column);
    }
    return i;
  }
}
