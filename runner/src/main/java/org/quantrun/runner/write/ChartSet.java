package org.quantrun.runner.write;

import java.io.IOException;
import java.io.UncheckedIOException;
import java.util.ArrayList;
import java.util.List;
import java.util.Optional;
import java.util.concurrent.FutureTask;
import org.quantrun.core.model.CalibrationResult;
import org.quantrun.core.model.RunResult;

/**
 * The calibration charts of one run's report, each drawn once by whichever thread comes to it
 * first: the report takes them in order, and the thread that writes the tables, once done with
 * them, draws from the last one backwards, so that two cores share the drawing. A chart's
 * failure is kept and met by the report when it takes that chart.
 */
final class ChartSet {
  private final List<FutureTask<Optional<String>>> charts;

  /**
   * The charts of a run, none drawn yet.
   *
   * @param run the processed run
   */
  ChartSet(RunResult run) {
    charts = new ArrayList<>(run.calibrations().size());
    for (int i = 0; i < run.calibrations().size(); i++) {
      CalibrationResult c = run.calibrations().get(i);
      String id = id(i);
      charts.add(new FutureTask<>(() -> CalibrationChart.svg(c, id)));
    }
  }

  /**
   * The element id of the chart of the {@code i}-th calibration.
   *
   * @param i the calibration's index in the run
   * @return e.g. {@code cal-1-plot}
   */
  static String id(int i) {
    return HtmlReport.anchor(i) + "-plot";
  }

  /**
   * The chart of the {@code i}-th calibration: drawn now unless another thread has drawn it or is
   * drawing it (then waited for).
   *
   * @param i the calibration's index in the run
   * @return the SVG element; empty when there is nothing to plot
   * @throws RuntimeException or {@link Error} as drawing the chart threw it
   */
  Optional<String> get(int i) {
    FutureTask<Optional<String>> chart = charts.get(i);
    chart.run();
    try {
      // a chart being drawn on the other thread finishes on its own: waited for
      return Uninterruptibly.get(chart);
    } catch (IOException e) {
      throw new UncheckedIOException(e);
    }
  }

  /** Draws the charts no thread has started yet, from the last one backwards. */
  void help() {
    for (int i = charts.size() - 1; i >= 0; i--) {
      charts.get(i).run();
    }
  }
}
