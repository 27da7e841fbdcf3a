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

  /**
   * Rows made on reading, unmodifiable. A table of up to {@link #KEPT_ROWS} rows keeps each row once
   * made, so the writers that read it in turn (CSV, JSON, HTML) share its cells and the text of its
   * numbers; a longer one makes each row afresh, so a large run is never held twice.
   */
  private static final class ComputedRows extends AbstractList<List<Cell>> implements RandomAccess {
    /** About 10 MB of cells for a results table. */
    static final int KEPT_ROWS = 20_000;
    private final String name;
    private final int width;
    private final int size;
    private final IntFunction<List<Cell>> row;
    /**
     * The rows made so far, when kept. Two writer threads may make the same row at once: the rows
     * are equal and immutable (final fields), so either may stay.
     */
    private final List<Cell>[] kept;

    @SuppressWarnings("unchecked")
    ComputedRows(String name, int width, int size, IntFunction<List<Cell>> row) {
      this.name = name;
      this.width = width;
      this.size = size;
      this.row = row;
      this.kept = size <= KEPT_ROWS ? (List<Cell>[]) new List<?>[size] : null;
    }

    @Override
    public List<Cell> get(int index) {
      if (index < 0 || index >= size) {
        throw new IndexOutOfBoundsException(index);
      }
      if (kept == null) {
        return check(name, width, row.apply(index));
      }
      List<Cell> r = kept[index];
      if (r == null) {
        r = List.copyOf(check(name, width, row.apply(index)));
        kept[index] = r;
      }
      return r;
    }

    @Override
    public int size() {
      return size;
    }
  }
}
