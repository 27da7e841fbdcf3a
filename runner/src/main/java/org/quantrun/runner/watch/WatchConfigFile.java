package org.quantrun.runner.watch;

import java.io.IOException;
import java.nio.charset.CharacterCodingException;
import java.nio.charset.CodingErrorAction;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.Duration;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Optional;
import java.util.Set;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
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
 * Reads a watch configuration (YAML, safe loading through the node API: no tags, few aliases,
 * limited nesting and size, no duplicate keys). Paths in it are relative to the file's folder.
 * Every problem names {@code file:line:column}, the key, and what was expected. See {@code
 * config-examples/watch.yaml}.
 */
final class WatchConfigFile {
  private static final Set<String> TOP = Set.of("inbox", "out", "archive", "failed", "state", "quiet-period", "marker",
      "marker-only", "ignore", "poll-interval", "change-events", "workers", "reprocess", "status-interval", "log-max-size",
      "log-files", "routes");
  private static final Set<String> ROUTE = Set.of("folder", "pattern", "method", "profile", "prep");
  private static final Pattern DURATION = Pattern.compile("(\\d+(?:\\.\\d+)?)\\s*(ms|s|min|m|h)?");
  private static final Pattern SIZE = Pattern.compile("(\\d+)\\s*(B|KB|MB|GB)?", Pattern.CASE_INSENSITIVE);

  private final String name;
  private final Path base;
  private final List<String> problems = new ArrayList<>();

  private WatchConfigFile(String name, Path base) {
    this.name = name;
    this.base = base;
  }

  /**
   * Reads a configuration file into a draft.
   *
   * @param file the file
   * @param draft the draft to fill in
   * @throws WatchConfigException naming every problem
   */
  static void read(Path file, WatchDraft draft) throws WatchConfigException {
    String name = file.getFileName() == null ? file.toString() : file.getFileName().toString();
    String text;
    try {
      text = StandardCharsets.UTF_8.newDecoder().onMalformedInput(CodingErrorAction.REPORT)
          .decode(java.nio.ByteBuffer.wrap(Files.readAllBytes(file))).toString();
    } catch (CharacterCodingException e) {
      throw new WatchConfigException(name + ": the file is not UTF-8 text (expected a UTF-8 YAML watch configuration)");
    } catch (IOException e) {
      throw new WatchConfigException(file + ": the watch configuration cannot be read ("
          + (e instanceof java.nio.file.NoSuchFileException ? "no such file" : e.getMessage()) + ")");
    }
    new WatchConfigFile(name, file.toAbsolutePath().getParent()).parse(text, draft);
  }

  private void parse(String text, WatchDraft d) throws WatchConfigException {
    LoaderOptions options = new LoaderOptions();
    options.setAllowDuplicateKeys(false);
    options.setMaxAliasesForCollections(20);
    options.setNestingDepthLimit(10);
    options.setCodePointLimit(256 * 1024);
    Node root;
    try {
      root = new Yaml(new SafeConstructor(options)).compose(new java.io.StringReader(text));
    } catch (MarkedYAMLException e) {
      Mark m = e.getProblemMark() != null ? e.getProblemMark() : e.getContextMark();
      throw new WatchConfigException(at(m) + "not valid YAML: " + (e.getProblem() != null ? e.getProblem() : e.getMessage()).strip());
    } catch (YAMLException e) {
      throw new WatchConfigException(name + ": not a usable YAML file: " + e.getMessage());
    }
    if (!(root instanceof MappingNode top)) {
      throw new WatchConfigException(name + ": expected a mapping of keys to values at the top");
    }
    for (NodeTuple t : top.getValue()) {
      String key = key(t, "");
      if (key == null) {
        continue;
      }
      Node v = t.getValueNode();
      switch (key) {
        case "inbox" -> path(v, key).ifPresent(p -> d.inbox = p);
        case "out" -> path(v, key).ifPresent(p -> d.out = p);
        case "archive" -> path(v, key).ifPresent(p -> d.archive = p);
        case "failed" -> path(v, key).ifPresent(p -> d.failed = p);
        case "state" -> path(v, key).ifPresent(p -> d.state = p);
        case "quiet-period" -> duration(v, key).ifPresent(x -> d.quiet = x);
        case "poll-interval" -> duration(v, key).ifPresent(x -> d.poll = x);
        case "status-interval" -> duration(v, key).ifPresent(x -> d.statusInterval = x);
        case "marker" -> text(v, key).ifPresent(x -> d.marker = x);
        case "marker-only" -> bool(v, key).ifPresent(x -> d.markerOnly = x);
        case "change-events" -> bool(v, key).ifPresent(x -> d.changeEvents = x);
        case "reprocess" -> bool(v, key).ifPresent(x -> d.reprocess = x);
        case "workers" -> count(v, key).ifPresent(x -> d.workers = x);
        case "log-files" -> count(v, key).ifPresent(x -> d.logFiles = x);
        case "log-max-size" -> size(v, key).ifPresent(x -> d.logMaxBytes = x);
        case "ignore" -> texts(v, key).ifPresent(x -> d.ignore = x);
        case "routes" -> routes(v, d);
        default -> { }
      }
    }
    if (!problems.isEmpty()) {
      throw new WatchConfigException(problems);
    }
  }

  private void routes(Node v, WatchDraft d) {
    if (!(v instanceof SequenceNode seq) || seq.getValue().isEmpty()) {
      problem(v, "routes", "expected a list of routes, each with a method (and a folder or pattern)");
      return;
    }
    List<Route> routes = new ArrayList<>();
    for (int i = 0; i < seq.getValue().size(); i++) {
      Node item = seq.getValue().get(i);
      String path = "routes[" + i + "]";
      if (!(item instanceof MappingNode m)) {
        problem(item, path, "expected a mapping with method, and folder or pattern");
        continue;
      }
      Optional<String> folder = Optional.empty();
      String pattern = "*";
      Optional<Path> method = Optional.empty();
      Optional<Path> profile = Optional.empty();
      Optional<Path> prep = Optional.empty();
      for (NodeTuple t : m.getValue()) {
        String key = key(t, path);
        if (key == null) {
          continue;
        }
        Node val = t.getValueNode();
        String kp = path + "." + key;
        switch (key) {
          case "folder" -> folder = text(val, kp);
          case "pattern" -> {
            Optional<String> g = text(val, kp);
            if (g.isPresent()) {
              try {
                java.nio.file.FileSystems.getDefault().getPathMatcher("glob:" + g.get());
                pattern = g.get();
              } catch (RuntimeException e) {
                problem(val, kp, "not a usable file-name pattern (" + e.getMessage() + "); expected a glob such as *.csv");
              }
            }
          }
          case "method" -> method = path(val, kp);
          case "profile" -> profile = path(val, kp);
          case "prep" -> prep = path(val, kp);
          default -> { }
        }
      }
      if (method.isEmpty()) {
        problem(item, path, "a route needs a method (the method file that processes its files)");
        continue;
      }
      String label = folder.map(f -> "folder " + (f.isEmpty() ? "." : f)).orElse("") + (pattern.equals("*") ? ""
          : (folder.isPresent() ? ", " : "") + "pattern " + pattern);
      routes.add(new Route(label.isEmpty() ? path : label, folder, pattern, method.get(), profile, prep));
    }
    d.routes = routes;
  }

  // ---- scalars ----

  private String key(NodeTuple t, String parent) {
    if (!(t.getKeyNode() instanceof ScalarNode k)) {
      problem(t.getKeyNode(), parent, "keys must be plain texts");
      return null;
    }
    Set<String> allowed = parent.isEmpty() ? TOP : ROUTE;
    String path = parent.isEmpty() ? k.getValue() : parent + "." + k.getValue();
    if (!allowed.contains(k.getValue())) {
      problem(k, path, "unknown key (expected one of: " + String.join(", ", allowed.stream().sorted().toList()) + ")");
      return null;
    }
    return k.getValue();
  }

  private Optional<String> text(Node v, String key) {
    if (v instanceof ScalarNode s && !Tag.NULL.equals(s.getTag()) && plainTag(s)) {
      return Optional.of(s.getValue());
    }
    problem(v, key, "expected a text");
    return Optional.empty();
  }

  private boolean plainTag(ScalarNode s) {
    Tag t = s.getTag();
    return Tag.STR.equals(t) || Tag.INT.equals(t) || Tag.FLOAT.equals(t) || Tag.BOOL.equals(t);
  }

  private Optional<List<String>> texts(Node v, String key) {
    if (v instanceof SequenceNode seq) {
      List<String> out = new ArrayList<>();
      for (int i = 0; i < seq.getValue().size(); i++) {
        text(seq.getValue().get(i), key + "[" + i + "]").ifPresent(out::add);
      }
      return Optional.of(out);
    }
    return text(v, key).map(List::of);
  }

  private Optional<Path> path(Node v, String key) {
    return text(v, key).map(t -> base.resolve(t).normalize());
  }

  private Optional<Boolean> bool(Node v, String key) {
    if (v instanceof ScalarNode s && Tag.BOOL.equals(s.getTag())) {
      String t = s.getValue().toLowerCase(Locale.ROOT);
      return Optional.of(t.equals("true") || t.equals("yes") || t.equals("on"));
    }
    problem(v, key, "expected true or false");
    return Optional.empty();
  }

  private Optional<Integer> count(Node v, String key) {
    if (v instanceof ScalarNode s && Tag.INT.equals(s.getTag())) {
      try {
        int n = Integer.parseInt(s.getValue().replace("_", ""));
        if (n >= 1) {
          return Optional.of(n);
        }
      } catch (NumberFormatException e) {
        // reported below
      }
    }
    problem(v, key, "expected a whole number of at least 1");
    return Optional.empty();
  }

  private Optional<Duration> duration(Node v, String key) {
    Optional<String> t = v instanceof ScalarNode s && plainTag(s) ? Optional.of(s.getValue()) : Optional.empty();
    Optional<Duration> d = t.flatMap(WatchConfigFile::parseDuration);
    if (d.isEmpty()) {
      problem(v, key, "expected a duration such as 2s, 500ms or 1min");
    }
    return d;
  }

  private Optional<Long> size(Node v, String key) {
    Optional<Long> n = v instanceof ScalarNode s && plainTag(s) ? parseSize(s.getValue()) : Optional.empty();
    if (n.isEmpty()) {
      problem(v, key, "expected a size such as 10MB, 512KB or 1GB");
    }
    return n;
  }

  /**
   * Reads a duration: a number with {@code ms}, {@code s}, {@code min} (or {@code m}) or {@code h}; a bare number is seconds.
   *
   * @param text the text
   * @return the duration, if the text is one and it is positive
   */
  static Optional<Duration> parseDuration(String text) {
    Matcher m = DURATION.matcher(text.strip());
    if (!m.matches()) {
      return Optional.empty();
    }
    double n = Double.parseDouble(m.group(1));
    String unit = m.group(2) == null ? "s" : m.group(2);
    double ms = switch (unit) {
      case "ms" -> n;
      case "s" -> n * 1000;
      case "m", "min" -> n * 60_000;
      default -> n * 3_600_000;
    };
    return ms <= 0 || ms > 7 * 24 * 3_600_000.0 ? Optional.empty() : Optional.of(Duration.ofNanos((long) (ms * 1_000_000)));
  }

  /**
   * Reads a size in bytes: a number with {@code B}, {@code KB}, {@code MB} or {@code GB} (powers of 1024).
   *
   * @param text the text
   * @return the size, if the text is one and it is at least 1 KB
   */
  static Optional<Long> parseSize(String text) {
    Matcher m = SIZE.matcher(text.strip());
    if (!m.matches()) {
      return Optional.empty();
    }
    long n;
    try {
      n = Long.parseLong(m.group(1));
    } catch (NumberFormatException e) {
      return Optional.empty();
    }
    String unit = m.group(2) == null ? "B" : m.group(2).toUpperCase(Locale.ROOT);
    long mult = switch (unit) {
      case "KB" -> 1024L;
      case "MB" -> 1024L * 1024;
      case "GB" -> 1024L * 1024 * 1024;
      default -> 1L;
    };
    long bytes = n * mult;
    return bytes < 1024 || bytes / mult != n ? Optional.empty() : Optional.of(bytes);
  }

  private void problem(Node n, String key, String what) {
    problems.add(at(n == null ? null : n.getStartMark()) + key + ": " + what);
  }

  private String at(Mark m) {
    return m == null ? name + ": " : name + ":" + (m.getLine() + 1) + ":" + (m.getColumn() + 1) + ": ";
  }
}
