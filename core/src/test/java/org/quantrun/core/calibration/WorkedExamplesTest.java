package org.quantrun.core.calibration;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.ArrayList;
import java.util.List;
import org.junit.jupiter.api.DisplayName;
import org.junit.jupiter.api.Test;

/**
 * Handbook worked examples. Source (from memory): Miller and Miller, Statistics and Chemometrics
 * for Analytical Chemistry, chapter 5 (calibration). The book rounds intermediate values, so each
 * figure is checked to the digits printed there, plus or minus one in the last digit.
 */
class WorkedExamplesTest {

  private static final double[] X = {0, 2, 4, 6, 8, 10, 12};
  private static final double[] Y = {2.1, 5.0, 9.0, 12.6, 17.3, 21.0, 24.7};

  static CalibrationFit unweighted() {
    List<CalibrationPoint> pts = new ArrayList<>();
    for (int i = 0; i < X.length; i++) {
      pts.add(CalibrationPoint.of(X[i], Y[i]));
    }
    return CalibrationFit.fit(pts, FitOptions.DEFAULT);
  }

  @Test
  @DisplayName("the unweighted straight line gives the book's slope, intercept, r and s_y/x")
  void unweightedLine() {
    // Miller & Miller ch. 5 (from memory): b = 1.93, a = 1.52, r = 0.9989, s_y/x = 0.4329.
    CalibrationFit fit = unweighted();
    assertDigits(1.93, 2, fit.coefficient(1));
    assertDigits(1.52, 2, fit.coefficient(0));
    assertDigits(0.9989, 4, Math.sqrt(fit.r2()));
    assertDigits(0.4329, 4, fit.sYx().getAsDouble());
    assertDigits(0.43285, 5, fit.sYx().getAsDouble());
  }

  @Test
  @DisplayName("three unknowns read off the unweighted line give the book's x0 and s_x0")
  void unweightedInversePredictions() {
    // Miller & Miller ch. 5 (from memory): y0 = 2.9, 13.5, 23.0 (m = 1) give x0 = 0.72, 6.21,
    // 11.13 with s_x0 = 0.26, 0.24, 0.26.
    CalibrationFit fit = unweighted();
    double[] y0 = {2.9, 13.5, 23.0};
    double[] x0 = {0.72, 6.21, 11.13};
    double[] sx0 = {0.26, 0.24, 0.26};
    for (int i = 0; i < y0.length; i++) {
      InversePrediction p = fit.predict(y0[i], 1, 0.95);
      assertDigits(x0[i], 2, p.x0().getAsDouble());
      assertDigits(sx0[i], 2, p.sX0().getAsDouble());
      assertTrue(p.inRange());
    }
  }

  @Test
  @DisplayName("the 1/s^2-weighted line gives the book's weighted slope, intercept and x0")
  void weightedLine() {
    // Miller & Miller ch. 5, weighted regression (from memory): b = 0.0738, a = 0.0091;
    // y0 = 0.100 gives x0 = 1.23.
    double[] x = {0, 2, 4, 6, 8, 10};
    double[] y = {0.009, 0.158, 0.301, 0.472, 0.577, 0.739};
    double[] s = {0.001, 0.004, 0.010, 0.013, 0.017, 0.022};
    List<CalibrationPoint> pts = new ArrayList<>();
    for (int i = 0; i < x.length; i++) {
      pts.add(CalibrationPoint.of(x[i], y[i], s[i]));
    }
    CalibrationFit fit = CalibrationFit.fit(pts, FitOptions.DEFAULT.withWeighting(Weighting.INVERSE_VARIANCE));
    assertDigits(0.0738, 4, fit.coefficient(1));
    assertDigits(0.0091, 4, fit.coefficient(0));
    assertDigits(1.23, 2, fit.predict(0.100).x0().getAsDouble());
    double sumW = 0;
    for (double w : fit.weights()) {
      sumW += w;
    }
    assertEquals(x.length, sumW, 1e-12, "weights are normalised to sum to n");
  }

  /** Agreement to the given decimals, allowing one unit in the last digit (the book rounds). */
  static void assertDigits(double expected, int decimals, double actual) {
    double scale = Math.pow(10, decimals);
    long e = Math.round(expected * scale);
    long a = Math.round(actual * scale);
    assertTrue(Math.abs(e - a) <= 1,
        () -> "expected " + expected + " to " + decimals + " decimals (+-1 in the last), got " + actual);
  }
}
