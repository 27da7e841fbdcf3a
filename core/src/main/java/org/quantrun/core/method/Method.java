package org.quantrun.core.method;

import java.util.ArrayList;
import java.util.List;
import java.util.Optional;

/**
 * A loaded and validated method: everything the processing of a run needs to know about the
 * lab's procedure. Load one with {@link MethodLoader#load(String, String)}.
 *
 * @param identity id, version, description and default unit
 * @param importSettings how the run's export is read
 * @param analytes the analyte lines, in file order, unique by {@link Analyte#key()}
 * @param internalStandards the internal standards, unique by name
 * @param standards the calibration levels, unique by name
 * @param blanks blank handling
 * @param identification how injections get their roles
 * @param dilution where dilution factors come from
 * @param limits which limits results use
 * @param qc the QC plan and acceptance limits
 * @param reporting how results are written
 */
public record Method(
    MethodIdentity identity,
    ImportSettings importSettings,
    List<Analyte> analytes,
    List<InternalStandard> internalStandards,
    List<StandardLevel> standards,
    BlankPolicy blanks,
    Identification identification,
    DilutionScheme dilution,
    LimitPolicy limits,
    QcPlan qc,
    ReportingRules reporting) {

  /**
   * Copies the lists into unmodifiable ones.
   *
   * @param identity id, version, description and default unit
   * @param importSettings how the run's export is read
   * @param analytes the analyte lines, in file order, unique by {@link Analyte#key()}
   * @param internalStandards the internal standards, unique by name
   * @param standards the calibration levels, unique by name
   * @param blanks blank handling
   * @param identification how injections get their roles
   * @param dilution where dilution factors come from
   * @param limits which limits results use
   * @param qc the QC plan and acceptance limits
   * @param reporting how results are written
   */
  public Method {
    analytes = List.copyOf(analytes);
    internalStandards = List.copyOf(internalStandards);
    standards = List.copyOf(standards);
  }

  /**
   * Finds an analyte line by its key.
   *
   * @param key the key, as {@link Analyte#key()} gives it
   * @return the analyte line, or empty
   */
  public Optional<Analyte> analyte(String key) {
    return analytes.stream().filter(a -> a.key().equals(key)).findFirst();
  }

  /**
   * Finds a standard level by name.
   *
   * @param name the level's name
   * @return the level, or empty
   */
  public Optional<StandardLevel> level(String name) {
    return standards.stream().filter(l -> l.name().equals(name)).findFirst();
  }

  /**
   * The export columns this method reads per injection, for the import settings
   * ({@code org.quantrun.core.importer.ImportSettings.Builder#injectionColumn}): the type column
   * ({@code identification.type-column}), the standard's level column
   * ({@code identification.level-column}), then the dilution factor column
   * ({@code dilution.factor-column}), each when given.
   *
   * @return the column names, in that order
   */
  public List<String> injectionColumns() {
    List<String> out = new ArrayList<>(3);
    identification.typeColumn().ifPresent(out::add);
    identification.levelColumn().ifPresent(out::add);
    dilution.factorColumn().ifPresent(out::add);
    return List.copyOf(out);
  }

  /**
   * Finds an internal standard by name.
   *
   * @param name its name
   * @return the internal standard, or empty
   */
  public Optional<InternalStandard> internalStandard(String name) {
    return internalStandards.stream().filter(s -> s.name().equals(name)).findFirst();
  }

  /**
   * The levels that hold an analyte, in file order.
   *
   * @param analyteName the analyte name
   * @return the levels with a concentration for it
   */
  public List<StandardLevel> levelsOf(String analyteName) {
    return standards.stream().filter(l -> l.concentrations().containsKey(analyteName)).toList();
  }

  /**
   * Whether an analyte line is the one reported for its analyte: the line marked {@code report},
   * else the first listed line of that analyte. Other lines are alternates, kept in the output.
   *
   * @param analyte an analyte line of this method
   * @return true for the reported line
   */
  public boolean isReportedLine(Analyte analyte) {
    List<Analyte> same = analytes.stream().filter(a -> a.name().equals(analyte.name())).toList();
    Optional<Analyte> marked = same.stream().filter(Analyte::report).findFirst();
    return marked.map(a -> a == analyte).orElse(!same.isEmpty() && same.get(0) == analyte);
  }
}
