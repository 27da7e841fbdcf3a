package org.quantrun.runner.write;

import com.fasterxml.jackson.core.JsonProcessingException;
import com.fasterxml.jackson.databind.node.ArrayNode;
import com.fasterxml.jackson.databind.node.ObjectNode;
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
    ObjectNode root = RunJson.mapper().createObjectNode();
    root.put("format", FORMAT);
    root.put("format_version", 1);
    root.put("quantrun_version", quantrunVersion);
    root.put("java_version", javaVersion);
    root.put("user", user);
    root.put("host", host);
    root.put("started", started.toString());
    root.put("finished", finished.toString());
    ArrayNode args = root.putArray("arguments");
    arguments.forEach(args::add);
    ObjectNode m = root.putObject("method");
    m.put("id", method.id());
    m.put("version", method.version());
    m.put("sha256", method.sha256());
    ArrayNode in = root.putArray("inputs");
    for (InputFile f : inputs) {
      ObjectNode o = in.addObject();
      o.put("role", f.role());
      o.put("name", f.name());
      o.put("path", f.path());
      o.put("sha256", f.sha256());
      o.put("bytes", f.bytes());
    }
    root.put("importer_id", importerId);
    ArrayNode pl = root.putArray("plugins");
    for (PluginRef p : plugins) {
      ObjectNode o = pl.addObject();
      o.put("plugin_id", p.pluginId());
      o.put("version", p.version());
      o.put("importer_id", p.importerId());
      if (p.jar().isPresent()) {
        o.put("jar", p.jar().get());
      } else {
        o.putNull("jar");
      }
      if (p.sha256().isPresent()) {
        o.put("sha256", p.sha256().get());
      } else {
        o.putNull("sha256");
      }
    }
    ArrayNode out = root.putArray("outputs");
    for (OutputFile f : outputs) {
      ObjectNode o = out.addObject();
      o.put("name", f.name());
      o.put("sha256", f.sha256());
      o.put("bytes", f.bytes());
    }
    try {
      return RunJson.mapper().writeValueAsString(root).concat("\n").getBytes(StandardCharsets.UTF_8);
    } catch (JsonProcessingException e) {
      throw new IllegalStateException("cannot write audit.json", e);
    }
  }
}
