package org.quantrun.runner.output;

import java.io.IOException;
import java.io.InputStream;
import java.io.OutputStream;
import java.nio.file.Files;
import java.nio.file.Path;
import java.security.DigestOutputStream;
import java.security.MessageDigest;
import java.security.NoSuchAlgorithmException;
import java.util.HexFormat;

/** SHA-256 digests of files and bytes, as lower-case hex, for the audit trail. */
public final class Digests {
  private Digests() {}

  /** The SHA-256 of a file's content. */
  public static String sha256(Path file) throws IOException {
    MessageDigest md = newDigest();
    byte[] buffer = new byte[1 << 16];
    try (InputStream in = Files.newInputStream(file)) {
      for (int n = in.read(buffer); n > 0; n = in.read(buffer)) {
        md.update(buffer, 0, n);
      }
    }
    return HexFormat.of().formatHex(md.digest());
  }

  /**
   * A stream that computes the SHA-256 of everything written through it, so a file's digest is
   * known when it has been written, without reading it again.
   *
   * @param out where the bytes go
   * @return the stream; {@link #hex(DigestOutputStream)} gives the digest once it is closed
   */
  public static DigestOutputStream sha256(OutputStream out) {
    return new DigestOutputStream(out, newDigest());
  }

  /**
   * The digest of what went through a stream made by {@link #sha256(OutputStream)}, as lower-case hex.
   *
   * @param stream the stream, all written
   * @return the SHA-256
   */
  public static String hex(DigestOutputStream stream) {
    return HexFormat.of().formatHex(stream.getMessageDigest().digest());
  }

  /** The SHA-256 of some bytes. */
  public static String sha256(byte[] bytes) {
    return HexFormat.of().formatHex(newDigest().digest(bytes));
  }

  private static MessageDigest newDigest() {
    try {
      return MessageDigest.getInstance("SHA-256");
    } catch (NoSuchAlgorithmException e) {
      throw new IllegalStateException("this Java runtime has no SHA-256", e);
    }
  }
}
