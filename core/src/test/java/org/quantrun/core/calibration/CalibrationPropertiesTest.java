package org.quantrun.core.calibration;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.ArrayList;
import java.util.List;
import java.util.Random;
import net.jqwik.api.ForAll;
import net.jqwik.api.Property;
import net.jqwik.api.constraints.DoubleRange;
import net.jqwik.api.constraints.IntRange;
import net.jqwik.api.constraints.LongRange;
import net.jqwik.api.constraints.Scale;

/**
 * Properties that hold for any calibration (common practice: what any correct least-squares
 * calibration must satisfy).
 */
class CalibrationPropertiesTest {

  /** Distinct positive concentrations spread over up to four decades. */
  private static double[] levels(long seed, int count) {
    Random r = new Random(seed);
    double[] x = new double[count];
    double v = 0.1 + r.nextDouble();
    for (int i = 0; i < count; i++) {
      x[i] = v;
      v *= 1.5 + 2 * r.nextDouble();
    }
    return x;
  }

  private static double curve(CurveModel m, double c0, double c1, double c2, double x) {
    switch (m) {
      case THROUGH_ZERO: return c1 * x;
      case LINEAR: return c0 + c1 * x;
      default: return c0 + c1 * x + c2 * x * x;
    }
  }

  @Property(tries = 300)
  void noiseFreeDataIsRecoveredForEveryModelAndWeighting(
      @ForAll CurveModel model,
      @ForAll Weighting weighting,
      @ForAll @LongRange(min = 1, max = 1_000_000) long seed,
      @ForAll @IntRange(min = 3, max = 9) int count,
      @ForAll @DoubleRange(min = 0.01, max = 1000) double slope,
      @ForAll @DoubleRange(min = 0.0, max = 5) double intercept) {
    double[] x = levels(seed, count);
    double xMax = x[count - 1];
    // a gentle curvature that keeps the quadratic rising over the range (vertex beyond 2 xMax)
    double c2 = model == CurveModel.QUADRATIC ? -slope / (4 * xMax) * new Random(seed).nextDouble() : 0;
    double c0 = model == CurveModel.THROUGH_ZERO ? 0 : intercept;
    List<CalibrationPoint> pts = new ArrayList<>();
    for (double xi : x) {
      double y = curve(model, c0, slope, c2, xi);
      pts.add(CalibrationPoint.of(xi, y, 0.01 * y + 0.001));
    }
    CalibrationFit fit = CalibrationFit.fit(pts, new FitOptions(model, weighting));
    double yScale = Math.abs(curve(model, c0, slope, c2, xMax));
    assertEquals(slope, fit.coefficient(1), 1e-9 * Math.abs(slope) + 1e-9 * yScale / xMax);
    assertEquals(c0, fit.coefficient(0), 1e-9 * yScale);
    assertEquals(c2, fit.coefficient(2), 1e-9 * yScale / (xMax * xMax));
    for (double xi : new double[] {x[0], (x[0] + xMax) / 2, xMax}) {
      InversePrediction p = fit.predict(curve(model, c0, slope, c2, xi), 1, 0.95);
      assertEquals(xi, p.x0().getAsDouble(), 1e-9 * xMax);
    }
  }

  @Property(tries = 200)
  void scalingEverySignalByAConstantLeavesX0AndItsErrorUnchanged(
      @ForAll CurveModel model,
      @ForAll Weighting weighting,
      @ForAll @LongRange(min = 1, max = 1_000_000) long seed,
      @ForAll @DoubleRange(min = 1e-3, max = 1e4) @Scale(6) double factor) {
    Random r = new Random(seed);
    double[] x = levels(seed, 6);
    List<CalibrationPoint> base = new ArrayList<>();
    List<CalibrationPoint> scaled = new ArrayList<>();
    for (double xi : x) {
      double y = 0.5 + 3 * xi * (1 + 0.02 * r.nextGaussian());
      double sd = 0.02 * y;
      base.add(CalibrationPoint.of(xi, y, sd));
      scaled.add(CalibrationPoint.of(xi, y * factor, sd * factor));
    }
    FitOptions o = new FitOptions(model, weighting);
    CalibrationFit a = CalibrationFit.fit(base, o);
    CalibrationFit b = CalibrationFit.fit(scaled, o);
    double y0 = a.signalAt((x[0] + x[5]) / 3);
    InversePrediction pa = a.predict(y0, 1, 0.95);
    InversePrediction pb = b.predict(y0 * factor, 1, 0.95);
    assertEquals(pa.status(), pb.status());
    if (pa.x0().isPresent()) {
      double x0 = pa.x0().getAsDouble();
      assertEquals(x0, pb.x0().getAsDouble(), 1e-9 * Math.abs(x0) + 1e-12 * x[5]);
      double s = pa.sX0().getAsDouble();
      assertEquals(s, pb.sX0().getAsDouble(), 1e-8 * s);
    }
  }

  @Property(tries = 200)
  void moreReplicateMeasurementsShrinkTheErrorOfX0(
      @ForAll CurveModel model,
      @ForAll Weighting weighting,
      @ForAll @LongRange(min = 1, max = 1_000_000) long seed,
      @ForAll @IntRange(min = 1, max = 20) int m) {
    Random r = new Random(seed);
    double[] x = levels(seed, 7);
    List<CalibrationPoint> pts = new ArrayList<>();
    for (double xi : x) {
      double y = 0.2 + 1.7 * xi * (1 + 0.03 * r.nextGaussian());
      pts.add(CalibrationPoint.of(xi, y, 0.03 * y));
    }
    CalibrationFit fit = CalibrationFit.fit(pts, new FitOptions(model, weighting));
    double y0 = fit.signalAt(x[3]);
    double s1 = fit.predict(y0, m, 0.95).sX0().getAsDouble();
    double s2 = fit.predict(y0, m + 1, 0.95).sX0().getAsDouble();
    assertTrue(s2 < s1, "s_x0 with m + 1 = " + s2 + " must be below s_x0 with m = " + s1);
  }
}
