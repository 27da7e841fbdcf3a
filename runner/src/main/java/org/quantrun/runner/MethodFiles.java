package org.quantrun.runner;

import java.io.BufferedReader;
import java.io.IOException;
import java.io.InputStreamReader;
import java.io.Reader;
import java.nio.charset.CharacterCodingException;
import java.nio.charset.CodingErrorAction;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Optional;
import org.quantrun.core.method.Method;
import org.quantrun.core.method.MethodException;
import org.quantrun.core.method.MethodLoader;
import org.quantrun.core.method.MethodProblem;

/** Reads method files for the commands: strict UTF-8, every problem as one line. */
public final class MethodFiles {
  private MethodFiles() {}

  /**
   * Problems that stop a command; each line is ready to print on standard error.
   */
  public static final class Failure extends Exception {
    private static final long serialVersionUID = 1L;
    private final List<String> lines;

    /**
     * The failure.
     *
     * @param lines the lines to print, at least one
     */
    public Failure(List<String> lines) {
      super(lines.get(0));
      this.lines = List.copyOf(lines);
    }

    /**
     * The lines to print.
     *
     * @return the lines
     */
    public List<String> lines() {
      return lines;
    }
  }

  /**
   * Loads and validates a method file, and checks that the import profile it names exists.
   *
   * @param method the method file
   * @param command the command's name for messages that name no file position, e.g. {@code quantrun check}
   * @return the method
   * @throws Failure with one line per problem, and a count line
   */
  public static Method load(Path method, String command) throws Failure {
    return load(method, null, command);
  }

  /**
   * Loads and validates a method from the bytes already read from its file (so that what is parsed
   * is exactly what was digested for the audit trail), and checks that the import profile it names
   * exists.
   *
   * @param method the method file (for its name, folder and messages)
   * @param content the file's bytes
   * @param command the command's name for messages that name no file position
   * @return the method
   * @throws Failure with one line per problem, and a count line
   */
  public static Method load(Path method, byte[] content, String command) throws Failure {
    String name = name(method);
    if (content == null && !Files.isRegularFile(method)) {
      throw new Failure(List.of(command + ": " + method + (Files.exists(method) ? ": is not a file" : ": no such file")));
    }
    Method m;
    try (Reader reader = content == null ? strictUtf8(method) : strictUtf8(new java.io.ByteArrayInputStream(content))) {
      m = MethodLoader.load(reader, name);
    } catch (MethodException e) {
      throw problems(command, name, e.problems());
    } catch (CharacterCodingException e) {
      throw new Failure(List.of(name + ": the file is not UTF-8 text (expected a UTF-8 YAML method file)"));
    } catch (IOException e) {
      throw new Failure(List.of(command + ": " + method + ": cannot be read (" + e.getMessage() + ")"));
    }
    Optional<Path> profile = profile(method, m);
    if (profile.isPresent() && !Files.isRegularFile(profile.get())) {
      throw problems(command, name, List.of(new MethodProblem(name, 0, 0, "import.profile",
          "import profile '" + m.importSettings().profile().get() + "' not found beside the method file",
          Optional.of("a file relative to the method file"))));
    }
    return m;
  }

  /**
   * The import profile a method names, resolved against the method file's folder.
   *
   * @param methodFile the method file
   * @param method the loaded method
   * @return the profile's path, if the method names one
   */
  public static Optional<Path> profile(Path methodFile, Method method) {
    Path dir = methodFile.toAbsolutePath().getParent();
    return method.importSettings().profile().map(dir::resolve);
  }

  /**
   * A problem list as a failure.
   *
   * @param command the command's name
   * @param name the file's name
   * @param problems the problems
   * @return the failure, one line per problem and a count line
   */
  public static Failure problems(String command, String name, List<MethodProblem> problems) {
    List<String> lines = new ArrayList<>();
    problems.forEach(p -> lines.add(p.toString()));
    lines.add(command + ": " + problems.size() + (problems.size() == 1 ? " problem" : " problems") + " in " + name);
    return new Failure(lines);
  }

  /**
   * Reads a text file as strict UTF-8 (a bad byte is an error, not a replacement character).
   *
   * @param file the file
   * @return its text
   * @throws IOException if it cannot be read; {@link CharacterCodingException} if it is not UTF-8
   */
  public static String readUtf8(Path file) throws IOException {
    try (Reader r = strictUtf8(file)) {
      StringBuilder b = new StringBuilder();
      char[] buf = new char[8192];
      for (int n = r.read(buf); n >= 0; n = r.read(buf)) {
        b.append(buf, 0, n);
      }
      return b.toString();
    }
  }

  private static Reader strictUtf8(Path file) throws IOException {
    return strictUtf8(Files.newInputStream(file));
  }

  private static Reader strictUtf8(java.io.InputStream in) {
    return new BufferedReader(new InputStreamReader(in,
        StandardCharsets.UTF_8.newDecoder().onMalformedInput(CodingErrorAction.REPORT).onUnmappableCharacter(CodingErrorAction.REPORT)));
  }

  /**
   * A path's file name for messages.
   *
   * @param p the path
   * @return its last element, or the whole path when it has none
   */
  public static String name(Path p) {
    return p.getFileName() == null ? p.toString() : p.getFileName().toString();
  }
}
