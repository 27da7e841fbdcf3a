package org.quantrun.core.importer;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.Optional;
import org.junit.jupiter.api.DisplayName;
import org.junit.jupiter.api.Test;

/**
 * LineReadings keeps its replicates in a compact form; what comes out must be what went in:
 * every value (to the bit), every reason, every line and column. The readings below are chosen by
 * hand to cover each way positions are spaced in the bundled export layouts (common practice for a
 * storage change: round-trip every case).
 */
class LineReadingsStorageTest {

  private static final AnalyteLine PB = AnalyteLine.of("Pb", "220.353");

  private static LineReadings line(List<Reading> reps) {
    return new LineReadings(PB, Optional.of("cps"), reps, Optional.empty(), Optional.empty(), Optional.empty(),
        new SourcePosition(reps.isEmpty() ? 1 : reps.get(0).line(), 1));
  }

  private static void assertSameReadings(List<Reading> given, List<Reading> stored) {
    assertEquals(given.size(), stored.size());
    for (int i = 0; i < given.size(); i++) {
      Reading g = given.get(i);
      Reading s = stored.get(i);
      assertEquals(Double.doubleToRawLongBits(g.value()), Double.doubleToRawLongBits(s.value()), "value " + i);
      assertEquals(g.invalidReason(), s.invalidReason(), "reason " + i);
      assertEquals(g.line(), s.line(), "line " + i);
      assertEquals(g.column(), s.column(), "column " + i);
      assertEquals(g, s);
    }
    assertEquals(given, stored);
    assertEquals(stored, given);
    assertEquals(given.hashCode(), stored.hashCode());
    assertEquals(given.toString(), stored.toString());
  }

  @Test
  @DisplayName("a row per replicate: next line, same column, an invalid reading among them")
  void rowPerReplicate() {
    List<Reading> given = List.of(
        Reading.valid(1520.5, new SourcePosition(10, 8)),
        Reading.invalid("instrument reported \"OVER\"", new SourcePosition(11, 8)),
        Reading.valid(1498.25, new SourcePosition(12, 8)));
    assertSameReadings(given, line(given).replicates());
    assertTrue(line(given).replicates().get(1).invalidReason().isPresent());
    assertTrue(Double.isNaN(line(given).replicates().get(1).value()));
  }

  @Test
  @DisplayName("replicate columns: same line, next column")
  void replicateColumns() {
    List<Reading> given = List.of(
        Reading.valid(0.5, new SourcePosition(7, 5)),
        Reading.valid(0.25, new SourcePosition(7, 6)),
        Reading.valid(0.125, new SourcePosition(7, 7)),
        Reading.valid(0.0625, new SourcePosition(7, 8)));
    assertSameReadings(given, line(given).replicates());
  }

  @Test
  @DisplayName("unevenly spaced positions, and values whose bits matter (-0.0, the smallest double, the largest)")
  void unevenPositions() {
    List<Reading> given = List.of(
        Reading.valid(-0.0, new SourcePosition(3, 9)),
        Reading.valid(Double.MIN_VALUE, new SourcePosition(3, 16)),
        Reading.invalid("no value (empty)", new SourcePosition(3, 17)),
        Reading.valid(Double.MAX_VALUE, new SourcePosition(5, 2)),
        Reading.invalid("\"abc\" is not a number", new SourcePosition(4, 40)));
    assertSameReadings(given, line(given).replicates());
  }

  @Test
  @DisplayName("one reading, none, and positions not known (0)")
  void smallCases() {
    List<Reading> one = List.of(Reading.valid(42, new SourcePosition(0, 0)));
    assertSameReadings(one, line(one).replicates());
    assertSameReadings(List.of(), line(List.of()).replicates());
    List<Reading> twoSame = List.of(Reading.valid(1, new SourcePosition(2, 3)), Reading.valid(2, new SourcePosition(2, 3)));
    assertSameReadings(twoSame, line(twoSame).replicates());
  }

  @Test
  @DisplayName("the stored list is a copy: changing the given list later does not change it")
  void copyOfTheGivenList() {
    List<Reading> given = new ArrayList<>(List.of(Reading.valid(1, new SourcePosition(1, 1)),
        Reading.valid(2, new SourcePosition(2, 1))));
    LineReadings lr = line(given);
    given.set(0, Reading.valid(99, new SourcePosition(9, 9)));
    given.add(Reading.valid(3, new SourcePosition(3, 1)));
    assertEquals(2, lr.replicates().size());
    assertEquals(1.0, lr.replicates().get(0).value());
    assertEquals(1, lr.replicates().get(0).line());
  }

  @Test
  @DisplayName("unmodifiable and checked like List.copyOf: no changes, no nulls, indexes checked")
  void unmodifiable() {
    List<Reading> reps = line(List.of(Reading.valid(1, new SourcePosition(1, 1)),
        Reading.valid(2, new SourcePosition(2, 1)))).replicates();
    Reading r = Reading.valid(3, new SourcePosition(3, 1));
    assertThrows(UnsupportedOperationException.class, () -> reps.add(r));
    assertThrows(UnsupportedOperationException.class, () -> reps.set(0, r));
    assertThrows(UnsupportedOperationException.class, () -> reps.remove(0));
    assertThrows(IndexOutOfBoundsException.class, () -> reps.get(2));
    assertThrows(IndexOutOfBoundsException.class, () -> reps.get(-1));
    assertThrows(NullPointerException.class, () -> line(Arrays.asList(r, null)));
  }

  @Test
  @DisplayName("two LineReadings of equal readings are equal, whichever list they were built from")
  void equalLines() {
    List<Reading> given = List.of(Reading.valid(5, new SourcePosition(4, 2)),
        Reading.invalid("instrument reported \"----\"", new SourcePosition(5, 2)));
    LineReadings a = line(given);
    LineReadings b = line(new ArrayList<>(given));
    LineReadings c = line(a.replicates());
    assertEquals(a, b);
    assertEquals(a.hashCode(), b.hashCode());
    assertEquals(a, c);
  }
}
