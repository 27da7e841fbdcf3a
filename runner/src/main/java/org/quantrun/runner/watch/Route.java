package org.quantrun.runner.watch;

import java.nio.file.FileSystems;
import java.nio.file.Path;
import java.nio.file.PathMatcher;
import java.util.Optional;

/**
 * Which files of the inbox are processed with which method.
 *
 * @param name a label for logs and status (e.g. {@code routes[0]} or the sub-folder)
 * @param folder the inbox sub-folder the route takes files from ({@code /} separated, relative
 *     to the inbox; {@code ""} is the inbox itself); empty for files in any folder
 * @param pattern a glob the file name must match, e.g. {@code *.csv}
 * @param method the method file
 * @param profile an import profile that replaces the one the method names, if any
 * @param prep a prep sheet, if any
 */
public record Route(String name, Optional<String> folder, String pattern, Path method, Optional<Path> profile,
    Optional<Path> prep) {

  /** Checks the pattern. */
  public Route {
    FileSystems.getDefault().getPathMatcher("glob:" + pattern);
    folder = folder.map(Route::normalFolder);
  }

  /**
   * A route that takes every file, in any folder, with one method.
   *
   * @param method the method file
   * @param profile the import profile, if any
   * @param prep the prep sheet, if any
   * @return the route
   */
  public static Route everything(Path method, Optional<Path> profile, Optional<Path> prep) {
    return new Route("all files", Optional.empty(), "*", method, profile, prep);
  }

  /**
   * Whether this route takes a file.
   *
   * @param folderInInbox the file's folder relative to the inbox ({@code /} separated, {@code ""} for the inbox)
   * @param fileName the file's name
   * @return true when folder and pattern match
   */
  public boolean takes(String folderInInbox, String fileName) {
    if (folder.isPresent() && !folder.get().equals(folderInInbox)) {
      return false;
    }
    PathMatcher m = FileSystems.getDefault().getPathMatcher("glob:" + pattern);
    return m.matches(Path.of(fileName));
  }

  private static String normalFolder(String f) {
    String s = f.replace('\\', '/');
    while (s.startsWith("./")) {
      s = s.substring(2);
    }
    s = s.replaceAll("/+", "/").replaceAll("^/|/$", "");
    return s.equals(".") ? "" : s;
  }
}
