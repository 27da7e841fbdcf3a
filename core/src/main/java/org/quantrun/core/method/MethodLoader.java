package org.quantrun.core.method;

import java.io.IOException;
import java.io.Reader;
import java.io.StringReader;
import java.util.Optional;
import org.quantrun.core.yaml.NodeLimits;
import org.yaml.snakeyaml.DumperOptions;
import org.yaml.snakeyaml.LoaderOptions;
import org.yaml.snakeyaml.Yaml;
import org.yaml.snakeyaml.constructor.SafeConstructor;
import org.yaml.snakeyaml.error.MarkedYAMLException;
import org.yaml.snakeyaml.error.YAMLException;
import org.yaml.snakeyaml.nodes.Node;
import org.yaml.snakeyaml.representer.Representer;

/**
 * Loads and validates a method file (YAML). The text is composed into SnakeYAML's node tree
 * only: no Java object is ever constructed from it, explicit type tags are refused, and the size,
 * nesting depth, alias count and length of each value are limited, and recursive aliases refused,
 * so a hostile file is refused with a message. Every
 * problem is collected in one pass and thrown together in one {@link MethodException}.
 *
 * <pre>{@code
 * Method m = MethodLoader.load(Files.readString(path), path.getFileName().toString());
 * }</pre>
 */
public final class MethodLoader {

  /** The largest method file accepted, in characters (1 MiB). */
  public static final int MAX_CHARACTERS = 1 << 20;
  /** The deepest nesting of mappings and lists accepted. */
  public static final int MAX_NESTING_DEPTH = 32;
  /** The most aliases to mappings or lists accepted in one file. */
  public static final int MAX_COLLECTION_ALIASES = 20;
  /** The longest single value (or key) accepted, in characters. */
  public static final int MAX_SCALAR_CHARACTERS = 16 * 1024;

  private MethodLoader() {}

  /**
   * Loads a method from its text.
   *
   * @param text the whole YAML text of the method file
   * @param sourceName the file name to show in messages, e.g. {@code dw-metals.yaml}
   * @return the validated method
   * @throws MethodException listing every problem found, when the method cannot be used
   */
  public static Method load(String text, String sourceName) throws MethodException {
    Problems problems = new Problems(sourceName);
    if (text.length() > MAX_CHARACTERS) {
      problems.file("the file is larger than " + MAX_CHARACTERS / 1024 + " KiB and is refused",
          "a method file under " + MAX_CHARACTERS / 1024 + " KiB");
      throw new MethodException(problems.sorted());
    }
    Optional<Node> root = compose(text, problems);
    if (root.isPresent()) {
      Optional<Method> method = new MethodReader(problems).read(root.get());
      if (method.isPresent() && problems.isEmpty()) {
        return method.get();
      }
    }
    if (problems.isEmpty()) {
      problems.file("the method could not be read", "a method file");
    }
    throw new MethodException(problems.sorted());
  }

  /**
   * Loads a method from a reader, reading at most {@link #MAX_CHARACTERS} + 1 characters (a larger
   * input is refused without reading the rest). The caller closes the reader.
   *
   * @param reader the YAML text
   * @param sourceName the file name to show in messages
   * @return the validated method
   * @throws MethodException listing every problem found, when the method cannot be used
   * @throws IOException when the reader fails
   */
  public static Method load(Reader reader, String sourceName) throws MethodException, IOException {
    StringBuilder sb = new StringBuilder();
    char[] buf = new char[8192];
    int n;
    while ((n = reader.read(buf)) >= 0) {
      sb.append(buf, 0, n);
      if (sb.length() > MAX_CHARACTERS) {
        break;
      }
    }
    return load(sb.toString(), sourceName);
  }

  private static Optional<Node> compose(String text, Problems problems) {
    LoaderOptions options = new LoaderOptions();
    options.setAllowDuplicateKeys(false);
    options.setAllowRecursiveKeys(false);
    options.setMaxAliasesForCollections(MAX_COLLECTION_ALIASES);
    options.setNestingDepthLimit(MAX_NESTING_DEPTH);
    options.setCodePointLimit(MAX_CHARACTERS + 1);
    options.setTagInspector(tag -> false);
    options.setMergeOnCompose(false);
    Yaml yaml = new Yaml(new SafeConstructor(options), new Representer(new DumperOptions()), new DumperOptions(), options);
    try {
      Node root = yaml.compose(new StringReader(text));
      if (root == null) {
        problems.file("the file is empty", "a method: section and the others");
        return Optional.empty();
      }
      Optional<NodeLimits.Violation> v = NodeLimits.check(root, MAX_SCALAR_CHARACTERS);
      if (v.isPresent()) {
        problems.add(v.get().mark(), v.get().path(), v.get().problem(),
            "values of at most " + MAX_SCALAR_CHARACTERS + " characters; aliases only to whole mappings or lists");
        return Optional.empty();
      }
      return Optional.of(root);
    } catch (MarkedYAMLException e) {
      String problem = e.getProblem() == null ? "" : e.getProblem();
      if (problem.startsWith("Global tag is not allowed: ")) {
        problems.add(e.getProblemMark(), "", "explicit type tag '" + problem.substring("Global tag is not allowed: ".length())
            + "' is not allowed", "plain values; a method file never names Java types");
        return Optional.empty();
      }
      String what = e.getProblem() == null ? "is not valid YAML" : "is not valid YAML: " + e.getProblem();
      problems.add(e.getProblemMark() != null ? e.getProblemMark() : e.getContextMark(), "", what.trim(), "well-formed YAML");
      return Optional.empty();
    } catch (YAMLException e) {
      problems.file(refusal(e.getMessage()), "a plain method file within the loader's limits");
      return Optional.empty();
    } catch (IllegalArgumentException e) {
      // SnakeYAML refuses some malformed tags (e.g. "!%1") this way rather than with a YAMLException
      problems.file("is not valid YAML: " + e.getMessage(), "well-formed YAML without type tags");
      return Optional.empty();
    }
  }

  /** Turns SnakeYAML's limit messages into the technician's words. */
  private static String refusal(String message) {
    String m = message == null ? "" : message;
    if (m.contains("aliases")) {
      return "the file uses more than " + MAX_COLLECTION_ALIASES + " aliases to mappings or lists and is refused (possible alias bomb)";
    }
    if (m.toLowerCase(java.util.Locale.ROOT).contains("nesting")) {
      return "the file nests deeper than " + MAX_NESTING_DEPTH + " levels and is refused";
    }
    if (m.contains("code points")) {
      return "the file is larger than " + MAX_CHARACTERS / 1024 + " KiB and is refused";
    }
    if (m.toLowerCase(java.util.Locale.ROOT).contains("recursive")) {
      return "the file uses a recursive key and is refused";
    }
    return "the file cannot be read: " + m;
  }
}
