package org.quantrun.runner.write;

import java.io.IOException;
import java.io.Writer;

/**
 * Text gathered in a buffer and handed to a writer in chunks of about 64 K characters, as a
 * character array (no intermediate string): the writers of large files append to {@link #text}
 * and call {@link #flushIfFull()} now and then.
 */
final class ChunkedText {
  private static final int CHUNK = 1 << 16;
  private final Writer out;
  /** The text not yet written. */
  final StringBuilder text = new StringBuilder(CHUNK + 4096);
  private char[] chars = new char[CHUNK + 4096];

  ChunkedText(Writer out) {
    this.out = out;
  }

  /** Writes the text gathered if it has reached a chunk. */
  void flushIfFull() throws IOException {
    if (text.length() >= CHUNK) {
      flush();
    }
  }

  /** Writes all the text gathered and flushes the writer. */
  void flush() throws IOException {
    int n = text.length();
    if (chars.length < n) {
      chars = new char[n];
    }
    text.getChars(0, n, chars, 0);
    out.write(chars, 0, n);
    text.setLength(0);
    out.flush();
  }
}
