package org.quantrun.runner.process;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.io.PrintWriter;
import java.io.StringWriter;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.Clock;
import java.util.EnumSet;
import java.util.List;
import java.util.Optional;
import org.junit.jupiter.api.DisplayName;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.quantrun.runner.output.Digests;
import org.quantrun.runner.plugins.ImporterPlugins;
import org.quantrun.runner.write.OutputFormat;

class RunBatchTest {
  @TempDir Path dir;

  private RunBatch.Report run(RunBatch batch, Path method, String out) {
    RunBatch.Request req = new RunBatch.Request("quantrun test", List.of(RunBatch.Input.of(Path.of(ProcessCommandTest.DEMO))),
        RunBatch.Input.of(method), Optional.empty(), Optional.of(RunBatch.Input.of(Path.of(ProcessCommandTest.LONG_PROFILE))),
        dir.resolve(out), EnumSet.of(OutputFormat.CSV), ImporterPlugins.load(ImporterPlugins.defaultPluginsDir()), List.of());
    StringWriter err = new StringWriter();
    RunBatch.Report r = batch.run(req, new PrintWriter(new StringWriter()), new PrintWriter(err), false);
    assertTrue(r.exitCode() <= 1, err.toString());
    return r;
  }

  @Test
  @DisplayName("a batch that reuses the method parsed last still sees a method file edited in between, and audits the bytes it parsed")
  void editedMethodIsReadAgain() throws IOException {
    Path method = dir.resolve("method.yaml");
    String text = Files.readString(Path.of(ProcessCommandTest.DEMO_METHOD));
    Files.writeString(method, text);
    RunBatch batch = new RunBatch(CorePipeline.INSTANCE, Clock.systemUTC());
    assertEquals("1.0", run(batch, method, "a").outcomes().get(0).summary().get().methodVersion());
    assertEquals("1.0", run(batch, method, "b").outcomes().get(0).summary().get().methodVersion());
    String edited = text.replaceFirst("version: \"1.0\"", "version: \"1.1\"");
    assertTrue(!edited.equals(text), "the demo method has version 1.0");
    Files.writeString(method, edited);
    RunBatch.Report r = run(batch, method, "c");
    assertEquals("1.1", r.outcomes().get(0).summary().get().methodVersion());
    String audit = Files.readString(r.outcomes().get(0).folder().get().resolve("audit.json"));
    assertTrue(audit.contains(Digests.sha256(edited.getBytes(java.nio.charset.StandardCharsets.UTF_8))), audit);
  }
}
