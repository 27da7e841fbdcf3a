package org.quantrun.core.calibration;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.ArrayList;
import java.util.Collections;
import java.util.List;
import java.util.OptionalDouble;
import org.junit.jupiter.api.DisplayName;
import org.junit.jupiter.api.Test;

/** Detection and quantitation limits from a calibration, from blank replicates, and the MDL. */
class LimitsTest {

  @Test
  @DisplayName("unweighted calibration limits are 3.3 and 10 s_y/x over the slope")
  void fromUnweightedCalibration() {
    // ICH Q2 (from memory): LOD = 3.3 sigma / S, LOQ = 10 sigma / S with sigma the residual SD.
    // Data: the Miller & Miller ch. 5 example (from memory): s_y/x = 0.4329, b = 1.93.
    CalibrationFit fit = WorkedExamplesTest.unweighted();
    LimitEstimate l = DetectionLimits.fromCalibration(fit).orElseThrow();
    WorkedExamplesTest.assertDigits(3.3 * 0.4329 / 1.9296, 3, l.lod());
    WorkedExamplesTest.assertDigits(10 * 0.4329 / 1.9296, 3, l.loq());
    assertEquals(LimitSource.CALIBRATION, l.source());
  }

  @Test
  @DisplayName("weighted calibration limits use s_y/x,w over the root of the lowest standard's weight")
  void fromWeightedCalibration() {
    // domain.md section 4 convention: s0 = s_y/x,w / sqrt(w) at the lowest non-zero standard.
    List<CalibrationPoint> pts = new ArrayList<>();
    double[] x = {1, 2, 5, 10, 20, 50};
    double[] y = {10.3, 19.6, 50.8, 99.1, 203.5, 494.0};
    for (int i = 0; i < x.length; i++) {
      pts.add(CalibrationPoint.of(x[i], y[i]));
    }
    CalibrationFit fit = CalibrationFit.fit(pts, FitOptions.DEFAULT.withWeighting(Weighting.INVERSE_X_SQUARED));
    double sumRaw = 0;
    for (double v : x) {
      sumRaw += 1 / (v * v);
    }
    double w1 = (1 / 1.0) * x.length / sumRaw;
    double s0 = fit.sYx().getAsDouble() / Math.sqrt(w1);
    LimitEstimate l = DetectionLimits.fromCalibration(fit).orElseThrow();
    assertEquals(s0, l.signalSd(), 1e-12 * s0);
    assertEquals(3.3 * s0 / fit.coefficient(1), l.lod(), 1e-12 * l.lod());
    assertEquals(10 * s0 / fit.coefficient(1), l.loq(), 1e-12 * l.loq());
  }

  @Test
  @DisplayName("limits from blank replicates are 3 and 10 s_blank over the slope")
  void fromBlankReplicates() {
    // IUPAC-style limits (from memory): LOD = 3 s_blank / b, LOQ = 10 s_blank / b. The SD of
    // 0.010, 0.012, 0.008, 0.011, 0.009 is 0.0015811 (sample SD, n - 1), computed by hand.
    LimitEstimate l = DetectionLimits.fromBlankReplicates(new double[] {0.010, 0.012, 0.008, 0.011, 0.009}, 0.5);
    assertEquals(0.00158114, l.signalSd(), 1e-8);
    assertEquals(3 * 0.00158114 / 0.5, l.lod(), 1e-7);
    assertEquals(10 * 0.00158114 / 0.5, l.loq(), 1e-7);
    assertThrows(IllegalArgumentException.class, () -> DetectionLimits.fromBlankReplicates(new double[] {1, 2}, 1));
  }

  @Test
  @DisplayName("the MDL is t(6, 0.99) = 3.143 times the SD of seven spikes when the blanks are lower")
  void mdlFromSpikes() {
    // 40 CFR 136 App. B rev. 2 (from memory): MDL_s = t * S_s, t = 3.143 for seven replicates;
    // MDL = max(MDL_s, MDL_b). Spike results 1.9..2.3, sample SD 0.134519 computed by hand.
    double[] spikes = {2.1, 1.9, 2.2, 2.0, 2.3, 2.0, 2.1};
    List<OptionalDouble> blanks = List.of(
        OptionalDouble.of(0.01), OptionalDouble.of(-0.02), OptionalDouble.of(0.03), OptionalDouble.of(0.0),
        OptionalDouble.of(0.02), OptionalDouble.of(-0.01), OptionalDouble.of(0.01));
    MethodDetectionLimit mdl = MethodDetectionLimit.compute(spikes, blanks);
    assertEquals(3.143 * 0.134519, mdl.spikedMdl(), 0.001);
    assertEquals(mdl.spikedMdl(), mdl.mdl(), 0);
    // MDL_b = mean 0.005714 + 3.143 * 0.017182 (hand computed)
    assertEquals(0.005714 + 3.143 * 0.017182, mdl.blankMdl().getAsDouble(), 0.0002);
  }

  @Test
  @DisplayName("the MDL takes the blank estimate when it is larger, and the highest blank when only some give numbers")
  void mdlFromBlanks() {
    // 40 CFR 136 App. B rev. 2 (from memory): when only some method blanks give numerical
    // results, MDL_b is the highest of them.
    double[] spikes = {2.01, 2.00, 2.02, 1.99, 2.00, 2.01, 2.00};
    List<OptionalDouble> blanks = new ArrayList<>(Collections.nCopies(5, OptionalDouble.empty()));
    blanks.add(OptionalDouble.of(0.3));
    blanks.add(OptionalDouble.of(0.4));
    MethodDetectionLimit mdl = MethodDetectionLimit.compute(spikes, blanks);
    assertEquals(0.4, mdl.blankMdl().getAsDouble(), 0);
    assertEquals(0.4, mdl.mdl(), 0);
    // a negative blank mean counts as zero
    List<OptionalDouble> negative = new ArrayList<>();
    double[] nb = {-0.5, -0.4, -0.6, -0.5, -0.45, -0.55, -0.5};
    for (double v : nb) {
      negative.add(OptionalDouble.of(v));
    }
    MethodDetectionLimit m2 = MethodDetectionLimit.compute(spikes, negative);
    assertEquals(3.143 * 0.0645497, m2.blankMdl().getAsDouble(), 0.0005);
    assertTrue(MethodDetectionLimit.compute(spikes, List.of()).blankMdl().isEmpty());
    assertThrows(IllegalArgumentException.class, () -> MethodDetectionLimit.compute(new double[] {1, 2, 3}, List.of()));
  }
}
