package org.quantrun.core.bench;

import java.util.ArrayList;
import java.util.List;
import java.util.Optional;
import java.util.Random;
import java.util.concurrent.TimeUnit;
import org.openjdk.jmh.annotations.Benchmark;
import org.openjdk.jmh.annotations.BenchmarkMode;
import org.openjdk.jmh.annotations.Fork;
import org.openjdk.jmh.annotations.Measurement;
import org.openjdk.jmh.annotations.Mode;
import org.openjdk.jmh.annotations.OutputTimeUnit;
import org.openjdk.jmh.annotations.Param;
import org.openjdk.jmh.annotations.Scope;
import org.openjdk.jmh.annotations.Setup;
import org.openjdk.jmh.annotations.State;
import org.openjdk.jmh.annotations.Threads;
import org.openjdk.jmh.annotations.Warmup;
import org.quantrun.core.importer.AnalyteLine;
import org.quantrun.core.importer.Injection;
import org.quantrun.core.importer.LineReadings;
import org.quantrun.core.importer.RawRun;
import org.quantrun.core.importer.Reading;
import org.quantrun.core.importer.SourcePosition;
import org.quantrun.core.method.Method;
import org.quantrun.core.method.MethodLoader;
import org.quantrun.core.model.RunResult;
import org.quantrun.core.processing.RunProcessor;

/**
 * The run processor on a large run, after import: 2,000 injections x 70 analyte lines x 3
 * readings (420,000 readings), with a calibration blank, five standards, an ICV and a CCV/CCB pair
 * after every ten samples. Goal: under 1 s per run on one core, in a 512 MB heap. The "typical"
 * size (150 injections x 30 lines) shows the cost of an everyday run.
 *
 * <p>Run: {@code mvn -B -q -pl core test-compile exec:exec@jmh -Dbench=RunProcessorBenchmark}
 */
@State(Scope.Benchmark)
@BenchmarkMode(Mode.AverageTime)
@OutputTimeUnit(TimeUnit.MILLISECONDS)
@Warmup(iterations = 3, time = 5)
@Measurement(iterations = 5, time = 5)
@Fork(value = 1, jvmArgs = {"-Xmx512m", "-Xms512m"})
@Threads(1)
public class RunProcessorBenchmark {
  static final int READINGS = 3;

  /** "large": 2,000 injections x 70 lines; "typical": 150 x 30. */
  @Param({"large", "typical"})
  public String size;

  private int injections;
  private int lines;

  private RawRun run;
  private Method method;

  @Setup
  public void setUp() throws Exception {
    injections = size.equals("large") ? 2000 : 150;
    lines = size.equals("large") ? 70 : 30;
    method = MethodLoader.load(methodYaml(lines), "bench.yaml");
    run = run(new Random(42), injections, lines);
  }

  @Benchmark
  public RunResult processLargeRun() {
    return RunProcessor.process(run, method, Optional.empty());
  }

  static String name(int k) {
    return "E" + k;
  }

  static String methodYaml(int lineCount) {
    StringBuilder y = new StringBuilder();
    y.append("method: {id: BENCH, version: \"1\", description: benchmark, unit: ug/L}\nanalytes:\n");
    for (int k = 0; k < lineCount; k++) {
      y.append("  - {name: ").append(name(k)).append(", line: \"").append(200 + k).append(".000\", weighting: 1/x, mdl: 0.5, reporting-limit: 2}\n");
    }
    y.append("standards:\n");
    double[] levels = {1, 10, 50, 100, 500};
    for (int l = 0; l < levels.length; l++) {
      y.append("  - {level: S").append(l + 1).append(", concentrations: {");
      for (int k = 0; k < lineCount; k++) {
        y.append(k == 0 ? "" : ", ").append(name(k)).append(": ").append(levels[l]);
      }
      y.append("}}\n");
    }
    y.append("""
        identification:
          rules:
            - {pattern: 'BLK', role: calibration-blank}
            - {pattern: '(S\\d)', role: standard, level: '$1'}
            - {pattern: 'ICV', role: icv}
            - {pattern: 'CCV-\\d+', role: ccv}
            - {pattern: 'CCB-\\d+', role: ccb}
            - {pattern: 'P\\d+', role: sample}
        qc:
          icv: {from-level: S3}
          ccv: {from-level: S3}
        """);
    return y.toString();
  }

  static RawRun run(Random rnd, int injectionCount, int lineCount) {
    List<String> ids = new ArrayList<>(List.of("BLK", "S1", "S2", "S3", "S4", "S5", "ICV"));
    int sample = 0;
    while (ids.size() < injectionCount) {
      for (int i = 0; i < 10 && ids.size() < injectionCount - 2; i++) {
        ids.add("P" + (++sample));
      }
      ids.add("CCV-" + ids.size());
      ids.add("CCB-" + ids.size());
    }
    double[] conc = {0, 1, 10, 50, 100, 500, 50};
    List<Injection> injections = new ArrayList<>(injectionCount);
    int line = 1;
    for (int j = 0; j < ids.size(); j++) {
      String id = ids.get(j);
      double c = j < conc.length ? conc[j] : id.startsWith("CCV") ? 50 : id.startsWith("CCB") ? 0 : 200 * rnd.nextDouble();
      List<LineReadings> lines = new ArrayList<>(lineCount);
      for (int k = 0; k < lineCount; k++) {
        double y = 50 + (100 + k) * c;
        List<Reading> reps = new ArrayList<>(READINGS);
        for (int r = 0; r < READINGS; r++) {
          reps.add(Reading.valid(y * (1 + 0.01 * rnd.nextGaussian()) + 2 * rnd.nextGaussian(), new SourcePosition(line++, 8)));
        }
        lines.add(new LineReadings(AnalyteLine.of(name(k), (200 + k) + ".000"), Optional.of("cps"), reps,
            Optional.empty(), Optional.empty(), Optional.empty(), new SourcePosition(line, 1)));
      }
      injections.add(new Injection(j + 1, id, Optional.empty(), Optional.empty(), lines, new SourcePosition(line, 1)));
    }
    return new RawRun("bench.csv", "bench", List.of(), injections);
  }
}
