package org.quantrun.runner.write;

import java.util.AbstractList;
import java.util.ArrayList;
import java.util.List;
import java.util.RandomAccess;
import java.util.function.IntFunction;

/**
 * A named table of cells: the shape shared by every CSV file, the arrays of {@code run.json} and
 * the tables of the HTML report.
 *
 * <p>A table made by {@link #computed} holds no cells: each row is made from the run's records
 * when it is read, so a run of a million readings does not hold its results twice.
 *
 * @param name the table's name, e.g. {@code results} (the CSV file is {@code NAME.csv})
 * @param columns the column names, in order
 * @param rows the rows, each exactly as long as {@code columns}; unmodifiable
 */
public record Table(String name, List<String> columns, List<List<Cell>> rows) {

  /**
   * Copies the columns; copies and checks the rows, unless they are computed on reading.
   *
   * @param name the table's name
   * @param columns the column names
   * @param rows the rows
   */
  public Table {
    columns = List.copyOf(columns);
    if (!(rows instanceof ComputedRows)) {
      List<List<Cell>> copy = new ArrayList<>(rows.size());
      for (List<Cell> r : rows) {
        copy.add(List.copyOf(check(name, columns.size(), r)));
      }
      rows = List.copyOf(copy);
    }
  }

  /**
   * A table whose rows are made when read.
   *
   * @param name the table's name
   * @param columns the column names
   * @param size the number of rows
   * @param row makes row i (0-based) from immutable data; it must always give the same cells
   * @return the table
   */
  static Table computed(String name, List<String> columns, int size, IntFunction<List<Cell>> row) {
    return new Table(name, columns, new ComputedRows(name, columns.size(), size, row));
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

  private static List<Cell> check(String name, int width, List<Cell> row) {
    if (row.size() != width) {
      throw new IllegalArgumentException(name + ": a row has " + row.size() + " cells for " + width + " columns");
    }
    return row;
  }

  /** Rows made on reading, unmodifiable. */
  private static final class ComputedRows extends AbstractList<List<Cell>> implements RandomAccess {
    private final String name;
    private final int width;
    private final int size;
    private final IntFunction<List<Cell>> row;

    ComputedRows(String name, int width, int size, IntFunction<List<Cell>> row) {
      this.name = name;
      this.width = width;
      this.size = size;
      this.row = row;
    }

    @Override
    public List<Cell> get(int index) {
      if (index < 0 || index >= size) {
        throw new IndexOutOfBoundsException(index);
      }
      return check(name, width, row.apply(index));
    }

    @Override
    public int size() {
      return size;
    }
  }
}
