package org.quantrun.core.calibration;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.ArrayList;
import java.util.List;
import org.junit.jupiter.api.DisplayName;
import org.junit.jupiter.api.Test;

/**
 * Quadratic curves (ISO 8466-2 second-order calibration, from memory): the root inside the range,
 * "no root in range" as a result, and a turning point inside the range reported as non-monotonic.
 */
class QuadraticShapeTest {
  private static final FitOptions QUADRATIC = FitOptions.DEFAULT.withCurve(CurveModel.QUADRATIC);

  /** y = 0.05 + 2 x - 0.04 x^2 on 0..10: rising, bending over, vertex at x = 25. */
  private static List<CalibrationPoint> saturating() {
    List<CalibrationPoint> pts = new ArrayList<>();
    for (double x : new double[] {0, 1, 2, 4, 6, 8, 10}) {
      pts.add(CalibrationPoint.of(x, 0.05 + 2 * x - 0.04 * x * x + (x == 4 ? 0.002 : x == 8 ? -0.002 : 0)));
    }
    return pts;
  }

  @Test
  @DisplayName("a bending curve is monotonic over its range and gives the root inside it")
  void rootInsideRange() {
    CalibrationFit fit = CalibrationFit.fit(saturating(), QUADRATIC);
    assertTrue(fit.isMonotonic());
    assertEquals(25.0, fit.vertex().getAsDouble(), 0.5);
    InversePrediction p = fit.predict(0.05 + 2 * 5 - 0.04 * 25);
    assertEquals(PredictionStatus.QUANTIFIED, p.status());
    assertEquals(5.0, p.x0().getAsDouble(), 0.01);
    assertTrue(p.inRange());
    assertTrue(p.sX0().isPresent());
  }

  @Test
  @DisplayName("a signal the curve never reaches inside the range is 'no root in range', not an exception")
  void noRootInRange() {
    CalibrationFit fit = CalibrationFit.fit(saturating(), QUADRATIC);
    InversePrediction above = fit.predict(30); // the curve tops out near 25 at x = 25
    assertEquals(PredictionStatus.NO_ROOT_IN_RANGE, above.status());
    assertTrue(above.x0().isEmpty());
    assertTrue(above.sX0().isEmpty());
    assertEquals(RangePosition.ABOVE_RANGE, above.position());
    assertTrue(above.nearestRoot().isEmpty(), "no real root at all above the vertex");
    InversePrediction over = fit.predict(20); // reached at x = 13.764 (solved by hand for the noise-free curve), beyond the top standard
    assertEquals(PredictionStatus.NO_ROOT_IN_RANGE, over.status());
    assertEquals(RangePosition.ABOVE_RANGE, over.position());
    assertEquals(13.764, over.nearestRoot().getAsDouble(), 0.01);
    assertFalse(over.inRange());
  }

  @Test
  @DisplayName("a turning point inside the calibrated range makes the fit non-monotonic")
  void vertexInsideRange() {
    List<CalibrationPoint> pts = new ArrayList<>();
    for (double x : new double[] {0, 2, 4, 6, 8, 10}) {
      pts.add(CalibrationPoint.of(x, 10 * x - 0.8 * x * x));
    }
    CalibrationFit fit = CalibrationFit.fit(pts, QUADRATIC);
    assertFalse(fit.isMonotonic());
    assertEquals(6.25, fit.vertex().getAsDouble(), 1e-9);
  }

  @Test
  @DisplayName("back-calculation of each standard gives its percent error, undefined at the blank")
  void backCalculation() {
    CalibrationFit fit = CalibrationFit.fit(saturating(), QUADRATIC);
    BackCalculation blank = fit.backCalculations().get(0);
    assertTrue(blank.percentError().isEmpty());
    assertTrue(blank.backCalculated().isPresent());
    for (BackCalculation b : fit.backCalculations().subList(1, 7)) {
      assertEquals(b.x(), b.backCalculated().getAsDouble(), 0.01);
      double pct = (b.backCalculated().getAsDouble() - b.x()) / b.x() * 100;
      assertEquals(pct, b.percentError().getAsDouble(), 1e-9);
      assertEquals(b.y() - fit.signalAt(b.x()), b.residual(), 1e-12);
    }
  }
}
