package org.quantrun.runner.plugins;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.io.OutputStream;
import java.io.PrintWriter;
import java.io.StringWriter;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.jar.Attributes;
import java.util.jar.JarEntry;
import java.util.jar.JarOutputStream;
import java.util.jar.Manifest;
import java.util.stream.Stream;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.DisplayName;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.quantrun.core.importer.ImportException;
import org.quantrun.core.importer.ImportSettings;
import org.quantrun.core.importer.RawRun;
import org.quantrun.core.importer.RunImporter;
import org.quantrun.runner.Main;
import picocli.CommandLine;

/** Loads the plugin jars the reactor built into target/plugins (build from the repository root). */
class ImporterPluginsTest {

  static final Path BUILT = Path.of("target/plugins");
  static List<Path> builtJars;

  @BeforeAll
  static void builtPluginsExist() throws IOException {
    assertTrue(Files.isDirectory(BUILT), "target/plugins is missing: build from the repository root (mvn -B verify)");
    try (Stream<Path> s = Files.list(BUILT)) {
      // the two plugins the build ships (a developer may have installed more beside them)
      builtJars = s.filter(p -> p.getFileName().toString().matches("quantrun-importer-(delimited|fixedwidth)-.*\\.jar"))
          .sorted().toList();
    }
    assertEquals(2, builtJars.size(), "the delimited and fixed-width jars are not in target/plugins: build from the root");
  }

  @Test
  @DisplayName("the built plugin jars load as the delimited and fixed-width importers, with no problems")
  void builtPluginsLoad() {
    ImporterPlugins.Result r = ImporterPlugins.load(BUILT);
    assertEquals(List.of(), r.problems());
    List<String> ids = r.importers().stream().map(li -> li.importer().id()).toList();
    assertTrue(ids.containsAll(List.of("delimited", "fixed-width")), ids.toString());
    assertTrue(r.importers().stream().allMatch(li -> li.source().isPresent()));
  }

  @Test
  @DisplayName("an importer from a plugin jar reads the long demo export")
  void pluginImporterReads() throws IOException, ImportException {
    RunImporter delimited = ImporterPlugins.load(BUILT).selection().byId("delimited").orElseThrow();
    try (var in = Files.newInputStream(Path.of("../demo-data/run-R2611A-long.csv"))) {
      RawRun run = delimited.read(in, ImportSettings.DEFAULT.toBuilder().endPattern(java.util.regex.Pattern.compile("^End of data")).build(), "long.csv");
      assertEquals(38, run.injections().size());
    }
  }

  @Test
  @DisplayName("auto selection picks the delimited importer for the CSV demo export")
  void autoSelection() throws IOException, ImportException {
    byte[] head = Files.readAllBytes(Path.of("../demo-data/run-R2611A-long.csv"));
    RunImporter chosen = ImporterPlugins.load(BUILT).selection().select("auto", "run-R2611A-long.csv", head);
    assertEquals("delimited", chosen.id());
  }

  @Test
  @DisplayName("a broken jar, a non-plugin jar and an incompatible plugin are reported and skipped; the others load")
  void brokenPluginsAreSkipped(@TempDir Path dir) throws IOException {
    for (Path j : builtJars) {
      Files.copy(j, dir.resolve(j.getFileName()));
    }
    Files.write(dir.resolve("a-broken.jar"), "this is not a zip file".getBytes(StandardCharsets.UTF_8));
    writeJar(dir.resolve("b-plain-library.jar"), new Manifest(), "META-INF/x.txt", "x");
    Manifest future = pluginManifest("from-the-future", ">=9.0.0");
    writeJar(dir.resolve("c-future.jar"), future, "META-INF/extensions.idx", "org.example.Missing\n");
    Manifest empty = pluginManifest("no-importers", ">=1.0.0");
    writeJar(dir.resolve("d-missing-class.jar"), empty, "META-INF/extensions.idx", "org.example.Missing\n");

    ImporterPlugins.Result r = ImporterPlugins.load(dir);

    assertEquals(List.of("delimited", "fixed-width"), r.importers().stream().map(li -> li.importer().id()).toList());
    List<String> problems = r.problems().stream().map(ImporterPlugins.Problem::text).toList();
    assertEquals(4, problems.size(), problems.toString());
    assertTrue(problems.get(0).startsWith("a-broken.jar: "), problems.toString());
    assertTrue(problems.stream().anyMatch(p -> p.startsWith("b-plain-library.jar: ")), problems.toString());
    assertTrue(problems.stream().anyMatch(p -> p.startsWith("c-future.jar: ") && p.contains(">=9.0.0")), problems.toString());
    assertTrue(problems.stream().anyMatch(p -> p.startsWith("d-missing-class.jar: ") && p.contains("no usable importer")),
        problems.toString());
  }

  @Test
  @DisplayName("'quantrun importers' lists id, version, the jar's SHA-256 and description of each importer")
  void importersCommandLists() {
    StringWriter out = new StringWriter();
    StringWriter err = new StringWriter();
    CommandLine cl = Main.commandLine();
    cl.setOut(new PrintWriter(out));
    cl.setErr(new PrintWriter(err));
    int code = cl.execute("importers", "--plugins", BUILT.toString());
    assertEquals(0, code, err.toString());
    String[] lines = out.toString().split("\\R");
    assertTrue(lines[0].matches("id\\s+version\\s+sha256\\s+description"), lines[0]);
    assertTrue(java.util.Arrays.stream(lines)
        .anyMatch(l -> l.matches("delimited\\s+0\\.1\\.0-SNAPSHOT\\s+[0-9a-f]{64}\\s+Delimited text exports.*")), out.toString());
    assertTrue(java.util.Arrays.stream(lines).anyMatch(l -> l.startsWith("fixed-width ")), out.toString());
    assertEquals("", err.toString());
  }

  @Test
  @DisplayName("'quantrun importers --detect' shows the confidences and the importer auto picks")
  void importersDetect() {
    StringWriter out = new StringWriter();
    StringWriter err = new StringWriter();
    CommandLine cl = Main.commandLine();
    cl.setOut(new PrintWriter(out));
    cl.setErr(new PrintWriter(err));
    int code = cl.execute("importers", "--plugins", BUILT.toString(), "--detect", "../demo-data/run-R2611A-report.txt");
    assertEquals(0, code, err.toString());
    assertTrue(out.toString().contains("auto picks: fixed-width"), out.toString());
    assertTrue(out.toString().matches("(?s)fixed-width\\s+0\\.\\d\\d.*"), out.toString());
  }

  @Test
  @DisplayName("'quantrun importers --plugins' with a folder that does not exist is a usage error (exit 2)")
  void missingPluginsFolder(@TempDir Path dir) {
    StringWriter err = new StringWriter();
    CommandLine cl = Main.commandLine();
    cl.setErr(new PrintWriter(err));
    cl.setOut(new PrintWriter(new StringWriter()));
    int code = cl.execute("importers", "--plugins", dir.resolve("nowhere").toString());
    assertEquals(Main.EXIT_INPUT_ERROR, code);
    assertTrue(err.toString().contains("does not exist"), err.toString());
  }

  static Manifest pluginManifest(String id, String requires) {
    Manifest m = new Manifest();
    Attributes a = m.getMainAttributes();
    a.put(Attributes.Name.MANIFEST_VERSION, "1.0");
    a.putValue("Plugin-Id", id);
    a.putValue("Plugin-Version", "1.0.0");
    a.putValue("Plugin-Requires", requires);
    return m;
  }

  static void writeJar(Path path, Manifest m, String entry, String content) throws IOException {
    if (m.getMainAttributes().isEmpty()) {
      m.getMainAttributes().put(Attributes.Name.MANIFEST_VERSION, "1.0");
    }
    try (OutputStream os = Files.newOutputStream(path); JarOutputStream jar = new JarOutputStream(os, m)) {
      jar.putNextEntry(new JarEntry(entry));
      jar.write(content.getBytes(StandardCharsets.UTF_8));
      jar.closeEntry();
    }
  }
}
