package org.quantrun.runner.processing;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.Optional;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.DisplayName;
import org.junit.jupiter.api.Test;
import org.quantrun.core.importer.ImportException;
import org.quantrun.core.importer.RawRun;
import org.quantrun.core.method.Method;
import org.quantrun.core.method.MethodException;
import org.quantrun.core.method.MethodLoader;
import org.quantrun.core.model.RunResult;
import org.quantrun.core.processing.RunProcessor;
import org.quantrun.runner.plugins.ImporterPlugins;
import org.quantrun.runner.plugins.RunFileImport;

/** The demo run, in each of its three dialects, through the whole processor. */
class DemoRunProcessingTest {
  static final Path DEMO = Path.of("../demo-data");
  static final Path EXAMPLES = Path.of("../config-examples");
  static Method method;
  static RunFileImport importer;

  @BeforeAll
  static void setUp() throws IOException, MethodException {
    method = MethodLoader.load(Files.readString(EXAMPLES.resolve("demo-R2611A.yaml"), StandardCharsets.UTF_8),
        "demo-R2611A.yaml");
    importer = new RunFileImport(ImporterPlugins.load(Path.of("target/plugins")).selection());
  }

  static RunResult process(String export, String profile) throws ImportException {
    RawRun run = importer.read(DEMO.resolve(export), RunFileImport.loadProfile(EXAMPLES.resolve("importers").resolve(profile)));
    return RunProcessor.process(run, method, Optional.empty());
  }

  @Test
  @DisplayName("print")
  void print() throws ImportException {
    RunResult r = process("run-R2611A-long.csv", "long-csv.yaml");
    r.calibrations().forEach(c -> System.out.println(c.analyteKey() + " " + c.status() + " " + c.reasons() + " " + c.limits()));
    r.qc().stream().filter(q -> q.verdict() != org.quantrun.core.qc.Verdict.PASSED).forEach(System.out::println);
    r.results().stream().filter(a -> a.sampleId().equals("W2611-004") || a.sampleId().equals("W2611-013")).forEach(a -> System.out.println(a.sampleId() + " " + a.analyteKey() + " " + a.value() + " " + a.reported() + " " + a.flags() + " " + a.lod()));
    r.reruns().forEach(System.out::println);
    System.out.println(r.verdict() + " " + r.findings());
  }
}
