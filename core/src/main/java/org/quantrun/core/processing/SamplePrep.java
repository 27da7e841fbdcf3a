package org.quantrun.core.processing;

import java.util.ArrayList;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.OptionalDouble;
import org.quantrun.core.method.ConcentrationUnit;
import org.quantrun.core.method.DilutionScheme;
import org.quantrun.core.method.Method;
import org.quantrun.core.method.PrepSheetLayout;
import org.quantrun.core.method.SolidsBasis;
import org.quantrun.core.method.prep.PrepSheet;
import org.quantrun.core.method.prep.PrepSheetRow;

/**
 * How each injection's solution concentration turns into a result in the original sample.
 *
 * <ul>
 *   <li>Calibration checks (ICV, CCV, ICB, CCB, low-level check) are measured as made: factor 1.
 *   <li>Samples, duplicates, spikes, serial dilutions, method blanks and LCS use their prep-sheet
 *       row when the method has a prep sheet (a duplicate or spike without a row of its own uses
 *       its parent's): C_sample = C_solution * DF * V_final / mass, as received or, with a solids
 *       fraction, dry weight; else the method's default dilution factor. When the method names a
 *       factor column ({@code dilution.factor-column}), a non-blank cell of the injection gives its
 *       factor instead of the default; with a prep-sheet row it is one more step and multiplies the
 *       row's factor (domain.md, dilution: DF is the product of every step).
 * </ul>
 *
 * The factor is linear, so it applies alike to the value, its half-width and the limits.
 */
final class SamplePrep {
  private final Method method;
  private final Optional<PrepSheet> sheet;
  private final Map<String, Classified> byId = new HashMap<>();
  private final List<Classified> injections;
  /** The prep batch of each injection, by index, found once. */
  private final String[] batches;
  /** The prep of each injection, by index, per unit: made once, shared by every line of that unit. */
  private final Map<ConcentrationUnit, PrepOf[]> preps = new java.util.EnumMap<>(ConcentrationUnit.class);

  /**
   * What one injection's results are multiplied by.
   *
   * @param toSample the factor from the measured solution to the original sample
   * @param dilutionFactor the dilution factor alone (1 for mass-based preparation too, where the
   *     factor includes volume and mass)
   * @param unit the unit of the results in the original sample
   * @param prepBatch the prep batch, if the prep sheet names one
   * @param trace the steps, in plain words
   * @param problem why the results cannot be reported, if they cannot
   */
  record PrepOf(double toSample, double dilutionFactor, String unit, Optional<String> prepBatch, List<String> trace,
      Optional<String> problem) {}

  SamplePrep(Method method, Optional<PrepSheet> sheet, List<Classified> injections) {
    this.method = method;
    this.sheet = sheet;
    for (Classified c : injections) {
      byId.putIfAbsent(c.sampleId(), c);
    }
    this.injections = injections;
    this.batches = new String[injections.size()];
    for (int i = 0; i < batches.length; i++) {
      batches[i] = batchOf(injections.get(i));
    }
  }

  /** Whether {@code c} is the injection of the run at its index (so the per-index tables apply). */
  private boolean indexed(Classified c) {
    return c.index() >= 0 && c.index() < injections.size() && injections.get(c.index()) == c;
  }

  /** The prep of one injection for the analyte line's unit. */
  PrepOf of(Classified c, ConcentrationUnit unit) {
    if (!indexed(c)) {
      return prepOf(c, unit);
    }
    PrepOf[] known = preps.computeIfAbsent(unit, u -> new PrepOf[injections.size()]);
    PrepOf p = known[c.index()];
    if (p == null) {
      p = prepOf(c, unit);
      known[c.index()] = p;
    }
    return p;
  }

  private PrepOf prepOf(Classified c, ConcentrationUnit unit) {
    String solutionUnit = unit.token();
    if (!c.isPrepared()) {
      return new PrepOf(1, 1, solutionUnit, Optional.empty(), List.of(), Optional.empty());
    }
    Optional<PrepSheetRow> row = sheet.flatMap(s -> s.row(c.sampleId()));
    if (row.isEmpty() && c.parent().isPresent()) {
      row = sheet.flatMap(s -> s.row(c.parent().get()));
    }
    DilutionScheme scheme = method.dilution();
    Optional<String> column = scheme.factorColumn();
    OptionalDouble exported = column.isEmpty() ? OptionalDouble.empty() : InjectionColumns.factor(c.injection(), column.get());
    if (row.isEmpty()) {
      double df;
      List<String> trace;
      if (exported.isPresent()) {
        df = exported.getAsDouble();
        trace = List.of("dilution factor " + Text.num(df) + " from the export's '" + column.get() + "' column");
      } else {
        df = scheme.defaultFactor();
        trace = column.isPresent()
            ? List.of("default dilution factor " + Text.num(df) + " (the export's '" + column.get() + "' column is blank)")
            : df == 1 ? List.of() : List.of("default dilution factor " + Text.num(df));
      }
      Optional<String> problem = sheet.isPresent() && c.isRealSample()
          ? Optional.of("sample " + c.sampleId() + " is not on the prep sheet " + sheet.get().source())
          : Optional.empty();
      return new PrepOf(df, df, solutionUnit, Optional.empty(), trace, problem);
    }
    PrepSheetRow p = row.get();
    PrepSheetLayout layout = scheme.prepSheet().get();
    // the export's factor is a step of its own (the measured solution's dilution): every step multiplies
    double step = exported.orElse(1);
    Optional<Double> factor = p.toSampleBasis(step, unit, layout);
    List<String> trace = new ArrayList<>(3);
    trace.add("prep sheet line " + p.line() + ": dilution factor " + Text.num(p.dilutionFactor()) + ", "
        + Text.num(p.sampleMass()) + " g made up to " + Text.num(p.finalVolume()) + " mL"
        + (layout.basis() == SolidsBasis.DRY_WEIGHT ? p.solidsFraction().map(f -> ", solids fraction " + Text.num(f)).orElse("") : ""));
    if (exported.isPresent()) {
      trace.add("dilution factor " + Text.num(step) + " from the export's '" + column.get() + "' column, times the prep sheet's "
          + Text.num(p.dilutionFactor()) + ": " + Text.num(step * p.dilutionFactor()));
    }
    double df = p.dilutionFactor() * step;
    if (factor.isEmpty()) {
      return new PrepOf(Double.NaN, df, layout.reportUnit().token(), Optional.of(p.prepBatch()), List.copyOf(trace),
          Optional.of("dry-weight reporting needs a solids fraction, and the prep sheet gives none for " + p.sampleId()));
    }
    trace.add("to " + layout.reportUnit().token() + " " + layout.basis().token() + ": x " + Text.num(factor.get()));
    return new PrepOf(factor.get(), df, layout.reportUnit().token(), Optional.of(p.prepBatch()), List.copyOf(trace),
        Optional.empty());
  }

  /** The prep batch of an injection: its prep-sheet row's (or its parent's), else the whole run. */
  String batch(Classified c) {
    return indexed(c) ? batches[c.index()] : batchOf(c);
  }

  private String batchOf(Classified c) {
    Optional<PrepSheetRow> row = sheet.flatMap(s -> s.row(c.sampleId()));
    if (row.isEmpty() && c.parent().isPresent()) {
      row = sheet.flatMap(s -> s.row(c.parent().get()));
    }
    return row.map(PrepSheetRow::prepBatch).orElse(RUN_BATCH);
  }

  /** The batch name used when there is no prep sheet: the run is one batch. */
  static final String RUN_BATCH = "";
}
