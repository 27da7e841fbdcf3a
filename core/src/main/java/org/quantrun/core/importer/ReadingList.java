package org.quantrun.core.importer;

import java.util.AbstractList;
import java.util.List;
import java.util.Objects;
import java.util.Optional;
import java.util.RandomAccess;

/**
 * The replicate readings of a {@link LineReadings}, stored compactly: the values in one array, the
 * reasons of the invalid ones (if any) in another, and the positions as a first position and a
 * step when the readings are evenly spaced (a row per replicate: the next line, the same column;
 * replicate columns: the same line, the next column), else as an array. A large run holds
 * millions of readings; {@link #get} makes each {@link Reading} when asked, equal to the one stored.
 *
 * <p>Unmodifiable, like {@link List#copyOf}.
 */
final class ReadingList extends AbstractList<Reading> implements RandomAccess {
  private final double[] values;
  /** The reason of each invalid reading (null for a valid one); null when every reading is valid. */
  private final String[] reasons;
  private final int firstLine;
  private final int firstColumn;
  private final int lineStep;
  private final int columnStep;
  /** Line and column of each reading, in pairs, when they are not evenly spaced; else null. */
  private final int[] positions;

  private ReadingList(double[] values, String[] reasons, int firstLine, int firstColumn, int lineStep,
      int columnStep, int[] positions) {
    this.values = values;
    this.reasons = reasons;
    this.firstLine = firstLine;
    this.firstColumn = firstColumn;
    this.lineStep = lineStep;
    this.columnStep = columnStep;
    this.positions = positions;
  }

  /**
   * An unmodifiable list of the same readings.
   *
   * @param readings the readings
   * @return the list; the argument itself when it is already one
   * @throws NullPointerException if the list or a reading is null
   */
  static List<Reading> copyOf(List<Reading> readings) {
    if (readings instanceof ReadingList) {
      return readings;
    }
    int n = readings.size();
    if (n == 0) {
      return List.of();
    }
    Reading[] all = readings.toArray(new Reading[0]);
    n = all.length;
    double[] values = new double[n];
    String[] reasons = null;
    for (int i = 0; i < n; i++) {
      Reading r = Objects.requireNonNull(all[i], "reading");
      values[i] = r.value();
      if (r.invalidReason().isPresent()) {
        if (reasons == null) {
          reasons = new String[n];
        }
        reasons[i] = r.invalidReason().get();
      }
    }
    int line0 = all[0].line();
    int column0 = all[0].column();
    int lineStep = n > 1 ? all[1].line() - line0 : 0;
    int columnStep = n > 1 ? all[1].column() - column0 : 0;
    boolean even = true;
    for (int i = 2; i < n && even; i++) {
      even = all[i].line() == line0 + i * lineStep && all[i].column() == column0 + i * columnStep;
    }
    int[] positions = null;
    if (!even) {
      positions = new int[2 * n];
      for (int i = 0; i < n; i++) {
        positions[2 * i] = all[i].line();
        positions[2 * i + 1] = all[i].column();
      }
    }
    return new ReadingList(values, reasons, line0, column0, lineStep, columnStep, positions);
  }

  @Override
  public Reading get(int index) {
    Objects.checkIndex(index, values.length);
    String reason = reasons == null ? null : reasons[index];
    int line = positions == null ? firstLine + index * lineStep : positions[2 * index];
    int column = positions == null ? firstColumn + index * columnStep : positions[2 * index + 1];
    return new Reading(values[index], Optional.ofNullable(reason), line, column);
  }

  @Override
  public int size() {
    return values.length;
  }
}
