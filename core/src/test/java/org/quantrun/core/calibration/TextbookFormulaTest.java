package org.quantrun.core.calibration;

import static org.junit.jupiter.api.Assertions.assertEquals;

import java.util.ArrayList;
import java.util.List;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.ValueSource;

/**
 * The delta-method s_x0 of the engine equals the closed-form straight-line formulas (source: the
 * standard results for the error of a concentration read off a straight line, e.g. Miller and
 * Miller, Statistics and Chemometrics for Analytical Chemistry, ch. 5, from memory):
 *
 * <pre>
 *   unweighted: s_x0  = (s_y/x / b) sqrt(1/m + 1/n + (y0 - ybar)^2 / (b^2 Sxx))
 *   weighted:   s_x0w = (s_y/x,w / b) sqrt(1/(w0 m) + 1/n + (y0 - ybar_w)^2 / (b^2 (sum w x^2 - n xbar_w^2)))
 * </pre>
 *
 * computed here independently from the raw sums.
 */
class TextbookFormulaTest {
  private static final double[] X = {0.5, 1, 2, 5, 10, 20, 50};
  private static final double[] Y = {0.0523, 0.1046, 0.2019, 0.5174, 1.0102, 2.0533, 5.0391};
  private static final double[] SD = {0.0011, 0.0019, 0.0035, 0.0081, 0.017, 0.036, 0.088};

  @ParameterizedTest(name = "m = {0}")
  @ValueSource(ints = {1, 2, 3, 5})
  void unweightedDeltaMethodEqualsTheClosedForm(int m) {
    List<CalibrationPoint> pts = points();
    CalibrationFit fit = CalibrationFit.fit(pts, FitOptions.DEFAULT);
    int n = X.length;
    double xbar = mean(X);
    double ybar = mean(Y);
    double sxx = 0;
    double sxy = 0;
    for (int i = 0; i < n; i++) {
      sxx += (X[i] - xbar) * (X[i] - xbar);
      sxy += (X[i] - xbar) * (Y[i] - ybar);
    }
    double b = sxy / sxx;
    double a = ybar - b * xbar;
    double rss = 0;
    for (int i = 0; i < n; i++) {
      double r = Y[i] - a - b * X[i];
      rss += r * r;
    }
    double s = Math.sqrt(rss / (n - 2));
    for (double y0 : new double[] {0.03, 0.4, 1.7, 4.9, 6.0}) {
      double expected = s / b * Math.sqrt(1.0 / m + 1.0 / n + Math.pow(y0 - ybar, 2) / (b * b * sxx));
      InversePrediction p = fit.predict(y0, m, 0.95);
      assertEquals(expected, p.sX0().getAsDouble(), 1e-12 * expected, "y0 = " + y0);
      assertEquals((y0 - a) / b, p.x0().getAsDouble(), 1e-12);
      assertEquals(StudentT.twoSided(0.95, n - 2) * expected, p.halfWidth().getAsDouble(), 1e-12 * expected);
    }
  }

  @ParameterizedTest(name = "weighting {0}")
  @ValueSource(strings = {"1/x", "1/x2", "1/y", "1/y2", "1/s2"})
  void weightedDeltaMethodEqualsTheClosedForm(String label) {
    Weighting weighting = Weighting.fromLabel(label);
    CalibrationFit fit = CalibrationFit.fit(points(), FitOptions.DEFAULT.withWeighting(weighting));
    int n = X.length;
    double[] w = new double[n];
    double sum = 0;
    for (int i = 0; i < n; i++) {
      w[i] = rawWeight(weighting, X[i], Y[i], SD[i]);
      sum += w[i];
    }
    for (int i = 0; i < n; i++) {
      w[i] *= n / sum;
    }
    double xw = 0;
    double yw = 0;
    for (int i = 0; i < n; i++) {
      xw += w[i] * X[i] / n;
      yw += w[i] * Y[i] / n;
    }
    double sxy = 0;
    double sxx = 0;
    for (int i = 0; i < n; i++) {
      sxy += w[i] * (X[i] - xw) * (Y[i] - yw);
      sxx += w[i] * (X[i] - xw) * (X[i] - xw);
    }
    double b = sxy / sxx;
    double a = yw - b * xw;
    double rss = 0;
    double sumWx2 = 0;
    for (int i = 0; i < n; i++) {
      double r = Y[i] - a - b * X[i];
      rss += w[i] * r * r;
      sumWx2 += w[i] * X[i] * X[i];
    }
    double s = Math.sqrt(rss / (n - 2));
    assertEquals(b, fit.coefficient(1), 1e-12 * Math.abs(b));
    assertEquals(a, fit.coefficient(0), 1e-11);
    assertEquals(s, fit.sYx().getAsDouble(), 1e-12 * s);
    for (double y0 : new double[] {0.08, 0.3, 1.5, 3.3}) {
      double x0 = (y0 - a) / b;
      double w0 = rawWeight(weighting, x0, y0, interpolatedSd(x0)) * n / sum;
      double expected = s / b * Math.sqrt(
          1.0 / w0 + 1.0 / n + Math.pow(y0 - yw, 2) / (b * b * (sumWx2 - n * xw * xw)));
      InversePrediction p = fit.predict(y0, 1, 0.95);
      assertEquals(expected, p.sX0().getAsDouble(), 1e-10 * expected, "y0 = " + y0);
    }
  }

  private static double rawWeight(Weighting w, double x, double y, double sd) {
    switch (w) {
      case INVERSE_X: return 1 / x;
      case INVERSE_X_SQUARED: return 1 / (x * x);
      case INVERSE_Y: return 1 / y;
      case INVERSE_Y_SQUARED: return 1 / (y * y);
      case INVERSE_VARIANCE: return 1 / (sd * sd);
      default: return 1;
    }
  }

  /** domain.md section 8: s at x0 interpolated linearly between neighbouring standards. */
  private static double interpolatedSd(double x0) {
    if (x0 <= X[0]) {
      return SD[0];
    }
    for (int i = 1; i < X.length; i++) {
      if (x0 <= X[i]) {
        return SD[i - 1] + (x0 - X[i - 1]) / (X[i] - X[i - 1]) * (SD[i] - SD[i - 1]);
      }
    }
    return SD[SD.length - 1];
  }

  private static List<CalibrationPoint> points() {
    List<CalibrationPoint> pts = new ArrayList<>();
    for (int i = 0; i < X.length; i++) {
      pts.add(CalibrationPoint.of(X[i], Y[i], SD[i]));
    }
    return pts;
  }

  private static double mean(double[] v) {
    double s = 0;
    for (double d : v) {
      s += d;
    }
    return s / v.length;
  }
}
