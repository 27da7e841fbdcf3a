package org.quantrun.runner;

import java.util.Collection;
import java.util.Collections;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import picocli.CommandLine;
import picocli.CommandLine.Command;

/**
 * The {@code quantrun} command line. Each sub-command is a class of its own in this package
 * (or a sub-package) and is registered in {@link #commandLine()}.
 */
@Command(
    name = "quantrun",
    mixinStandardHelpOptions = true,
    versionProvider = Main.Version.class,
    description = "Turns the raw export of an instrument run into reportable, QC-checked concentrations.",
    exitCodeListHeading = "%nExit codes:%n",
    exitCodeList = {
      "0:done; for process, every run processed and no QC check failed",
      "1:process: every run processed, outputs complete, but a QC check failed",
      "2:bad input or usage (message on stderr; nothing half-written)",
      "3:internal error (details in the log file)"},
    footer = {"", "Caution: results need review by a qualified analyst; the lab's accredited method and local regulations govern."})
// sub-commands are registered in code (see COMMANDS), so that a run builds only the one it needs
public final class Main implements Runnable {

  /** Exit code: done, and (for {@code process}) no QC check failed. */
  public static final int EXIT_OK = 0;
  /** Exit code of {@code process}: processed, outputs complete, but a QC check failed. */
  public static final int EXIT_QC_FAILED = 1;
  /** Exit code for a usage or input-data error. */
  public static final int EXIT_INPUT_ERROR = 2;
  /** Exit code for an internal error (a bug): details are in the log file. */
  public static final int EXIT_INTERNAL_ERROR = 3;

  /**
   * The sub-commands by name, in the order the help lists them. Each class carries its own
   * {@code @Command(name = ...)}, which must equal its key here (a test checks).
   */
  static final Map<String, Class<?>> COMMANDS = commands();

  @CommandLine.Spec CommandLine.Model.CommandSpec spec;

  private static Map<String, Class<?>> commands() {
    Map<String, Class<?>> m = new LinkedHashMap<>();
    m.put("help", CommandLine.HelpCommand.class);
    m.put("calibrate", org.quantrun.runner.calibrate.CalibrateCommand.class);
    m.put("check", CheckCommand.class);
    m.put("importers", org.quantrun.runner.plugins.ImportersCommand.class);
    m.put("process", org.quantrun.runner.process.ProcessCommand.class);
    m.put("demo", org.quantrun.runner.process.DemoCommand.class);
    m.put("generate", org.quantrun.runner.generate.GenerateCommand.class);
    m.put("watch", org.quantrun.runner.watch.WatchCommand.class);
    return Collections.unmodifiableMap(m);
  }

  /**
   * Runs the command line and exits with its code.
   *
   * @param args the arguments
   */
  public static void main(String[] args) {
    System.setProperty("java.awt.headless", "true");
    StartupTrace.mark("main entered");
    int code;
    try {
      CommandLine cl = forArguments(args);
      int n = cl.getSubcommands().size();
      StartupTrace.mark("command line built (" + n + (n == 1 ? " sub-command)" : " sub-commands)"));
      if (StartupTrace.on()) {
        org.slf4j.LoggerFactory.getILoggerFactory();
        StartupTrace.mark("logging set up");
      }
      code = cl.execute(args);
    } catch (OutOfMemoryError e) {
      System.err.println("quantrun: " + outOfMemoryAdvice() + "; nothing half-written was left behind");
      code = EXIT_INTERNAL_ERROR;
    }
    StartupTrace.mark("done, exit code " + code);
    StartupTrace.print(System.err);
    System.exit(code);
  }

  /**
   * What to tell the user when Java ran out of memory: the heap limit and how to raise it.
   *
   * @return e.g. {@code not enough memory (Java heap limit 512 MB): ...}
   */
  public static String outOfMemoryAdvice() {
    long mb = Runtime.getRuntime().maxMemory() / (1024 * 1024);
    long suggestGb = Math.max(2, (2 * mb + 1023) / 1024);
    return "not enough memory (Java heap limit " + mb + " MB): give Java more, e.g. QUANTRUN_JAVA_OPTS=-Xmx"
        + suggestGb + "g, or process fewer exports at once";
  }

  /**
   * The command line a run with these arguments needs: when the first argument names a
   * sub-command (other than {@code help}), only that sub-command is built, since building the
   * others (picocli reads every option of every command class by reflection) is start-up time
   * spent for nothing; otherwise (help, {@code --version}, a mistyped command) all of them.
   *
   * @param args the arguments
   * @return the command line
   */
  static CommandLine forArguments(String[] args) {
    if (args.length > 0 && !"help".equals(args[0]) && COMMANDS.containsKey(args[0])) {
      return commandLine(CommandLine.defaultFactory(), List.of(args[0]));
    }
    return commandLine();
  }

  /**
   * This quantrun's version, from the jar manifest.
   *
   * @return e.g. {@code 0.1.0}, or {@code development build} when run from classes
   */
  public static String version() {
    String v = Main.class.getPackage().getImplementationVersion();
    return v == null ? "development build" : v;
  }

  /** The command line with every sub-command registered; tests execute it directly. */
  public static CommandLine commandLine() {
    return commandLine(CommandLine.defaultFactory());
  }

  /**
   * The command line with a factory of its own for the sub-commands (tests give commands a
   * different pipeline or clock this way).
   *
   * @param factory makes the command objects
   * @return the command line
   */
  public static CommandLine commandLine(CommandLine.IFactory factory) {
    return commandLine(factory, COMMANDS.keySet());
  }

  private static CommandLine commandLine(CommandLine.IFactory factory, Collection<String> names) {
    CommandLine cl = new CommandLine(new Main(), factory);
    for (String name : names) {
      cl.addSubcommand(name, new CommandLine(COMMANDS.get(name), factory));
    }
    cl.setParameterExceptionHandler(Main::onUsageError);
    cl.setExecutionExceptionHandler(Main::onInternalError);
    return cl;
  }

  private static int onUsageError(CommandLine.ParameterException e, String[] args) {
    CommandLine cl = e.getCommandLine();
    cl.getErr().println("quantrun: " + e.getMessage() + " (see '" + cl.getCommandSpec().qualifiedName() + " --help')");
    return EXIT_INPUT_ERROR;
  }

  /** An exception no command handled is a bug: one line for the user, the stack trace to the log file. */
  private static int onInternalError(Exception e, CommandLine cl, CommandLine.ParseResult parsed) {
    org.slf4j.LoggerFactory.getLogger(Main.class).error(org.slf4j.MarkerFactory.getMarker(LogSetup.FILE_ONLY),
        "internal error in {}", cl.getCommandSpec().qualifiedName(), e);
    cl.getErr().println(cl.getCommandSpec().qualifiedName() + ": internal error (" + e
        + "); nothing half-written was left behind; details are in the log file");
    cl.getErr().flush();
    return EXIT_INTERNAL_ERROR;
  }

  @Override
  public void run() {
    spec.commandLine().usage(spec.commandLine().getOut());
  }

  /**
   * The version from the jar manifest (or "development build"), the Java runtime, and the importer
   * plugins found in the default plugins folder.
   */
  static final class Version implements CommandLine.IVersionProvider {
    @Override
    public String[] getVersion() {
      java.util.List<String> lines = new java.util.ArrayList<>();
      lines.add("quantrun " + version());
      lines.add("Java " + System.getProperty("java.version") + " (" + System.getProperty("java.vendor") + ")");
      org.quantrun.runner.plugins.ImporterPlugins.Result plugins =
          org.quantrun.runner.plugins.ImporterPlugins.load(org.quantrun.runner.plugins.ImporterPlugins.defaultPluginsDir());
      lines.add("importers (" + plugins.importers().size() + "):");
      for (org.quantrun.runner.plugins.ImporterPlugins.LoadedImporter li : plugins.importers()) {
        lines.add("  " + li.importer().id() + " " + li.version() + " (plugin " + li.pluginId()
            + li.source().map(p -> ", " + p.getFileName()).orElse("") + ")");
      }
      for (org.quantrun.runner.plugins.ImporterPlugins.Problem p : plugins.problems()) {
        lines.add("  skipped: " + p.text());
      }
      return lines.toArray(new String[0]);
    }
  }
}
