package org.quantrun.core.method;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.Reader;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import org.junit.jupiter.api.DisplayName;
import org.junit.jupiter.api.Test;

/** Hostile and malformed input is refused with one clear message, never a stack trace or a hang. */
class LoaderSafetyTest {

  static final String BASE = Fixtures.resource("base-method.yaml");

  private static MethodException refused(String text) {
    return assertThrows(MethodException.class, () -> MethodLoader.load(text, "hostile.yaml"));
  }

  @Test
  @DisplayName("an alias bomb (billion laughs) is refused with a message about aliases")
  void aliasBombIsRefused() {
    StringBuilder sb = new StringBuilder("a0: &a0 [lol, lol, lol, lol, lol, lol, lol, lol, lol]\n");
    for (int i = 1; i <= 9; i++) {
      String prev = "*a" + (i - 1);
      sb.append("a").append(i).append(": &a").append(i).append(" [")
          .append(String.join(", ", java.util.Collections.nCopies(9, prev))).append("]\n");
    }
    MethodException e = refused(sb.toString());
    assertEquals(1, e.problems().size());
    assertTrue(e.getMessage().contains("more than 20 aliases"), e.getMessage());
    assertTrue(e.getMessage().startsWith("hostile.yaml: "), e.getMessage());
  }

  @Test
  @DisplayName("a few aliases to reuse a window are accepted")
  void modestAliasesAreAccepted() throws MethodException {
    String text = BASE.replace("recovery: {low: 90, high: 110}", "recovery: &window {low: 90, high: 110}")
        .replace("  ccv:\n", "  ccv:\n    recovery: *window\n");
    Method m = MethodLoader.load(text, "aliases.yaml");
    assertEquals(m.qc().icv().recovery(), m.qc().ccv().standard().recovery());
  }

  @Test
  @DisplayName("a 100 MB input is refused after reading little more than the size limit")
  void hugeInputIsRefusedWithoutReadingItAll() {
    long hundredMb = 100L * 1024 * 1024;
    long[] served = {0};
    Reader endless = new Reader() {
      @Override
      public int read(char[] buf, int off, int len) {
        if (served[0] >= hundredMb) {
          return -1;
        }
        int n = (int) Math.min(len, hundredMb - served[0]);
        java.util.Arrays.fill(buf, off, off + n, '#');
        served[0] += n;
        return n;
      }

      @Override
      public void close() {}
    };
    MethodException e = assertThrows(MethodException.class, () -> MethodLoader.load(endless, "huge.yaml"));
    assertTrue(e.getMessage().contains("larger than 1024 KiB"), e.getMessage());
    assertTrue(served[0] < 2L * MethodLoader.MAX_CHARACTERS, "read " + served[0] + " characters");
  }

  @Test
  @DisplayName("a text over the size limit is refused before parsing")
  void oversizedTextIsRefused() {
    String text = "method:\n  description: \"" + "x".repeat(MethodLoader.MAX_CHARACTERS) + "\"\n";
    assertTrue(refused(text).getMessage().contains("is refused"));
  }

  @Test
  @DisplayName("nesting deeper than the limit is refused")
  void deepNestingIsRefused() {
    String text = "method: " + "[".repeat(200) + "]".repeat(200) + "\n";
    MethodException e = refused(text);
    assertTrue(e.getMessage().contains("nests deeper than 32 levels"), e.getMessage());
  }

  @Test
  @DisplayName("a Java type tag is refused and nothing is constructed")
  void javaTypeTagIsRefused() {
    String text = "method: !!javax.script.ScriptEngineManager [!!java.net.URLClassLoader [[!!java.net.URL [\"http://localhost/\"]]]]\n";
    MethodException e = refused(text);
    assertEquals(1, e.problems().size());
    assertTrue(e.getMessage().contains("explicit type tag 'tag:yaml.org,2002:javax.script.ScriptEngineManager' is not allowed"), e.getMessage());
  }

  @Test
  @DisplayName("a local tag such as !include is refused with its key path")
  void localTagIsRefused() {
    MethodException e = refused(BASE.replace("id: TEST-01", "id: !include other.yaml"));
    assertEquals("method.id", e.problems().get(0).path());
    assertTrue(e.getMessage().contains("explicit type tag '!include' is not allowed"), e.getMessage());
  }

  @Test
  @DisplayName("a merge key is refused rather than silently expanded")
  void mergeKeyIsRefused() {
    String text = BASE.replace("  icv:\n", "  icv:\n    <<: {exempt: [Pb]}\n");
    MethodException e = refused(text);
    assertTrue(e.getMessage().contains("qc.icv.<<: merge keys are not supported"), e.getMessage());
  }

  @Test
  @DisplayName("two YAML documents in one file are refused")
  void twoDocumentsAreRefused() {
    MethodException e = refused(BASE + "---\nmethod: {id: X}\n");
    assertTrue(e.getMessage().contains("is not valid YAML"), e.getMessage());
  }

  @Test
  @DisplayName("a YAML syntax error is reported at its 1-based line and column")
  void syntaxErrorHasLineAndColumn() {
    MethodException e = refused("method:\n  id: [unclosed\n  version: 1\n");
    MethodProblem p = e.problems().get(0);
    assertTrue(p.line() >= 2, p.toString());
    assertTrue(p.column() >= 1, p.toString());
    assertTrue(p.toString().startsWith("hostile.yaml:" + p.line() + ":" + p.column() + ": is not valid YAML"), p.toString());
  }

  @Test
  @DisplayName("an empty file and a file that is a list are each refused with one message")
  void emptyAndNonMappingFilesAreRefused() {
    assertTrue(refused("").getMessage().contains("the file is empty"));
    assertTrue(refused("# only a comment\n").getMessage().contains("the file is empty"));
    assertTrue(refused("- a\n- b\n").getMessage().contains("is a list (expected a mapping of keys to values)"));
  }

  @Test
  @DisplayName("a missing required section is reported with what belongs there")
  void missingSectionsAreReported() {
    MethodException e = refused("method: {id: X, version: 1, unit: ug/L}\n");
    List<String> paths = e.problems().stream().map(MethodProblem::path).toList();
    assertTrue(paths.containsAll(List.of("analytes", "standards", "qc")), paths.toString());
  }

  @Test
  @DisplayName("the loaded method is immutable all the way down")
  void loadedMethodIsImmutable() throws MethodException {
    Method m = MethodLoader.load(Fixtures.read(Fixtures.examples().resolve("drinking-water-trace-metals.yaml")), "dw.yaml");
    assertThrows(UnsupportedOperationException.class, () -> m.analytes().remove(0));
    assertThrows(UnsupportedOperationException.class, () -> m.standards().get(0).concentrations().put("Pb", 1.0));
    assertThrows(UnsupportedOperationException.class, () -> m.importSettings().settings().put("k", "v"));
    assertThrows(UnsupportedOperationException.class, () -> m.identification().rules().clear());
    assertThrows(UnsupportedOperationException.class, () -> m.identification().typeValues().clear());
    assertThrows(UnsupportedOperationException.class, () -> m.qc().icv().trueValues().clear());
    assertThrows(UnsupportedOperationException.class, () -> m.reporting().qualifiers().clear());
    assertThrows(UnsupportedOperationException.class, () -> m.limits().order().clear());
  }

  @Test
  @DisplayName("import settings keep single values as text and refuse nested ones")
  void importSettingsAreScalarsOnly() throws MethodException {
    String ok = BASE.replace("dilution:\n", "import:\n  importer: delimited\n  settings: {delimiter: \";\", header-lines: 2, quoted: true}\ndilution:\n");
    Method m = MethodLoader.load(ok, "ok.yaml");
    assertEquals(Map.of("delimiter", ";", "header-lines", "2", "quoted", "true"), m.importSettings().settings());
    assertEquals("delimited", m.importSettings().importer());
    assertEquals(Optional.empty(), m.importSettings().profile());
    MethodException e = refused(ok.replace("quoted: true", "quoted: {a: 1}"));
    assertEquals("import.settings.quoted", e.problems().get(0).path());
  }

  @Test
  @DisplayName("a relative import-profile path is kept as written for the runner to resolve")
  void relativeProfileIsKept() throws MethodException {
    String text = BASE.replace("dilution:\n", "import:\n  profile: profiles/ms-export.yaml\ndilution:\n");
    assertEquals(Optional.of("profiles/ms-export.yaml"), MethodLoader.load(text, "p.yaml").importSettings().profile());
  }

  @Test
  @DisplayName("an absolute import-profile path is refused")
  void absoluteProfileIsRefused() {
    String text = BASE.replace("dilution:\n", "import:\n  profile: /etc/profile.yaml\ndilution:\n");
    MethodException e = refused(text);
    assertTrue(e.getMessage().contains("import.profile: '/etc/profile.yaml' is an absolute path"), e.getMessage());
  }
}
