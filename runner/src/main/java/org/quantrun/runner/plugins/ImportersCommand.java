package org.quantrun.runner.plugins;

import java.io.PrintWriter;
import java.util.concurrent.Callable;
import picocli.CommandLine;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;

/** {@code quantrun importers}: lists the installed importers and any plugin that was skipped. */
@Command(name = "importers", mixinStandardHelpOptions = true,
    description = "Lists the installed importers (id, version, description); skipped plugins are reported on stderr.")
public final class ImportersCommand implements Callable<Integer> {

  @Mixin PluginOptions plugins;

  @CommandLine.Spec CommandLine.Model.CommandSpec spec;

  @Override
  public Integer call() {
    ImporterPlugins.Result result = plugins.load(spec);
    PrintWriter out = spec.commandLine().getOut();
    PrintWriter err = spec.commandLine().getErr();
    for (ImporterPlugins.Problem p : result.problems()) {
      err.println("quantrun: plugin skipped: " + p.text());
    }
    if (result.importers().isEmpty()) {
      out.println("no importers installed");
      out.flush();
      return 0;
    }
    int idWidth = 2;
    int versionWidth = 7;
    for (ImporterPlugins.LoadedImporter li : result.importers()) {
      idWidth = Math.max(idWidth, li.importer().id().length());
      versionWidth = Math.max(versionWidth, li.version().length());
    }
    String row = "%-" + idWidth + "s  %-" + versionWidth + "s  %s%n";
    out.printf(row, "id", "version", "description");
    for (ImporterPlugins.LoadedImporter li : result.importers()) {
      out.printf(row, li.importer().id(), li.version(), li.importer().description());
    }
    out.flush();
    err.flush();
    return 0;
  }
}
