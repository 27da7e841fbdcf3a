package org.quantrun.core.method;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.List;
import java.util.stream.Stream;
import org.junit.jupiter.api.DisplayName;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.Arguments;
import org.junit.jupiter.params.provider.MethodSource;
import org.quantrun.core.calibration.CurveModel;

/**
 * More rules between keys and sections, each shown by one change to the base method. The rules
 * are common practice for a method file (a dry-weight result needs a solids fraction; a standard
 * needs a level; only one acceptance statistic for r).
 */
class CrossChecksTest {

  static final String PREP = "dilution:\n  prep-sheet:\n    columns: {sample-id: ID, prep-batch: B, dilution-factor: DF, sample-mass: M, final-volume: V}\n"
      + "    report-unit: mg/kg\n";

  static Stream<Arguments> cases() {
    return Stream.of(
        Arguments.of("dry weight without a solids column", List.of("dilution:\n  default-factor: 1\n", PREP + "    basis: dry-weight\n"),
            "dilution.prep-sheet.basis", "dry-weight results need the solids fraction"),
        Arguments.of("per-volume unit for mass-based results", List.of("dilution:\n  default-factor: 1\n", PREP.replace("mg/kg", "mg/L")),
            "dilution.prep-sheet.report-unit", "unit 'mg/L' is per volume of solution, not per mass of sample"),
        Arguments.of("per-mass unit for an analyte line", List.of("    weighting: none\n", "    weighting: none\n    unit: mg/kg\n"),
            "analytes[1].unit", "unit 'mg/kg' is per mass of sample, not per volume of solution"),
        Arguments.of("both min-r and min-r2", List.of("qc:\n", "qc:\n  calibration: {min-r: 0.995, min-r2: 0.99}\n"),
            "qc.calibration.min-r2", "give min-r or min-r2, not both"),
        Arguments.of("type column without its values", List.of("identification:\n", "identification:\n  type-column: Kind\n"),
            "identification.type-column", "type-column and type-values go together"),
        Arguments.of("standard rule without a level", List.of("      level: 'S$1'\n", ""),
            "identification.rules[0].level", "is missing"),
        Arguments.of("parent on a rule that has none", List.of("      role: standard\n", "      role: standard\n      of: '$1'\n"),
            "identification.rules[0].of", "only duplicate, spike, spike-duplicate and serial-dilution rules name a parent"),
        Arguments.of("duplicate rule without a parent", List.of("      of: '$1'\n", ""),
            "identification.rules[1].of", "is missing"),
        Arguments.of("only method limits but an analyte has none", List.of("[method, run-blanks, calibration]", "[method]"),
            "analytes[1]", "analyte line 'Cd 111' has no mdl and reporting-limit, and limits.order has no other source"),
        Arguments.of("an analyte both given and exempt", List.of("    recovery: {low: 90, high: 110}\n", "    recovery: {low: 90, high: 110}\n    exempt: [Cd]\n"),
            "qc.icv.exempt[0]", "'Cd' has a value and is exempt"),
        Arguments.of("the same analyte line twice", List.of("  - name: Cd\n    mass: 111\n", "  - name: Pb\n    line: \"220.353\"\n"),
            "analytes[1].name", "analyte line 'Pb 220.353' is defined twice"),
        Arguments.of("the same level twice", List.of("level: S3", "level: S2"), "standards[2].level", "level 'S2' is defined twice"),
        Arguments.of("MDL above the reporting limit", List.of("mdl: 0.5", "mdl: 5"), "analytes[0].mdl", "mdl 5.0 is above the reporting limit 2.0"),
        Arguments.of("weighting with a single standard concentration",
            List.of("curve: linear", "curve: through-zero", "{Pb: 50, Cd: 10}", "{Cd: 10}", "{Pb: 200, Cd: 40}", "{Cd: 40}"),
            "analytes[0].weighting", "weighting 1/x of 'Pb 220.353' needs at least 2 distinct standard concentrations, the standards give 1"),
        Arguments.of("a spike missing an analyte", List.of("  internal-standard:\n", "  matrix-spike:\n    added: {Pb: 20}\n  internal-standard:\n"),
            "qc.matrix-spike.added", "no value for Cd"),
        Arguments.of("below-lod-text without below-lod: text", List.of("  significant-figures: 3\n", "  significant-figures: 3\n  below-lod-text: nd\n"),
            "reporting.below-lod-text", "below-lod-text is used only with below-lod: text"),
        Arguments.of("no way to identify injections", List.of("identification:\n  rules:", "identification:\n  order: rules-first\n  rulez:"),
            "identification.rulez", "unknown key, did you mean 'rules'?"),
        Arguments.of("nothing identifies the CCV", List.of("    - {pattern: 'CCV\\d*', role: ccv}\n", ""),
            "identification", "nothing identifies the role ccv"),
        Arguments.of("standards by type with no way to their level",
            List.of("  rules:\n    - pattern: 'CAL(\\d)'\n      role: standard\n      level: 'S$1'\n", "  type-column: K\n  type-values: {S: standard}\n  rules:\n"),
            "identification.type-values", "standards found by the type column have no way to get their level"),
        Arguments.of("a level with no concentrations", List.of("{Pb: 5, Cd: 1}", "{}"), "standards[0].concentrations", "level 'S1' has no concentrations"),
        Arguments.of("an empty analyte list", List.of("analytes:\n", "analytes: []\nx-analytes:\n"), "analytes", "the method has no analytes"),
        Arguments.of("a template with a stray dollar", List.of("of: '$1'", "of: 'US$'"),
            "identification.rules[1].of", "template 'US$' has a '$' or '\\' that is not a group reference"),
        Arguments.of("a truth value spelt as a word", List.of("    frequency: 10\n", "    frequency: 10\n    non-detects-stand-after-high-bias: maybe\n"),
            "qc.ccv.non-detects-stand-after-high-bias", "'maybe' is not a truth value"),
        Arguments.of("no identification section", List.of("identification:\n", "x-identification:\n"), "identification", "is missing"));
  }

  @DisplayName("a rule between keys is enforced with a message at the key that breaks it")
  @ParameterizedTest(name = "{0}")
  @MethodSource("cases")
  void ruleIsEnforced(String name, List<String> edits, String path, String message) {
    String text = BrokenVariantsTest.apply(edits);
    MethodException e = assertThrows(MethodException.class, () -> MethodLoader.load(text, "m.yaml"));
    assertTrue(e.problems().stream().anyMatch(p -> p.path().equals(path) && p.message().contains(message)), e.getMessage());
    assertTrue(e.problems().stream().allMatch(p -> p.line() > 0), () -> "every problem has a line: " + e.getMessage());
  }

  @DisplayName("with from-level, exempt analytes are taken out of the level's values")
  @org.junit.jupiter.api.Test
  void fromLevelWithExempt() throws MethodException {
    String text = BrokenVariantsTest.apply(List.of("from-level: S2\n", "from-level: S2\n    exempt: [Cd]\n"));
    assertEquals(java.util.Map.of("Pb", 50.0), MethodLoader.load(text, "m.yaml").qc().ccv().standard().trueValues());
  }

  @DisplayName("a one-point through-zero curve with no weighting is accepted")
  @org.junit.jupiter.api.Test
  void singlePointThroughZero() throws MethodException {
    String text = BrokenVariantsTest.apply(List.of("curve: linear", "curve: through-zero", "weighting: 1/x", "weighting: none",
        "{Pb: 50, Cd: 10}", "{Cd: 10}", "{Pb: 200, Cd: 40}", "{Cd: 40}", "from-level: S2", "from-level: S1"));
    assertEquals(CurveModel.THROUGH_ZERO, MethodLoader.load(text, "m.yaml").analytes().get(0).curve());
  }
}
