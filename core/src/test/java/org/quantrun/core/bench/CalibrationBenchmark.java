package org.quantrun.core.bench;

import java.util.ArrayList;
import java.util.List;
import java.util.concurrent.TimeUnit;
import org.openjdk.jmh.annotations.Benchmark;
import org.openjdk.jmh.annotations.BenchmarkMode;
import org.openjdk.jmh.annotations.Fork;
import org.openjdk.jmh.annotations.Measurement;
import org.openjdk.jmh.annotations.Mode;
import org.openjdk.jmh.annotations.OutputTimeUnit;
import org.openjdk.jmh.annotations.Scope;
import org.openjdk.jmh.annotations.Setup;
import org.openjdk.jmh.annotations.State;
import org.openjdk.jmh.annotations.Threads;
import org.openjdk.jmh.annotations.Warmup;
import org.openjdk.jmh.infra.Blackhole;
import org.quantrun.core.calibration.CalibrationFit;
import org.quantrun.core.calibration.CalibrationPoint;
import org.quantrun.core.calibration.DetectionLimits;
import org.quantrun.core.calibration.FitOptions;
import org.quantrun.core.calibration.Weighting;

/**
 * One analyte line's calibration work: a 7-point 1/x-weighted straight-line fit with every
 * statistic (coefficients, covariance, s_y/x, r^2, residuals, back-calculation, limits), then 10
 * inverse predictions with intervals. Goal: at least 200,000 per second on one core.
 *
 * <p>Run: {@code mvn -B -q -pl core test-compile exec:exec@jmh -Dbench=CalibrationBenchmark}
 */
@State(Scope.Thread)
@BenchmarkMode(Mode.Throughput)
@OutputTimeUnit(TimeUnit.SECONDS)
@Warmup(iterations = 3, time = 2)
@Measurement(iterations = 5, time = 2)
@Fork(1)
@Threads(1)
public class CalibrationBenchmark {
  private List<CalibrationPoint> points;
  private double[] unknowns;
  private final FitOptions options = FitOptions.DEFAULT.withWeighting(Weighting.INVERSE_X);

  @Setup
  public void setUp() {
    double[] x = {0.5, 1, 2, 5, 10, 20, 50};
    double[] noise = {0.013, -0.021, 0.008, 0.017, -0.011, 0.004, -0.009};
    points = new ArrayList<>();
    for (int i = 0; i < x.length; i++) {
      points.add(CalibrationPoint.of(x[i], (0.4 + 1520 * x[i]) * (1 + noise[i])));
    }
    unknowns = new double[10];
    for (int i = 0; i < unknowns.length; i++) {
      unknowns[i] = 900 + 7300.0 * i;
    }
  }

  @Benchmark
  public void fitWithStatisticsAndTenPredictions(Blackhole bh) {
    CalibrationFit fit = CalibrationFit.fit(points, options);
    bh.consume(fit.standardError(0));
    bh.consume(fit.standardError(1));
    bh.consume(fit.covariance());
    bh.consume(fit.r2());
    bh.consume(fit.backCalculations());
    bh.consume(DetectionLimits.fromCalibration(fit));
    for (double y0 : unknowns) {
      bh.consume(fit.predict(y0, 1, 0.95));
    }
  }
}
