package org.quantrun.runner.generate;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import org.junit.jupiter.api.DisplayName;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;
import org.quantrun.core.importer.RawRun;
import org.quantrun.core.method.Method;
import org.quantrun.core.method.MethodLoader;
import org.quantrun.core.method.prep.PrepSheet;
import org.quantrun.core.method.prep.PrepSheetParser;
import org.quantrun.core.model.AnalyteResult;
import org.quantrun.core.model.CalibrationStatus;
import org.quantrun.core.model.RunResult;
import org.quantrun.core.processing.RunProcessor;
import org.quantrun.runner.CommandRun;
import org.quantrun.runner.plugins.ImporterPlugins;
import org.quantrun.runner.plugins.RunFileImport;

/**
 * The generator's runs read back through the bundled importers and the processor, and the results
 * agree with the true concentrations written beside them (the check a validation study makes).
 */
class GenerateCommandTest {
  @TempDir Path dir;

  @ParameterizedTest(name = "{0} dialect, {1}")
  @CsvSource({"long, water", "wide, water", "fixed, water", "long, soil"})
  void generatedRunsReadBackAndAgreeWithTheirTruth(String dialect, String matrix) throws Exception {
    CommandRun gen = CommandRun.of("generate", "--out", dir.toString(), "--name", "V1", "--dialect", dialect,
        "--matrix", matrix, "--injections", "60", "--analytes", "8", "--noise", "0.5", "--seed", "7");
    assertEquals(0, gen.exitCode(), gen.err());
    Path export = Files.list(dir).filter(p -> p.getFileName().toString().matches("V1\\.(csv|txt)")).findFirst().orElseThrow();
    Method m = MethodLoader.load(Files.readString(dir.resolve("V1-method.yaml")), "V1-method.yaml");
    assertEquals("V1-profile.yaml", m.importSettings().profile().orElseThrow());
    RunFileImport importer = new RunFileImport(ImporterPlugins.load(Path.of("target/plugins")).selection());
    RawRun run = importer.read(export, RunFileImport.loadProfile(dir.resolve("V1-profile.yaml")));
    assertEquals(60, run.injections().size());
    Optional<PrepSheet> prep = matrix.equals("soil")
        ? Optional.of(PrepSheetParser.parse(Files.readString(dir.resolve("V1-prep.csv")), "V1-prep.csv",
            m.dilution().prepSheet().get()))
        : Optional.empty();
    RunResult r = RunProcessor.process(run, m, prep);
    r.calibrations().forEach(c -> assertEquals(CalibrationStatus.ACCEPTED, c.status(), c.analyteKey() + c.reasons()));
    Map<String, Double> truth = truth(dir.resolve("V1-truth.csv"), matrix.equals("soil") ? 6 : 5);
    int compared = 0;
    for (AnalyteResult a : r.results()) {
      if (!a.sampleId().startsWith("SMP-") || a.value().isEmpty()) {
        continue;
      }
      double t = truth.get(a.sampleId() + "|" + a.analyte());
      double solution = truth.get(a.sampleId() + "|" + a.analyte() + "|solution");
      if (solution > 10 * a.loq().getAsDouble() / (a.value().getAsDouble() / a.solutionConcentration().getAsDouble())) {
        // 0.5 % noise: results well above the LOQ agree with the truth within 5 % (common practice)
        assertEquals(t, a.value().getAsDouble(), 0.05 * t, a.sampleId() + " " + a.analyteKey());
        compared++;
      }
    }
    assertTrue(compared > 50, "compared " + compared + " results");
  }

  private static Map<String, Double> truth(Path file, int column) throws IOException {
    Map<String, Double> m = new HashMap<>();
    List<String> lines = Files.readAllLines(file, StandardCharsets.UTF_8);
    for (String l : lines.subList(1, lines.size())) {
      String[] f = l.split(",", -1);
      m.put(f[1] + "|" + f[3] + "|solution", Double.parseDouble(f[5]));
      if (!f[column].isEmpty()) {
        m.put(f[1] + "|" + f[3], Double.parseDouble(f[column]));
      }
    }
    return m;
  }

  @Test
  @DisplayName("the same options and seed give the same files, byte for byte")
  void deterministic() throws IOException {
    for (String d : new String[] {"a", "b"}) {
      assertEquals(0, CommandRun.of("generate", "--out", dir.resolve(d).toString(), "--injections", "30", "--analytes", "4").exitCode());
    }
    for (String f : new String[] {"SYN1.csv", "SYN1-method.yaml", "SYN1-truth.csv"}) {
      assertArrayEquals(Files.readAllBytes(dir.resolve("a").resolve(f)), Files.readAllBytes(dir.resolve("b").resolve(f)), f);
    }
  }

  @Test
  @DisplayName("bad options and existing files give one line and exit code 2, and nothing is overwritten")
  void refusals() throws IOException {
    assertEquals(0, CommandRun.of("generate", "--out", dir.toString(), "--injections", "20", "--analytes", "2").exitCode());
    byte[] before = Files.readAllBytes(dir.resolve("SYN1.csv"));
    CommandRun again = CommandRun.of("generate", "--out", dir.toString(), "--injections", "20", "--analytes", "3");
    assertEquals(2, again.exitCode());
    assertTrue(again.err().contains("already exists; quantrun generate never overwrites a file"), again.err());
    assertArrayEquals(before, Files.readAllBytes(dir.resolve("SYN1.csv")));
    for (String[] args : new String[][] {{"--injections", "5"}, {"--analytes", "71"}, {"--dialect", "xml"},
        {"--matrix", "air"}, {"--name", "../x"}, {"--noise", "-1"}}) {
      String[] full = new String[] {"generate", "--out", dir.resolve("z").toString(), args[0], args[1]};
      CommandRun r = CommandRun.of(full);
      assertEquals(2, r.exitCode(), String.join(" ", args));
      assertEquals(1, r.err().strip().lines().count(), r.err());
    }
  }
}
