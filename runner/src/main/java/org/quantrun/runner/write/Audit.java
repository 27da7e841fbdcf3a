package org.quantrun.runner.write;

import com.fasterxml.jackson.core.JsonGenerator;
import com.fasterxml.jackson.core.util.DefaultPrettyPrinter;
import java.io.IOException;
import java.io.StringWriter;
import java.nio.charset.StandardCharsets;
import java.time.Instant;
import java.util.List;
import java.util.Optional;

/**
 * The audit trail of one results folder ({@code audit.json}): what went in (each input file with
 * its SHA-256), which method (id, version, SHA-256 of the file), which quantrun and plugins, who
 * ran it where, when it started and ended, and what came out (each output file with its SHA-256).
 *
 * @param quantrunVersion the quantrun version
 * @param javaVersion the Java runtime's version
 * @param user the operating-system user who ran quantrun
 * @param host the host name
 * @param started when processing of this run started
 * @param inputs every input file
 * @param method the method
 * @param plugins the importer plugins loaded
 * @param importerId the importer that read the export
 * @param arguments the command-line arguments
 */
public record Audit(
    String quantrunVersion,
    String javaVersion,
    String user,
    String host,
    Instant started,
    List<InputFile> inputs,
    MethodRef method,
    List<PluginRef> plugins,
    String importerId,
    List<String> arguments) {

  /** The value of the top-level {@code format} key. */
  public static final String FORMAT = "quantrun-audit";

  /**
   * Copies the lists.
   *
   * @param quantrunVersion the quantrun version
   * @param javaVersion the Java runtime's version
   * @param user the operating-system user
   * @param host the host name
   * @param started when processing started
   * @param inputs every input file
   * @param method the method
   * @param plugins the plugins loaded
   * @param importerId the importer used
   * @param arguments the command-line arguments
   */
  public Audit {
    inputs = List.copyOf(inputs);
    plugins = List.copyOf(plugins);
    arguments = List.copyOf(arguments);
  }

  /**
   * One input file.
   *
   * @param role what it is: {@code export}, {@code method}, {@code import-profile}, {@code prep-sheet}
   * @param name its file name
   * @param path its path as given
   * @param sha256 SHA-256 of its content, lower-case hex
   * @param bytes its size
   */
  public record InputFile(String role, String name, String path, String sha256, long bytes) {}

  /**
   * The method.
   *
   * @param id its id
   * @param version its version
   * @param sha256 SHA-256 of the method file
   */
  public record MethodRef(String id, String version, String sha256) {}

  /**
   * One loaded importer plugin.
   *
   * @param pluginId the plugin id (or {@code class path})
   * @param version its version
   * @param importerId the importer it provides
   * @param jar the jar's file name, if any
   * @param sha256 the SHA-256 of the jar's content, if it came from a jar
   */
  public record PluginRef(String pluginId, String version, String importerId, Optional<String> jar,
      Optional<String> sha256) {
    /**
     * A plugin whose jar digest is not known (or an importer from the class path).
     *
     * @param pluginId the plugin id
     * @param version its version
     * @param importerId the importer it provides
     * @param jar the jar's file name, if any
     */
    public PluginRef(String pluginId, String version, String importerId, Optional<String> jar) {
      this(pluginId, version, importerId, jar, Optional.empty());
    }
  }

  /**
   * One output file.
   *
   * @param name its file name in the folder
   * @param sha256 SHA-256 of its content
   * @param bytes its size
   */
  public record OutputFile(String name, String sha256, long bytes) {}

  /**
   * The audit trail as JSON.
   *
   * @param finished when processing ended
   * @param outputs the files written beside it
   * @return UTF-8 bytes
   */
  public byte[] json(Instant finished, List<OutputFile> outputs) {
    StringWriter text = new StringWriter(4096);
    try (JsonGenerator g = RunJson.factory().createGenerator(text)) {
      // the layout of Jackson's indented output (DefaultPrettyPrinter), as the file has always had
      g.setPrettyPrinter(new DefaultPrettyPrinter());
      g.writeStartObject();
      g.writeStringField("format", FORMAT);
      g.writeNumberField("format_version", 1);
      g.writeStringField("quantrun_version", quantrunVersion);
      g.writeStringField("java_version", javaVersion);
      g.writeStringField("user", user);
      g.writeStringField("host", host);
      g.writeStringField("started", started.toString());
      g.writeStringField("finished", finished.toString());
      strings(g, "arguments", arguments);
      g.writeObjectFieldStart("method");
      g.writeStringField("id", method.id());
      g.writeStringField("version", method.version());
      g.writeStringField("sha256", method.sha256());
      g.writeEndObject();
      inputs(g, inputs);
      g.writeStringField("importer_id", importerId);
      plugins(g, plugins);
      outputs(g, outputs);
      g.writeEndObject();
    } catch (IOException e) {
      throw new IllegalStateException("cannot write audit.json", e);
    }
    return text.toString().concat("\n").getBytes(StandardCharsets.UTF_8);
  }

  // each list in a method of its own, so the long method above stays short for the compiler

  private static void strings(JsonGenerator g, String key, List<String> values) throws IOException {
    g.writeArrayFieldStart(key);
    for (String a : values) {
      g.writeString(a);
    }
    g.writeEndArray();
  }

  /** Writes the fields of one item of a list. */
  @FunctionalInterface
  private interface Fields<T> {
    void write(JsonGenerator g, T item) throws IOException;
  }

  /** A list of items as an array of objects. */
  private static <T> void objects(JsonGenerator g, String key, List<T> items, Fields<T> fields) throws IOException {
    g.writeArrayFieldStart(key);
    for (T item : items) {
      g.writeStartObject();
      fields.write(g, item);
      g.writeEndObject();
    }
    g.writeEndArray();
  }

  private static void inputs(JsonGenerator g, List<InputFile> inputs) throws IOException {
    objects(g, "inputs", inputs, (o, f) -> {
      o.writeStringField("role", f.role());
      o.writeStringField("name", f.name());
      o.writeStringField("path", f.path());
      o.writeStringField("sha256", f.sha256());
      o.writeNumberField("bytes", f.bytes());
    });
  }

  private static void plugins(JsonGenerator g, List<PluginRef> plugins) throws IOException {
    objects(g, "plugins", plugins, (o, p) -> {
      o.writeStringField("plugin_id", p.pluginId());
      o.writeStringField("version", p.version());
      o.writeStringField("importer_id", p.importerId());
      o.writeStringField("jar", p.jar().orElse(null));
      o.writeStringField("sha256", p.sha256().orElse(null));
    });
  }

  private static void outputs(JsonGenerator g, List<OutputFile> outputs) throws IOException {
    objects(g, "outputs", outputs, (o, f) -> {
      o.writeStringField("name", f.name());
      o.writeStringField("sha256", f.sha256());
      o.writeNumberField("bytes", f.bytes());
    });
  }
}
