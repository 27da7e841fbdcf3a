package org.quantrun.core.method;

import java.util.ArrayList;
import java.util.Comparator;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import org.yaml.snakeyaml.error.Mark;
import org.yaml.snakeyaml.nodes.Node;

/** Collects the problems of one load, and remembers where each key path sits in the file. */
final class Problems {
  private final String source;
  private final List<MethodProblem> list = new ArrayList<>();
  private final Map<String, Mark> marks = new HashMap<>();

  Problems(String source) {
    this.source = source;
  }

  String source() {
    return source;
  }

  /** Remembers where the value of {@code path} is. */
  void remember(String path, Node node) {
    marks.putIfAbsent(path, node.getStartMark());
  }

  /** A problem at a node. */
  void add(Node node, String path, String message, String expected) {
    add(node.getStartMark(), path, message, expected);
  }

  void add(Mark mark, String path, String message, String expected) {
    int line = mark == null ? 0 : mark.getLine() + 1;
    int col = mark == null ? 0 : mark.getColumn() + 1;
    list.add(new MethodProblem(source, line, col, path, message, Optional.ofNullable(expected)));
  }

  /** A problem of the whole file. */
  void file(String message, String expected) {
    list.add(new MethodProblem(source, 0, 0, "", message, Optional.ofNullable(expected)));
  }

  /**
   * A problem at a remembered key path; when the path itself was never seen (a missing key), at
   * its nearest remembered parent.
   */
  void at(String path, String message, String expected) {
    String p = path;
    while (!p.isEmpty() && !marks.containsKey(p)) {
      p = parent(p);
    }
    add(marks.get(p), path, message, expected);
  }

  static String parent(String path) {
    int dot = path.lastIndexOf('.');
    int bracket = path.lastIndexOf('[');
    int cut = Math.max(dot, bracket);
    return cut <= 0 ? "" : path.substring(0, cut);
  }

  boolean knows(String path) {
    return marks.containsKey(path);
  }

  boolean isEmpty() {
    return list.isEmpty();
  }

  int size() {
    return list.size();
  }

  /** The problems in file order (whole-file problems first). */
  List<MethodProblem> sorted() {
    List<MethodProblem> copy = new ArrayList<>(list);
    copy.sort(Comparator.comparingInt(MethodProblem::line).thenComparingInt(MethodProblem::column));
    return copy;
  }
}
