package org.quantrun.runner.process;

import java.nio.file.Path;
import java.time.Clock;
import java.util.ArrayList;
import java.util.EnumSet;
import java.util.List;
import java.util.Optional;
import java.util.Set;
import java.util.concurrent.Callable;
import org.quantrun.runner.plugins.PluginOptions;
import org.quantrun.runner.write.OutputFormat;
import picocli.CommandLine;
import picocli.CommandLine.Command;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Option;
import picocli.CommandLine.Parameters;

/**
 * {@code quantrun process EXPORT... --method M.yaml [--prep PREP.csv] [--out DIR]}: reads each
 * export, processes it with the method and writes one results folder per run.
 */
@Command(
    name = "process",
    mixinStandardHelpOptions = true,
    sortOptions = false,
    description = {
      "Processes instrument exports with a method into one results folder per run.",
      "",
      "Each folder holds results.csv, results-wide.csv, calibration.csv, calibration-levels.csv, qc.csv, "
          + "reruns.csv, run.json, report.html and the audit trail audit.json. It is named from the run's id (else the export's name) and never "
          + "overwrites an earlier folder: NAME, NAME-2, NAME-3, ..."
    },
    exitCodeListHeading = "%nExit codes (for several exports, the highest that applies):%n",
    exitCodeList = {
      "0:processed, and no QC check failed (checks not evaluated do not fail)",
      "1:processed, outputs complete, but a QC check failed or a calibration was rejected",
      "2:bad input or usage: message on stderr, nothing half-written",
      "3:internal error: nothing half-written, details in the log file"},
    footer = {"", "Caution: results need review by a qualified analyst; the lab's accredited method and local regulations govern."})
public final class ProcessCommand implements Callable<Integer> {

  @Parameters(arity = "1..*", paramLabel = "EXPORT", description = "instrument exports, each one run")
  List<Path> exports = new ArrayList<>();

  @Option(names = "--method", required = true, paramLabel = "M.yaml", description = "the method file")
  Path method;

  @Option(names = "--prep", paramLabel = "PREP.csv", description = "prep sheet (sample masses, volumes, prep batches)")
  Path prep;

  @Option(names = "--profile", paramLabel = "PROFILE.yaml",
      description = "import profile to read the exports with, instead of the one the method names")
  Path profile;

  @Option(names = "--out", paramLabel = "DIR", defaultValue = ".",
      description = "folder the results folders go into (default: the current folder)")
  Path out;

  @Option(names = "--formats", paramLabel = "FORMAT", split = ",", converter = FormatConverter.class,
      description = "outputs to write, comma separated: csv, json, html (default: all); audit.json is always written")
  List<OutputFormat> formats = new ArrayList<>();

  @Mixin PluginOptions plugins;

  @CommandLine.Spec CommandLine.Model.CommandSpec spec;

  private final RunPipeline pipeline;
  private final Clock clock;

  /** The command with core's run processor and the system clock. */
  public ProcessCommand() {
    this(CorePipeline.INSTANCE, Clock.systemUTC());
  }

  /**
   * The command with another pipeline and clock (for tests).
   *
   * @param pipeline turns runs into results
   * @param clock the clock
   */
  public ProcessCommand(RunPipeline pipeline, Clock clock) {
    this.pipeline = pipeline;
    this.clock = clock;
  }

  @Override
  public Integer call() {
    Set<OutputFormat> chosen = formats.isEmpty() ? EnumSet.allOf(OutputFormat.class) : EnumSet.copyOf(formats);
    RunBatch.Request req = new RunBatch.Request("quantrun process",
        exports.stream().map(RunBatch.Input::of).toList(), RunBatch.Input.of(method),
        Optional.ofNullable(prep).map(RunBatch.Input::of), Optional.ofNullable(profile).map(RunBatch.Input::of),
        out, chosen, plugins.load(spec), spec.commandLine().getParseResult().originalArgs());
    return new RunBatch(pipeline, clock)
        .run(req, spec.commandLine().getOut(), spec.commandLine().getErr(), System.console() != null)
        .exitCode();
  }

  /** Reads {@code --formats} values. */
  static final class FormatConverter implements CommandLine.ITypeConverter<OutputFormat> {
    @Override
    public OutputFormat convert(String value) {
      try {
        return OutputFormat.fromLabel(value);
      } catch (IllegalArgumentException e) {
        throw new CommandLine.TypeConversionException(e.getMessage());
      }
    }
  }
}
