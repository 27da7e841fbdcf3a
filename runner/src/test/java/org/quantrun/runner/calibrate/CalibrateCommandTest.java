package org.quantrun.runner.calibrate;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import java.io.IOException;
import java.io.InputStream;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import org.junit.jupiter.api.DisplayName;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.quantrun.runner.CommandRun;

class CalibrateCommandTest {
  private static final ObjectMapper JSON = new ObjectMapper();

  @TempDir Path dir;

  private Path file(String name, String text) throws IOException {
    Path p = dir.resolve(name);
    Files.writeString(p, text, StandardCharsets.UTF_8);
    return p;
  }

  private Path resource(String name) throws IOException {
    try (InputStream in = getClass().getResourceAsStream("/reference/" + name)) {
      Path p = dir.resolve(name);
      Files.copy(in, p);
      return p;
    }
  }

  private static double lre(double est, double cert) {
    return -Math.log10(Math.abs(est - cert) / Math.abs(cert));
  }

  @Test
  @DisplayName("--json on NIST Norris prints one object whose fit matches the certified values")
  void jsonMatchesNistNorris() throws IOException {
    // Source: NIST StRD, linear least squares, dataset Norris (certified values).
    CommandRun run = CommandRun.of("calibrate", resource("nist-norris.csv").toString(), "--json");
    assertEquals(0, run.exitCode(), run.err());
    JsonNode o = JSON.readTree(run.out());
    assertEquals("linear", o.get("curve").asText());
    assertEquals("none", o.get("weighting").asText());
    assertEquals(36, o.get("n").asInt());
    assertEquals(34, o.get("dof").asInt());
    assertTrue(lre(o.at("/coefficients/c0").asDouble(), -0.262323073774029) >= 10);
    assertTrue(lre(o.at("/coefficients/c1").asDouble(), 1.00211681802045) >= 10);
    assertTrue(lre(o.at("/standard_errors/c0").asDouble(), 0.232818234301152) >= 10);
    assertTrue(lre(o.at("/standard_errors/c1").asDouble(), 0.429796848199937E-03) >= 10);
    assertTrue(lre(o.get("s_yx").asDouble(), 0.884796396144373) >= 10);
    assertTrue(lre(o.get("r2").asDouble(), 0.999993745883712) >= 10);
    assertFalse(o.get("coefficients").has("c2"), "a coefficient the model lacks is omitted");
    assertTrue(o.get("predictions").isArray() && o.get("predictions").isEmpty());
    assertEquals(1, run.out().strip().lines().count(), "exactly one JSON object on one line");
  }

  @Test
  @DisplayName("a quadratic on NIST Pontius reports c2 and its standard error")
  void quadraticPontius() throws IOException {
    // Source: NIST StRD, linear least squares, dataset Pontius (certified values).
    CommandRun run = CommandRun.of("calibrate", resource("nist-pontius.csv").toString(), "--curve", "quadratic", "--json");
    assertEquals(0, run.exitCode(), run.err());
    JsonNode o = JSON.readTree(run.out());
    assertTrue(lre(o.at("/coefficients/c2").asDouble(), -0.316081871345029E-14) >= 10);
    assertTrue(lre(o.at("/standard_errors/c2").asDouble(), 0.486652849992036E-16) >= 10);
  }

  @Test
  @DisplayName("predictions read the handbook unknowns off the line with t, s_x0 and the half-width")
  void predictions() throws IOException {
    // Miller & Miller ch. 5 (from memory): y0 = 13.5 gives x0 = 6.21, s_x0 = 0.24; t(0.975, 5) = 2.571.
    Path f = file("miller.csv", "x,y\n0,2.1\n2,5.0\n4,9.0\n6,12.6\n8,17.3\n10,21.0\n12,24.7\n");
    CommandRun run = CommandRun.of("calibrate", f.toString(), "--predict", "13.5", "--predict", "30", "--json");
    assertEquals(0, run.exitCode(), run.err());
    JsonNode p = JSON.readTree(run.out()).get("predictions");
    assertEquals(2, p.size());
    assertEquals(6.21, p.get(0).get("x0").asDouble(), 0.01);
    assertEquals(0.24, p.get(0).get("s_x0").asDouble(), 0.01);
    assertEquals(2.571, p.get(0).get("t").asDouble(), 0.001);
    assertEquals(p.get(0).get("t").asDouble() * p.get(0).get("s_x0").asDouble(),
        p.get(0).get("ci_half_width").asDouble(), 1e-12);
    assertEquals(1, p.get(0).get("m").asInt());
    assertTrue(p.get(0).get("in_range").asBoolean());
    assertFalse(p.get(1).get("in_range").asBoolean(), "30 lies above the top standard");
  }

  @Test
  @DisplayName("more replicates shrink s_x0, and the confidence level sets t")
  void replicatesAndConfidence() throws IOException {
    Path f = file("miller.csv", "x,y\n0,2.1\n2,5.0\n4,9.0\n6,12.6\n8,17.3\n10,21.0\n12,24.7\n");
    JsonNode one = JSON.readTree(CommandRun.of("calibrate", f.toString(), "--predict", "13.5", "--json").out());
    JsonNode three = JSON.readTree(CommandRun.of("calibrate", f.toString(), "--predict", "13.5",
        "--replicates", "3", "--confidence", "0.99", "--json").out());
    assertTrue(three.at("/predictions/0/s_x0").asDouble() < one.at("/predictions/0/s_x0").asDouble());
    assertEquals(3, three.at("/predictions/0/m").asInt());
    // two-sided 99 % t for 5 dof is 4.032 (Student t tables, from memory)
    assertEquals(4.032, three.at("/predictions/0/t").asDouble(), 0.001);
  }

  @Test
  @DisplayName("a single-point through-zero calibration prints null for what is not estimable")
  void notEstimableIsNull() throws IOException {
    Path f = file("one.csv", "x,y\n10,2500\n");
    CommandRun run = CommandRun.of("calibrate", f.toString(), "--curve", "through-zero", "--predict", "1000", "--json");
    assertEquals(0, run.exitCode(), run.err());
    JsonNode o = JSON.readTree(run.out());
    assertEquals(250.0, o.at("/coefficients/c1").asDouble(), 0);
    assertFalse(o.get("coefficients").has("c0"));
    assertTrue(o.at("/standard_errors/c1").isNull());
    assertTrue(o.get("s_yx").isNull());
    assertTrue(o.get("lod").isNull());
    assertTrue(o.get("loq").isNull());
    assertEquals(4.0, o.at("/predictions/0/x0").asDouble(), 1e-12);
    assertTrue(o.at("/predictions/0/s_x0").isNull());
    assertTrue(o.at("/predictions/0/t").isNull());
    assertTrue(o.at("/predictions/0/ci_half_width").isNull());
  }

  @Test
  @DisplayName("the default output is a readable table with the results caution")
  void table() throws IOException {
    Path f = file("pb.csv", "x,y,sd\n1,208.1,12.7\n2,411.1,5.9\n5,1064.3,49.4\n10,2124.3,37.7\n");
    CommandRun run = CommandRun.of("calibrate", f.toString(), "--weighting", "1/s2", "--predict", "850");
    assertEquals(0, run.exitCode(), run.err());
    assertTrue(run.out().contains("Calibration: linear, weighting 1/s2, n = 4, dof = 2"), run.out());
    assertTrue(run.out().contains("in range"));
    assertTrue(run.out().contains("qualified analyst"));
  }

  @Test
  @DisplayName("a value that is not a number gives one line naming file, line and column, exit code 2")
  void badNumber() throws IOException {
    Path f = file("bad.csv", "x,y\n1,2.0\n2,4,1\n3,\"6,1\"\n");
    CommandRun run = CommandRun.of("calibrate", f.toString());
    assertEquals(2, run.exitCode());
    assertEquals("quantrun calibrate: bad.csv:4:2: y \"6,1\" is not a number "
        + "(expected e.g. 12.5 or 1.25e3, with a decimal point)", run.err().strip());
    assertEquals("", run.out());
  }

  @Test
  @DisplayName("missing file, missing column, empty file and impossible weighting each give one line and exit code 2")
  void otherDataErrors() throws IOException {
    CommandRun missing = CommandRun.of("calibrate", dir.resolve("none.csv").toString());
    assertEquals(2, missing.exitCode());
    assertEquals("quantrun calibrate: none.csv: no such file", missing.err().strip());

    CommandRun noY = CommandRun.of("calibrate", file("noy.csv", "x,signal\n1,2\n").toString());
    assertEquals(2, noY.exitCode());
    assertTrue(noY.err().strip().startsWith("quantrun calibrate: noy.csv:1: the header has no column 'y'"), noY.err());

    CommandRun empty = CommandRun.of("calibrate", file("empty.csv", "").toString());
    assertEquals(2, empty.exitCode());
    assertTrue(empty.err().contains("empty.csv: the file is empty"), empty.err());

    CommandRun weighting = CommandRun.of("calibrate", file("blank.csv", "x,y\n0,0.1\n1,2\n2,4\n").toString(),
        "--weighting", "1/x");
    assertEquals(2, weighting.exitCode());
    assertTrue(weighting.err().contains("blank.csv: calibration point 1 (x = 0.0): weighting 1/x needs x > 0"),
        weighting.err());
    for (CommandRun r : new CommandRun[] {missing, noY, empty, weighting}) {
      assertEquals(1, r.err().strip().lines().count(), "one line: " + r.err());
      assertFalse(r.err().contains("Exception"), r.err());
    }
  }

  @Test
  @DisplayName("usage errors give one line and exit code 2")
  void usageErrors() throws IOException {
    Path f = file("ok.csv", "x,y\n1,2\n2,4\n3,6.1\n");
    for (String[] args : new String[][] {
        {"calibrate", f.toString(), "--curve", "quadratc"},
        {"calibrate", f.toString(), "--weighting", "1/z"},
        {"calibrate", f.toString(), "--predict", "abc"},
        {"calibrate", f.toString(), "--replicates", "0"},
        {"calibrate", f.toString(), "--confidence", "95"},
        {"calibrate"}}) {
      CommandRun r = CommandRun.of(args);
      assertEquals(2, r.exitCode(), String.join(" ", args));
      assertEquals(1, r.err().strip().lines().count(), r.err());
    }
    assertTrue(CommandRun.of("calibrate", f.toString(), "--curve", "quadratc").err()
        .contains("unknown curve 'quadratc' (expected: linear, through-zero, quadratic)"));
  }
}
