package org.quantrun.core.processing;

import java.util.EnumSet;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import org.quantrun.core.method.ResultFlag;

/**
 * Equal values of one run made once: the results of a run repeat the same trace steps, flag sets,
 * reported texts and rerun reasons many times over (every result of an analyte line has the same
 * curve step, most have the same flags), and a large run holds hundreds of thousands of results.
 * Lives as long as the processing of one run.
 */
final class Shared {
  private final Map<String, String> texts = new HashMap<>();
  private final Map<List<String>, List<String>> traces = new HashMap<>();
  private final Map<EnumSet<ResultFlag>, List<ResultFlag>> flagLists = new HashMap<>();
  private final Map<Object, Object> others = new HashMap<>();

  /** The one instance of a text equal to {@code s}. */
  String text(String s) {
    String known = texts.putIfAbsent(s, s);
    return known == null ? s : known;
  }

  /** An unmodifiable copy of the trace steps, the same instance for equal traces. */
  List<String> trace(List<String> steps) {
    List<String> known = traces.get(steps);
    if (known != null) {
      return known;
    }
    String[] copy = new String[steps.size()];
    for (int i = 0; i < copy.length; i++) {
      copy[i] = text(steps.get(i));
    }
    List<String> made = List.of(copy);
    traces.put(made, made);
    return made;
  }

  /** The flags in their fixed order as an unmodifiable list, the same instance for equal sets. */
  List<ResultFlag> flags(EnumSet<ResultFlag> flags) {
    List<ResultFlag> known = flagLists.get(flags);
    if (known != null) {
      return known;
    }
    List<ResultFlag> made = List.copyOf(flags);
    flagLists.put(EnumSet.copyOf(flags), made);
    return made;
  }

  /** The one instance of an immutable value equal to {@code v} (an {@code Optional}, say). */
  @SuppressWarnings("unchecked")
  <T> T value(T v) {
    Object known = others.putIfAbsent(v, v);
    return known == null ? v : (T) known;
  }
}
