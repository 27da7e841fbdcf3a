package org.quantrun.runner.plugins;

import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Optional;
import picocli.CommandLine;
import picocli.CommandLine.Option;

/** The {@code --plugins DIR} option, shared by every command that loads importers. */
public final class PluginOptions {

  @Option(names = "--plugins", paramLabel = "DIR",
      description = "Folder of importer plugin jars (default: the plugins folder beside quantrun.jar).")
  Path pluginsDir;

  /**
   * Loads the importers from the chosen folder.
   *
   * @param spec the command, for usage errors
   * @return what was loaded and skipped
   * @throws CommandLine.ParameterException if {@code --plugins} names no folder
   */
  public ImporterPlugins.Result load(CommandLine.Model.CommandSpec spec) {
    if (pluginsDir != null && !Files.isDirectory(pluginsDir)) {
      throw new CommandLine.ParameterException(spec.commandLine(),
          "--plugins: folder '" + pluginsDir + "' does not exist");
    }
    ImporterPlugins.Result r = ImporterPlugins.load(Optional.ofNullable(pluginsDir).orElseGet(ImporterPlugins::defaultPluginsDir));
    org.quantrun.runner.StartupTrace.mark("plugins loaded (" + r.importers().size() + " importers)");
    return r;
  }
}
