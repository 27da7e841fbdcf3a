package org.quantrun.core.yaml;

import java.util.ArrayDeque;
import java.util.Collections;
import java.util.Deque;
import java.util.IdentityHashMap;
import java.util.List;
import java.util.Optional;
import java.util.Set;
import org.yaml.snakeyaml.error.Mark;
import org.yaml.snakeyaml.nodes.MappingNode;
import org.yaml.snakeyaml.nodes.Node;
import org.yaml.snakeyaml.nodes.NodeTuple;
import org.yaml.snakeyaml.nodes.ScalarNode;
import org.yaml.snakeyaml.nodes.SequenceNode;

/**
 * Finds the first node of a composed YAML tree that a configuration reader must refuse: a scalar
 * longer than a limit, or an alias that refers to a mapping or list containing it (a recursive
 * structure, which a reader walking the tree would follow forever). Each node is visited once, so
 * aliases cost nothing extra.
 *
 * <pre>{@code
 * Optional<NodeLimits.Violation> v = NodeLimits.check(root, 16 * 1024);
 * }</pre>
 */
public final class NodeLimits {

  /**
   * What is wrong, and where.
   *
   * @param mark where the node starts (SnakeYAML's 0-based line and column)
   * @param path the key path of the node, e.g. {@code analytes[2].name}; empty at the top
   * @param problem what is wrong, for the technician
   */
  public record Violation(Mark mark, String path, String problem) {}

  private NodeLimits() {}

  /**
   * Checks a tree.
   *
   * @param root the composed root node
   * @param maxScalarCharacters the longest scalar (key or value) accepted
   * @return the first violation in file order, or empty
   */
  public static Optional<Violation> check(Node root, int maxScalarCharacters) {
    Set<Node> done = Collections.newSetFromMap(new IdentityHashMap<>());
    Set<Node> open = Collections.newSetFromMap(new IdentityHashMap<>());
    Deque<Frame> stack = new ArrayDeque<>();
    stack.push(new Frame(root, ""));
    while (!stack.isEmpty()) {
      Frame f = stack.peek();
      if (f.children == null) {
        if (done.contains(f.node)) {
          stack.pop();
          continue;
        }
        if (f.node instanceof ScalarNode s) {
          stack.pop();
          done.add(s);
          if (s.getValue().length() > maxScalarCharacters) {
            return Optional.of(new Violation(s.getStartMark(), f.path,
                "the value is longer than " + maxScalarCharacters + " characters"));
          }
          continue;
        }
        open.add(f.node);
        f.children = children(f);
      }
      if (f.next < f.children.size()) {
        Frame child = f.children.get(f.next++);
        if (open.contains(child.node)) {
          return Optional.of(new Violation(child.node.getStartMark(), child.path,
              "an alias refers to the mapping or list that contains it (the structure refers to itself)"));
        }
        stack.push(child);
      } else {
        stack.pop();
        open.remove(f.node);
        done.add(f.node);
      }
    }
    return Optional.empty();
  }

  private static List<Frame> children(Frame f) {
    if (f.node instanceof SequenceNode s) {
      List<Node> items = s.getValue();
      Frame[] out = new Frame[items.size()];
      for (int i = 0; i < out.length; i++) {
        out[i] = new Frame(items.get(i), f.path + "[" + i + "]");
      }
      return List.of(out);
    }
    if (f.node instanceof MappingNode m) {
      List<NodeTuple> tuples = m.getValue();
      Frame[] out = new Frame[tuples.size() * 2];
      for (int i = 0; i < tuples.size(); i++) {
        Node k = tuples.get(i).getKeyNode();
        String name = k instanceof ScalarNode sk && sk.getValue().length() <= 200 ? sk.getValue() : "?";
        String path = f.path.isEmpty() ? name : f.path + "." + name;
        out[2 * i] = new Frame(k, path);
        out[2 * i + 1] = new Frame(tuples.get(i).getValueNode(), path);
      }
      return List.of(out);
    }
    return List.of();
  }

  /** A node on the walk, with the index of its next child. */
  private static final class Frame {
    final Node node;
    final String path;
    List<Frame> children;
    int next;

    Frame(Node node, String path) {
      this.node = node;
      this.path = path;
    }
  }
}
