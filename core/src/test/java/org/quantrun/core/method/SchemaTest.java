package org.quantrun.core.method;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.TreeMap;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import java.util.stream.Stream;
import org.junit.jupiter.api.DisplayName;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.MethodSource;

class SchemaTest {

  static Stream<Path> examples() {
    return Fixtures.exampleMethods().stream();
  }

  @DisplayName("every example method validates against the JSON Schema")
  @ParameterizedTest(name = "{0}")
  @MethodSource("examples")
  void everyExampleValidatesAgainstTheSchema(Path file) {
    List<String> errors = SchemaSupport.errors(Fixtures.read(file));
    assertEquals(List.of(), errors, file.getFileName().toString());
  }

  @Test
  @DisplayName("the schema itself is valid against the JSON Schema 2020-12 meta-schema")
  void schemaIsValidJsonSchema() {
    // the meta-schema is published by json-schema.org; the validator ships a copy, so no network is used
    var meta = com.networknt.schema.SchemaRegistry.withDefaultDialect(com.networknt.schema.SpecificationVersion.DRAFT_2020_12)
        .getSchema(com.networknt.schema.SchemaLocation.of("https://json-schema.org/draft/2020-12/schema"));
    assertEquals(List.of(), meta.validate(SchemaSupport.schemaText(), com.networknt.schema.InputFormat.JSON));
  }

  @Test
  @DisplayName("the test base method validates against the JSON Schema")
  void theBaseMethodValidates() {
    assertEquals(List.of(), SchemaSupport.errors(Fixtures.resource("base-method.yaml")));
  }

  @Test
  @DisplayName("the schema and the loader accept exactly the same keys in every mapping")
  void schemaAndLoaderAgreeOnKeys() {
    Map<String, List<String>> schema = SchemaSupport.fixedKeyMappings();
    Map<String, List<String>> loader = new TreeMap<>(MethodReader.KEYS);
    assertEquals(loader.keySet(), schema.keySet(), "mappings with fixed keys");
    for (String path : loader.keySet()) {
      assertEquals(List.copyOf(new java.util.TreeSet<>(loader.get(path))), List.copyOf(new java.util.TreeSet<>(schema.get(path))),
          "keys of '" + path + "'");
    }
  }

  @Test
  @DisplayName("the method reference mentions every key path of the schema")
  void referenceMentionsEverySchemaKey() {
    String reference = Fixtures.read(Fixtures.examples().resolve("METHOD-REFERENCE.md"));
    List<String> missing = new ArrayList<>();
    SchemaSupport.fixedKeyMappings().forEach((path, keys) -> {
      for (String k : keys) {
        String full = path.isEmpty() ? k : path + "." + k;
        if (!reference.contains("`" + full + "`")) {
          missing.add(full);
        }
      }
    });
    assertEquals(List.of(), missing, "key paths the reference does not mention as `path`");
  }

  @Test
  @DisplayName("the reference mentions no key path that the schema does not have")
  void referenceMentionsNoStaleKey() {
    String reference = Fixtures.read(Fixtures.examples().resolve("METHOD-REFERENCE.md"));
    List<String> known = new ArrayList<>();
    SchemaSupport.fixedKeyMappings().forEach((path, keys) -> keys.forEach(k -> known.add(path.isEmpty() ? k : path + "." + k)));
    // key paths in the reference's tables are written `a.b.c` or `a[].b` in the first column
    Matcher m = Pattern.compile("(?m)^\\| `([a-z0-9\\[\\].-]+)` \\|").matcher(reference);
    List<String> stale = new ArrayList<>();
    while (m.find()) {
      if (!known.contains(m.group(1))) {
        stale.add(m.group(1));
      }
    }
    assertTrue(stale.isEmpty(), "reference rows for keys the schema lacks: " + stale);
  }
}
