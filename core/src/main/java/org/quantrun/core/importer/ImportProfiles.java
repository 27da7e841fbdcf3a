package org.quantrun.core.importer;

import java.io.Reader;
import java.io.StringReader;
import java.util.ArrayList;
import java.util.HashMap;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import org.quantrun.core.yaml.NodeLimits;
import org.yaml.snakeyaml.LoaderOptions;
import org.yaml.snakeyaml.Yaml;
import org.yaml.snakeyaml.constructor.SafeConstructor;
import org.yaml.snakeyaml.error.Mark;
import org.yaml.snakeyaml.error.MarkedYAMLException;
import org.yaml.snakeyaml.error.YAMLException;
import org.yaml.snakeyaml.nodes.MappingNode;
import org.yaml.snakeyaml.nodes.Node;
import org.yaml.snakeyaml.nodes.NodeTuple;
import org.yaml.snakeyaml.nodes.ScalarNode;
import org.yaml.snakeyaml.nodes.SequenceNode;
import org.yaml.snakeyaml.nodes.Tag;

/**
 * Loads YAML import profiles: one export variant described as data (see
 * {@link ImportSettings#fromMap} for the keys). Safe loading only, through the node API: no
 * custom tags, at most {@value #MAX_ALIASES} aliases, nesting at most {@value #MAX_DEPTH} deep,
 * at most {@value #MAX_CODE_POINTS} characters, values of at most {@value #MAX_SCALAR_CHARACTERS}
 * characters, no recursive aliases, no duplicate keys. Every error names
 * {@code file:line:col} and the key.
 */
public final class ImportProfiles {

  /** Largest profile accepted, in characters. */
  public static final int MAX_CODE_POINTS = 256 * 1024;
  /** Most aliases accepted. */
  public static final int MAX_ALIASES = 20;
  /** Deepest nesting accepted. */
  public static final int MAX_DEPTH = 10;
  /** Longest single value (or key) accepted, in characters. */
  public static final int MAX_SCALAR_CHARACTERS = 16 * 1024;

  private static final java.util.Set<Tag> STANDARD_TAGS =
      java.util.Set.of(Tag.MAP, Tag.SEQ, Tag.STR, Tag.INT, Tag.BOOL, Tag.NULL, Tag.FLOAT);

  private ImportProfiles() {}

  /**
   * Parses a profile.
   *
   * @param yaml the profile text
   * @param sourceName its file name, for messages
   * @return the settings
   * @throws ImportException for a YAML error or a bad key or value, naming line, column and key
   */
  public static ImportSettings parse(String yaml, String sourceName) throws ImportException {
    return parse(new StringReader(yaml), sourceName);
  }

  /**
   * Parses a profile from a reader (read to the end, not closed).
   *
   * @param yaml the profile text
   * @param sourceName its file name, for messages
   * @return the settings
   * @throws ImportException for a YAML error or a bad key or value, naming line, column and key
   */
  public static ImportSettings parse(Reader yaml, String sourceName) throws ImportException {
    LoaderOptions options = new LoaderOptions();
    options.setAllowDuplicateKeys(false);
    options.setMaxAliasesForCollections(MAX_ALIASES);
    options.setAllowRecursiveKeys(false);
    options.setNestingDepthLimit(MAX_DEPTH);
    options.setCodePointLimit(MAX_CODE_POINTS);
    Yaml parser = new Yaml(new SafeConstructor(options));
    Node root;
    try {
      root = parser.compose(yaml);
    } catch (MarkedYAMLException e) {
      Mark m = e.getProblemMark() != null ? e.getProblemMark() : e.getContextMark();
      String what = e.getProblem() != null ? e.getProblem() : e.getMessage();
      throw new ImportException(sourceName, position(m), "not valid YAML: " + what.strip(), e);
    } catch (YAMLException e) {
      throw new ImportException(sourceName, SourcePosition.UNKNOWN, refusal(e.getMessage()), e);
    } catch (IllegalArgumentException e) {
      // SnakeYAML refuses some malformed tags (e.g. "!%1") this way rather than with a YAMLException
      throw new ImportException(sourceName, SourcePosition.UNKNOWN, "not valid YAML: " + e.getMessage(), e);
    }
    if (root == null) {
      throw new ImportException(sourceName, SourcePosition.UNKNOWN, "the profile is empty");
    }
    Optional<NodeLimits.Violation> v = NodeLimits.check(root, MAX_SCALAR_CHARACTERS);
    if (v.isPresent()) {
      throw new ImportException(sourceName, position(v.get().mark()),
          (v.get().path().isEmpty() ? "" : v.get().path() + ": ") + v.get().problem());
    }
    Map<String, SourcePosition> positions = new HashMap<>();
    Object value = plain(root, "", positions, sourceName);
    if (!(value instanceof Map<?, ?>)) {
      throw new ImportException(sourceName, position(root.getStartMark()), "expected a mapping of keys to values at the top");
    }
    @SuppressWarnings("unchecked")
    Map<String, ?> map = (Map<String, ?>) value;
    return ImportSettings.fromMap(map, sourceName, k -> positions.getOrDefault(k, SourcePosition.UNKNOWN));
  }

  /** SnakeYAML's limit messages in the technician's words. */
  private static String refusal(String message) {
    String m = message == null ? "" : message;
    String lower = m.toLowerCase(java.util.Locale.ROOT);
    if (lower.contains("aliases")) {
      return "the profile uses more than " + MAX_ALIASES + " aliases to mappings or lists and is refused (possible alias bomb)";
    }
    if (lower.contains("nesting")) {
      return "the profile nests deeper than " + MAX_DEPTH + " levels and is refused";
    }
    if (lower.contains("code points")) {
      return "the profile is larger than " + MAX_CODE_POINTS / 1024 + " KiB and is refused";
    }
    return "not a usable YAML profile: " + m;
  }

  private static SourcePosition position(Mark m) {
    return m == null ? SourcePosition.UNKNOWN : new SourcePosition(m.getLine() + 1, m.getColumn() + 1);
  }

  private static Object plain(Node node, String path, Map<String, SourcePosition> positions, String source)
      throws ImportException {
    positions.putIfAbsent(path, position(node.getStartMark()));
    if (!STANDARD_TAGS.contains(node.getTag())) {
      throw new ImportException(source, position(node.getStartMark()),
          (path.isEmpty() ? "" : path + ": ") + "YAML tags are not allowed (found " + node.getTag().getValue() + ")");
    }
    if (node instanceof MappingNode m) {
      Map<String, Object> out = new LinkedHashMap<>();
      for (NodeTuple t : m.getValue()) {
        if (!(t.getKeyNode() instanceof ScalarNode k)) {
          throw new ImportException(source, position(t.getKeyNode().getStartMark()), path + ": keys must be plain texts");
        }
        String childPath = path.isEmpty() ? k.getValue() : path + "." + k.getValue();
        if (out.containsKey(k.getValue())) {
          throw new ImportException(source, position(k.getStartMark()), childPath + ": duplicate key");
        }
        positions.put(childPath, position(k.getStartMark()));
        out.put(k.getValue(), plain(t.getValueNode(), childPath, positions, source));
      }
      return out;
    }
    if (node instanceof SequenceNode s) {
      List<Object> out = new ArrayList<>();
      List<Node> items = s.getValue();
      for (int i = 0; i < items.size(); i++) {
        out.add(plain(items.get(i), path + "[" + i + "]", positions, source));
      }
      return out;
    }
    ScalarNode sc = (ScalarNode) node;
    Tag tag = sc.getTag();
    String v = sc.getValue();
    try {
      if (Tag.INT.equals(tag)) {
        return Integer.valueOf(v.replace("_", ""));
      }
      if (Tag.BOOL.equals(tag)) {
        return Boolean.valueOf(v.equalsIgnoreCase("true") || v.equalsIgnoreCase("yes") || v.equalsIgnoreCase("on"));
      }
      if (Tag.NULL.equals(tag)) {
        throw new ImportException(source, position(sc.getStartMark()), path + ": a value is required");
      }
    } catch (NumberFormatException e) {
      throw new ImportException(source, position(sc.getStartMark()), path + ": number out of range '" + v + "'");
    }
    return v;
  }
}
