package org.quantrun.core.model;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertNotEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.List;
import java.util.Optional;
import java.util.OptionalDouble;
import java.util.OptionalInt;
import org.junit.jupiter.api.DisplayName;
import org.junit.jupiter.api.Test;
import org.quantrun.core.calibration.LimitSource;
import org.quantrun.core.method.ResultFlag;
import org.quantrun.core.method.SampleRole;

/**
 * AnalyteResult keeps its optional numbers as plain doubles and presence bits; each accessor must
 * give back exactly what was passed in, and equality must be that of a record (every component
 * equal). Values chosen by hand (common practice for a value type: what goes in comes out).
 */
class AnalyteResultTest {

  private static AnalyteResult result(OptionalDouble value, OptionalDouble ci, OptionalDouble lod, OptionalDouble loq,
      OptionalDouble mean, OptionalDouble rsd, OptionalDouble solution, OptionalInt dilution) {
    return new AnalyteResult(12, "W-7", SampleRole.SAMPLE, "Pb 220.353", "Pb", Optional.of("220.353"), true, value,
        "12.3", "ug/L", ci, lod, loq, 2.5, List.of(ResultFlag.ESTIMATED), mean, rsd, 3,
        Optional.of(LimitSource.METHOD), solution, dilution, List.of("signal: mean of 3 valid readings"));
  }

  @Test
  @DisplayName("every component comes back as given, present numbers to the bit")
  void componentsComeBack() {
    AnalyteResult r = result(OptionalDouble.of(12.3), OptionalDouble.of(-0.0), OptionalDouble.of(Double.MIN_VALUE),
        OptionalDouble.of(Double.NaN), OptionalDouble.of(1520.5), OptionalDouble.of(0.25), OptionalDouble.of(4.92),
        OptionalInt.of(0));
    assertEquals(12, r.position());
    assertEquals("W-7", r.sampleId());
    assertEquals(SampleRole.SAMPLE, r.role());
    assertEquals("Pb 220.353", r.analyteKey());
    assertEquals("Pb", r.analyte());
    assertEquals(Optional.of("220.353"), r.line());
    assertTrue(r.reportedLine());
    assertEquals(OptionalDouble.of(12.3), r.value());
    assertEquals("12.3", r.reported());
    assertEquals("ug/L", r.unit());
    assertEquals(Double.doubleToRawLongBits(-0.0), Double.doubleToRawLongBits(r.ciHalfWidth().getAsDouble()));
    assertEquals(OptionalDouble.of(Double.MIN_VALUE), r.lod());
    assertTrue(r.loq().isPresent() && Double.isNaN(r.loq().getAsDouble()), "a present NaN stays present");
    assertEquals(2.5, r.dilutionFactor());
    assertEquals(List.of(ResultFlag.ESTIMATED), r.flags());
    assertEquals(OptionalDouble.of(1520.5), r.signalMean());
    assertEquals(OptionalDouble.of(0.25), r.signalRsdPct());
    assertEquals(3, r.replicates());
    assertEquals(Optional.of(LimitSource.METHOD), r.limitsFrom());
    assertEquals(OptionalDouble.of(4.92), r.solutionConcentration());
    assertEquals(OptionalInt.of(0), r.suggestedDilution());
    assertEquals(List.of("signal: mean of 3 valid readings"), r.trace());
  }

  @Test
  @DisplayName("empty numbers come back empty, whatever the others hold")
  void emptiesComeBackEmpty() {
    OptionalDouble e = OptionalDouble.empty();
    AnalyteResult r = result(e, e, OptionalDouble.of(1), e, e, OptionalDouble.of(2), e, OptionalInt.empty());
    assertEquals(e, r.value());
    assertEquals(e, r.ciHalfWidth());
    assertEquals(OptionalDouble.of(1), r.lod());
    assertEquals(e, r.loq());
    assertEquals(e, r.signalMean());
    assertEquals(OptionalDouble.of(2), r.signalRsdPct());
    assertEquals(e, r.solutionConcentration());
    assertEquals(OptionalInt.empty(), r.suggestedDilution());
  }

  @Test
  @DisplayName("equal as a record is: same components equal, any one different not")
  void equality() {
    OptionalDouble e = OptionalDouble.empty();
    AnalyteResult a = result(OptionalDouble.of(1), e, e, e, e, e, e, OptionalInt.empty());
    AnalyteResult b = result(OptionalDouble.of(1), e, e, e, e, e, e, OptionalInt.empty());
    assertEquals(a, b);
    assertEquals(a.hashCode(), b.hashCode());
    assertEquals(a.toString(), b.toString());
    assertNotEquals(a, result(e, e, e, e, e, e, e, OptionalInt.empty()));
    assertNotEquals(a, result(OptionalDouble.of(1), OptionalDouble.of(0), e, e, e, e, e, OptionalInt.empty()));
    assertNotEquals(a, result(OptionalDouble.of(1), e, e, e, e, e, e, OptionalInt.of(0)));
    assertNotEquals(result(OptionalDouble.of(Double.NaN), e, e, e, e, e, e, OptionalInt.empty()),
        result(e, e, e, e, e, e, e, OptionalInt.empty()));
    assertNotEquals(result(OptionalDouble.of(0.0), e, e, e, e, e, e, OptionalInt.empty()),
        result(OptionalDouble.of(-0.0), e, e, e, e, e, e, OptionalInt.empty()), "as OptionalDouble.equals: 0.0 is not -0.0");
    assertTrue(a.toString().startsWith("AnalyteResult[position=12, sampleId=W-7, role="));
  }
}
