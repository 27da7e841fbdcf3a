package org.quantrun.runner.generate;

import java.io.BufferedWriter;
import java.io.IOException;
import java.io.InputStream;
import java.io.OutputStreamWriter;
import java.io.PrintWriter;
import java.io.Writer;
import java.nio.charset.Charset;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.StandardCopyOption;
import java.time.LocalDateTime;
import java.time.format.DateTimeParseException;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.SplittableRandom;
import java.util.concurrent.Callable;
import org.quantrun.runner.InputException;
import org.quantrun.runner.Main;
import org.quantrun.runner.output.SafeNames;
import picocli.CommandLine.Command;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Option;
import picocli.CommandLine.Spec;

/**
 * {@code quantrun generate}: writes an invented run with known true concentrations, for training,
 * validation studies and benchmarks: the export (in one of the bundled dialects), the matching
 * method file and import profile, a prep sheet for soil digests, and the true concentrations.
 */
@Command(
    name = "generate",
    mixinStandardHelpOptions = true,
    description = {
      "Writes a synthetic run with known true concentrations: an export in one of the bundled dialects, its "
          + "method file and import profile, a prep sheet (soil) and the truth table. The same options and seed "
          + "give the same files, byte for byte."
    })
public final class GenerateCommand implements Callable<Integer> {
  @Spec CommandSpec spec;

  @Option(names = "--out", paramLabel = "DIR", required = true, description = "folder to write into (created if missing)")
  Path out;

  @Option(names = "--name", paramLabel = "NAME", defaultValue = "SYN1", description = "run id and file-name stem (default: ${DEFAULT-VALUE})")
  String name;

  @Option(names = "--injections", paramLabel = "N", defaultValue = "150", description = "injections in the run, 12 or more (default: ${DEFAULT-VALUE})")
  int injections;

  @Option(names = "--analytes", paramLabel = "N", defaultValue = "30", description = "analyte lines, 1 to 70 (default: ${DEFAULT-VALUE})")
  int analytes;

  @Option(names = "--replicates", paramLabel = "N", defaultValue = "3", description = "readings per injection, 1 to 10 (default: ${DEFAULT-VALUE})")
  int replicates;

  @Option(names = "--noise", paramLabel = "PERCENT", defaultValue = "1.0", description = "injection-to-injection noise, percent (default: ${DEFAULT-VALUE})")
  double noise;

  @Option(names = "--seed", paramLabel = "N", defaultValue = "1", description = "random seed (default: ${DEFAULT-VALUE})")
  long seed;

  @Option(names = "--dialect", paramLabel = "D", defaultValue = "long", description = "long, wide or fixed (default: ${DEFAULT-VALUE})")
  String dialect;

  @Option(names = "--matrix", paramLabel = "M", defaultValue = "water",
      description = "water (results in ug/L) or soil (digests with a prep sheet, mg/kg dry weight) (default: ${DEFAULT-VALUE})")
  String matrix;

  @Option(names = "--start", paramLabel = "TIME", defaultValue = "2026-11-26T09:00:00",
      description = "time stamp of the first injection (default: ${DEFAULT-VALUE})")
  String start;

  @Override
  public Integer call() {
    PrintWriter err = spec.commandLine().getErr();
    try {
      List<Path> written = generate();
      PrintWriter o = spec.commandLine().getOut();
      for (Path p : written) {
        o.println("wrote " + p);
      }
      o.flush();
      return 0;
    } catch (InputException e) {
      err.println("quantrun generate: " + e.getMessage());
      err.flush();
      return Main.EXIT_INPUT_ERROR;
    } catch (IOException e) {
      err.println("quantrun generate: cannot write into " + out + ": " + e.getMessage());
      err.flush();
      return Main.EXIT_INPUT_ERROR;
    }
  }

  List<Path> generate() throws IOException {
    if (injections < 12) {
      throw new InputException("--injections must be 12 or more (blank, 5 standards, ICV, ICB, a batch and a closing CCV), was " + injections);
    }
    if (analytes < 1 || analytes > SyntheticRun.MAX_ANALYTES) {
      throw new InputException("--analytes must be 1 to " + SyntheticRun.MAX_ANALYTES + ", was " + analytes);
    }
    if (replicates < 1 || replicates > 10) {
      throw new InputException("--replicates must be 1 to 10, was " + replicates);
    }
    if (!(noise >= 0 && noise <= 50)) {
      throw new InputException("--noise must be 0 to 50 percent, was " + noise);
    }
    String stem = SafeNames.of(name, "");
    if (!stem.equals(name) || stem.isEmpty()) {
      throw new InputException("--name '" + name + "' must be letters, digits, '.', '-' or '_' only");
    }
    Dialect d;
    try {
      d = Dialect.of(dialect);
    } catch (IllegalArgumentException e) {
      throw new InputException("--dialect: " + e.getMessage());
    }
    boolean soil;
    switch (matrix.toLowerCase(Locale.ROOT)) {
      case "water":
        soil = false;
        break;
      case "soil":
        soil = true;
        break;
      default:
        throw new InputException("--matrix: unknown matrix '" + matrix + "' (expected: water, soil)");
    }
    LocalDateTime t0;
    try {
      t0 = LocalDateTime.parse(start);
    } catch (DateTimeParseException e) {
      throw new InputException("--start '" + start + "' is not a time stamp like 2026-11-26T09:00:00");
    }
    Path export = out.resolve(name + "." + d.extension);
    Path method = out.resolve(name + "-method.yaml");
    Path profile = out.resolve(name + "-profile.yaml");
    Path truth = out.resolve(name + "-truth.csv");
    Path prep = out.resolve(name + "-prep.csv");
    List<Path> targets = new ArrayList<>(List.of(export, method, profile, truth));
    if (soil) {
      targets.add(prep);
    }
    for (Path p : targets) {
      if (Files.exists(p)) {
        throw new InputException(p + " already exists; quantrun generate never overwrites a file (choose another --name or --out)");
      }
    }
    Files.createDirectories(out);
    SyntheticRun run = new SyntheticRun(name, injections, analytes, replicates, noise, seed);
    double[][] prepRows = soil ? prepRows(run, new SplittableRandom(seed ^ 0x5DEECE66DL)) : null;
    write(export, d.charset, w -> d.write(run, t0, w));
    write(method, StandardCharsets.UTF_8, w -> w.write(MethodText.of(run, profile.getFileName().toString(), soil)));
    write(profile, StandardCharsets.UTF_8, w -> w.write(profileText(d)));
    write(truth, StandardCharsets.UTF_8, w -> writeTruth(run, prepRows, w));
    if (soil) {
      write(prep, StandardCharsets.UTF_8, w -> writePrep(run, prepRows, w));
    }
    return targets;
  }

  /** Per injection: mass (g), final volume (mL), solids fraction, batch number; null rows for solutions. */
  private static double[][] prepRows(SyntheticRun run, SplittableRandom rnd) {
    double[][] rows = new double[run.shots.size()][];
    int batch = 0;
    for (int j = 0; j < rows.length; j++) {
      SyntheticRun.Shot s = run.shots.get(j);
      if (s.role().equals("method-blank")) {
        batch++;
      }
      switch (s.role()) {
        case "method-blank":
        case "lcs":
          rows[j] = new double[] {0.5, 50, 1, batch};
          break;
        case "sample":
          rows[j] = new double[] {0.45 + 0.1 * rnd.nextDouble(), 50, 0.7 + 0.25 * rnd.nextDouble(), batch};
          break;
        case "duplicate":
        case "spike":
          rows[j] = new double[] {0.45 + 0.1 * rnd.nextDouble(), 50, rows[j - (s.role().equals("duplicate") ? 1 : 2)][2], batch};
          break;
        default:
          rows[j] = null;
      }
    }
    return rows;
  }

  private static void writePrep(SyntheticRun run, double[][] rows, Writer w) throws IOException {
    w.write("Sample,Batch,DF,Mass_g,Volume_mL,Solids\n");
    for (int j = 0; j < rows.length; j++) {
      if (rows[j] != null) {
        w.write(String.format(Locale.ROOT, "%s,B%d,1,%.4f,%.1f,%.4f%n", run.shots.get(j).sampleId(), (int) rows[j][3],
            rows[j][0], rows[j][1], rows[j][2]));
      }
    }
  }

  private static void writeTruth(SyntheticRun run, double[][] prep, Writer w) throws IOException {
    w.write("position,sample_id,role,analyte,line,true_solution_ug_per_l" + (prep != null ? ",true_sample_mg_per_kg_dry" : "") + "\n");
    for (int j = 0; j < run.shots.size(); j++) {
      SyntheticRun.Shot s = run.shots.get(j);
      for (int k = 0; k < run.lines.size(); k++) {
        SyntheticRun.Line l = run.lines.get(k);
        StringBuilder b = new StringBuilder();
        b.append(s.sequence()).append(',').append(s.sampleId()).append(',').append(s.role()).append(',')
            .append(l.element()).append(',').append(l.wavelength()).append(',').append(s.truth()[k]);
        if (prep != null) {
          b.append(',');
          if (prep[j] != null) {
            // mg/kg = ug/L x V[L] / mass[g] / solids (prep as written in the prep sheet: rounded like it)
            double mass = Double.parseDouble(String.format(Locale.ROOT, "%.4f", prep[j][0]));
            double solids = Double.parseDouble(String.format(Locale.ROOT, "%.4f", prep[j][2]));
            b.append(s.truth()[k] * (prep[j][1] / 1000) / mass / solids);
          }
        }
        w.write(b.append('\n').toString());
      }
    }
  }

  private static String profileText(Dialect d) throws IOException {
    try (InputStream in = GenerateCommand.class.getResourceAsStream("/profiles/" + d.profile)) {
      if (in == null) {
        throw new IOException("the bundled import profile " + d.profile + " is missing from this build");
      }
      return new String(in.readAllBytes(), StandardCharsets.UTF_8);
    }
  }

  private interface Body {
    void write(Writer w) throws IOException;
  }

  /** Writes a file through a temporary file beside it and an atomic rename, never overwriting. */
  private static void write(Path target, Charset charset, Body body) throws IOException {
    Path tmp = target.resolveSibling("." + target.getFileName() + ".part");
    Files.deleteIfExists(tmp);
    try {
      try (Writer w = new BufferedWriter(new OutputStreamWriter(
          Files.newOutputStream(tmp, java.nio.file.StandardOpenOption.CREATE_NEW, java.nio.file.StandardOpenOption.WRITE),
          charset), 1 << 16)) {
        body.write(w);
      }
      Files.move(tmp, target, StandardCopyOption.ATOMIC_MOVE);
    } finally {
      Files.deleteIfExists(tmp);
    }
  }
}
