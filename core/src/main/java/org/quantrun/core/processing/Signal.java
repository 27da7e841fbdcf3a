package org.quantrun.core.processing;

import java.util.ArrayList;
import java.util.List;
import org.quantrun.core.importer.LineReadings;
import org.quantrun.core.importer.Reading;

/**
 * The readings of one analyte line in one injection: the valid values, their mean, SD and %RSD,
 * and why the others were left out. When the export gives no replicate readings but a valid
 * reported mean, that mean (and reported SD) stands for them.
 *
 * @param values the valid readings, in export order
 * @param mean their mean; NaN when there is none
 * @param sd their sample SD (n - 1); NaN with fewer than two readings
 * @param excluded why each left-out reading was left out, with its source line
 */
record Signal(double[] values, double mean, double sd, List<String> excluded) {

  static Signal of(LineReadings lr) {
    List<Reading> reps = lr.replicates();
    List<String> excluded = List.of(); // most signals leave nothing out
    double[] v = new double[reps.size()];
    int n = 0;
    for (Reading r : reps) {
      if (r.isValid()) {
        v[n++] = r.value();
      } else {
        if (excluded.isEmpty()) {
          excluded = new ArrayList<>(2);
        }
        excluded.add("reading at line " + r.line() + ": " + r.invalidReason().get());
      }
    }
    if (n == 0 && lr.reportedMean().isPresent() && lr.reportedMean().get().isValid()) {
      double sd = lr.reportedSd().filter(Reading::isValid).map(Reading::value).orElse(Double.NaN);
      return new Signal(new double[] {lr.reportedMean().get().value()}, lr.reportedMean().get().value(), sd, excluded);
    }
    double[] values = n == v.length ? v : java.util.Arrays.copyOf(v, n);
    return new Signal(values, mean(values), sd(values), excluded);
  }

  /** A signal with every value multiplied by {@code factor} and then {@code offset} subtracted. */
  Signal corrected(double factor, double offset) {
    if (factor == 1 && offset == 0) {
      return this;
    }
    double[] c = new double[values.length];
    for (int i = 0; i < c.length; i++) {
      c[i] = values[i] * factor - offset;
    }
    return new Signal(c, mean * factor - offset, sd * Math.abs(factor), excluded);
  }

  /** Instrument markers that mean the signal was above the detector's range. */
  private static final java.util.regex.Pattern OVER_MARKER =
      java.util.regex.Pattern.compile("(?i).*reported \"(over|over ?range|overrange|sat|saturated|>.*)\".*");

  /** Whether some left-out reading was marked by the instrument as over its range. */
  boolean markedOverRange() {
    return excluded.stream().anyMatch(e -> OVER_MARKER.matcher(e).matches());
  }

  boolean hasValue() {
    return values.length > 0;
  }

  int count() {
    return values.length;
  }

  /** The %RSD; NaN with fewer than two readings or a zero mean. */
  double rsdPercent() {
    return mean != 0 ? sd / Math.abs(mean) * 100 : Double.NaN;
  }

  static double mean(double[] v) {
    if (v.length == 0) {
      return Double.NaN;
    }
    double s = 0;
    for (double d : v) {
      s += d;
    }
    return s / v.length;
  }

  static double sd(double[] v) {
    if (v.length < 2) {
      return Double.NaN;
    }
    double m = mean(v);
    double s = 0;
    for (double d : v) {
      s += (d - m) * (d - m);
    }
    return Math.sqrt(s / (v.length - 1));
  }
}
