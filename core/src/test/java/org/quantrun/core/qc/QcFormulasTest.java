package org.quantrun.core.qc;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import org.junit.jupiter.api.DisplayName;
import org.junit.jupiter.api.Test;

/** The QC formulas and rules. Windows below are example limits of published methods, from memory. */
class QcFormulasTest {

  @Test
  @DisplayName("a CCV reading 10.4 of 10.0 recovers 104 %, inside 90-110 and outside 95-105 only at 106")
  void recovery() {
    // CCV window 90-110 % (EPA 200.7 / 6010, from memory); 104 = 10.4 / 10.0 * 100.
    CheckOutcome ok = QcFormulas.recovery(10.4, 10.0, Window.between(90, 110));
    assertEquals(104.0, ok.value().getAsDouble(), 1e-12);
    assertEquals(Verdict.PASSED, ok.verdict());
    assertTrue(ok.reason().isEmpty());
    CheckOutcome bad = QcFormulas.recovery(10.6, 10.0, Window.between(95, 105));
    assertEquals(Verdict.FAILED, bad.verdict());
    assertEquals("recovery 106.0 % is outside 95.0 to 105.0 %", bad.reason().get());
    assertEquals(Verdict.PASSED, QcFormulas.recovery(11.0, 10.0, Window.between(90, 110)).verdict(),
        "the window's ends are included");
    assertEquals(Verdict.NOT_EVALUATED, QcFormulas.recovery(1, 0, Window.between(90, 110)).verdict());
  }

  @Test
  @DisplayName("a blank passes while its absolute result does not exceed the limit")
  void blank() {
    // ICB/CCB/method blank below the reporting limit (EPA 200.7, from memory).
    assertEquals(Verdict.PASSED, QcFormulas.blank(-0.8, 1.0, "ug/L").verdict());
    assertEquals(Verdict.FAILED, QcFormulas.blank(-1.2, 1.0, "ug/L").verdict());
    assertEquals(Verdict.PASSED, QcFormulas.blank(1.0, 1.0, "ug/L").verdict());
    assertEquals(Verdict.FAILED, QcFormulas.blank(1.0001, 1.0, "ug/L").verdict());
  }

  @Test
  @DisplayName("duplicates above 5x the reporting limit are judged by RPD, lower ones by the absolute difference")
  void duplicate() {
    // SW-846 style duplicate rule (from memory): RPD <= 20 % when both >= 5x RL, else
    // |a - b| <= RL. Here RL = 2, so the threshold is 10. RPD of 52 and 44 = 8 / 48 * 100 = 16.67 %
    // (by hand).
    CheckOutcome high = QcFormulas.duplicate(52, 44, 10, 20, 2, "ug/L");
    assertEquals(16.6667, high.value().getAsDouble(), 1e-4);
    assertEquals(Verdict.PASSED, high.verdict());
    CheckOutcome highBad = QcFormulas.duplicate(60, 40, 10, 20, 2, "ug/L");
    assertEquals(40.0, highBad.value().getAsDouble(), 1e-12);
    assertEquals(Verdict.FAILED, highBad.verdict());
    CheckOutcome low = QcFormulas.duplicate(5.0, 3.5, 10, 20, 2, "ug/L");
    assertEquals("ug/L", low.unit());
    assertEquals(1.5, low.value().getAsDouble(), 1e-12);
    assertEquals(Verdict.PASSED, low.verdict());
    assertEquals(Verdict.FAILED, QcFormulas.duplicate(5.0, 2.5, 10, 20, 2, "ug/L").verdict());
    assertEquals(Verdict.NOT_EVALUATED, QcFormulas.duplicate(5.0, 2.5, 10, 20, Double.NaN, "ug/L").verdict());
    assertTrue(QcFormulas.rpd(-1, 0.5).isEmpty(), "no RPD when a + b <= 0");
  }

  @Test
  @DisplayName("a matrix spike recovers (spiked - unspiked) / added, unless the sample holds over 4x the spike")
  void spike() {
    // Matrix spike 75-125 % and the 4x rule (SW-846 6010, from memory). (58 - 12) / 50 = 92 %.
    CheckOutcome ok = QcFormulas.spikeRecovery(58, 12, 50, Window.between(75, 125), 4);
    assertEquals(92.0, ok.value().getAsDouble(), 1e-12);
    assertEquals(Verdict.PASSED, ok.verdict());
    assertEquals(Verdict.FAILED, QcFormulas.spikeRecovery(40, 12, 50, Window.between(75, 125), 4).verdict());
    CheckOutcome big = QcFormulas.spikeRecovery(260, 250, 50, Window.between(75, 125), 4);
    assertEquals(Verdict.NOT_EVALUATED, big.verdict());
    assertEquals(20.0, big.value().getAsDouble(), 1e-12, "the recovery is still shown");
  }

  @Test
  @DisplayName("a 1:5 serial dilution differs by %D = |U - 5D| / U, judged only above its threshold")
  void serialDilution() {
    // Serial dilution %D <= 10 % at >= 50x the reporting limit (EPA 200.7, from memory).
    // |200 - 5 * 37| / 200 = 7.5 % (by hand).
    CheckOutcome ok = QcFormulas.serialDilution(200, 37, 5, 10, 50);
    assertEquals(7.5, ok.value().getAsDouble(), 1e-12);
    assertEquals(Verdict.PASSED, ok.verdict());
    assertEquals(Verdict.FAILED, QcFormulas.serialDilution(200, 34, 5, 10, 50).verdict());
    assertEquals(Verdict.NOT_EVALUATED, QcFormulas.serialDilution(40, 7, 5, 10, 50).verdict());
  }

  @Test
  @DisplayName("replicate %RSD is judged only above its minimum mean")
  void replicateRsd() {
    // %RSD <= 5 % above 10x the reporting limit (common practice).
    assertEquals(Verdict.PASSED, QcFormulas.replicateRsd(100, 3, 5, 10).verdict());
    assertEquals(Verdict.FAILED, QcFormulas.replicateRsd(100, 6, 5, 10).verdict());
    assertEquals(Verdict.NOT_EVALUATED, QcFormulas.replicateRsd(5, 3, 5, 10).verdict());
  }

  @Test
  @DisplayName("a window must be ordered")
  void window() {
    assertThrows(IllegalArgumentException.class, () -> Window.between(110, 90));
  }
}
