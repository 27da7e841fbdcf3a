package org.quantrun.core.method;

import com.networknt.schema.InputFormat;
import com.networknt.schema.Schema;
import com.networknt.schema.SchemaRegistry;
import com.networknt.schema.SpecificationVersion;
import java.util.ArrayList;
import java.util.Iterator;
import java.util.List;
import java.util.Map;
import java.util.TreeMap;
import tools.jackson.databind.JsonNode;
import tools.jackson.databind.ObjectMapper;

/** The method-file JSON Schema of config-examples, and a walk over its keys. */
final class SchemaSupport {
  private SchemaSupport() {}

  static String schemaText() {
    return Fixtures.read(Fixtures.examples().resolve("method.schema.json"));
  }

  private static Schema cached;

  static synchronized Schema schema() {
    if (cached == null) {
      cached = SchemaRegistry.withDefaultDialect(SpecificationVersion.DRAFT_2020_12).getSchema(schemaText(), InputFormat.JSON);
    }
    return cached;
  }

  /** Schema errors of a YAML method text, as messages. */
  static List<String> errors(String yaml) {
    return schema().validate(yaml, InputFormat.YAML).stream().map(com.networknt.schema.Error::toString).toList();
  }

  /**
   * Every mapping of fixed keys the schema describes, by key path ({@code []} for list items),
   * with its keys in schema order.
   */
  static Map<String, List<String>> fixedKeyMappings() {
    JsonNode root = new ObjectMapper().readTree(schemaText());
    Map<String, List<String>> out = new TreeMap<>();
    walk(root, root, "", out);
    return out;
  }

  private static void walk(JsonNode root, JsonNode node, String path, Map<String, List<String>> out) {
    JsonNode n = resolve(root, node);
    if (n.has("properties")) {
      List<String> keys = new ArrayList<>();
      Iterator<Map.Entry<String, JsonNode>> it = n.get("properties").properties().iterator();
      while (it.hasNext()) {
        Map.Entry<String, JsonNode> e = it.next();
        keys.add(e.getKey());
        walk(root, e.getValue(), path.isEmpty() ? e.getKey() : path + "." + e.getKey(), out);
      }
      out.put(path, keys);
    }
    if (n.has("items")) {
      walk(root, n.get("items"), path + "[]", out);
    }
  }

  private static JsonNode resolve(JsonNode root, JsonNode node) {
    JsonNode n = node;
    while (n.has("$ref")) {
      String ref = n.get("$ref").asString();
      n = root.at(ref.substring(1));
    }
    return n;
  }
}
