package org.quantrun.core.method;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.List;
import java.util.stream.Stream;
import org.junit.jupiter.api.DisplayName;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.Arguments;
import org.junit.jupiter.params.provider.MethodSource;

/**
 * Broken variants of a valid base method, each changing one thing. Each must fail in the loader
 * with its own message at its own line, and (where JSON Schema can express the rule) fail
 * against the schema too. The expected messages are this project's own wording (common
 * practice for what a method file must hold); no published source exists for them.
 */
class BrokenVariantsTest {

  static final String BASE = Fixtures.resource("base-method.yaml");
  static final String FILE = "base-method.yaml";

  /** name, edits (find, replace, ...), key path, message fragment, line, column (0: any), schema rejects. */
  static Stream<Arguments> variants() {
    return Stream.of(
        v("misspelt curve value", List.of("curve: linear", "curve: quadratc"),
            "analytes[0].curve", "unknown value 'quadratc', did you mean 'quadratic'? (expected one of: linear, through-zero, quadratic)", 9, 12, true),
        v("misspelt key", List.of("weighting: 1/x", "weigting: 1/x"),
            "analytes[0].weigting", "unknown key, did you mean 'weighting'?", 10, 5, true),
        v("unknown unit", List.of("unit: ug/L", "unit: ug/dL"), "method.unit", "unknown unit 'ug/dL'", 5, 9, true),
        v("recovery window upside down", List.of("recovery: {low: 90, high: 110}", "recovery: {low: 110, high: 90}"),
            "qc.icv.recovery.high", "high 90 is not above low 110 (expected low < high)", 47, 0, false),
        v("internal standard not defined", List.of("internal-standard: In115", "internal-standard: In113"),
            "analytes[1].internal-standard", "internal standard 'In113' is not defined, did you mean 'In115'?", 15, 24, false),
        v("ID pattern does not compile", List.of("pattern: 'CAL(\\d)'", "pattern: 'CAL(\\d'"),
            "identification.rules[0].pattern", "pattern does not compile: Unclosed group", 31, 0, false),
        v("ICV true value missing for one analyte", List.of("true-values: {Pb: 50, Cd: 10}", "true-values: {Pb: 50}"),
            "qc.icv.true-values", "no value for Cd (expected a value for every analyte, or the analyte listed in exempt)", 46, 0, false),
        v("too few levels for a quadratic curve", List.of("curve: linear", "curve: quadratic", "{Pb: 200, Cd: 40}", "{Cd: 40}"),
            "analytes[0].curve", "curve quadratic of 'Pb 220.353' needs 3 calibration points but the standards give 2", 9, 0, false),
        v("1/x weights with the blank as zero point", List.of("calibration-blank: subtract", "calibration-blank: zero-point"),
            "analytes[0].weighting", "weighting 1/x cannot weigh the blank fitted at concentration 0", 10, 0, false),
        v("negative MDL", List.of("mdl: 0.5", "mdl: -0.5"), "analytes[0].mdl", "value -0.5 is out of range (expected a number > 0)", 11, 10, true),
        v("duplicate key", List.of("weighting: 1/x\n", "weighting: 1/x\n    curve: linear\n"),
            "analytes[0].curve", "key appears twice (first at line 9)", 11, 5, false),
        v("CCV section missing", List.of("  ccv:\n    from-level: S2\n    frequency: 10\n", ""), "qc.ccv", "is missing", 45, 0, true),
        v("CCV from an unknown level", List.of("from-level: S2", "from-level: S9"),
            "qc.ccv.from-level", "level 'S9' is not a standard level", 49, 0, false),
        v("template names a group the pattern lacks", List.of("of: '$1'", "of: '$2'"),
            "identification.rules[1].of", "template refers to group $2 that the pattern does not have", 36, 0, false),
        v("unknown flag name in qualifiers", List.of("estimated: EST", "estimatd: EST"),
            "reporting.qualifiers.estimatd", "unknown flag 'estimatd', did you mean 'estimated'?", 57, 5, true),
        v("words where a number belongs", List.of("significant-figures: 3", "significant-figures: three"),
            "reporting.significant-figures", "'three' is not a whole number", 54, 0, true),
        v("line and mass both given", List.of("mass: 111", "mass: 111\n    line: \"214.439\""),
            "analytes[1].mass", "an analyte line has a line or a mass, not both", 14, 0, true),
        v("rule names an undefined level", List.of("level: 'S$1'", "level: 'S7'"),
            "identification.rules[0].level", "level 'S7' is not a standard level", 33, 0, false),
        v("below-lod text without the text", List.of("below-lod: less-than-lod", "below-lod: text"),
            "reporting.below-lod", "below-lod: text needs the text to write", 55, 0, true),
        v("standard names an analyte the method lacks", List.of("{Pb: 5, Cd: 1}", "{Pb: 5, Cd: 1, Cu: 3}"),
            "standards[0].concentrations.Cu", "'Cu' is not an analyte of this method", 22, 0, false),
        v("Java type tag", List.of("id: TEST-01", "id: !!java.net.URL TEST-01"),
            "", "explicit type tag 'tag:yaml.org,2002:java.net.URL' is not allowed", 3, 0, false),
        v("limit source listed twice", List.of("[method, run-blanks, calibration]", "[run-blanks, calibration, run-blanks]"),
            "limits.order[2]", "'run-blanks' is listed twice", 43, 0, true),
        v("zero concentration in a standard", List.of("{Pb: 5, Cd: 1}", "{Pb: 0, Cd: 1}"),
            "standards[0].concentrations.Pb", "value 0 is out of range (expected a number > 0)", 22, 0, true));
  }

  private static Arguments v(String name, List<String> edits, String path, String message, int line, int column, boolean schemaRejects) {
    return Arguments.of(name, edits, path, message, line, column, schemaRejects);
  }

  static String apply(List<String> edits) {
    String text = BASE;
    for (int i = 0; i < edits.size(); i += 2) {
      assertTrue(text.contains(edits.get(i)), "base holds '" + edits.get(i) + "'");
      text = text.replaceFirst(java.util.regex.Pattern.quote(edits.get(i)), java.util.regex.Matcher.quoteReplacement(edits.get(i + 1)));
    }
    return text;
  }

  @Test
  @DisplayName("there are at least 15 broken variants")
  void atLeastFifteenVariants() {
    assertTrue(variants().count() >= 15);
  }

  @Test
  @DisplayName("the unchanged base method loads")
  void baseLoads() throws MethodException {
    assertEquals("TEST-01", MethodLoader.load(BASE, FILE).identity().id());
  }

  @DisplayName("a broken variant fails in the loader with its one expected message at its line")
  @ParameterizedTest(name = "{0}")
  @MethodSource("variants")
  void loaderRejectsVariant(String name, List<String> edits, String path, String message, int line, int column, boolean schemaRejects) {
    MethodException e = assertThrows(MethodException.class, () -> MethodLoader.load(apply(edits), FILE));
    List<MethodProblem> problems = e.problems();
    assertEquals(1, problems.size(), () -> "exactly one problem, got:\n" + e.getMessage());
    MethodProblem p = problems.get(0);
    assertEquals(path, p.path(), e.getMessage());
    assertEquals(line, p.line(), e.getMessage());
    if (column > 0) {
      assertEquals(column, p.column(), e.getMessage());
    }
    String formatted = p.toString();
    assertTrue(formatted.startsWith(FILE + ":" + line + ":" + p.column() + ": " + (path.isEmpty() ? "" : path + ": ")), formatted);
    assertTrue(formatted.contains(message), () -> "expected '" + message + "' in: " + formatted);
  }

  @DisplayName("a broken variant the schema can express fails against the schema too")
  @ParameterizedTest(name = "{0}")
  @MethodSource("variants")
  void schemaRejectsVariant(String name, List<String> edits, String path, String message, int line, int column, boolean schemaRejects) {
    List<String> errors = SchemaSupport.errors(apply(edits));
    if (schemaRejects) {
      assertFalse(errors.isEmpty(), "schema accepted the variant");
    } else {
      // rules JSON Schema cannot state (references across sections, ordering, regular expressions):
      // only the loader catches them, and the schema must not reject a structurally sound file
      assertEquals(List.of(), errors);
    }
  }

  @Test
  @DisplayName("every problem of a file is reported in one pass, in file order")
  void everyProblemInOnePass() {
    String text = apply(List.of(
        "unit: ug/L", "unit: ug/dL",
        "curve: linear", "curve: quadratc",
        "internal-standard: In115", "internal-standard: In113",
        "true-values: {Pb: 50, Cd: 10}", "true-values: {Pb: 50}",
        "estimated: EST", "estimatd: EST"));
    MethodException e = assertThrows(MethodException.class, () -> MethodLoader.load(text, FILE));
    List<String> paths = e.problems().stream().map(MethodProblem::path).toList();
    assertEquals(List.of("method.unit", "analytes[0].curve", "analytes[1].internal-standard", "qc.icv.true-values",
        "reporting.qualifiers.estimatd"), paths);
    assertEquals(5, e.getMessage().lines().count(), "the message lists every problem, one per line");
  }
}
