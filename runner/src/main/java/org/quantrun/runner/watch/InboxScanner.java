package org.quantrun.runner.watch;

import java.io.IOException;
import java.nio.file.DirectoryStream;
import java.nio.file.FileSystems;
import java.nio.file.Files;
import java.nio.file.LinkOption;
import java.nio.file.NoSuchFileException;
import java.nio.file.Path;
import java.nio.file.PathMatcher;
import java.nio.file.attribute.BasicFileAttributes;
import java.time.Duration;
import java.util.ArrayList;
import java.util.HashMap;
import java.util.HashSet;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Optional;
import java.util.Set;

/**
 * Lists the inbox and says which files are complete. A file is complete when its size and
 * modification time stayed the same for the quiet period, or when its companion marker file
 * ({@code NAME} + marker suffix) is there. A file is looked at at least twice before it is taken.
 * Names that are never taken: dot-files and dot-folders, {@code ~$*}, {@code *.tmp}, {@code
 * *.part}, marker files, the configured ignore globs, and the archive and failed folders when
 * they are inside the inbox. Not thread-safe: one scanning thread uses it.
 */
final class InboxScanner {
  private static final int MAX_DEPTH = 8;

  /**
   * A file that is ready to be taken.
   *
   * @param file the file
   * @param relative its path in the inbox, {@code /} separated
   * @param size its size when it was judged complete
   * @param modified its modification time then (epoch milliseconds)
   */
  record Ready(Path file, String relative, long size, long modified) {}

  /** What one look at the inbox found. */
  record Scan(boolean inboxPresent, List<Ready> ready, int waiting, Optional<Duration> nextLook) {}

  private record Look(long size, long modified, long firstSeenNanos, boolean changedSinceFirstSeen) {}

  private final Path inbox;
  private final Duration quiet;
  private final Optional<String> marker;
  private final boolean markerOnly;
  private final List<PathMatcher> ignore;
  private final Set<Path> excludedFolders;
  private final Map<Path, Look> looks = new HashMap<>();
  private final long settleNanos;

  InboxScanner(WatchSettings s) {
    this.inbox = s.inbox().toAbsolutePath().normalize();
    this.quiet = s.quietPeriod();
    this.marker = s.marker();
    this.markerOnly = s.markerOnly();
    this.ignore = s.ignore().stream().map(g -> FileSystems.getDefault().getPathMatcher("glob:" + g)).toList();
    this.excludedFolders = new HashSet<>();
    for (Path p : List.of(s.archive(), s.failed(), s.state(), s.out(), s.work())) {
      excludedFolders.add(p.toAbsolutePath().normalize());
    }
    this.settleNanos = Math.min(quiet.toNanos(), Duration.ofMillis(100).toNanos());
  }

  /**
   * Whether a name is one the service never takes (temporary, hidden, marker, ignored).
   *
   * @param name a file name
   * @return true when the file is left alone
   */
  boolean ignored(String name) {
    String lower = name.toLowerCase(Locale.ROOT);
    // common practice: dot-files are hidden or in-progress copies (rsync, editors), ~$ names are
    // office lock files, .tmp and .part are files still being written by copy and download tools
    if (name.startsWith(".") || name.startsWith("~$") || lower.endsWith(".tmp") || lower.endsWith(".part")) {
      return true;
    }
    if (marker.isPresent() && name.endsWith(marker.get())) {
      return true;
    }
    Path p = Path.of(name);
    return ignore.stream().anyMatch(m -> m.matches(p));
  }

  /**
   * The marker file of an export, if markers are used.
   *
   * @param file the export
   * @return its marker's path
   */
  Optional<Path> markerOf(Path file) {
    return marker.map(m -> file.resolveSibling(file.getFileName() + m));
  }

  /**
   * Looks at the inbox once.
   *
   * @param nowNanos the monotonic time of the look
   * @param nowMillis the wall-clock time of the look (epoch ms), to judge modification times
   * @param busy files already taken (not reported again)
   * @return the complete files, how many wait, and when to look again at the latest
   */
  Scan scan(long nowNanos, long nowMillis, Set<Path> busy) {
    if (!Files.isDirectory(inbox)) {
      looks.clear();
      return new Scan(false, List.of(), 0, Optional.empty());
    }
    List<Path> files = new ArrayList<>();
    try {
      collect(inbox, 0, files);
    } catch (NoSuchFileException e) {
      return new Scan(false, List.of(), 0, Optional.empty());
    } catch (IOException e) {
      // an unreadable sub-folder: what was listed so far is still judged
    }
    Set<Path> seen = new HashSet<>();
    List<Ready> ready = new ArrayList<>();
    long next = Long.MAX_VALUE;
    int waiting = 0;
    for (Path f : files) {
      if (busy.contains(f)) {
        continue;
      }
      BasicFileAttributes a;
      try {
        a = Files.readAttributes(f, BasicFileAttributes.class, LinkOption.NOFOLLOW_LINKS);
      } catch (IOException e) {
        continue; // gone since the listing
      }
      if (a.isDirectory()) {
        continue;
      }
      seen.add(f);
      long size = a.size();
      long modified = a.lastModifiedTime().toMillis();
      Look before = looks.get(f);
      Look now;
      if (before == null) {
        now = new Look(size, modified, nowNanos, false);
      } else if (before.size() != size || before.modified() != modified) {
        now = new Look(size, modified, nowNanos, true);
      } else {
        now = before;
      }
      looks.put(f, now);
      boolean looked = before != null && now == before && nowNanos - now.firstSeenNanos() >= settleNanos;
      boolean markerThere = markerOf(f).map(Files::exists).orElse(false);
      long observedQuiet = nowNanos - now.firstSeenNanos();
      long fileQuiet = now.changedSinceFirstSeen() ? observedQuiet : Math.max(observedQuiet, (nowMillis - modified) * 1_000_000L);
      boolean quietEnough = !markerOnly && fileQuiet >= quiet.toNanos();
      if (looked && (markerThere || quietEnough)) {
        ready.add(new Ready(f, relative(f), size, modified));
      } else {
        waiting++;
        long wait = markerThere ? settleNanos - observedQuiet
            : markerOnly ? Long.MAX_VALUE : Math.max(quiet.toNanos() - fileQuiet, settleNanos - observedQuiet);
        next = Math.min(next, Math.max(wait, 1_000_000L));
      }
    }
    looks.keySet().retainAll(seen);
    ready.sort((x, y) -> x.relative().compareTo(y.relative()));
    return new Scan(true, ready, waiting, next == Long.MAX_VALUE ? Optional.empty() : Optional.of(Duration.ofNanos(next)));
  }

  /** Forgets what it knew about a file (it was taken, or it went). */
  void forget(Path file) {
    looks.remove(file);
  }

  /**
   * A file's path in the inbox, {@code /} separated.
   *
   * @param file a file in the inbox
   * @return its relative path
   */
  String relative(Path file) {
    return inbox.relativize(file.toAbsolutePath().normalize()).toString().replace('\\', '/');
  }

  private void collect(Path dir, int depth, List<Path> files) throws IOException {
    try (DirectoryStream<Path> entries = Files.newDirectoryStream(dir)) {
      for (Path p : entries) {
        String name = p.getFileName().toString();
        if (ignored(name)) {
          continue;
        }
        if (Files.isDirectory(p, LinkOption.NOFOLLOW_LINKS)) {
          if (depth < MAX_DEPTH && !excludedFolders.contains(p.toAbsolutePath().normalize())) {
            try {
              collect(p, depth + 1, files);
            } catch (IOException e) {
              // a sub-folder that cannot be listed, or went away: skip it this time
            }
          }
        } else {
          files.add(p.toAbsolutePath().normalize());
        }
      }
    }
  }
}
