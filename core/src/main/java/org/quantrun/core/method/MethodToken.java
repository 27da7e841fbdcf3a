package org.quantrun.core.method;

/**
 * A value that the method file spells as one fixed word (for example {@code through-zero} or
 * {@code 1/x2}). Every enum of this package implements it, so the loader can read, list and
 * suggest its words uniformly.
 */
public interface MethodToken {

  /**
   * The word that stands for this value in a method file.
   *
   * @return the word, never empty
   */
  String token();
}
