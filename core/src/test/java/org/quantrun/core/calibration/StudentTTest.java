package org.quantrun.core.calibration;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;

import org.junit.jupiter.api.DisplayName;
import org.junit.jupiter.api.Test;

/** Student t critical values against printed tables. */
class StudentTTest {

  @Test
  @DisplayName("two-sided 95 % t is 2.776 for 4 and 2.571 for 5 degrees of freedom")
  void twoSided95() {
    // Source: any table of Student's t (e.g. the statistical tables of Miller & Miller, from
    // memory); also common practice: 2.78 and 2.57.
    assertEquals(2.776, StudentT.twoSided(0.95, 4), 0.0005);
    assertEquals(2.571, StudentT.twoSided(0.95, 5), 0.0005);
  }

  @Test
  @DisplayName("one-sided 99 % t for 6 degrees of freedom is 3.143, the MDL value for seven replicates")
  void oneSided99() {
    // Source: 40 CFR 136 Appendix B, table of Student's t values (from memory): 3.143 for 7 replicates.
    assertEquals(3.143, StudentT.oneSided(0.99, 6), 0.0005);
  }

  @Test
  @DisplayName("a confidence outside (0, 1) is refused with a message")
  void badConfidence() {
    IllegalArgumentException e = assertThrows(IllegalArgumentException.class, () -> StudentT.twoSided(95, 4));
    assertEquals("confidence must lie strictly between 0 and 1 (e.g. 0.95), was 95.0", e.getMessage());
    assertThrows(IllegalArgumentException.class, () -> StudentT.twoSided(0.95, 0));
  }
}
