package org.quantrun.runner;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.io.PrintWriter;
import java.io.StringWriter;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.stream.Stream;
import org.junit.jupiter.api.DisplayName;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.MethodSource;
import picocli.CommandLine;

class CheckCommandTest {

  @TempDir Path dir;

  record Run(int exit, String out, String err) {}

  static Run run(String... args) {
    StringWriter out = new StringWriter();
    StringWriter err = new StringWriter();
    CommandLine cl = Main.commandLine();
    cl.setOut(new PrintWriter(out, true));
    cl.setErr(new PrintWriter(err, true));
    int exit = cl.execute(args);
    return new Run(exit, out.toString(), err.toString());
  }

  static Path examples() {
    Path base = Path.of(System.getProperty("basedir", ".")).toAbsolutePath();
    for (Path p = base; p != null; p = p.getParent()) {
      if (Files.isRegularFile(p.resolve("config-examples/method.schema.json"))) {
        return p.resolve("config-examples");
      }
    }
    throw new IllegalStateException("config-examples not found above " + base);
  }

  static Stream<Path> exampleMethods() throws IOException {
    try (Stream<Path> s = Files.list(examples())) {
      return s.filter(p -> p.toString().endsWith(".yaml")).sorted().toList().stream();
    }
  }

  @DisplayName("check accepts every example method with exit code 0 and a summary")
  @ParameterizedTest(name = "{0}")
  @MethodSource("exampleMethods")
  void examplesPass(Path file) {
    Run r = run("check", file.toString());
    assertEquals(0, r.exit(), r.err());
    assertEquals("", r.err());
    assertTrue(r.out().contains("OK: " + file.getFileName() + " is a valid method."), r.out());
  }

  @Test
  @DisplayName("the summary lists the analytes, the levels and the QC plan")
  void summaryShowsAnalytesLevelsAndQc() {
    Run r = run("check", examples().resolve("icpms-water-internal-standards.yaml").toString());
    assertEquals(0, r.exit());
    String out = r.out();
    assertTrue(out.contains("analytes (26 lines)"), out);
    assertTrue(out.contains("Pb 206") && out.contains("Pb 208") && out.contains("Bi209"), out);
    assertTrue(out.contains("standards (6 levels)"), out);
    assertTrue(out.contains("QC plan"), out);
    assertTrue(out.contains("r2 >= 0.998"), out);
    assertTrue(out.contains("every 10 samples"), out);
    assertTrue(out.contains("internal std     recovery 60-125 %"), out);
    assertTrue(out.contains("qualified analyst"), "the summary carries the caution");
  }

  @Test
  @DisplayName("a broken method prints every problem on stderr as FILE:LINE:COL and exits with 2")
  void brokenMethodListsEveryProblem() throws IOException {
    String text = Files.readString(examples().resolve("drinking-water-trace-metals.yaml"))
        .replace("curve: quadratic ", "curve: quadratc ")
        .replace("from-level: S3 ", "from-level: S7 ");
    Path file = dir.resolve("broken.yaml");
    Files.writeString(file, text);
    Run r = run("check", file.toString());
    assertEquals(Main.EXIT_INPUT_ERROR, r.exit());
    assertEquals("", r.out(), "no summary for a broken method");
    List<String> lines = r.err().lines().toList();
    assertEquals(3, lines.size(), r.err());
    assertTrue(lines.get(0).matches("broken\\.yaml:\\d+:\\d+: analytes\\[13\\]\\.curve: unknown value 'quadratc', did you mean 'quadratic'\\? .*"),
        lines.get(0));
    assertTrue(lines.get(1).matches("broken\\.yaml:\\d+:\\d+: qc\\.ccv\\.from-level: level 'S7' is not a standard level.*"), lines.get(1));
    assertEquals("quantrun check: 2 problems in broken.yaml", lines.get(2));
  }

  @Test
  @DisplayName("a missing file, a missing argument and a non-UTF-8 file each exit with 2 and one message")
  void unreadableInputExitsWithTwo() throws IOException {
    Run missing = run("check", dir.resolve("nope.yaml").toString());
    assertEquals(Main.EXIT_INPUT_ERROR, missing.exit());
    assertTrue(missing.err().contains("nope.yaml: no such file"), missing.err());

    Run directory = run("check", dir.toString());
    assertEquals(Main.EXIT_INPUT_ERROR, directory.exit());
    assertTrue(directory.err().contains(": is not a file"), directory.err());

    Run noArg = run("check");
    assertEquals(Main.EXIT_INPUT_ERROR, noArg.exit());
    assertTrue(noArg.err().contains("METHOD.yaml"), noArg.err());

    Path latin1 = dir.resolve("latin1.yaml");
    Files.write(latin1, "method:\n  description: \"caf\u00e9\"\n".getBytes(StandardCharsets.ISO_8859_1));
    Run bad = run("check", latin1.toString());
    assertEquals(Main.EXIT_INPUT_ERROR, bad.exit());
    assertEquals("latin1.yaml: the file is not UTF-8 text (expected a UTF-8 YAML method file)", bad.err().strip());
  }

  @Test
  @DisplayName("an import profile named by the method must exist beside it")
  void missingProfileIsAnError() throws IOException {
    String text = Files.readString(examples().resolve("icpms-water-internal-standards.yaml"))
        .replace("  # profile: profiles/ms-batch-export.yaml", "  profile: profiles/ms-batch-export.yaml");
    Path file = dir.resolve("with-profile.yaml");
    Files.writeString(file, text);
    Run r = run("check", file.toString());
    assertEquals(Main.EXIT_INPUT_ERROR, r.exit());
    assertTrue(r.err().contains("with-profile.yaml: import.profile: import profile 'profiles/ms-batch-export.yaml' not found"), r.err());

    Files.createDirectories(dir.resolve("profiles"));
    Files.writeString(dir.resolve("profiles/ms-batch-export.yaml"), "# a profile\n");
    Run ok = run("check", file.toString());
    assertEquals(0, ok.exit(), ok.err());
    assertTrue(ok.out().contains("profile profiles/ms-batch-export.yaml"), ok.out());
  }

  @Test
  @DisplayName("check never changes the method file it reads")
  void methodFileIsUntouched() throws IOException {
    Path file = dir.resolve("m.yaml");
    Files.copy(examples().resolve("soil-digest-mg-per-kg.yaml"), file);
    byte[] before = Files.readAllBytes(file);
    run("check", file.toString());
    assertTrue(java.util.Arrays.equals(before, Files.readAllBytes(file)));
  }
}
