package org.quantrun.runner.write;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.math.BigDecimal;
import java.util.regex.Matcher;
import java.util.regex.Pattern;
import net.jqwik.api.ForAll;
import net.jqwik.api.Property;
import net.jqwik.api.constraints.DoubleRange;
import net.jqwik.api.constraints.IntRange;
import org.junit.jupiter.api.Test;
import org.quantrun.core.model.CalibrationResult;

/** The SVG of a calibration chart: text stays text, coordinates are short and exact to 0.01. */
class CalibrationChartTest {

  @Test
  void axisLabelsAreTextNotGlyphOutlines() {
    CalibrationResult c = InventedRun.run().calibrations().get(0);
    String svg = CalibrationChart.svg(c, "p").orElseThrow();
    // the rotated range-axis labels, like every other label, are <text> elements
    assertTrue(svg.matches("(?s).*<text [^>]*>signal</text>.*"), "the y-axis label as text");
    assertTrue(svg.matches("(?s).*<text [^>]*>residual</text>.*"), "the residual axis label as text");
    assertTrue(svg.contains(">concentration (" + c.unit() + ")</text>"), "the x-axis label as text");
    // glyph outlines would be paths of hundreds of quadratic segments
    Matcher paths = Pattern.compile("<path d='([^']*)'").matcher(svg);
    while (paths.find()) {
      assertTrue(paths.group(1).chars().filter(ch -> ch == 'Q').count() == 0, "no glyph outline: " + paths.group(1));
    }
  }

  @Test
  void coordinatesHaveAtMostTwoDecimals() {
    String svg = CalibrationChart.svg(InventedRun.run().calibrations().get(0), "p").orElseThrow();
    Matcher numbers = Pattern.compile("(?<=[ ,'(MLCQ])-?\\d+\\.(\\d+)(?=[ ,')MLCQZ])").matcher(svg.replaceAll("<text[^>]*>[^<]*</text>", ""));
    int n = 0;
    while (numbers.find()) {
      assertTrue(numbers.group(1).length() <= 2, "more than two decimals: " + numbers.group());
      n++;
    }
    assertTrue(n > 50, "the chart has coordinates with decimals (" + n + ")");
  }

  @Test
  void decimalExamples() {
    assertEquals("82", CalibrationChart.decimal(82.0, 2));
    assertEquals("376.2", CalibrationChart.decimal(376.1953125, 2));
    assertEquals("432.21", CalibrationChart.decimal(432.21044921875, 2));
    assertEquals("-120.5", CalibrationChart.decimal(-120.5, 2));
    assertEquals("0.05", CalibrationChart.decimal(0.05, 2));
    assertEquals("-0.07", CalibrationChart.decimal(-0.07, 2));
    assertEquals("0", CalibrationChart.decimal(-0.001, 2));
    assertEquals("0", CalibrationChart.decimal(6.123233995736766e-17, 4));
    assertEquals("-1", CalibrationChart.decimal(-1.0, 4));
  }

  /** Within half a unit of the last place of the exact value, no trailing zero, no exponent. */
  @Property(tries = 5000)
  void decimalIsCloseAndShort(@ForAll @DoubleRange(min = -1e6, max = 1e6) double v, @ForAll @IntRange(min = 0, max = 4) int decimals) {
    String text = CalibrationChart.decimal(v, decimals);
    assertTrue(text.matches("-?\\d+(\\.\\d*[1-9])?"), text);
    assertTrue(!text.contains(".") || text.length() - text.indexOf('.') - 1 <= decimals, text);
    BigDecimal error = new BigDecimal(text).subtract(new BigDecimal(v)).abs();
    assertTrue(error.compareTo(new BigDecimal("0.5").movePointLeft(decimals).add(new BigDecimal("1e-9"))) <= 0,
        v + " -> " + text);
  }
}
