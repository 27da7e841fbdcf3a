package org.quantrun.core.method;

import java.util.Collection;
import java.util.Locale;
import java.util.Optional;

/** "Did you mean" for misspelt keys and words: the closest candidate by edit distance. */
final class Suggestions {
  private Suggestions() {}

  /** The closest candidate, when it is close enough to be a likely misspelling. */
  static Optional<String> closest(String word, Collection<String> candidates) {
    String w = word.toLowerCase(Locale.ROOT);
    String best = null;
    int bestDistance = Integer.MAX_VALUE;
    for (String c : candidates) {
      int d = distance(w, c.toLowerCase(Locale.ROOT));
      if (d < bestDistance) {
        bestDistance = d;
        best = c;
      }
    }
    int allowed = Math.max(2, word.length() / 3);
    return best != null && bestDistance <= allowed ? Optional.of(best) : Optional.empty();
  }

  /** Optimal string alignment distance (Levenshtein plus adjacent transpositions). */
  static int distance(String a, String b) {
    int[][] d = new int[a.length() + 1][b.length() + 1];
    for (int i = 0; i <= a.length(); i++) {
      d[i][0] = i;
    }
    for (int j = 0; j <= b.length(); j++) {
      d[0][j] = j;
    }
    for (int i = 1; i <= a.length(); i++) {
      for (int j = 1; j <= b.length(); j++) {
        int cost = a.charAt(i - 1) == b.charAt(j - 1) ? 0 : 1;
        d[i][j] = Math.min(Math.min(d[i - 1][j] + 1, d[i][j - 1] + 1), d[i - 1][j - 1] + cost);
        if (i > 1 && j > 1 && a.charAt(i - 1) == b.charAt(j - 2) && a.charAt(i - 2) == b.charAt(j - 1)) {
          d[i][j] = Math.min(d[i][j], d[i - 2][j - 2] + 1);
        }
      }
    }
    return d[a.length()][b.length()];
  }
}
