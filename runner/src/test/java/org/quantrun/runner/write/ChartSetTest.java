package org.quantrun.runner.write;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.ArrayList;
import java.util.List;
import java.util.Optional;
import org.junit.jupiter.api.Test;
import org.quantrun.core.model.RunResult;

/** The report's charts drawn by two threads are the charts one thread draws, each once, in order. */
class ChartSetTest {

  @Test
  void helpedChartsAreTheSameAsChartsDrawnInTurn() throws Exception {
    RunResult run = InventedRun.run();
    int n = run.calibrations().size();
    assertTrue(n >= 2, "the invented run has several calibrations");
    List<Optional<String>> alone = new ArrayList<>();
    for (int i = 0; i < n; i++) {
      alone.add(CalibrationChart.svg(run.calibrations().get(i), ChartSet.id(i)));
    }
    ChartSet shared = new ChartSet(run);
    Thread helper = new Thread(shared::help);
    helper.start();
    for (int i = 0; i < n; i++) {
      assertEquals(alone.get(i), shared.get(i), "chart " + i);
    }
    helper.join();
    // once drawn, a chart is not drawn again: the same text instance comes back
    assertTrue(shared.get(0).orElseThrow() == shared.get(0).orElseThrow());
  }

  @Test
  void ids() {
    // the ids the report's anchors use: cal-1, cal-2, ... with -plot for the chart (common practice: unique per page)
    assertEquals("cal-1-plot", ChartSet.id(0));
    assertEquals("cal-12-plot", ChartSet.id(11));
  }
}
