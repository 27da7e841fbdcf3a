package org.quantrun.core.method;

import java.util.List;
import java.util.Map;
import java.util.Optional;

/**
 * How the role of every injection (and a standard's level, a duplicate's parent) is found.
 *
 * @param typeColumn the export column that states each injection's type
 * @param typeValues value of the type column to role, unmodifiable, in file order
 * @param levelColumn the export column that states a standard's level
 * @param rules ordered ID rules; the first whose pattern matches applies
 * @param order which source decides when both give a role
 * @param unmatched what happens to an injection no source recognises
 */
public record Identification(
    Optional<String> typeColumn,
    Map<String, SampleRole> typeValues,
    Optional<String> levelColumn,
    List<IdRule> rules,
    IdentificationOrder order,
    UnmatchedPolicy unmatched) {

  /**
   * Copies the collections into unmodifiable ones.
   *
   * @param typeColumn the export column that states each injection's type
   * @param typeValues value of the type column to role, unmodifiable, in file order
   * @param levelColumn the export column that states a standard's level
   * @param rules ordered ID rules; the first whose pattern matches applies
   * @param order which source decides when both give a role
   * @param unmatched what happens to an injection no source recognises
   */
  public Identification {
    typeValues = Collections2.orderedCopy(typeValues);
    rules = List.copyOf(rules);
  }
}
