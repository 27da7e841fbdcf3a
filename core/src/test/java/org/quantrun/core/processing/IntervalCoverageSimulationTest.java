package org.quantrun.core.processing;

import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.Optional;
import java.util.Random;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;
import org.quantrun.core.method.Method;
import org.quantrun.core.model.AnalyteResult;
import org.quantrun.core.model.RunResult;

/**
 * Simulation check of the reported 95 % intervals (common practice: a correct interval covers the
 * true value in about 95 % of repeated experiments). 1000 synthetic runs per noise model, each
 * with its own calibration and five unknowns of known concentration, through the whole processor;
 * the noise model matches the weighting: constant SD for an unweighted fit, SD proportional to
 * concentration for 1/x^2. The coverage must lie between 93 and 97 %. Seeded: the same runs every time.
 */
class IntervalCoverageSimulationTest {
  private static final int RUNS = 1000;
  private static final int UNKNOWNS = 5;

  static String method(String weighting, String blanks, String levels) {
    return """
        method: {id: SIM, version: "1", description: simulation, unit: ug/L}
        analytes:
          - {name: Cu, line: "324.754", weighting: %s}
        standards:
        %s
        blanks: {calibration-blank: %s}
        identification:
          rules:
            - {pattern: 'BLK', role: calibration-blank}
            - {pattern: '(S\\d)', role: standard, level: '$1'}
            - {pattern: 'ICV', role: icv}
            - {pattern: 'CCV', role: ccv}
            - {pattern: 'U\\d+', role: sample}
        limits: {order: [calibration]}
        qc:
          calibration: {min-r: 0.5, max-back-calc-error: 1000, max-back-calc-error-lowest: 1000}
          icv: {true-values: {Cu: 10}}
          ccv: {true-values: {Cu: 10}, frequency: 1000}
        """.formatted(weighting, levels, blanks);
  }

  @ParameterizedTest(name = "{0}")
  @CsvSource(delimiter = '|', value = {
    "unweighted, constant SD | none | zero-point | 0.0",
    "1/x2, SD proportional to concentration | 1/x2 | none | 0.03",
  })
  void intervalsCoverTheTruthNinetyFivePercentOfTheTime(String name, String weighting, String blanks, double relSd) {
    boolean proportional = relSd > 0;
    double[] x = proportional ? new double[] {1, 2, 5, 10, 20, 50} : new double[] {0, 10, 20, 30, 40, 50};
    StringBuilder levels = new StringBuilder();
    for (int i = 0; i < x.length; i++) {
      if (x[i] > 0) {
        levels.append("  - {level: S").append(i).append(", concentrations: {Cu: ").append(x[i]).append("}}\n");
      }
    }
    Method m = RunBuilder.method(method(weighting, blanks, levels.toString()));
    Random rnd = new Random(20261201L + (proportional ? 1 : 0));
    int covered = 0;
    int total = 0;
    for (int run = 0; run < RUNS; run++) {
      double intercept = 50;
      double slope = 120;
      double sigma = 6;
      RunBuilder b = new RunBuilder("sim.csv");
      for (int i = 0; i < x.length; i++) {
        double y = intercept + slope * x[i];
        double sd = proportional ? relSd * slope * x[i] : sigma;
        b.inject(x[i] == 0 ? "BLK" : "S" + i, "Cu 324.754", readings(y + sd * rnd.nextGaussian(), sd, rnd));
      }
      double[] truth = new double[UNKNOWNS];
      for (int k = 0; k < UNKNOWNS; k++) {
        truth[k] = x[1] + (x[x.length - 1] - x[1]) * rnd.nextDouble();
        double y = intercept + slope * truth[k];
        double sd = proportional ? relSd * slope * truth[k] : sigma;
        b.inject("U" + k, "Cu 324.754", readings(y + sd * rnd.nextGaussian(), sd, rnd));
      }
      b.inject("CCV", "Cu 324.754", readings(intercept + slope * 10, 0, rnd));
      RunResult res = RunProcessor.process(b.build(), m, Optional.empty());
      for (int k = 0; k < UNKNOWNS; k++) {
        String id = "U" + k;
        AnalyteResult r = res.results().stream().filter(a -> a.sampleId().equals(id)).findFirst().orElseThrow();
        double v = r.value().getAsDouble();
        double h = r.ciHalfWidth().getAsDouble();
        covered += Math.abs(v - truth[k]) <= h ? 1 : 0;
        total++;
      }
    }
    double coverage = 100.0 * covered / total;
    assertTrue(coverage >= 93 && coverage <= 97, name + ": the 95 % intervals covered the truth " + coverage
        + " % of the time over " + total + " unknowns");
  }

  /** Three readings of one aspiration: the injection's value plus a small reading-to-reading scatter. */
  private static double[] readings(double y, double sd, Random rnd) {
    double s = sd / 20;
    return new double[] {y + s * rnd.nextGaussian(), y + s * rnd.nextGaussian(), y + s * rnd.nextGaussian()};
  }
}
