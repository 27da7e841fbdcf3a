package org.quantrun.core.method;

import java.util.Collections;
import java.util.LinkedHashMap;
import java.util.Map;

/** Unmodifiable copies that keep insertion order (Map.copyOf does not). */
final class Collections2 {
  private Collections2() {}

  static <K, V> Map<K, V> orderedCopy(Map<K, V> map) {
    return Collections.unmodifiableMap(new LinkedHashMap<>(map));
  }
}
