package org.quantrun.core.calibration;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.List;
import org.junit.jupiter.api.DisplayName;
import org.junit.jupiter.api.Test;

/** Fits with no degrees of freedom, and data the engine must refuse with a clear message. */
class DegenerateAndBadInputTest {

  @Test
  @DisplayName("a single-point through-zero calibration fits, with its statistics not estimable")
  void singlePointThroughZero() {
    // Common practice: a single-point calibration assumes the blank is a true zero, so the slope
    // is y / x and nothing about scatter can be estimated.
    CalibrationFit fit = CalibrationFit.fit(
        List.of(CalibrationPoint.of(10, 2500)), FitOptions.DEFAULT.withCurve(CurveModel.THROUGH_ZERO));
    assertEquals(250.0, fit.coefficient(1), 0);
    assertEquals(0, fit.dof());
    assertTrue(fit.sYx().isEmpty());
    assertTrue(fit.standardError(1).isEmpty());
    assertTrue(fit.covariance().isEmpty());
    assertTrue(DetectionLimits.fromCalibration(fit).isEmpty());
    InversePrediction p = fit.predict(1000);
    assertEquals(4.0, p.x0().getAsDouble(), 1e-12);
    assertTrue(p.sX0().isEmpty());
    assertTrue(p.t().isEmpty());
    assertTrue(p.halfWidth().isEmpty());
    assertEquals(RangePosition.BELOW_RANGE, p.position(), "4 lies below the only standard, 10");
  }

  @Test
  @DisplayName("two points on a straight line and three on a quadratic are exact fits with no degrees of freedom")
  void exactFits() {
    CalibrationFit line = CalibrationFit.fit(
        List.of(CalibrationPoint.of(0, 1), CalibrationPoint.of(10, 21)), FitOptions.DEFAULT);
    assertEquals(2.0, line.coefficient(1), 1e-14);
    assertEquals(1.0, line.coefficient(0), 1e-13);
    assertTrue(line.sYx().isEmpty());
    CalibrationFit quad = CalibrationFit.fit(
        List.of(CalibrationPoint.of(1, 2), CalibrationPoint.of(2, 5), CalibrationPoint.of(3, 10)),
        FitOptions.DEFAULT.withCurve(CurveModel.QUADRATIC));
    assertEquals(1.0, quad.coefficient(2), 1e-12);
    assertEquals(0.0, quad.coefficient(1), 1e-12);
    assertEquals(1.0, quad.coefficient(0), 1e-12);
    assertTrue(quad.standardError(2).isEmpty());
  }

  @Test
  @DisplayName("fewer points than the curve has parameters are refused")
  void tooFewPoints() {
    CalibrationException e = assertThrows(CalibrationException.class, () -> CalibrationFit.fit(
        List.of(CalibrationPoint.of(1, 2), CalibrationPoint.of(2, 4)),
        FitOptions.DEFAULT.withCurve(CurveModel.QUADRATIC)));
    assertEquals("a quadratic curve needs at least 3 calibration points, got 2", e.getMessage());
    assertEquals("there are no calibration points to fit",
        assertThrows(CalibrationException.class, () -> CalibrationFit.fit(List.of(), FitOptions.DEFAULT)).getMessage());
  }

  @Test
  @DisplayName("points that all share one concentration are refused")
  void allXEqual() {
    CalibrationException e = assertThrows(CalibrationException.class, () -> CalibrationFit.fit(
        List.of(CalibrationPoint.of(5, 2), CalibrationPoint.of(5, 2.1), CalibrationPoint.of(5, 1.9)),
        FitOptions.DEFAULT));
    assertEquals("every calibration point has the same concentration x = 5.0: "
        + "a linear curve needs at least 2 different concentrations", e.getMessage());
  }

  @Test
  @DisplayName("a value that is not a finite number is refused, naming the point")
  void nonFinite() {
    CalibrationException e = assertThrows(CalibrationException.class, () -> CalibrationFit.fit(
        List.of(CalibrationPoint.of(1, 2), CalibrationPoint.of(2, Double.NaN)), FitOptions.DEFAULT));
    assertEquals("calibration point 2: signal y is NaN (expected a finite number)", e.getMessage());
    e = assertThrows(CalibrationException.class, () -> CalibrationFit.fit(
        List.of(CalibrationPoint.of(Double.POSITIVE_INFINITY, 2), CalibrationPoint.of(2, 3)), FitOptions.DEFAULT));
    assertEquals("calibration point 1: concentration x is Infinity (expected a finite number)", e.getMessage());
  }

  @Test
  @DisplayName("a negative standard deviation is refused")
  void negativeSd() {
    CalibrationException e = assertThrows(CalibrationException.class, () -> CalibrationFit.fit(
        List.of(CalibrationPoint.of(1, 2, 0.1), CalibrationPoint.of(2, 4, -0.2)), FitOptions.DEFAULT));
    assertEquals("calibration point 2: standard deviation -0.2 is negative (expected 0 or more)", e.getMessage());
  }

  @Test
  @DisplayName("1/x weighting with a blank point at x = 0 is refused, naming the point and a remedy")
  void inverseXWithBlankPoint() {
    CalibrationException e = assertThrows(CalibrationException.class, () -> CalibrationFit.fit(
        List.of(CalibrationPoint.of(0, 0.01), CalibrationPoint.of(1, 2), CalibrationPoint.of(2, 4)),
        FitOptions.DEFAULT.withWeighting(Weighting.INVERSE_X)));
    assertEquals("calibration point 1 (x = 0.0): weighting 1/x needs x > 0; subtract the blank instead "
        + "of fitting it as a point, or choose weighting 1/s2 or none", e.getMessage());
  }

  @Test
  @DisplayName("1/y weighting with a non-positive signal and 1/s2 without SDs are refused")
  void otherImpossibleWeightings() {
    CalibrationException e = assertThrows(CalibrationException.class, () -> CalibrationFit.fit(
        List.of(CalibrationPoint.of(0, -0.01), CalibrationPoint.of(1, 2)),
        FitOptions.DEFAULT.withWeighting(Weighting.INVERSE_Y_SQUARED)));
    assertTrue(e.getMessage().startsWith("calibration point 1 (y = -0.01): weighting 1/y2 needs a positive signal"));
    e = assertThrows(CalibrationException.class, () -> CalibrationFit.fit(
        List.of(CalibrationPoint.of(0, 0.01, 0.001), CalibrationPoint.of(1, 2)),
        FitOptions.DEFAULT.withWeighting(Weighting.INVERSE_VARIANCE)));
    assertTrue(e.getMessage().startsWith("calibration point 2 has no standard deviation"));
    e = assertThrows(CalibrationException.class, () -> CalibrationFit.fit(
        List.of(CalibrationPoint.of(0, 0.01, 0), CalibrationPoint.of(1, 2, 0.1)),
        FitOptions.DEFAULT.withWeighting(Weighting.INVERSE_VARIANCE)));
    assertTrue(e.getMessage().startsWith("calibration point 1 has standard deviation 0"));
  }

  @Test
  @DisplayName("a flat signal is refused: nothing responds to concentration")
  void flatSignal() {
    CalibrationException e = assertThrows(CalibrationException.class, () -> CalibrationFit.fit(
        List.of(CalibrationPoint.of(0, 3), CalibrationPoint.of(1, 3), CalibrationPoint.of(2, 3)), FitOptions.DEFAULT));
    assertTrue(e.getMessage().contains("does not respond to concentration"), e.getMessage());
  }

  @Test
  @DisplayName("bad prediction arguments are refused")
  void badPredictionArguments() {
    CalibrationFit fit = WorkedExamplesTest.unweighted();
    assertThrows(IllegalArgumentException.class, () -> fit.predict(Double.NaN));
    assertThrows(IllegalArgumentException.class, () -> fit.predict(1, 0, 0.95));
    assertThrows(IllegalArgumentException.class, () -> fit.predict(1, 1, 1.0));
    assertFalse(fit.predict(40).inRange());
    assertEquals(RangePosition.ABOVE_RANGE, fit.predict(40).position());
  }
}
