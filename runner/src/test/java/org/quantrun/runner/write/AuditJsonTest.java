package org.quantrun.runner.write;

import static org.junit.jupiter.api.Assertions.assertEquals;

import com.fasterxml.jackson.databind.ObjectMapper;
import com.fasterxml.jackson.databind.SerializationFeature;
import java.nio.charset.StandardCharsets;
import java.time.Instant;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import org.junit.jupiter.api.Test;

/**
 * {@code audit.json} is laid out as Jackson's data binding writes the same tree with indented
 * output (its {@code SerializationFeature.INDENT_OUTPUT}), byte for byte, with a line end after it.
 */
class AuditJsonTest {

  private static Map<String, Object> object(Object... keyValues) {
    Map<String, Object> m = new LinkedHashMap<>();
    for (int i = 0; i < keyValues.length; i += 2) {
      m.put((String) keyValues[i], keyValues[i + 1]);
    }
    return m;
  }

  @Test
  void sameAsJacksonIndentedOutput() throws Exception {
    String odd = "Gr\u00fcn \"quoted\" back\\slash tab\t new\nline \u0001 \u2013 \ud83e\uddea";
    Instant started = Instant.parse("2026-11-30T08:15:00Z");
    Instant finished = Instant.parse("2026-11-30T08:15:02.125Z");
    Audit audit = new Audit("1.2.3", "17.0.15", odd, "bench-pc", started,
        List.of(new Audit.InputFile("export", "run.csv", "in/run.csv", "ab12", 1234),
            new Audit.InputFile("method", odd, "m.yaml", "cd34", 0)),
        new Audit.MethodRef("M-1", "3.1", "ef56"),
        List.of(new Audit.PluginRef("delimited", "1.0", "delimited", Optional.of("delimited.jar"), Optional.of("99")),
            new Audit.PluginRef("class path", "", "x", Optional.empty())),
        "delimited", List.of("process", odd, ""));
    List<Audit.OutputFile> outputs = List.of(new Audit.OutputFile("results.csv", "0f", Long.MAX_VALUE),
        new Audit.OutputFile("report.html", "1e", 7));

    List<Object> inputs = new ArrayList<>();
    for (Audit.InputFile f : audit.inputs()) {
      inputs.add(object("role", f.role(), "name", f.name(), "path", f.path(), "sha256", f.sha256(), "bytes", f.bytes()));
    }
    List<Object> plugins = new ArrayList<>();
    for (Audit.PluginRef p : audit.plugins()) {
      plugins.add(object("plugin_id", p.pluginId(), "version", p.version(), "importer_id", p.importerId(),
          "jar", p.jar().orElse(null), "sha256", p.sha256().orElse(null)));
    }
    List<Object> files = new ArrayList<>();
    for (Audit.OutputFile f : outputs) {
      files.add(object("name", f.name(), "sha256", f.sha256(), "bytes", f.bytes()));
    }
    Map<String, Object> tree = object("format", Audit.FORMAT, "format_version", 1, "quantrun_version", "1.2.3",
        "java_version", "17.0.15", "user", odd, "host", "bench-pc", "started", started.toString(),
        "finished", finished.toString(), "arguments", audit.arguments(),
        "method", object("id", "M-1", "version", "3.1", "sha256", "ef56"), "inputs", inputs,
        "importer_id", "delimited", "plugins", plugins, "outputs", files);
    String expected = new ObjectMapper().enable(SerializationFeature.INDENT_OUTPUT).writeValueAsString(tree) + "\n";

    assertEquals(expected, new String(audit.json(finished, outputs), StandardCharsets.UTF_8));
  }
}
