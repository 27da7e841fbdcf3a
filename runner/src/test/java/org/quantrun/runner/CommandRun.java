package org.quantrun.runner;

import java.io.PrintWriter;
import java.io.StringWriter;
import picocli.CommandLine;

/** The result of running the command line in-process: exit code, standard output and error. */
public record CommandRun(int exitCode, String out, String err) {

  /** Runs {@code quantrun ARGS...} in this JVM and captures what it prints. */
  public static CommandRun of(String... args) {
    return of(Main.commandLine(), args);
  }

  /** Runs a prepared command line in this JVM and captures what it prints. */
  public static CommandRun of(CommandLine cl, String... args) {
    StringWriter out = new StringWriter();
    StringWriter err = new StringWriter();
    cl.setOut(new PrintWriter(out, true));
    cl.setErr(new PrintWriter(err, true));
    int code = cl.execute(args);
    return new CommandRun(code, out.toString(), err.toString());
  }
}
