package org.quantrun.core;

/**
 * A value spelled as one fixed word in method files, on the command line and in output files (for
 * example {@code through-zero}, {@code 1/x2} or {@code not evaluated}). Enums that implement it
 * can be read, listed and suggested uniformly.
 */
public interface Token {
  /**
   * The word that stands for this value.
   *
   * @return the word, never empty
   */
  String token();
}
