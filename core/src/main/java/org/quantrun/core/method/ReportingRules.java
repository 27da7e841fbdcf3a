package org.quantrun.core.method;

import java.util.Map;

/**
 * How results are written.
 *
 * @param significantFigures significant figures of reported values (QC is judged unrounded)
 * @param rounding the rounding rule
 * @param belowLod how a result below the LOD is written
 * @param belowLodText the text written when {@code belowLod} is {@link BelowLodStyle#TEXT}, else
 *     empty
 * @param betweenLodLoq how a result between LOD and LOQ is written
 * @param qualifiers quantrun flag to the lab's own qualifier code, unmodifiable; a flag with no
 *     entry is written by its own name
 */
public record ReportingRules(
    int significantFigures,
    RoundingRule rounding,
    BelowLodStyle belowLod,
    String belowLodText,
    BetweenLodLoqStyle betweenLodLoq,
    Map<ResultFlag, String> qualifiers) {

  /**
   * Copies the qualifiers into an unmodifiable map.
   *
   * @param significantFigures significant figures of reported values (QC is judged unrounded)
   * @param rounding the rounding rule
   * @param belowLod how a result below the LOD is written
   * @param belowLodText the text written when {@code belowLod} is {@link BelowLodStyle#TEXT}, else empty
   * @param betweenLodLoq how a result between LOD and LOQ is written
   * @param qualifiers quantrun flag to the lab's own qualifier code, unmodifiable; a flag with no entry is written by its own name
   */
  public ReportingRules {
    qualifiers = Collections2.orderedCopy(qualifiers);
  }

  /**
   * The code written for a flag.
   *
   * @param flag the flag
   * @return the lab's code, or the flag's own name when the method maps none
   */
  public String qualifier(ResultFlag flag) {
    return qualifiers.getOrDefault(flag, flag.token());
  }
}
