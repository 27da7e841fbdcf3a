package org.quantrun.runner.write;

import java.awt.BasicStroke;
import java.awt.Color;
import java.awt.Font;
import java.awt.Rectangle;
import java.awt.Shape;
import java.awt.geom.Ellipse2D;
import java.awt.geom.Path2D;
import java.util.Optional;
import org.jfree.chart.JFreeChart;
import org.jfree.chart.axis.NumberAxis;
import org.jfree.chart.plot.CombinedDomainXYPlot;
import org.jfree.chart.plot.ValueMarker;
import org.jfree.chart.plot.XYPlot;
import org.jfree.chart.renderer.xy.XYLineAndShapeRenderer;
import org.jfree.chart.text.TextUtils;
import org.jfree.chart.title.LegendTitle;
import org.jfree.chart.ui.RectangleEdge;
import org.jfree.data.xy.XYSeries;
import org.jfree.data.xy.XYSeriesCollection;
import org.jfree.svg.SVGGraphics2D;
import org.jfree.svg.ViewBox;
import org.quantrun.core.calibration.CalibrationFit;
import org.quantrun.core.model.CalibrationLevel;
import org.quantrun.core.model.CalibrationResult;
import org.quantrun.core.qc.Verdict;

/**
 * Draws one analyte line's calibration with JFreeChart as an inline SVG element (JFreeSVG): the
 * standards (points that failed their back-calculation limit with a different marker, not only a
 * different colour), the fitted curve, and below it the residuals against concentration.
 */
public final class CalibrationChart {
  /** Width of the drawing in SVG user units. */
  static final int WIDTH = 640;
  /** Height of the drawing in SVG user units. */
  static final int HEIGHT = 440;
  private static final int CURVE_POINTS = 80;

  /** Decimals of coordinates in the SVG: a hundredth of a user unit, far below a screen or printer dot. */
  private static final int GEOMETRY_DECIMALS = 2;
  /** Decimals of transform matrices (rotated axis labels). */
  private static final int TRANSFORM_DECIMALS = 4;

  static {
    System.setProperty("java.awt.headless", "true");
    // rotated axis labels as SVG text (drawString under a rotation), not as outlines of every glyph
    TextUtils.setUseDrawRotatedStringWorkaround(false);
  }

  private CalibrationChart() {}

  /**
   * The chart as an {@code <svg>} element, sized by its view box (it scales to its container).
   *
   * @param c the calibration
   * @param id a unique id for the element; also prefixes the SVG's internal references, so several
   *     charts can share one page
   * @return the SVG text; empty when the calibration has no fit points to draw
   */
  public static Optional<String> svg(CalibrationResult c, String id) {
    if (c.levels().isEmpty()) {
      return Optional.empty();
    }
    XYSeries passed = new XYSeries("standards", false, true);
    XYSeries failed = new XYSeries("standards outside the back-calculation limit (x)", false, true);
    XYSeries residualsPassed = new XYSeries("residual", false, true);
    XYSeries residualsFailed = new XYSeries("residual, outside limit", false, true);
    double xMin = Double.POSITIVE_INFINITY;
    double xMax = Double.NEGATIVE_INFINITY;
    for (CalibrationLevel l : c.levels()) {
      boolean bad = l.verdict() == Verdict.FAILED;
      (bad ? failed : passed).add(l.x(), l.y());
      (bad ? residualsFailed : residualsPassed).add(l.x(), l.residual());
      xMin = Math.min(xMin, l.x());
      xMax = Math.max(xMax, l.x());
    }
    XYSeriesCollection points = new XYSeriesCollection();
    points.addSeries(passed);
    points.addSeries(failed);
    XYSeriesCollection curve = new XYSeriesCollection();
    if (c.fit().isPresent() && xMax > xMin) {
      CalibrationFit fit = c.fit().get();
      XYSeries line = new XYSeries("fitted " + c.curve().token() + " curve (" + c.weighting().token() + ")", false, true);
      for (int i = 0; i <= CURVE_POINTS; i++) {
        double x = xMin + (xMax - xMin) * i / CURVE_POINTS;
        line.add(x, fit.signalAt(x));
      }
      curve.addSeries(line);
    }

    Font tick = new Font(Font.SANS_SERIF, Font.PLAIN, 11);
    Font label = new Font(Font.SANS_SERIF, Font.PLAIN, 12);
    NumberAxis xAxis = axis("concentration (" + c.unit() + ")", tick, label);
    NumberAxis yAxis = axis("signal", tick, label);
    NumberAxis rAxis = axis("residual", tick, label);
    rAxis.setUpperMargin(0.15);
    rAxis.setLowerMargin(0.15);

    XYPlot top = new XYPlot();
    top.setRangeAxis(yAxis);
    top.setDataset(0, points);
    top.setRenderer(0, pointRenderer(new Color(0x1f4e9a), new Color(0xb3261e)));
    top.setDataset(1, curve);
    XYLineAndShapeRenderer lineRenderer = new XYLineAndShapeRenderer(true, false);
    // the fitted curve as one SVG path, not a line element per segment
    lineRenderer.setDrawSeriesLineAsPath(true);
    lineRenderer.setSeriesPaint(0, new Color(0x333333));
    lineRenderer.setSeriesStroke(0, new BasicStroke(1.5f));
    top.setRenderer(1, lineRenderer);
    style(top);

    XYSeriesCollection residuals = new XYSeriesCollection();
    residuals.addSeries(residualsPassed);
    residuals.addSeries(residualsFailed);
    XYPlot bottom = new XYPlot();
    bottom.setRangeAxis(rAxis);
    bottom.setDataset(residuals);
    XYLineAndShapeRenderer residualRenderer = pointRenderer(new Color(0x1f4e9a), new Color(0xb3261e));
    residualRenderer.setDefaultSeriesVisibleInLegend(false);
    bottom.setRenderer(residualRenderer);
    ValueMarker zero = new ValueMarker(0, new Color(0x777777), new BasicStroke(1f));
    bottom.addRangeMarker(zero);
    style(bottom);

    CombinedDomainXYPlot plot = new CombinedDomainXYPlot(xAxis);
    plot.setGap(12);
    plot.add(top, 3);
    plot.add(bottom, 1);
    JFreeChart chart = new JFreeChart(null, label, plot, true);
    chart.setBackgroundPaint(Color.WHITE);
    chart.setAntiAlias(true);
    LegendTitle legend = chart.getLegend();
    legend.setPosition(RectangleEdge.BOTTOM);
    legend.setItemFont(tick);
    legend.setFrame(org.jfree.chart.block.BlockBorder.NONE);

    SVGGraphics2D g2 = new SVGGraphics2D(WIDTH, HEIGHT);
    g2.setDefsKeyPrefix(id + "-");
    g2.setGeomDoubleConverter(v -> decimal(v, GEOMETRY_DECIMALS));
    g2.setTransformDoubleConverter(v -> decimal(v, TRANSFORM_DECIMALS));
    chart.draw(g2, new Rectangle(0, 0, WIDTH, HEIGHT));
    return Optional.of(g2.getSVGElement(id, false, new ViewBox(0, 0, WIDTH, HEIGHT), null, null));
  }

  private static final long[] SCALES = {1, 10, 100, 1000, 10000};

  /**
   * A coordinate for the SVG: rounded to {@code decimals} places, trailing zeros dropped
   * ({@code 82}, {@code 376.2}, {@code -0.05}); very large values (never drawn) as {@link Double#toString}.
   */
  static String decimal(double v, int decimals) {
    long scale = SCALES[decimals];
    if (!(Math.abs(v) < 1e12)) {
      return Double.toString(v);
    }
    long r = Math.round(v * scale);
    if (r == 0) {
      return "0";
    }
    StringBuilder b = new StringBuilder(12);
    if (r < 0) {
      b.append('-');
      r = -r;
    }
    b.append(r / scale);
    long fraction = r % scale;
    if (fraction != 0) {
      int places = decimals;
      while (fraction % 10 == 0) {
        fraction /= 10;
        places--;
      }
      b.append('.');
      String f = Long.toString(fraction);
      for (int i = f.length(); i < places; i++) {
        b.append('0');
      }
      b.append(f);
    }
    return b.toString();
  }

  private static NumberAxis axis(String text, Font tick, Font label) {
    NumberAxis a = new NumberAxis(text);
    a.setAutoRangeIncludesZero(false);
    a.setTickLabelFont(tick);
    a.setLabelFont(label);
    return a;
  }

  private static XYLineAndShapeRenderer pointRenderer(Color ok, Color bad) {
    XYLineAndShapeRenderer r = new XYLineAndShapeRenderer(false, true);
    r.setSeriesShape(0, new Ellipse2D.Double(-4, -4, 8, 8));
    r.setSeriesPaint(0, ok);
    r.setSeriesShape(1, cross(5));
    r.setSeriesPaint(1, bad);
    r.setUseOutlinePaint(false);
    return r;
  }

  private static Shape cross(double s) {
    Path2D.Double p = new Path2D.Double();
    double w = s / 3;
    p.moveTo(-s, -s + w);
    p.lineTo(-s + w, -s);
    p.lineTo(0, -w);
    p.lineTo(s - w, -s);
    p.lineTo(s, -s + w);
    p.lineTo(w, 0);
    p.lineTo(s, s - w);
    p.lineTo(s - w, s);
    p.lineTo(0, w);
    p.lineTo(-s + w, s);
    p.lineTo(-s, s - w);
    p.lineTo(-w, 0);
    p.closePath();
    return p;
  }

  private static void style(XYPlot p) {
    p.setBackgroundPaint(Color.WHITE);
    p.setDomainGridlinePaint(new Color(0xdddddd));
    p.setRangeGridlinePaint(new Color(0xdddddd));
    p.setOutlinePaint(new Color(0x999999));
    p.setInsets(new org.jfree.chart.ui.RectangleInsets(4, 4, 4, 8));
  }
}
