package org.quantrun.core.calibration;

import java.io.BufferedReader;
import java.io.IOException;
import java.io.InputStream;
import java.io.InputStreamReader;
import java.io.UncheckedIOException;
import java.nio.charset.StandardCharsets;
import java.util.ArrayList;
import java.util.HashMap;
import java.util.List;
import java.util.Map;

/** Reads the NIST StRD files copied into the test resources, and measures agreement. */
final class Reference {
  private Reference() {}

  /** The (x, y) pairs of a NIST dataset, e.g. "norris". */
  static List<CalibrationPoint> points(String dataset) {
    List<CalibrationPoint> pts = new ArrayList<>();
    for (String[] row : rows("nist-" + dataset + ".csv")) {
      pts.add(CalibrationPoint.of(Double.parseDouble(row[0]), Double.parseDouble(row[1])));
    }
    return pts;
  }

  /** The certified values of a dataset, keyed by statistic name (c0, se_c1, residual_sd, ...). */
  static Map<String, Double> certified(String dataset) {
    Map<String, Double> values = new HashMap<>();
    for (String[] row : rows("nist-certified-values.csv")) {
      if (row[0].equals(dataset)) {
        values.put(row[2], Double.parseDouble(row[3]));
      }
    }
    if (values.isEmpty()) {
      throw new IllegalArgumentException("no certified values for " + dataset);
    }
    return values;
  }

  /**
   * Log relative error, -log10(|estimate - certified| / |certified|): the number of agreeing
   * significant digits, as NIST uses it to judge StRD results (capped at 16 for exact agreement).
   */
  static double lre(double estimate, double certified) {
    double rel = Math.abs(estimate - certified) / Math.abs(certified);
    return rel == 0 ? 16 : Math.min(16, -Math.log10(rel));
  }

  private static List<String[]> rows(String resource) {
    try (InputStream in = Reference.class.getResourceAsStream("/reference/" + resource)) {
      if (in == null) {
        throw new IllegalStateException("missing test resource reference/" + resource);
      }
      BufferedReader r = new BufferedReader(new InputStreamReader(in, StandardCharsets.UTF_8));
      List<String[]> rows = new ArrayList<>();
      r.readLine();
      for (String line = r.readLine(); line != null; line = r.readLine()) {
        if (!line.isBlank()) {
          rows.add(line.trim().split(","));
        }
      }
      return rows;
    } catch (IOException e) {
      throw new UncheckedIOException(e);
    }
  }
}
