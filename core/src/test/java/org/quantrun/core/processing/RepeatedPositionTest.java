package org.quantrun.core.processing;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;
import static org.quantrun.core.processing.RunBuilder.r;
import static org.quantrun.core.processing.RunProcessorScenarioTest.PB;
import static org.quantrun.core.processing.RunProcessorScenarioTest.yaml;

import java.util.List;
import java.util.Optional;
import org.junit.jupiter.api.DisplayName;
import org.junit.jupiter.api.Test;
import org.quantrun.core.model.RunResult;

/**
 * An export whose sequence column gives one number to two injections (a vial position measured
 * again, two sequences in one file): the run is processed, and the findings say which number and
 * where, because the result rows of both injections carry it (common practice: a LIMS keys
 * results by run, position and analyte).
 */
class RepeatedPositionTest {

  private static RunBuilder calibrated() {
    return new RunBuilder("run-P1.csv")
        .inject("BLK", PB, r(100, 100, 100))
        .inject("S1", PB, r(300, 300, 300))
        .inject("S2", PB, r(1100, 1100, 1100))
        .inject("S3", PB, r(2100, 2100, 2100))
        .inject("ICV", PB, r(1100, 1100, 1100));
  }

  @Test
  @DisplayName("a sequence number given to two injections is a finding naming the number, both samples and their lines")
  void repeatedSequenceIsAFinding() {
    RunResult res = RunProcessor.process(calibrated()
        .inject("X1", PB, r(260, 260, 260))
        .inject("CCV1", PB, r(1100, 1100, 1100))
        .sequence(6).inject("X2", PB, r(260, 260, 260))
        .inject("CCV2", PB, r(1100, 1100, 1100)).build(), RunBuilder.method(yaml("", "", "1")), Optional.empty());
    List<String> about = res.findings().stream().filter(f -> f.contains("sequence number")).toList();
    // X1 is the 6th injection (lines 17-19), X2 given 6 as well (lines 23-25)
    assertEquals(List.of("the export gives sequence number 6 to 2 injections ('X1' at line 17, 'X2' at line 23): their"
        + " results share position 6; check the export's sequence column"), about);
    assertEquals(2, res.results().stream().filter(a -> a.position() == 6).count(), "both are still reported");
  }

  @Test
  @DisplayName("sequence numbers that are all different give no such finding")
  void distinctSequencesGiveNone() {
    RunResult res = RunProcessor.process(calibrated().inject("X1", PB, r(260, 260, 260))
        .inject("CCV1", PB, r(1100, 1100, 1100)).build(), RunBuilder.method(yaml("", "", "1")), Optional.empty());
    assertTrue(res.findings().stream().noneMatch(f -> f.contains("sequence number")), res.findings().toString());
  }
}
