package org.quantrun.runner.output;

import java.io.IOException;
import java.io.UncheckedIOException;
import java.nio.file.AtomicMoveNotSupportedException;
import java.nio.file.DirectoryStream;
import java.nio.file.FileAlreadyExistsException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.StandardCopyOption;

/**
 * A results folder that appears whole or not at all.
 *
 * <p>Files are written into a hidden staging folder beside the final one (same file system); on
 * {@link #publish()} the staging folder is renamed, atomically, to the first free name of {@code
 * NAME}, {@code NAME-2}, {@code NAME-3}, ... so an earlier folder is never overwritten. If the
 * work fails, {@link #close()} removes the staging folder, leaving nothing half-written behind.
 *
 * <pre>{@code
 * try (OutputFolder out = OutputFolder.create(dir, "R2611A")) {
 *   Files.writeString(out.staging().resolve("results.csv"), text);
 *   Path published = out.publish();
 * }
 * }</pre>
 */
public final class OutputFolder implements AutoCloseable {
  /** Prefix of staging folders; a reader of the output folder ignores names starting with it. */
  public static final String STAGING_PREFIX = ".staging-";
  private static final Object NAMING_LOCK = new Object();

  private final Path parent;
  private final String name;
  private final Path staging;
  private Path published;

  private OutputFolder(Path parent, String name, Path staging) {
    this.parent = parent;
    this.name = name;
    this.staging = staging;
  }

  /**
   * Starts a results folder named {@code name} (already a safe name, see {@link SafeNames}) under
   * {@code parent}, which is created if missing.
   */
  public static OutputFolder create(Path parent, String name) throws IOException {
    if (!name.equals(SafeNames.of(name, "run"))) {
      throw new IllegalArgumentException("not a safe folder name: " + name);
    }
    Files.createDirectories(parent);
    Path staging = Files.createTempDirectory(parent, STAGING_PREFIX + name + "-");
    return new OutputFolder(parent, name, staging);
  }

  /** The staging folder to write the files into. */
  public Path staging() {
    if (published != null) {
      throw new IllegalStateException("already published as " + published);
    }
    return staging;
  }

  /**
   * Renames the staging folder to its final name, the first of NAME, NAME-2, ... that is free.
   *
   * @return the published folder
   */
  public Path publish() throws IOException {
    if (published != null) {
      return published;
    }
    synchronized (NAMING_LOCK) {
      for (int i = 1; ; i++) {
        Path target = parent.resolve(i == 1 ? name : name + "-" + i);
        if (Files.exists(target)) {
          continue;
        }
        try {
          Files.move(staging, target, StandardCopyOption.ATOMIC_MOVE);
        } catch (FileAlreadyExistsException e) {
          continue;
        } catch (AtomicMoveNotSupportedException e) {
          throw new IOException("the output folder " + parent.getFileName()
              + " does not support atomic renames; choose a folder on a local file system", e);
        }
        published = target;
        return target;
      }
    }
  }

  /** Removes the staging folder if the folder was not published. */
  @Override
  public void close() {
    if (published == null && Files.exists(staging)) {
      try {
        deleteTree(staging);
      } catch (IOException e) {
        throw new UncheckedIOException("cannot remove the staging folder " + staging.getFileName(), e);
      }
    }
  }

  private static void deleteTree(Path dir) throws IOException {
    if (Files.isDirectory(dir, java.nio.file.LinkOption.NOFOLLOW_LINKS)) {
      try (DirectoryStream<Path> entries = Files.newDirectoryStream(dir)) {
        for (Path p : entries) {
          deleteTree(p);
        }
      }
    }
    Files.delete(dir);
  }
}
