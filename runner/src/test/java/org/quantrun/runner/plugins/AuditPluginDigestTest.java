package org.quantrun.runner.plugins;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import java.nio.file.Files;
import java.nio.file.Path;
import java.security.MessageDigest;
import java.util.HexFormat;
import java.util.stream.Stream;
import org.junit.jupiter.api.DisplayName;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.quantrun.runner.CommandRun;

/** audit.json names every loaded plugin with the SHA-256 of its jar. */
class AuditPluginDigestTest {

  @Test
  @DisplayName("audit.json of a processed run gives each plugin jar's SHA-256, equal to the digest of the jar's bytes")
  void auditGivesPluginDigests(@TempDir Path dir) throws Exception {
    ImporterPluginsTest.builtPluginsExist();
    CommandRun r = CommandRun.of("process", "../demo-data/run-R2611A-long.csv", "--method", "../config-examples/demo-R2611A.yaml",
        "--profile", "../config-examples/importers/long-csv.yaml", "--plugins", ImporterPluginsTest.BUILT.toString(),
        "--out", dir.toString());
    assertTrue(r.exitCode() == 0 || r.exitCode() == 1, r.err());
    Path audit;
    try (Stream<Path> s = Files.walk(dir)) {
      audit = s.filter(p -> p.getFileName().toString().equals("audit.json")).findFirst().orElseThrow();
    }
    JsonNode plugins = new ObjectMapper().readTree(audit.toFile()).get("plugins");
    int jars = 0;
    for (JsonNode p : plugins) {
      if (p.get("jar").isNull()) {
        continue;
      }
      jars++;
      Path jar = ImporterPluginsTest.BUILT.resolve(p.get("jar").asText());
      // computed here with the JDK alone, not with the runner's own helper
      String expected = HexFormat.of().formatHex(MessageDigest.getInstance("SHA-256").digest(Files.readAllBytes(jar)));
      assertEquals(expected, p.get("sha256").asText(), p.toString());
    }
    assertTrue(jars >= 2, plugins.toString());
  }
}
