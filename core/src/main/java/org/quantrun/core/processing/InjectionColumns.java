package org.quantrun.core.processing;

import java.util.List;
import java.util.Optional;
import java.util.OptionalDouble;
import org.quantrun.core.importer.CellText;
import org.quantrun.core.importer.Injection;
import org.quantrun.core.importer.RawRun;
import org.quantrun.core.method.Method;
import org.quantrun.core.method.StandardLevel;

/**
 * The export columns a method reads per injection ({@code identification.type-column},
 * {@code identification.level-column}, {@code dilution.factor-column}): the run must have them, and their text must be what the method
 * expects. Every problem is one {@link ProcessingException} naming the export, the line and column,
 * the method key, the text found and what was expected.
 */
final class InjectionColumns {
  static final String TYPE_KEY = "identification.type-column";
  static final String LEVEL_KEY = "identification.level-column";
  static final String FACTOR_KEY = "dilution.factor-column";

  private InjectionColumns() {}

  /** Refuses a run whose export lacks a column the method names, then any factor cell that is not a positive number. */
  static void check(RawRun run, Method method) {
    present(run, TYPE_KEY, method.identification().typeColumn());
    present(run, LEVEL_KEY, method.identification().levelColumn());
    present(run, FACTOR_KEY, method.dilution().factorColumn());
    Optional<String> factor = method.dilution().factorColumn();
    if (factor.isPresent()) {
      for (Injection inj : run.injections()) {
        CellText c = cell(run, inj, FACTOR_KEY, factor.get());
        if (c.isBlank()) {
          continue;
        }
        OptionalDouble v = c.number();
        if (v.isEmpty() || !(v.getAsDouble() > 0)) {
          throw new ProcessingException(where(run, c) + ": " + FACTOR_KEY + " '" + factor.get() + "' of injection "
              + inj.sequence() + " '" + inj.sampleId() + "' is \"" + c.text() + "\": expected a positive number ("
              + c.numberFormat() + "), or a blank cell for the method's default factor "
              + Text.num(method.dilution().defaultFactor()));
        }
      }
    }
  }

  private static void present(RawRun run, String key, Optional<String> column) {
    if (column.isEmpty() || run.hasColumn(column.get())) {
      return;
    }
    String has = run.columns().isEmpty()
        ? "the importer '" + run.importerId() + "' reports no column names"
        : "its columns: " + String.join(", ", run.columns().stream().map(c -> "'" + c + "'").toList());
    throw new ProcessingException(run.sourceName() + ": the method's " + key + " names the column '" + column.get()
        + "', which the export does not have (" + has + ")");
  }

  private static CellText cell(RawRun run, Injection inj, String key, String column) {
    return inj.column(column).orElseThrow(() -> new ProcessingException(run.sourceName() + ":" + inj.position().text()
        + ": injection " + inj.sequence() + " '" + inj.sampleId() + "': the importer '" + run.importerId()
        + "' gave no text of the column '" + column + "' (" + key + "), although the export has it"));
  }

  /**
   * The type an injection states: the text of the method's type column when the method names one
   * (the export has it: see {@link #check}), else the type the importer found by its own column
   * names ({@link Injection#sampleType()}).
   *
   * @return the type's text, or empty for a blank cell or no type
   */
  static Optional<String> type(RawRun run, Injection inj, Optional<String> column) {
    if (column.isEmpty()) {
      return inj.sampleType();
    }
    CellText c = cell(run, inj, TYPE_KEY, column.get());
    return c.isBlank() ? Optional.empty() : Optional.of(c.text());
  }

  /**
   * The dilution factor an injection's cell gives (already checked by {@link #check}).
   *
   * @return the factor, or empty for a blank cell
   */
  static OptionalDouble factor(Injection inj, String column) {
    Optional<CellText> c = inj.column(column);
    return c.isEmpty() || c.get().isBlank() ? OptionalDouble.empty() : c.get().number();
  }

  /**
   * The standard level an injection's level cell names.
   *
   * @return the level's name as the method writes it, or empty for a blank cell
   * @throws ProcessingException when the cell names no level of the method
   */
  static Optional<String> level(RawRun run, Injection inj, Method method, String column) {
    CellText c = cell(run, inj, LEVEL_KEY, column);
    if (c.isBlank()) {
      return Optional.empty();
    }
    List<String> names = method.standards().stream().map(StandardLevel::name).toList();
    if (names.contains(c.text())) {
      return Optional.of(c.text());
    }
    List<String> ignoringCase = names.stream().filter(n -> n.strip().equalsIgnoreCase(c.text())).toList();
    if (ignoringCase.size() == 1) {
      return Optional.of(ignoringCase.get(0));
    }
    throw new ProcessingException(where(run, c) + ": " + LEVEL_KEY + " '" + column + "' of injection " + inj.sequence()
        + " '" + inj.sampleId() + "' is \"" + c.text() + "\", which is not a standard level of the method (expected one of: "
        + String.join(", ", names) + ")");
  }

  static String where(RawRun run, CellText c) {
    String at = c.position().text();
    return at.isEmpty() ? run.sourceName() : run.sourceName() + ":" + at;
  }
}
