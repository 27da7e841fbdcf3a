package org.quantrun.core.calibration;

import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.ArrayList;
import java.util.List;
import java.util.Map;
import java.util.function.ToDoubleFunction;
import org.junit.jupiter.api.DisplayName;
import org.junit.jupiter.api.Test;

/**
 * The fits against NIST Statistical Reference Datasets (linear least squares: Norris, Pontius,
 * NoInt1), certified to 15 significant digits. Every certified value must be reproduced with a log
 * relative error of at least 10 digits.
 */
class NistCertifiedValuesTest {
  private static final double REQUIRED_DIGITS = 10;

  @Test
  @DisplayName("the straight-line fit reproduces every certified value of NIST Norris to 10 digits")
  void norris() {
    // Source: NIST StRD, linear least squares, dataset Norris (certified values).
    CalibrationFit fit = CalibrationFit.fit(Reference.points("norris"), FitOptions.DEFAULT);
    assertCertified("norris", fit, Map.of(
        "c0", f -> f.coefficient(0),
        "c1", f -> f.coefficient(1),
        "se_c0", f -> f.standardError(0).getAsDouble(),
        "se_c1", f -> f.standardError(1).getAsDouble(),
        "residual_sd", f -> f.sYx().getAsDouble(),
        "r_squared", CalibrationFit::r2));
  }

  @Test
  @DisplayName("the quadratic fit reproduces every certified value of the ill-conditioned NIST Pontius to 10 digits")
  void pontius() {
    // Source: NIST StRD, linear least squares, dataset Pontius (certified values).
    CalibrationFit fit = CalibrationFit.fit(
        Reference.points("pontius"), FitOptions.DEFAULT.withCurve(CurveModel.QUADRATIC));
    assertCertified("pontius", fit, Map.of(
        "c0", f -> f.coefficient(0),
        "c1", f -> f.coefficient(1),
        "c2", f -> f.coefficient(2),
        "se_c0", f -> f.standardError(0).getAsDouble(),
        "se_c1", f -> f.standardError(1).getAsDouble(),
        "se_c2", f -> f.standardError(2).getAsDouble(),
        "residual_sd", f -> f.sYx().getAsDouble(),
        "r_squared", CalibrationFit::r2));
  }

  @Test
  @DisplayName("the through-zero fit reproduces every certified value of NIST NoInt1, with the uncentred r^2, to 10 digits")
  void noInt1() {
    // Source: NIST StRD, linear least squares, dataset NoInt1 (certified values; NIST's R-squared
    // for a model without intercept is the uncentred one).
    CalibrationFit fit = CalibrationFit.fit(
        Reference.points("noint1"), FitOptions.DEFAULT.withCurve(CurveModel.THROUGH_ZERO));
    assertCertified("noint1", fit, Map.of(
        "c1", f -> f.coefficient(1),
        "se_c1", f -> f.standardError(1).getAsDouble(),
        "residual_sd", f -> f.sYx().getAsDouble(),
        "r_squared_uncentered", CalibrationFit::r2));
  }

  private static void assertCertified(
      String dataset, CalibrationFit fit, Map<String, ToDoubleFunction<CalibrationFit>> statistics) {
    Map<String, Double> certified = Reference.certified(dataset);
    assertTrue(certified.keySet().equals(statistics.keySet()),
        "the test must check every certified value of " + dataset + ": " + certified.keySet());
    List<String> report = new ArrayList<>();
    boolean ok = true;
    for (Map.Entry<String, ToDoubleFunction<CalibrationFit>> e : statistics.entrySet()) {
      double cert = certified.get(e.getKey());
      double est = e.getValue().applyAsDouble(fit);
      double lre = Reference.lre(est, cert);
      report.add(String.format("%s: estimate %.15g, certified %.15g, LRE %.1f", e.getKey(), est, cert, lre));
      ok &= lre >= REQUIRED_DIGITS;
    }
    assertTrue(ok, dataset + " below " + REQUIRED_DIGITS + " digits:\n  " + String.join("\n  ", report));
  }
}
