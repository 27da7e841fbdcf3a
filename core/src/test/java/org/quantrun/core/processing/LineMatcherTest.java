package org.quantrun.core.processing;

import static org.junit.jupiter.api.Assertions.assertEquals;

import java.util.Optional;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;
import org.quantrun.core.importer.AnalyteLine;

/**
 * Whether an exported analyte line is the one a method names (common practice: the spellings of
 * emission lines and isotopes instrument exports use).
 */
class LineMatcherTest {

  @ParameterizedTest(name = "method {0} {1} against export {2} {3}: {4}")
  @CsvSource(delimiter = '|', value = {
      "Cd|228.802|Cd|228.802|true",
      "Cd|228.802|CD|228.8020|true",
      "Cd|228.802|Cd|228.80|false",
      "Cd|111|Cd|111 [He]|true",
      "Pb|208|Pb|208 (He)|true",
      "Pb|208|Pb|m/z 208|true",
      "Pb|208|Pb|206|false",
      "Pb|208|Cd|208|false",
      "Hg||Hg||true",
      "Hg||Hg|194.164|false",
      "Hg|194.164|Hg||false",
  })
  void matches(String name, String line, String analyte, String exportedLine, boolean expected) {
    Optional<String> methodLine = line == null ? Optional.empty() : Optional.of(line);
    AnalyteLine exported = AnalyteLine.of(analyte, exportedLine == null ? "" : exportedLine);
    assertEquals(expected, LineMatcher.matches(name, methodLine, exported));
  }
}
