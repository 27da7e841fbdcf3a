package org.quantrun.runner.watch;

import java.io.IOException;
import java.nio.file.AtomicMoveNotSupportedException;
import java.nio.file.DirectoryStream;
import java.nio.file.Files;
import java.nio.file.LinkOption;
import java.nio.file.Path;
import java.nio.file.StandardCopyOption;
import java.nio.file.StandardOpenOption;

/**
 * Renames that never overwrite: a clash gets a suffix ({@code run.csv}, {@code run-2.csv}, {@code
 * run-3.csv}, ...). Every move is one atomic rename on one file system; a move across file systems
 * is refused rather than done as a copy that a crash could leave behind twice.
 */
final class Moves {
  private static final Object LOCK = new Object();

  private Moves() {}

  /**
   * The first name in a folder that is free: {@code name}, then {@code stem-2.ext}, {@code stem-3.ext}, ...
   * Callers that then move to it hold {@link #lock()}.
   *
   * @param dir the folder
   * @param name the wanted name
   * @param keepExtension whether the suffix goes before the extension (files) or at the end (folders)
   * @return the free path
   */
  static Path freeName(Path dir, String name, boolean keepExtension) {
    int dot = keepExtension ? name.lastIndexOf('.') : -1;
    String stem = dot > 0 ? name.substring(0, dot) : name;
    String ext = dot > 0 ? name.substring(dot) : "";
    for (int i = 1; ; i++) {
      Path p = dir.resolve(i == 1 ? name : stem + "-" + i + ext);
      if (!Files.exists(p, LinkOption.NOFOLLOW_LINKS)) {
        return p;
      }
    }
  }

  /** @return the lock that makes choosing a free name and moving to it one step for this JVM */
  static Object lock() {
    return LOCK;
  }

  /**
   * Renames a file or folder to a path that must be free.
   *
   * @param from the source
   * @param to the free target (its folder is created)
   * @throws IOException if the target is taken, the rename fails, or it would cross file systems
   */
  static void rename(Path from, Path to) throws IOException {
    Files.createDirectories(to.getParent());
    if (Files.exists(to, LinkOption.NOFOLLOW_LINKS)) {
      throw new java.nio.file.FileAlreadyExistsException(to.toString());
    }
    try {
      Files.move(from, to, StandardCopyOption.ATOMIC_MOVE);
    } catch (AtomicMoveNotSupportedException e) {
      throw new IOException("cannot move " + from.getFileName() + " to " + to.getParent()
          + " in one step (another file system?); keep the inbox, archive and failed folders on one file system,"
          + " and the work area on the output folder's", e);
    }
  }

  /**
   * Writes a small text file whole: into a temporary file beside it, then renamed over it.
   *
   * @param file the file
   * @param text its content
   * @throws IOException if it cannot be written
   */
  static void writeWhole(Path file, byte[] text) throws IOException {
    Files.createDirectories(file.getParent());
    Path tmp = file.resolveSibling("." + file.getFileName() + ".tmp");
    Files.write(tmp, text, StandardOpenOption.CREATE, StandardOpenOption.TRUNCATE_EXISTING, StandardOpenOption.WRITE);
    Files.move(tmp, file, StandardCopyOption.ATOMIC_MOVE, StandardCopyOption.REPLACE_EXISTING);
  }

  /**
   * Deletes a folder tree the service wrote itself (the work area); never used on inputs.
   *
   * @param dir the folder
   * @throws IOException if it cannot be deleted
   */
  static void deleteTree(Path dir) throws IOException {
    if (!Files.exists(dir, LinkOption.NOFOLLOW_LINKS)) {
      return;
    }
    if (Files.isDirectory(dir, LinkOption.NOFOLLOW_LINKS)) {
      try (DirectoryStream<Path> entries = Files.newDirectoryStream(dir)) {
        for (Path p : entries) {
          deleteTree(p);
        }
      }
    }
    Files.deleteIfExists(dir);
  }
}
