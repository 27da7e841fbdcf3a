package org.quantrun.core.importer;

import java.io.BufferedInputStream;
import java.io.IOException;
import java.io.InputStream;
import java.io.Reader;
import java.nio.ByteBuffer;
import java.nio.CharBuffer;
import java.nio.charset.CharacterCodingException;
import java.nio.charset.Charset;
import java.nio.charset.CharsetDecoder;
import java.nio.charset.CoderResult;
import java.nio.charset.CodingErrorAction;
import java.nio.charset.StandardCharsets;
import java.util.Optional;

/**
 * The text of an export, decoded safely, for importers of text formats.
 *
 * <p>The charset is the one in the settings, or detected: a byte-order mark (UTF-8, UTF-16 LE/BE),
 * else UTF-8 when the first 64 KB are valid UTF-8, else Windows-1252. A byte-order mark is
 * skipped. Binary data (NUL bytes, many control characters), text that is not valid in the
 * charset, lines longer than {@link ImportSettings#maxLineLength()} and more bytes than
 * {@link ImportSettings#maxFileBytes()} end reading with an
 * {@link IOException} whose {@link #problem problem} names the line; use {@link #problem} to turn
 * any exception of this reader into an {@link ImportException}.
 */
public final class TextInput extends Reader {

  private static final int PEEK = 64 * 1024;
  /** Windows-1252, the usual charset of older exports. */
  public static final Charset WINDOWS_1252 = Charset.forName("windows-1252");

  private final InputStream in;
  private final CharsetDecoder decoder;
  private final ByteBuffer bytes = ByteBuffer.allocate(16 * 1024).flip();
  private boolean endOfInput;
  private boolean flushed;
  private boolean decodeError;
  private final Charset charset;
  private final String sourceName;
  private final int maxLineLength;
  private final long maxBytes;
  private long bytesRead;
  private int line = 1;
  private int lineLength;
  private ImportException failure;

  private TextInput(InputStream in, CharsetDecoder decoder, String sourceName, int maxLineLength, long maxBytes) {
    this.in = in;
    this.maxBytes = maxBytes;
    this.decoder = decoder;
    this.charset = decoder.charset();
    this.sourceName = sourceName;
    this.maxLineLength = maxLineLength;
  }

  /**
   * Opens the text of an export.
   *
   * @param bytes the export's bytes (not closed by closing the result)
   * @param settings the import settings (charset, max line length)
   * @param sourceName the source name for messages
   * @return the text
   * @throws ImportException if the source cannot be read or is binary
   */
  public static TextInput open(InputStream bytes, ImportSettings settings, String sourceName)
      throws ImportException {
    BufferedInputStream buffered = new BufferedInputStream(new NonClosing(bytes), PEEK);
    byte[] head;
    try {
      buffered.mark(PEEK);
      head = buffered.readNBytes(PEEK);
      buffered.reset();
    } catch (IOException e) {
      throw new ImportException(sourceName, SourcePosition.UNKNOWN, "cannot be read: " + e.getMessage(), e);
    }
    if (head.length > settings.maxFileBytes()) {
      throw tooLarge(sourceName, settings.maxFileBytes());
    }
    Optional<Charset> bom = bomCharset(head);
    Charset cs;
    if (settings.charset().isPresent()) {
      cs = settings.charset().get();
    } else if (bom.isPresent()) {
      cs = bom.get();
    } else {
      Optional<String> binary = binaryProblem(head);
      if (binary.isPresent()) {
        throw new ImportException(sourceName, SourcePosition.UNKNOWN, binary.get());
      }
      cs = isUtf8(head) ? StandardCharsets.UTF_8 : WINDOWS_1252;
    }
    try {
      int skip = bom.filter(b -> b.equals(cs) || (cs.name().equals("UTF-16") && b.name().startsWith("UTF-16")))
          .map(b -> b.equals(StandardCharsets.UTF_8) ? 3 : 2).orElse(0);
      Charset decodeAs = cs.name().equals("UTF-16") && bom.isPresent() ? bom.get() : cs;
      buffered.skipNBytes(skip);
      CharsetDecoder decoder = decodeAs.newDecoder()
          .onMalformedInput(CodingErrorAction.REPORT)
          .onUnmappableCharacter(CodingErrorAction.REPORT);
      return new TextInput(buffered, decoder, sourceName, settings.maxLineLength(), settings.maxFileBytes());
    } catch (IOException e) {
      throw new ImportException(sourceName, SourcePosition.UNKNOWN, "cannot be read: " + e.getMessage(), e);
    }
  }

  private static ImportException tooLarge(String sourceName, long maxBytes) {
    return new ImportException(sourceName, SourcePosition.UNKNOWN,
        "the file is larger than " + maxBytes + " bytes (max_file_bytes in the import profile)");
  }

  /**
   * The first bytes as text for detection: decoded as {@link #open} would, with bad bytes
   * replaced. Never throws.
   *
   * @param head the first bytes of a file
   * @return the text, empty for binary data
   */
  public static String headText(byte[] head) {
    Optional<Charset> bom = bomCharset(head);
    if (bom.isPresent()) {
      int skip = bom.get().equals(StandardCharsets.UTF_8) ? 3 : 2;
      return new String(head, skip, head.length - skip, bom.get());
    }
    if (binaryProblem(head).isPresent()) {
      return "";
    }
    return new String(head, isUtf8(head) ? StandardCharsets.UTF_8 : WINDOWS_1252);
  }

  private static Optional<Charset> bomCharset(byte[] h) {
    if (h.length >= 3 && (h[0] & 0xFF) == 0xEF && (h[1] & 0xFF) == 0xBB && (h[2] & 0xFF) == 0xBF) {
      return Optional.of(StandardCharsets.UTF_8);
    }
    if (h.length >= 2 && (h[0] & 0xFF) == 0xFF && (h[1] & 0xFF) == 0xFE) {
      return Optional.of(StandardCharsets.UTF_16LE);
    }
    if (h.length >= 2 && (h[0] & 0xFF) == 0xFE && (h[1] & 0xFF) == 0xFF) {
      return Optional.of(StandardCharsets.UTF_16BE);
    }
    return Optional.empty();
  }

  private static Optional<String> binaryProblem(byte[] h) {
    int nul = 0;
    int control = 0;
    for (byte b : h) {
      int c = b & 0xFF;
      if (c == 0) {
        nul++;
      } else if (c < 0x20 && c != '\t' && c != '\n' && c != '\r' && c != '\f') {
        control++;
      }
    }
    if (nul > 0 && nul * 3 >= h.length) {
      return Optional.of("looks like UTF-16 text without a byte-order mark; set the charset (e.g. charset: UTF-16LE) in the import profile");
    }
    if (nul > 0 || control * 100 > h.length) {
      return Optional.of("is binary data, not a text export");
    }
    return Optional.empty();
  }

  private static boolean isUtf8(byte[] head) {
    int end = head.length;
    // a multi-byte character cut at the end of the peek window is not an error
    int back = 0;
    while (back < 3 && end - back - 1 >= 0 && (head[end - back - 1] & 0xC0) == 0x80) {
      back++;
    }
    if (end - back - 1 >= 0 && (head[end - back - 1] & 0xC0) == 0xC0) {
      end = end - back - 1;
    }
    try {
      StandardCharsets.UTF_8.newDecoder()
          .onMalformedInput(CodingErrorAction.REPORT)
          .onUnmappableCharacter(CodingErrorAction.REPORT)
          .decode(ByteBuffer.wrap(head, 0, end));
      return true;
    } catch (CharacterCodingException e) {
      return false;
    }
  }

  /**
   * The charset the text is decoded with.
   *
   * @return the charset
   */
  public Charset charset() {
    return charset;
  }

  /**
   * The 1-based line of the last character read.
   *
   * @return the line
   */
  public int line() {
    return line;
  }

  /**
   * Turns an exception from reading this text (possibly wrapped, as parsers do) into the import
   * error to report.
   *
   * @param e the exception
   * @param fallbackLine the line to name when the exception carries none
   * @return the import error
   */
  public ImportException problem(Exception e, int fallbackLine) {
    if (failure != null) {
      return failure;
    }
    Throwable t = e;
    while (t.getCause() != null && t.getCause() != t) {
      t = t.getCause();
    }
    String msg = t.getMessage() == null ? t.getClass().getSimpleName() : t.getMessage();
    return new ImportException(sourceName, SourcePosition.ofLine(Math.max(fallbackLine, 0)), "cannot be read: " + msg, e);
  }

  @Override
  public int read(char[] buf, int off, int len) throws IOException {
    if (failure != null) {
      throw new IOException(failure.getMessage());
    }
    if (len == 0) {
      return 0;
    }
    CharBuffer out = CharBuffer.wrap(buf, off, len);
    while (out.position() == off) {
      if (decodeError) {
        // the characters before the bad bytes have been counted: the line is exact
        failure = new ImportException(sourceName, SourcePosition.ofLine(line),
            "not valid " + charset.name() + " text; set the right charset in the import profile");
        throw new IOException(failure.getMessage());
      }
      if (flushed) {
        return -1;
      }
      CoderResult r = decoder.decode(bytes, out, endOfInput);
      if (r.isError()) {
        decodeError = true;
      } else if (r.isUnderflow()) {
        if (endOfInput) {
          decoder.flush(out);
          flushed = true;
        } else if (out.position() == off) {
          fill();
        }
      }
    }
    int n = out.position() - off;
    for (int i = off; i < off + n; i++) {
      char c = buf[i];
      if (c == '\n') {
        line++;
        lineLength = 0;
      } else {
        if (c == 0) {
          failure = new ImportException(sourceName, SourcePosition.ofLine(line),
              "contains a NUL character: binary data, or the wrong charset (" + charset.name() + ")");
          throw new IOException(failure.getMessage());
        }
        if (++lineLength > maxLineLength) {
          failure = new ImportException(sourceName, SourcePosition.ofLine(line),
              "line is longer than " + maxLineLength + " characters (max_line_length in the import profile)");
          throw new IOException(failure.getMessage());
        }
      }
    }
    return n;
  }

  private void fill() throws IOException {
    bytes.compact();
    int n = in.read(bytes.array(), bytes.arrayOffset() + bytes.position(), bytes.remaining());
    if (n < 0) {
      endOfInput = true;
    } else {
      bytesRead += n;
      if (bytesRead > maxBytes) {
        failure = tooLarge(sourceName, maxBytes);
        throw new IOException(failure.getMessage());
      }
      bytes.position(bytes.position() + n);
    }
    bytes.flip();
  }

  @Override
  public void close() {
    // the caller owns the stream
  }

  /** Keeps the caller's stream open when the reader is closed. */
  private static final class NonClosing extends java.io.FilterInputStream {
    NonClosing(InputStream in) {
      super(in);
    }

    @Override
    public void close() {
      // the caller owns the stream
    }
  }
}
