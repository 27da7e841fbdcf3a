package org.quantrun.runner.plugins;

import java.io.IOException;
import java.io.InputStream;
import java.io.PrintWriter;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Locale;
import java.util.concurrent.Callable;
import org.quantrun.core.importer.ImportException;
import org.quantrun.core.importer.ImportSettings;
import org.quantrun.core.importer.ImporterSelection;
import org.quantrun.core.importer.RunImporter;
import picocli.CommandLine;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;

/**
 * {@code quantrun importers}: lists the installed importers and any plugin that was skipped; with
 * {@code --detect FILE}, shows each importer's confidence for a file and which one {@code auto}
 * would pick.
 */
@Command(name = "importers", mixinStandardHelpOptions = true,
    description = "Lists the installed importers (id, version, SHA-256 of the plugin jar, description); skipped plugins are reported on stderr.")
public final class ImportersCommand implements Callable<Integer> {

  @Mixin PluginOptions plugins;

  @CommandLine.Option(names = "--detect", paramLabel = "FILE",
      description = "Show each importer's detection confidence for FILE and the importer 'auto' picks.")
  Path detect;

  @CommandLine.Spec CommandLine.Model.CommandSpec spec;

  @Override
  public Integer call() {
    ImporterPlugins.Result result = plugins.load(spec);
    PrintWriter out = spec.commandLine().getOut();
    PrintWriter err = spec.commandLine().getErr();
    for (ImporterPlugins.Problem p : result.problems()) {
      err.println("quantrun: " + (p.source().endsWith(".jar") ? "plugin skipped: " : "") + p.text());
    }
    if (detect != null) {
      return detect(result.selection(), out, err);
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
    String row = "%-" + idWidth + "s  %-" + versionWidth + "s  %-64s  %s%n";
    out.printf(row, "id", "version", "sha256", "description");
    for (ImporterPlugins.LoadedImporter li : result.importers()) {
      out.printf(row, li.importer().id(), li.version(), li.sha256().orElse("(class path)"), description(li));
    }
    out.flush();
    err.flush();
    return 0;
  }

  private static String description(ImporterPlugins.LoadedImporter li) {
    try {
      String d = li.importer().description();
      return d == null ? "" : d.replaceAll("\\p{Cntrl}", " ");
    } catch (Throwable e) { // a plugin's failure is contained and shown, never a stack trace
      return "(" + li.origin() + " failed to describe itself: " + e + ")";
    }
  }

  private int detect(ImporterSelection selection, PrintWriter out, PrintWriter err) {
    String name = detect.getFileName().toString();
    byte[] head;
    try (InputStream in = Files.newInputStream(detect)) {
      head = in.readNBytes(RunImporter.DETECT_HEAD_BYTES);
    } catch (IOException e) {
      err.println("quantrun: " + name + ": cannot be read (" + e.getMessage() + ")");
      err.flush();
      return org.quantrun.runner.Main.EXIT_INPUT_ERROR;
    }
    for (ImporterSelection.Candidate c : selection.detect(name, head)) {
      out.printf(Locale.ROOT, "%-16s %.2f%s%n", c.importerId(), c.confidence(),
          c.failure().map(f -> "  (failed: " + f + ")").orElse(""));
    }
    try {
      out.println("auto picks: " + selection.select(ImportSettings.AUTO, name, head).id());
      out.flush();
      return 0;
    } catch (ImportException e) {
      out.flush();
      err.println("quantrun: " + e.getMessage());
      err.flush();
      return org.quantrun.runner.Main.EXIT_INPUT_ERROR;
    }
  }
}
