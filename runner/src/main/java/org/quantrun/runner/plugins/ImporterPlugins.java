package org.quantrun.runner.plugins;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.HashSet;
import java.util.List;
import java.util.Optional;
import java.util.Set;
import java.util.stream.Stream;
import org.pf4j.JarPluginManager;
import org.pf4j.PluginManager;
import org.pf4j.PluginState;
import org.pf4j.PluginWrapper;
import org.quantrun.core.importer.ImporterSelection;
import org.quantrun.core.importer.RunImporter;

/**
 * Loads the importer plugins: every {@code *.jar} file in a plugins folder (not in its sub-folders,
 * not a symbolic link to a file elsewhere) is tried as a PF4J plugin
 * (manifest entries {@code Plugin-Id}, {@code Plugin-Version}, {@code Plugin-Requires}); its
 * {@link RunImporter} extensions are collected. A jar that is broken, not a plugin, requires an
 * importer API this runner does not have, fails to start or holds no usable importer is reported
 * as a {@link Problem} and skipped; the others load regardless. Each loaded jar's SHA-256 is
 * taken for {@code quantrun importers} and the audit trail. Importer extensions on the
 * runner's own class path (listed in its {@code META-INF/extensions.idx}) are added too, so
 * in-process tools and tests can find importers without jars.
 */
public final class ImporterPlugins {

  /**
   * An importer and where it came from.
   *
   * @param importer the importer
   * @param pluginId the plugin id, or {@code "class path"}
   * @param version the plugin version, or the runner's for class-path importers
   * @param source the jar it came from, if any
   * @param sha256 the SHA-256 of that jar (lower-case hex), if it came from one
   */
  public record LoadedImporter(RunImporter importer, String pluginId, String version, Optional<Path> source,
      Optional<String> sha256) {

    /**
     * An importer from the class path or a jar whose digest is not known.
     *
     * @param importer the importer
     * @param pluginId the plugin id
     * @param version the version
     * @param source the jar, if any
     */
    public LoadedImporter(RunImporter importer, String pluginId, String version, Optional<Path> source) {
      this(importer, pluginId, version, source, Optional.empty());
    }

    /**
     * Where the importer came from, for messages: {@code plugin 'delimited' (quantrun-importer-delimited-0.1.0.jar)}
     * or {@code the class path}.
     *
     * @return the description
     */
    public String origin() {
      return source.map(p -> "plugin '" + pluginId + "' (" + p.getFileName() + ")").orElse("the class path");
    }
  }

  /**
   * A plugin that was skipped.
   *
   * @param source the jar (file name) or plugin id concerned
   * @param message what is wrong, for the user
   */
  public record Problem(String source, String message) {
    /** @return {@code "<source>: <message>"} */
    public String text() {
      return source + ": " + message;
    }
  }

  /**
   * What loading found.
   *
   * @param importers the importers, in load order (jars by file name, then class path)
   * @param problems what was skipped and why
   */
  public record Result(List<LoadedImporter> importers, List<Problem> problems) {
    /**
     * Copies the lists.
     *
     * @param importers the importers, in load order
     * @param problems what was skipped and why
     */
    public Result {
      importers = List.copyOf(importers);
      problems = List.copyOf(problems);
    }

    /** @return the selection service over the loaded importers, naming each importer's plugin in messages */
    public ImporterSelection selection() {
      java.util.Map<String, String> origins = new java.util.HashMap<>();
      for (LoadedImporter li : importers) {
        origins.put(li.importer().id(), li.origin());
      }
      return new ImporterSelection(importers.stream().map(LoadedImporter::importer).toList(), origins);
    }
  }

  private ImporterPlugins() {}

  /**
   * The plugins folder of this distribution: {@code plugins} beside {@code quantrun.jar} (in a
   * development build, beside the runner's {@code classes} folder, i.e. {@code runner/target/plugins}).
   *
   * @return the folder (it may not exist)
   */
  public static Path defaultPluginsDir() {
    try {
      Path here = Path.of(ImporterPlugins.class.getProtectionDomain().getCodeSource().getLocation().toURI());
      return here.toAbsolutePath().getParent().resolve("plugins");
    } catch (Exception e) {
      return Path.of("plugins").toAbsolutePath();
    }
  }

  /**
   * Loads the importers from a plugins folder and the class path.
   *
   * @param pluginsDir the plugins folder; a missing folder is reported as a problem
   * @return what was loaded and what was skipped
   */
  public static Result load(Path pluginsDir) {
    List<LoadedImporter> loaded = new ArrayList<>();
    List<Problem> problems = new ArrayList<>();
    Set<String> ids = new HashSet<>();
    JarPluginManager manager = new JarPluginManager(pluginsDir);
    manager.setSystemVersion(RunImporter.API_VERSION);
    List<Path> jars = jars(pluginsDir, problems);
    List<String> pluginIds = new ArrayList<>();
    for (Path jar : jars) {
      String name = jar.getFileName().toString();
      try {
        String id = manager.loadPlugin(jar);
        if (id == null) {
          problems.add(new Problem(name, "not a quantrun plugin (no Plugin-Id in its manifest)"));
          continue;
        }
        PluginWrapper w = manager.getPlugin(id);
        if (w.getPluginState() == PluginState.DISABLED) {
          problems.add(new Problem(name, "plugin '" + id + "' requires importer API " + w.getDescriptor().getRequires()
              + "; this quantrun has " + RunImporter.API_VERSION));
          unload(manager, id);
          continue;
        }
        pluginIds.add(id);
      } catch (Exception | LinkageError e) {
        problems.add(new Problem(name, "not a usable plugin: " + reason(e)));
      }
    }
    try {
      manager.startPlugins();
    } catch (Exception | LinkageError e) {
      problems.add(new Problem(pluginsDir.getFileName() == null ? "plugins" : pluginsDir.getFileName().toString(),
          "plugins failed to start: " + reason(e)));
    }
    for (String id : pluginIds) {
      PluginWrapper w = manager.getPlugin(id);
      String name = w.getPluginPath().getFileName().toString();
      if (w.getPluginState() != PluginState.STARTED) {
        problems.add(new Problem(name, "plugin '" + id + "' did not start"
            + (w.getFailedException() == null ? "" : ": " + reason(w.getFailedException()))));
        continue;
      }
      List<RunImporter> found = extensions(manager, id, name, problems);
      if (found.isEmpty()) {
        problems.add(new Problem(name, "plugin '" + id + "' holds no usable importer"));
      }
      Optional<String> digest = sha256(w.getPluginPath(), name, problems);
      if (digest.isEmpty()) {
        continue;
      }
      for (RunImporter r : found) {
        add(loaded, ids, problems,
            new LoadedImporter(r, id, w.getDescriptor().getVersion(), Optional.of(w.getPluginPath()), digest), name);
      }
    }
    for (RunImporter r : extensions(manager, null, "class path", problems)) {
      add(loaded, ids, problems, new LoadedImporter(r, "class path", RunImporter.API_VERSION, Optional.empty()), "class path");
    }
    return new Result(loaded, problems);
  }

  private static void add(List<LoadedImporter> loaded, Set<String> ids, List<Problem> problems, LoadedImporter li,
      String source) {
    String id;
    try {
      id = li.importer().id();
    } catch (RuntimeException | LinkageError e) {
      problems.add(new Problem(source, "an importer failed to give its id: " + reason(e)));
      return;
    }
    if (id == null || !id.matches("[a-z][a-z0-9-]*") || id.equals("auto")) {
      problems.add(new Problem(source, "importer id '" + id + "' is not usable (lower case letters, digits, hyphens; not 'auto')"));
    } else if (!ids.add(id)) {
      problems.add(new Problem(source, "importer '" + id + "' is already loaded from another plugin; skipped"));
    } else {
      loaded.add(li);
    }
  }

  private static List<RunImporter> extensions(PluginManager manager, String pluginId, String source,
      List<Problem> problems) {
    try {
      return new ArrayList<>(manager.getExtensions(RunImporter.class, pluginId));
    } catch (Exception | LinkageError e) {
      problems.add(new Problem(source, "importers could not be created: " + reason(e)));
      return List.of();
    }
  }

  private static Optional<String> sha256(Path jar, String name, List<Problem> problems) {
    try {
      return Optional.of(org.quantrun.runner.output.Digests.sha256(jar));
    } catch (IOException e) {
      problems.add(new Problem(name, "cannot be read to take its SHA-256: " + e.getMessage()));
      return Optional.empty();
    }
  }

  private static void unload(PluginManager manager, String id) {
    try {
      manager.unloadPlugin(id);
    } catch (Exception e) {
      // already reported as unusable
    }
  }

  private static List<Path> jars(Path dir, List<Problem> problems) {
    if (!Files.isDirectory(dir)) {
      problems.add(new Problem(dir.toString(), "plugins folder not found"));
      return List.of();
    }
    List<Path> jars = new ArrayList<>();
    try (Stream<Path> s = Files.list(dir)) {
      for (Path p : s.filter(p -> p.getFileName().toString().endsWith(".jar")).sorted().toList()) {
        if (Files.isSymbolicLink(p)) {
          // only jars that are in the plugins folder itself load, not files linked from elsewhere
          problems.add(new Problem(p.getFileName().toString(), "is a symbolic link; copy the jar into the plugins folder"));
        } else if (Files.isRegularFile(p, java.nio.file.LinkOption.NOFOLLOW_LINKS)) {
          jars.add(p);
        }
      }
      return jars;
    } catch (IOException e) {
      problems.add(new Problem(dir.toString(), "plugins folder cannot be read: " + e.getMessage()));
      return List.of();
    }
  }

  private static String reason(Throwable e) {
    Throwable t = e;
    String msg = t.getMessage();
    while ((msg == null || msg.isBlank()) && t.getCause() != null) {
      t = t.getCause();
      msg = t.getMessage();
    }
    return msg == null || msg.isBlank() ? t.getClass().getSimpleName() : msg;
  }
}
