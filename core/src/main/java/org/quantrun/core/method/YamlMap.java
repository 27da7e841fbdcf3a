package org.quantrun.core.method;

import java.math.BigDecimal;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.Set;
import java.util.stream.Collectors;
import org.quantrun.core.Token;
import org.yaml.snakeyaml.nodes.MappingNode;
import org.yaml.snakeyaml.nodes.Node;
import org.yaml.snakeyaml.nodes.NodeTuple;
import org.yaml.snakeyaml.nodes.ScalarNode;
import org.yaml.snakeyaml.nodes.SequenceNode;
import org.yaml.snakeyaml.nodes.Tag;

/**
 * A typed view of one YAML mapping of the method file. Every read records what is wrong in
 * {@link Problems} instead of throwing, and returns empty (or the default) so the walk goes on.
 */
final class YamlMap {

  /** An allowed numeric range; null ends are open. */
  record Bound(Double min, boolean minInclusive, Double max, boolean maxInclusive) {
    static final Bound ANY = new Bound(null, false, null, false);
    static final Bound POSITIVE = new Bound(0.0, false, null, false);
    static final Bound NOT_NEGATIVE = new Bound(0.0, true, null, false);
    static final Bound FRACTION = new Bound(0.0, false, 1.0, true);
    static final Bound AT_LEAST_ONE = new Bound(1.0, true, null, false);

    boolean accepts(double v) {
      return (min == null || (minInclusive ? v >= min : v > min)) && (max == null || (maxInclusive ? v <= max : v < max));
    }

    String describe(String what) {
      List<String> parts = new ArrayList<>();
      if (min != null) {
        parts.add((minInclusive ? ">= " : "> ") + fmt(min));
      }
      if (max != null) {
        parts.add((maxInclusive ? "<= " : "< ") + fmt(max));
      }
      return parts.isEmpty() ? what : what + " " + String.join(" and ", parts);
    }

    private static String fmt(double d) {
      return d == Math.rint(d) ? Long.toString((long) d) : Double.toString(d);
    }
  }

  private static final Set<String> PLAIN_TAGS = Set.of(
      Tag.STR.getValue(), Tag.INT.getValue(), Tag.FLOAT.getValue(), Tag.BOOL.getValue(), Tag.NULL.getValue(),
      Tag.MAP.getValue(), Tag.SEQ.getValue(), Tag.TIMESTAMP.getValue());

  private final String path;
  private final Problems problems;
  private final Map<String, Node> values = new LinkedHashMap<>();
  private final Map<String, Node> keys = new LinkedHashMap<>();
  private final Node node;

  private YamlMap(MappingNode node, String path, Problems problems, List<String> allowed) {
    this.node = node;
    this.path = path;
    this.problems = problems;
    for (NodeTuple t : node.getValue()) {
      Node k = t.getKeyNode();
      if (!(k instanceof ScalarNode sk) || isNull(k)) {
        problems.add(k, path, "a key must be a plain word", "a scalar key");
        continue;
      }
      String key = sk.getValue();
      if (Tag.MERGE.equals(k.getTag()) || "<<".equals(key)) {
        problems.add(k, join(key), "merge keys are not supported", "the keys written out");
        continue;
      }
      if (keys.containsKey(key)) {
        problems.add(k, join(key), "key appears twice (first at line " + (keys.get(key).getStartMark().getLine() + 1) + ")",
            "each key once");
        continue;
      }
      if (allowed != null && !allowed.contains(key)) {
        Optional<String> near = Suggestions.closest(key, allowed);
        problems.add(k, join(key), "unknown key" + near.map(n -> ", did you mean '" + n + "'?").orElse(""),
            "one of: " + String.join(", ", allowed));
        continue;
      }
      keys.put(key, k);
      values.put(key, t.getValueNode());
      problems.remember(join(key), t.getValueNode());
    }
  }

  /** Reads {@code node} as a mapping whose keys must be among {@code allowed} (null: any key). */
  static Optional<YamlMap> of(Node node, String path, Problems problems, List<String> allowed) {
    if (!plainTag(node, path, problems)) {
      return Optional.empty();
    }
    if (!(node instanceof MappingNode m)) {
      problems.add(node, path, "is " + describe(node), "a mapping of keys to values");
      return Optional.empty();
    }
    return Optional.of(new YamlMap(m, path, problems, allowed));
  }

  String path() {
    return path;
  }

  Node node() {
    return node;
  }

  String join(String key) {
    return path.isEmpty() ? key : path + "." + key;
  }

  boolean has(String key) {
    return values.containsKey(key);
  }

  /** The keys present, in file order. */
  List<String> keys() {
    return List.copyOf(values.keySet());
  }

  Optional<Node> node(String key) {
    return Optional.ofNullable(values.get(key));
  }

  Node keyNode(String key) {
    return keys.get(key);
  }

  /** A required key that is missing: reported at this mapping. */
  void missing(String key, String expected) {
    problems.add(node, join(key), "is missing", expected);
  }

  Optional<String> text(String key) {
    return node(key).flatMap(n -> text(n, join(key), problems));
  }

  String requiredText(String key, String expected) {
    if (!has(key)) {
      missing(key, expected);
      return "";
    }
    return text(key).orElse("");
  }

  Optional<Double> number(String key, Bound bound) {
    return node(key).flatMap(n -> number(n, join(key), bound, problems));
  }

  double number(String key, double fallback, Bound bound) {
    return number(key, bound).orElse(fallback);
  }

  Optional<Integer> integer(String key, int min, int max) {
    return node(key).flatMap(n -> integer(n, join(key), min, max, problems));
  }

  int integer(String key, int fallback, int min, int max) {
    return integer(key, min, max).orElse(fallback);
  }

  boolean bool(String key, boolean fallback) {
    Optional<Node> n = node(key);
    if (n.isEmpty()) {
      return fallback;
    }
    Optional<ScalarNode> s = scalar(n.get(), join(key), "true or false", problems);
    if (s.isEmpty()) {
      return fallback;
    }
    String v = s.get().getValue();
    if (Tag.BOOL.equals(s.get().getTag()) && (v.equals("true") || v.equals("false"))) {
      return v.equals("true");
    }
    problems.add(s.get(), join(key), "'" + v + "' is not a truth value", "true or false");
    return fallback;
  }

  <E extends Enum<E> & Token> Optional<E> token(String key, Class<E> type) {
    return node(key).flatMap(n -> token(n, join(key), type, problems));
  }

  <E extends Enum<E> & Token> E token(String key, Class<E> type, E fallback) {
    return token(key, type).orElse(fallback);
  }

  Optional<ConcentrationUnit> unit(String key, ConcentrationUnit.Dimension dimension) {
    return node(key).flatMap(n -> unit(n, join(key), dimension, problems));
  }

  /** A nested mapping with fixed keys; empty when absent or not a mapping. */
  Optional<YamlMap> map(String key, List<String> allowed) {
    return node(key).flatMap(n -> of(n, join(key), problems, allowed));
  }

  /** The items of a sequence; empty when absent or not a sequence. */
  List<Node> list(String key) {
    Optional<Node> n = node(key);
    if (n.isEmpty() || !plainTag(n.get(), join(key), problems)) {
      return List.of();
    }
    if (!(n.get() instanceof SequenceNode seq)) {
      problems.add(n.get(), join(key), "is " + describe(n.get()), "a list");
      return List.of();
    }
    for (int i = 0; i < seq.getValue().size(); i++) {
      problems.remember(join(key) + "[" + i + "]", seq.getValue().get(i));
    }
    return seq.getValue();
  }

  /** The items of a list that must each be a mapping with fixed keys; items that are not are reported and left out. */
  List<YamlMap> maps(String key, List<String> allowed) {
    List<YamlMap> out = new ArrayList<>();
    List<Node> items = list(key);
    for (int i = 0; i < items.size(); i++) {
      of(items.get(i), join(key) + "[" + i + "]", problems, allowed).ifPresent(out::add);
    }
    return out;
  }

  /** A list of words (e.g. analyte names). */
  List<String> words(String key) {
    List<String> out = new ArrayList<>();
    List<Node> items = list(key);
    for (int i = 0; i < items.size(); i++) {
      text(items.get(i), join(key) + "[" + i + "]", problems).ifPresent(out::add);
    }
    return out; // mutable on purpose: callers copy it into records
  }

  /** A mapping from free keys (names of our user's own) to numbers in {@code bound}. */
  Map<String, Double> numberMap(String key, Bound bound) {
    Map<String, Double> out = new LinkedHashMap<>();
    map(key, null).ifPresent(m -> {
      for (String k : m.keys()) {
        m.number(k, bound).ifPresent(v -> out.put(k, v));
      }
    });
    return out;
  }

  // ---- single nodes ----

  static boolean isNull(Node n) {
    return n instanceof ScalarNode && Tag.NULL.equals(n.getTag());
  }

  static boolean plainTag(Node n, String path, Problems problems) {
    if (!PLAIN_TAGS.contains(n.getTag().getValue())) {
      problems.add(n, path, "explicit type tag '" + n.getTag().getValue() + "' is not allowed", "a plain value");
      return false;
    }
    return true;
  }

  static String describe(Node n) {
    if (n instanceof MappingNode) {
      return "a mapping";
    }
    if (n instanceof SequenceNode) {
      return "a list";
    }
    if (isNull(n)) {
      return "empty";
    }
    return "'" + ((ScalarNode) n).getValue() + "'";
  }

  static Optional<ScalarNode> scalar(Node n, String path, String expected, Problems problems) {
    if (!plainTag(n, path, problems)) {
      return Optional.empty();
    }
    if (!(n instanceof ScalarNode s) || isNull(n)) {
      problems.add(n, path, isNull(n) ? "has no value" : "is " + describe(n), expected);
      return Optional.empty();
    }
    return Optional.of(s);
  }

  static Optional<String> text(Node n, String path, Problems problems) {
    Optional<String> v = scalar(n, path, "a text", problems).map(ScalarNode::getValue);
    if (v.isPresent() && v.get().isBlank()) {
      problems.add(n, path, "is blank", "a text");
      return Optional.empty();
    }
    return v;
  }

  static Optional<Double> number(Node n, String path, Bound bound, Problems problems) {
    String expected = bound.describe("a number");
    Optional<ScalarNode> s = scalar(n, path, expected, problems);
    if (s.isEmpty()) {
      return Optional.empty();
    }
    Tag tag = s.get().getTag();
    String v = s.get().getValue();
    double d;
    try {
      if (!Tag.INT.equals(tag) && !Tag.FLOAT.equals(tag)) {
        throw new NumberFormatException();
      }
      d = new BigDecimal(v.replace("_", "")).doubleValue();
    } catch (NumberFormatException e) {
      problems.add(n, path, "'" + v + "' is not a number", expected);
      return Optional.empty();
    }
    if (!Double.isFinite(d) || !bound.accepts(d)) {
      problems.add(n, path, "value " + v + " is out of range", expected);
      return Optional.empty();
    }
    return Optional.of(d);
  }

  static Optional<Integer> integer(Node n, String path, int min, int max, Problems problems) {
    String expected = "a whole number from " + min + " to " + max;
    Optional<ScalarNode> s = scalar(n, path, expected, problems);
    if (s.isEmpty()) {
      return Optional.empty();
    }
    String v = s.get().getValue().replace("_", "");
    try {
      if (!Tag.INT.equals(s.get().getTag())) {
        throw new NumberFormatException();
      }
      int i = Integer.parseInt(v);
      if (i < min || i > max) {
        problems.add(n, path, "value " + v + " is out of range", expected);
        return Optional.empty();
      }
      return Optional.of(i);
    } catch (NumberFormatException e) {
      problems.add(n, path, "'" + s.get().getValue() + "' is not a whole number", expected);
      return Optional.empty();
    }
  }

  static <E extends Enum<E> & Token> Optional<E> token(Node n, String path, Class<E> type, Problems problems) {
    List<String> words = Arrays.stream(type.getEnumConstants()).map(Token::token).toList();
    String expected = "one of: " + String.join(", ", words);
    Optional<ScalarNode> s = scalar(n, path, expected, problems);
    if (s.isEmpty()) {
      return Optional.empty();
    }
    String v = s.get().getValue();
    for (E e : type.getEnumConstants()) {
      if (e.token().equals(v)) {
        return Optional.of(e);
      }
    }
    Optional<String> near = Suggestions.closest(v, words);
    problems.add(n, path, "unknown value '" + v + "'" + near.map(w -> ", did you mean '" + w + "'?").orElse(""), expected);
    return Optional.empty();
  }

  static Optional<ConcentrationUnit> unit(Node n, String path, ConcentrationUnit.Dimension dimension, Problems problems) {
    List<String> words = ConcentrationUnit.of(dimension).stream().map(ConcentrationUnit::token).toList();
    String expected = "one of: " + String.join(", ", words);
    Optional<String> v = text(n, path, problems);
    if (v.isEmpty()) {
      return Optional.empty();
    }
    Optional<ConcentrationUnit> u = ConcentrationUnit.of(v.get());
    if (u.isPresent() && u.get().dimension() == dimension) {
      return u;
    }
    String why = u.isPresent()
        ? "unit '" + v.get() + "' is " + (dimension == ConcentrationUnit.Dimension.PER_VOLUME ? "per mass of sample, not per volume of solution" : "per volume of solution, not per mass of sample")
        : "unknown unit '" + v.get() + "'" + Suggestions.closest(v.get(), words).map(w -> ", did you mean '" + w + "'?").orElse("");
    problems.add(n, path, why, expected);
    return Optional.empty();
  }

  /** Joins names for messages. */
  static String names(List<String> names) {
    return names.stream().collect(Collectors.joining(", "));
  }
}
