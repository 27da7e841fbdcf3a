package org.quantrun.runner.plugins;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.io.InputStream;
import java.io.OutputStream;
import java.io.PrintWriter;
import java.io.StringWriter;
import java.nio.file.Files;
import java.nio.file.Path;
import java.security.MessageDigest;
import java.util.HexFormat;
import java.util.List;
import java.util.jar.JarEntry;
import java.util.jar.JarOutputStream;
import java.util.jar.Manifest;
import org.junit.jupiter.api.DisplayName;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.quantrun.core.importer.ImportException;
import org.quantrun.core.importer.ImportSettings;
import org.quantrun.runner.Main;
import org.quantrun.runner.plugins.hostile.HostileImporter;
import picocli.CommandLine;

/**
 * Plugins are loaded only from the configured folder, are identified by their jar's SHA-256, and
 * whatever a plugin throws while detecting or reading is contained and reported as an import
 * error naming the plugin.
 */
class PluginContainmentTest {

  static final Path BUILT = ImporterPluginsTest.BUILT;

  /** Packs {@link HostileImporter} into a plugin jar of its own. */
  static void writeHostileJar(Path jar) throws IOException {
    Manifest m = ImporterPluginsTest.pluginManifest("hostile-plugin", ">=1.0.0 & <2.0.0");
    String cls = HostileImporter.class.getName().replace('.', '/') + ".class";
    try (OutputStream os = Files.newOutputStream(jar); JarOutputStream out = new JarOutputStream(os, m);
        InputStream in = HostileImporter.class.getClassLoader().getResourceAsStream(cls)) {
      out.putNextEntry(new JarEntry("META-INF/extensions.idx"));
      out.write((HostileImporter.class.getName() + "\n").getBytes(java.nio.charset.StandardCharsets.UTF_8));
      out.closeEntry();
      out.putNextEntry(new JarEntry(cls));
      in.transferTo(out);
      out.closeEntry();
    }
  }

  private static Path folderWithHostilePlugin(Path dir) throws IOException {
    for (Path j : ImporterPluginsTest.builtJars) {
      Files.copy(j, dir.resolve(j.getFileName()));
    }
    writeHostileJar(dir.resolve("hostile.jar"));
    return dir;
  }

  @Test
  @DisplayName("each plugin jar's SHA-256 is reported, equal to the digest of the jar's bytes")
  void digestsOfTheJars() throws Exception {
    ImporterPluginsTest.builtPluginsExist();
    ImporterPlugins.Result r = ImporterPlugins.load(BUILT);
    assertFalse(r.importers().isEmpty());
    for (ImporterPlugins.LoadedImporter li : r.importers()) {
      // the digest computed here with the JDK alone, not with the runner's own helper
      String expected = HexFormat.of().formatHex(MessageDigest.getInstance("SHA-256").digest(Files.readAllBytes(li.source().orElseThrow())));
      assertEquals(expected, li.sha256().orElseThrow(), li.importer().id());
    }
  }

  @Test
  @DisplayName("jars in a sub-folder, beside the plugins folder or linked into it from elsewhere do not load")
  void onlyJarsInTheFolderItselfLoad(@TempDir Path root) throws Exception {
    ImporterPluginsTest.builtPluginsExist();
    Path plugins = Files.createDirectory(root.resolve("plugins"));
    Path delimited = ImporterPluginsTest.builtJars.get(0);
    Files.createDirectory(plugins.resolve("nested"));
    Files.copy(delimited, plugins.resolve("nested").resolve(delimited.getFileName()));
    Files.copy(delimited, root.resolve(delimited.getFileName()));
    Path elsewhere = Files.createDirectory(root.resolve("elsewhere"));
    writeHostileJar(elsewhere.resolve("hostile.jar"));
    Files.createSymbolicLink(plugins.resolve("linked.jar"), elsewhere.resolve("hostile.jar"));

    ImporterPlugins.Result r = ImporterPlugins.load(plugins);

    assertEquals(List.of(), r.importers().stream().filter(li -> li.source().isPresent()).toList());
    assertEquals(List.of("linked.jar: is a symbolic link; copy the jar into the plugins folder"),
        r.problems().stream().map(ImporterPlugins.Problem::text).toList());
  }

  @Test
  @DisplayName("a plugin whose detector throws an Error makes auto selection an import error naming the plugin")
  void detectorFailureIsContained(@TempDir Path dir) throws Exception {
    ImporterPluginsTest.builtPluginsExist();
    ImporterPlugins.Result r = ImporterPlugins.load(folderWithHostilePlugin(dir));
    assertEquals(List.of(), r.problems());
    RunFileImport files = new RunFileImport(r.selection());
    ImportException e = assertThrows(ImportException.class,
        () -> files.read(Path.of("../demo-data/run-R2611A-long.csv"), ImportSettings.DEFAULT));
    assertTrue(e.getMessage().startsWith("run-R2611A-long.csv: importer 'hostile' of plugin 'hostile-plugin' (hostile.jar) "
        + "failed while detecting this file (java.lang.StackOverflowError)"), e.getMessage());
  }

  @Test
  @DisplayName("a plugin whose reader throws an Error gives an import error naming the plugin")
  void readerFailureIsContained(@TempDir Path dir) throws Exception {
    ImporterPluginsTest.builtPluginsExist();
    ImporterPlugins.Result r = ImporterPlugins.load(folderWithHostilePlugin(dir));
    RunFileImport files = new RunFileImport(r.selection());
    ImportSettings named = ImportSettings.DEFAULT.toBuilder().importer("hostile").build();
    ImportException e = assertThrows(ImportException.class,
        () -> files.read(Path.of("../demo-data/run-R2611A-long.csv"), named));
    assertEquals("run-R2611A-long.csv: importer 'hostile' of plugin 'hostile-plugin' (hostile.jar) failed unexpectedly: "
        + "java.lang.NoClassDefFoundError: org/example/Missing", e.getMessage());
  }

  @Test
  @DisplayName("'quantrun importers --detect' shows a failing detector instead of crashing, and exits 2")
  void detectCommandShowsTheFailure(@TempDir Path dir) throws Exception {
    ImporterPluginsTest.builtPluginsExist();
    folderWithHostilePlugin(dir);
    StringWriter out = new StringWriter();
    StringWriter err = new StringWriter();
    CommandLine cl = Main.commandLine();
    cl.setOut(new PrintWriter(out));
    cl.setErr(new PrintWriter(err));
    int code = cl.execute("importers", "--plugins", dir.toString(), "--detect", "../demo-data/run-R2611A-long.csv");
    assertEquals(Main.EXIT_INPUT_ERROR, code, out + "\n" + err);
    assertTrue(out.toString().contains("hostile          0.00  (failed: java.lang.StackOverflowError)"), out.toString());
    assertTrue(err.toString().contains("of plugin 'hostile-plugin' (hostile.jar) failed while detecting"), err.toString());
  }
}
