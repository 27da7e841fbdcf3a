package org.quantrun.runner.calibrate;

import com.fasterxml.jackson.core.JsonProcessingException;
import com.fasterxml.jackson.databind.ObjectMapper;
import com.fasterxml.jackson.databind.node.ArrayNode;
import com.fasterxml.jackson.databind.node.ObjectNode;
import java.io.PrintWriter;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Optional;
import java.util.OptionalDouble;
import java.util.concurrent.Callable;
import org.quantrun.core.calibration.BackCalculation;
import org.quantrun.core.calibration.CalibrationException;
import org.quantrun.core.calibration.CalibrationFit;
import org.quantrun.core.calibration.CalibrationPoint;
import org.quantrun.core.calibration.CurveModel;
import org.quantrun.core.calibration.DetectionLimits;
import org.quantrun.core.calibration.FitOptions;
import org.quantrun.core.calibration.InversePrediction;
import org.quantrun.core.calibration.LimitEstimate;
import org.quantrun.core.calibration.Weighting;
import org.quantrun.runner.InputException;
import org.quantrun.runner.Main;
import picocli.CommandLine.Command;
import picocli.CommandLine.ITypeConverter;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Option;
import picocli.CommandLine.Parameters;
import picocli.CommandLine.Spec;
import picocli.CommandLine.TypeConversionException;

/** {@code quantrun calibrate POINTS.csv}: fits one calibration and reads unknowns off it. */
@Command(
    name = "calibrate",
    mixinStandardHelpOptions = true,
    description = {
      "Fits a calibration curve to the points of a CSV file (header x,y and optionally sd) and reads "
          + "concentrations off it for the signals given with --predict."
    })
public final class CalibrateCommand implements Callable<Integer> {

  @Spec CommandSpec spec;

  @Parameters(index = "0", paramLabel = "POINTS.csv", description = "CSV file with columns x, y and optionally sd")
  Path pointsFile;

  @Option(names = "--curve", paramLabel = "CURVE", defaultValue = "linear",
      converter = CurveConverter.class,
      description = "linear, through-zero or quadratic (default: ${DEFAULT-VALUE})")
  CurveModel curve;

  @Option(names = "--weighting", paramLabel = "W", defaultValue = "none",
      converter = WeightingConverter.class,
      description = "none, 1/x, 1/x2, 1/y, 1/y2 or 1/s2 (default: ${DEFAULT-VALUE})")
  Weighting weighting;

  @Option(names = "--predict", paramLabel = "Y", description = "a mean signal to read a concentration for (repeatable)")
  List<Double> predict = new ArrayList<>();

  @Option(names = "--replicates", paramLabel = "M", defaultValue = "1",
      description = "independent measurements averaged into each --predict signal (default: ${DEFAULT-VALUE})")
  int replicates;

  @Option(names = "--confidence", paramLabel = "C", defaultValue = "0.95",
      description = "two-sided confidence level of the intervals (default: ${DEFAULT-VALUE})")
  double confidence;

  @Option(names = "--json", description = "print one JSON object instead of the table")
  boolean json;

  @Override
  public Integer call() {
    PrintWriter err = spec.commandLine().getErr();
    try {
      if (replicates < 1) {
        throw new InputException("--replicates must be 1 or more, was " + replicates);
      }
      if (!(confidence > 0 && confidence < 1)) {
        throw new InputException("--confidence must lie strictly between 0 and 1 (e.g. 0.95), was " + confidence);
      }
      for (double y : predict) {
        if (!Double.isFinite(y)) {
          throw new InputException("--predict must be a finite number, was " + y);
        }
      }
      List<CalibrationPoint> points = PointsFile.read(pointsFile);
      CalibrationFit fit;
      try {
        fit = CalibrationFit.fit(points, new FitOptions(curve, weighting));
      } catch (CalibrationException e) {
        throw new InputException(displayName() + ": " + e.getMessage());
      }
      List<InversePrediction> predictions = new ArrayList<>();
      for (double y : predict) {
        predictions.add(fit.predict(y, replicates, confidence));
      }
      Optional<LimitEstimate> limits = DetectionLimits.fromCalibration(fit);
      PrintWriter out = spec.commandLine().getOut();
      out.print(json ? json(fit, limits, predictions) + System.lineSeparator() : table(fit, limits, predictions));
      out.flush();
      return 0;
    } catch (InputException e) {
      err.println("quantrun calibrate: " + e.getMessage());
      err.flush();
      return Main.EXIT_INPUT_ERROR;
    }
  }

  private String displayName() {
    return pointsFile.getFileName() == null ? pointsFile.toString() : pointsFile.getFileName().toString();
  }

  // ---------------------------------------------------------------- JSON

  static String json(CalibrationFit fit, Optional<LimitEstimate> limits, List<InversePrediction> predictions) {
    ObjectMapper mapper = new ObjectMapper();
    ObjectNode root = mapper.createObjectNode();
    root.put("curve", fit.curve().token());
    root.put("weighting", fit.weighting().token());
    root.put("n", fit.n());
    root.put("dof", fit.dof());
    ObjectNode coefficients = root.putObject("coefficients");
    ObjectNode errors = root.putObject("standard_errors");
    for (int power : fit.curve().powers()) {
      coefficients.put("c" + power, fit.coefficient(power));
      putOptional(errors, "c" + power, fit.standardError(power));
    }
    putOptional(root, "s_yx", fit.sYx());
    root.put("r2", fit.r2());
    putOptional(root, "lod", limits.map(l -> OptionalDouble.of(l.lod())).orElse(OptionalDouble.empty()));
    putOptional(root, "loq", limits.map(l -> OptionalDouble.of(l.loq())).orElse(OptionalDouble.empty()));
    ArrayNode list = root.putArray("predictions");
    for (InversePrediction p : predictions) {
      ObjectNode o = list.addObject();
      o.put("y0", p.y0());
      o.put("m", p.m());
      putOptional(o, "x0", p.x0());
      putOptional(o, "s_x0", p.sX0());
      putOptional(o, "t", p.t());
      putOptional(o, "ci_half_width", p.halfWidth());
      o.put("in_range", p.inRange());
    }
    try {
      return mapper.writeValueAsString(root);
    } catch (JsonProcessingException e) {
      throw new IllegalStateException("cannot write JSON", e);
    }
  }

  private static void putOptional(ObjectNode node, String key, OptionalDouble value) {
    if (value.isPresent()) {
      node.put(key, value.getAsDouble());
    } else {
      node.putNull(key);
    }
  }

  // ---------------------------------------------------------------- table

  static String table(CalibrationFit fit, Optional<LimitEstimate> limits, List<InversePrediction> predictions) {
    StringBuilder b = new StringBuilder();
    String nl = System.lineSeparator();
    b.append(String.format(Locale.ROOT, "Calibration: %s, weighting %s, n = %d, dof = %d%n",
        fit.curve().token(), fit.weighting().token(), fit.n(), fit.dof()));
    b.append(nl).append(String.format(Locale.ROOT, "  %-12s %16s %16s%n", "coefficient", "value", "std. error"));
    for (int power : fit.curve().powers()) {
      b.append(String.format(Locale.ROOT, "  %-12s %16s %16s%n",
          "c" + power + (power == 0 ? " (x^0)" : power == 1 ? " (x^1)" : " (x^2)"),
          g(fit.coefficient(power)), g(fit.standardError(power))));
    }
    b.append(nl);
    b.append(String.format(Locale.ROOT, "  s_y/x   %s%n", g(fit.sYx())));
    b.append(String.format(Locale.ROOT, "  r^2     %s%s%n", g(fit.r2()),
        fit.curve() == CurveModel.THROUGH_ZERO ? "  (uncentred)" : ""));
    b.append(String.format(Locale.ROOT, "  LOD     %s%n",
        limits.map(l -> g(l.lod())).orElse("not estimable")));
    b.append(String.format(Locale.ROOT, "  LOQ     %s%n",
        limits.map(l -> g(l.loq())).orElse("not estimable")));
    if (fit.curve() == CurveModel.QUADRATIC) {
      b.append(String.format(Locale.ROOT, "  shape   %s%n", fit.isMonotonic()
          ? "monotonic over the calibrated range"
          : "NOT monotonic: turns at x = " + g(fit.vertex().getAsDouble()) + " inside the range"));
    }
    b.append(nl).append(String.format(Locale.ROOT, "  %12s %12s %8s %12s %12s %10s%n",
        "x", "y", "weight", "residual", "x back", "error %"));
    for (BackCalculation p : fit.backCalculations()) {
      b.append(String.format(Locale.ROOT, "  %12s %12s %8.4f %12s %12s %10s%n",
          g(p.x()), g(p.y()), p.weight(), g(p.residual()), g(p.backCalculated()),
          p.percentError().isPresent() ? String.format(Locale.ROOT, "%.2f", p.percentError().getAsDouble()) : "-"));
    }
    if (!predictions.isEmpty()) {
      b.append(nl).append(String.format(Locale.ROOT, "  %12s %3s %14s %12s %8s %14s  %s%n",
          "y0", "m", "x0", "s_x0", "t", "+/- (" + pct(predictions.get(0).confidence()) + ")", "range"));
      for (InversePrediction p : predictions) {
        b.append(String.format(Locale.ROOT, "  %12s %3d %14s %12s %8s %14s  %s%n",
            g(p.y0()), p.m(), p.x0().isPresent() ? g(p.x0()) : "no root", g(p.sX0()),
            p.t().isPresent() ? String.format(Locale.ROOT, "%.4f", p.t().getAsDouble()) : "-",
            g(p.halfWidth()), describe(p)));
      }
    }
    b.append(nl).append("Results need review by a qualified analyst; the lab's accredited method and local")
        .append(nl).append("regulations govern.").append(nl);
    return b.toString();
  }

  private static String describe(InversePrediction p) {
    switch (p.position()) {
      case IN_RANGE:
        return p.x0().isPresent() ? "in range" : "no root in range";
      case BELOW_RANGE:
        return "below the lowest standard";
      default:
        return "above the highest standard";
    }
  }

  private static String pct(double confidence) {
    return String.format(Locale.ROOT, "%s %%", new java.math.BigDecimal(Double.toString(confidence * 100))
        .stripTrailingZeros().toPlainString());
  }

  private static String g(double v) {
    return String.format(Locale.ROOT, "%.6g", v);
  }

  private static String g(OptionalDouble v) {
    return v.isPresent() ? g(v.getAsDouble()) : "-";
  }

  /** Converts a curve label for picocli, with the list of known labels on error. */
  static final class CurveConverter implements ITypeConverter<CurveModel> {
    @Override
    public CurveModel convert(String value) {
      try {
        return CurveModel.fromLabel(value);
      } catch (IllegalArgumentException e) {
        throw new TypeConversionException(e.getMessage());
      }
    }
  }

  /** Converts a weighting label for picocli, with the list of known labels on error. */
  static final class WeightingConverter implements ITypeConverter<Weighting> {
    @Override
    public Weighting convert(String value) {
      try {
        return Weighting.fromLabel(value);
      } catch (IllegalArgumentException e) {
        throw new TypeConversionException(e.getMessage());
      }
    }
  }
}
