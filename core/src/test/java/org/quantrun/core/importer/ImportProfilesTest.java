package org.quantrun.core.importer;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.charset.Charset;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.Optional;
import org.junit.jupiter.api.DisplayName;
import org.junit.jupiter.api.Test;

class ImportProfilesTest {

  static final Path EXAMPLES = Path.of("../config-examples/importers");

  @Test
  @DisplayName("the example profiles load into the settings they describe")
  void exampleProfilesLoad() throws Exception {
    ImportSettings wide = ImportProfiles.parse(Files.readString(EXAMPLES.resolve("wide-semicolon.yaml")), "wide.yaml");
    assertEquals("delimited", wide.importer());
    assertEquals(Optional.of(';'), wide.delimiter());
    assertEquals(',', wide.decimalSeparator());
    assertEquals(Optional.of('.'), wide.groupingSeparator());
    assertEquals(Layout.WIDE, wide.layout());
    assertEquals(Optional.of(Charset.forName("windows-1252")), wide.charset());
    assertEquals(List.of("Kind"), wide.columnAliases().get("sample_type"));
    ImportSettings fixed = ImportProfiles.parse(Files.readString(EXAMPLES.resolve("fixed-width-report.yaml")), "f.yaml");
    assertEquals("fixed-width", fixed.importer());
    assertEquals(1, fixed.contextPatterns().size());
    ImportSettings lng = ImportProfiles.parse(Files.readString(EXAMPLES.resolve("long-csv.yaml")), "l.yaml");
    assertTrue(lng.ends("End of data,1710 readings"));
  }

  @Test
  @DisplayName("every example profile loads")
  void everyExampleLoads() throws Exception {
    try (var files = Files.list(EXAMPLES)) {
      List<Path> yamls = files.filter(p -> p.toString().endsWith(".yaml")).toList();
      assertTrue(yamls.size() >= 5, yamls.toString());
      for (Path p : yamls) {
        ImportSettings s = ImportProfiles.parse(Files.readString(p), p.getFileName().toString());
        assertTrue(List.of("delimited", "fixed-width").contains(s.importer()), p.toString());
      }
    }
    ImportSettings tab = ImportProfiles.parse(Files.readString(EXAMPLES.resolve("tab-renamed-columns.yaml")), "t.yaml");
    assertEquals(Optional.of('\t'), tab.delimiter());
    assertTrue(tab.invalidMarkers().contains("<lod>"));
    ImportSettings cols = ImportProfiles.parse(Files.readString(EXAMPLES.resolve("fixed-width-columns.yaml")), "c.yaml");
    assertEquals(new FixedField("sample_id", 6, 16), cols.fixedFields().get(1));
  }

  @Test
  @DisplayName("a profile gives the same settings as the fluent builder")
  void profileEqualsBuilder() throws ImportException {
    ImportSettings p = ImportProfiles.parse("importer: delimited\ndelimiter: \"\\t\"\nlayout: wide\n", "p.yaml");
    ImportSettings b = ImportSettings.DEFAULT.toBuilder().importer("delimited").delimiter('\t').layout(Layout.WIDE).build();
    assertEquals(b, p);
  }

  @Test
  @DisplayName("an unknown key is an error naming file, line, column and key")
  void unknownKey() {
    ImportException e = assertThrows(ImportException.class,
        () -> ImportProfiles.parse("importer: delimited\n  \nlayuot: wide\n", "p.yaml"));
    assertTrue(e.getMessage().startsWith("p.yaml:3:1: layuot: unknown key"), e.getMessage());
  }

  @Test
  @DisplayName("a bad value is an error naming its key path and position, and what was expected")
  void badValue() {
    ImportException e = assertThrows(ImportException.class,
        () -> ImportProfiles.parse("layout: wide\nfields:\n  - {name: Sample, start: 0, width: 4}\n", "p.yaml"));
    assertTrue(e.getMessage().startsWith("p.yaml:3:"), e.getMessage());
    assertTrue(e.getMessage().contains("fields[0].start: expected a whole number from 1"), e.getMessage());
    ImportException l = assertThrows(ImportException.class, () -> ImportProfiles.parse("layout: tall\n", "p.yaml"));
    assertEquals("p.yaml:1:1: layout: unknown value 'tall' (expected: long, wide)", l.getMessage());
  }

  @Test
  @DisplayName("broken YAML is an error with line and column")
  void brokenYaml() {
    ImportException e = assertThrows(ImportException.class, () -> ImportProfiles.parse("a: [1, 2\nb: 3\n", "p.yaml"));
    assertTrue(e.getMessage().matches("p\\.yaml:\\d+:\\d+: not valid YAML: .*"), e.getMessage());
  }

  // common practice: the "billion laughs" alias expansion attack, nine aliases per level
  @Test
  @DisplayName("an alias bomb is refused (billion laughs)")
  void aliasBomb() {
    StringBuilder y = new StringBuilder("a: &a [x, x, x, x, x, x, x, x, x]\n");
    char prev = 'a';
    for (char c = 'b'; c <= 'j'; c++) {
      y.append(c).append(": &").append(c).append(" [");
      for (int i = 0; i < 9; i++) {
        y.append(i == 0 ? "" : ", ").append('*').append(prev);
      }
      y.append("]\n");
      prev = c;
    }
    assertThrows(ImportException.class, () -> ImportProfiles.parse(y.toString(), "bomb.yaml"));
  }

  @Test
  @DisplayName("deep nesting, an oversized profile and YAML tags are refused")
  void limits() {
    String deep = "options: " + "[".repeat(50) + "]".repeat(50) + "\n";
    assertThrows(ImportException.class, () -> ImportProfiles.parse(deep, "deep.yaml"));
    String big = "description: \"" + "x".repeat(ImportProfiles.MAX_CODE_POINTS + 10) + "\"\n";
    assertThrows(ImportException.class, () -> ImportProfiles.parse(big, "big.yaml"));
    ImportException tag = assertThrows(ImportException.class,
        () -> ImportProfiles.parse("importer: !!javax.script.ScriptEngineManager [x]\n", "tag.yaml"));
    assertTrue(tag.getMessage().toLowerCase(java.util.Locale.ROOT).contains("tag"), tag.getMessage());
    ImportException local = assertThrows(ImportException.class, () -> ImportProfiles.parse("importer: !mine x\n", "tag.yaml"));
    assertTrue(local.getMessage().startsWith("tag.yaml:1:11: importer: YAML tags are not allowed"), local.getMessage());
  }

  @Test
  @DisplayName("a duplicate key is refused")
  void duplicateKey() {
    ImportException e = assertThrows(ImportException.class, () -> ImportProfiles.parse("layout: wide\nlayout: long\n", "p.yaml"));
    assertEquals("p.yaml:2:1: layout: duplicate key", e.getMessage());
  }
}
