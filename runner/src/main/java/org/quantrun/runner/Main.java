package org.quantrun.runner;

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
    subcommands = {
      CommandLine.HelpCommand.class,
      org.quantrun.runner.calibrate.CalibrateCommand.class,
      CheckCommand.class,
      org.quantrun.runner.plugins.ImportersCommand.class,
      org.quantrun.runner.generate.GenerateCommand.class,
    })
public final class Main implements Runnable {

  /** Exit code for a usage or input-data error. */
  public static final int EXIT_INPUT_ERROR = 2;

  @CommandLine.Spec CommandLine.Model.CommandSpec spec;

  public static void main(String[] args) {
    System.exit(commandLine().execute(args));
  }

  /** The command line with every sub-command registered; tests execute it directly. */
  public static CommandLine commandLine() {
    CommandLine cl = new CommandLine(new Main());
    cl.setParameterExceptionHandler(Main::onUsageError);
    return cl;
  }

  private static int onUsageError(CommandLine.ParameterException e, String[] args) {
    CommandLine cl = e.getCommandLine();
    cl.getErr().println("quantrun: " + e.getMessage() + " (see '" + cl.getCommandSpec().qualifiedName() + " --help')");
    return EXIT_INPUT_ERROR;
  }

  @Override
  public void run() {
    spec.commandLine().usage(spec.commandLine().getOut());
  }

  /** Reads the version from the jar manifest, falling back to "development build". */
  static final class Version implements CommandLine.IVersionProvider {
    @Override
    public String[] getVersion() {
      String v = Main.class.getPackage().getImplementationVersion();
      return new String[] {"quantrun " + (v == null ? "development build" : v)};
    }
  }
}
