package org.quantrun.core.calibration;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.Collections;
import java.util.List;
import java.util.Optional;
import java.util.OptionalDouble;
import org.apache.commons.math3.linear.Array2DRowRealMatrix;
import org.apache.commons.math3.linear.ArrayRealVector;
import org.apache.commons.math3.linear.DecompositionSolver;
import org.apache.commons.math3.linear.QRDecomposition;
import org.apache.commons.math3.linear.RealMatrix;

/**
 * A fitted calibration curve with every statistic of the fit; immutable.
 *
 * <p>Made by {@link #fit(List, FitOptions)}. The fit centres and scales x (u = (x - x_c) / x_s;
 * through-zero curves are scaled only) and solves the weighted least-squares problem by QR
 * decomposition, which keeps ten or more significant digits on ill-conditioned data where the
 * normal equations would not. Coefficients, their covariance and all derived values are then
 * carried back to x.
 *
 * <p>Weights are normalised to sum to n. With n = p (no degrees of freedom) the coefficients
 * exist but s_y/x, the standard errors, the covariance, prediction errors and calibration limits
 * are not estimable: they are empty, never NaN.
 */
public final class CalibrationFit {
  private static final int MAX_TERMS = 3;
  /** Relative tolerance used to decide whether a predicted x lies on the end of the range. */
  private static final double RANGE_TOLERANCE = 1e-9;

  private final FitOptions options;
  private final List<CalibrationPoint> points;
  private final int n;
  private final int p;
  private final int dof;
  private final int[] powers;
  // the scaled problem: u = (x - xc) / xs, y = sum beta_j u^powers[j]
  private final double xc;
  private final double xs;
  private final double[] beta;
  private final double[][] unscaledCovU;
  private final double weightScale;
  private final double[] weights;
  private final double sYx;
  private final double r2;
  private final double[] coefficients;
  private final double[][] unscaledCovX;
  private final double xMin;
  private final double xMax;
  private final double uMin;
  private final double uMax;
  private final OptionalDouble vertex;
  private final boolean monotonic;
  private final List<BackCalculation> backCalculations;
  // for 1/s2 weighting at a predicted x: distinct x ascending and the pooled SD at each
  private final double[] sdX;
  private final double[] sdAtX;
  private final double minPositiveX;
  private final double minPositiveY;

  private CalibrationFit(List<CalibrationPoint> pts, FitOptions options) {
    this.options = options;
    this.points = List.copyOf(pts);
    this.n = pts.size();
    CurveModel curve = options.curve();
    Weighting weighting = options.weighting();
    this.p = curve.parameterCount();
    this.powers = curve.powers();
    double[] x = xValues(pts);
    double[] y = yValues(pts);
    this.xMin = min(x);
    this.xMax = max(x);
    this.minPositiveX = minPositive(x);
    this.minPositiveY = minPositive(y);

    // weights, normalised to sum to n
    double[] raw = rawWeights(weighting, pts);
    this.weightScale = n / sum(raw);
    this.weights = scaled(raw, weightScale);

    // centre and scale x
    this.xc = curve.hasIntercept() ? sum(x) / n : 0;
    this.xs = largestDistance(x, xc);
    this.uMin = (xMin - xc) / xs;
    this.uMax = (xMax - xc) / xs;

    // weighted least squares by QR on the scaled design matrix
    QRDecomposition qr = new QRDecomposition(
        new Array2DRowRealMatrix(designMatrix(x, weights, xc, xs, powers), false), 1e-13);
    DecompositionSolver solver = qr.getSolver();
    if (!solver.isNonSingular()) {
      throw new CalibrationException(
          "the calibration points do not determine a " + curve.token()
              + " curve (the concentrations are too few or too close together)");
    }
    this.beta = solver.solve(new ArrayRealVector(weightedSignals(y, weights), false)).toArray();
    this.unscaledCovU = productWithTranspose(upperTriangularInverse(qr.getR(), p), p);

    // residuals and goodness of fit
    double[] fitted = fittedValues(x);
    double rss = weightedSquaredResiduals(y, fitted, weights);
    double sst = curve.hasIntercept()
        ? weightedSquaredDeviations(y, weightedSum(weights, y) / n, weights)
        : weightedSquares(y, weights);
    if (!(sst > 0)) {
      throw new CalibrationException(
          "every calibration signal is " + y[0]
              + ": the signal does not respond to concentration, so nothing can be calibrated");
    }
    this.dof = n - p;
    this.sYx = dof > 0 ? Math.sqrt(rss / dof) : Double.NaN;
    this.r2 = 1 - rss / sst;

    // coefficients and covariance in x: c = T beta
    double[][] t = transform(xc, xs);
    this.coefficients = coefficientsInX(t, byPower(beta, powers), curve);
    this.unscaledCovX = covarianceInX(t, byPower(unscaledCovU, powers));

    // shape: a quadratic must not turn inside the calibrated range
    if (curve == CurveModel.QUADRATIC && beta[2] != 0) {
      double uv = -beta[1] / (2 * beta[2]);
      this.vertex = OptionalDouble.of(xc + xs * uv);
      this.monotonic = !(uv > uMin && uv < uMax);
    } else {
      this.vertex = OptionalDouble.empty();
      this.monotonic = true;
    }

    // 1/s2: pooled SD per distinct concentration, for the weight at a predicted x
    if (weighting == Weighting.INVERSE_VARIANCE) {
      double[][] pooled = pooledSdByX(pts);
      this.sdX = pooled[0];
      this.sdAtX = pooled[1];
    } else {
      this.sdX = new double[0];
      this.sdAtX = new double[0];
    }

    this.backCalculations = Collections.unmodifiableList(readBack(x, y, fitted));
  }

  // ---------------------------------------------------------------- steps of the fit
  // Each loop of the fit is a method of its own: small methods are compiled quickly and alone.

  private static double[] xValues(List<CalibrationPoint> pts) {
    double[] x = new double[pts.size()];
    for (int i = 0; i < x.length; i++) {
      x[i] = pts.get(i).x();
    }
    return x;
  }

  private static double[] yValues(List<CalibrationPoint> pts) {
    double[] y = new double[pts.size()];
    for (int i = 0; i < y.length; i++) {
      y[i] = pts.get(i).y();
    }
    return y;
  }

  private static double[] rawWeights(Weighting weighting, List<CalibrationPoint> pts) {
    double[] raw = new double[pts.size()];
    for (int i = 0; i < raw.length; i++) {
      raw[i] = weighting.rawWeight(weightArgument(weighting, pts.get(i)));
    }
    return raw;
  }

  /** The sum in index order. */
  private static double sum(double[] v) {
    double s = 0;
    for (double d : v) {
      s += d;
    }
    return s;
  }

  private static double[] scaled(double[] v, double factor) {
    double[] s = new double[v.length];
    for (int i = 0; i < v.length; i++) {
      s[i] = v[i] * factor;
    }
    return s;
  }

  /** The largest |v - centre|. */
  private static double largestDistance(double[] v, double centre) {
    double spread = 0;
    for (double d : v) {
      spread = Math.max(spread, Math.abs(d - centre));
    }
    return spread;
  }

  /** The rows sqrt(w_i) u_i^powers[j] of the weighted least-squares problem in u = (x - xc) / xs. */
  private static double[][] designMatrix(double[] x, double[] weights, double xc, double xs, int[] powers) {
    double[][] a = new double[x.length][powers.length];
    for (int i = 0; i < x.length; i++) {
      double sw = Math.sqrt(weights[i]);
      double u = (x[i] - xc) / xs;
      for (int j = 0; j < powers.length; j++) {
        a[i][j] = sw * pow(u, powers[j]);
      }
    }
    return a;
  }

  private static double[] weightedSignals(double[] y, double[] weights) {
    double[] b = new double[y.length];
    for (int i = 0; i < y.length; i++) {
      b[i] = Math.sqrt(weights[i]) * y[i];
    }
    return b;
  }

  /** R^-1 R^-T for the upper triangular R^-1: the unscaled covariance (X'WX)^-1 in u. */
  private static double[][] productWithTranspose(double[][] rInv, int p) {
    double[][] c = new double[p][p];
    for (int i = 0; i < p; i++) {
      for (int j = 0; j < p; j++) {
        double s = 0;
        for (int k = Math.max(i, j); k < p; k++) {
          s += rInv[i][k] * rInv[j][k];
        }
        c[i][j] = s;
      }
    }
    return c;
  }

  private double[] fittedValues(double[] x) {
    double[] fitted = new double[x.length];
    for (int i = 0; i < x.length; i++) {
      fitted[i] = evalU((x[i] - xc) / xs);
    }
    return fitted;
  }

  private static double weightedSum(double[] weights, double[] y) {
    double s = 0;
    for (int i = 0; i < y.length; i++) {
      s += weights[i] * y[i];
    }
    return s;
  }

  /** sum w (y - fitted)^2. */
  private static double weightedSquaredResiduals(double[] y, double[] fitted, double[] weights) {
    double rss = 0;
    for (int i = 0; i < y.length; i++) {
      double r = y[i] - fitted[i];
      rss += weights[i] * r * r;
    }
    return rss;
  }

  /** sum w (y - centre)^2. */
  private static double weightedSquaredDeviations(double[] y, double centre, double[] weights) {
    double sst = 0;
    for (int i = 0; i < y.length; i++) {
      double d = y[i] - centre;
      sst += weights[i] * d * d;
    }
    return sst;
  }

  /** sum w y^2. */
  private static double weightedSquares(double[] y, double[] weights) {
    double sst = 0;
    for (int i = 0; i < y.length; i++) {
      double d = y[i];
      sst += weights[i] * d * d;
    }
    return sst;
  }

  /** The model's coefficients placed at their powers 0..2 (zero where the model has no term). */
  private static double[] byPower(double[] modelOrder, int[] powers) {
    double[] v = new double[MAX_TERMS];
    for (int i = 0; i < powers.length; i++) {
      v[powers[i]] = modelOrder[i];
    }
    return v;
  }

  /** A matrix in the model's order placed at the powers 0..2 (zero where the model has no term). */
  private static double[][] byPower(double[][] modelOrder, int[] powers) {
    double[][] m = new double[MAX_TERMS][MAX_TERMS];
    for (int i = 0; i < powers.length; i++) {
      for (int j = 0; j < powers.length; j++) {
        m[powers[i]][powers[j]] = modelOrder[i][j];
      }
    }
    return m;
  }

  /** c = T beta, with 0 for the powers the curve does not have. */
  private static double[] coefficientsInX(double[][] t, double[] beta3, CurveModel curve) {
    double[] c = new double[MAX_TERMS];
    for (int i = 0; i < MAX_TERMS; i++) {
      double s = 0;
      for (int k = 0; k < MAX_TERMS; k++) {
        s += t[i][k] * beta3[k];
      }
      c[i] = curve.hasTerm(i) ? s : 0.0;
    }
    return c;
  }

  /** T Cov T'. */
  private static double[][] covarianceInX(double[][] t, double[][] cov3) {
    double[][] c = new double[MAX_TERMS][MAX_TERMS];
    for (int i = 0; i < MAX_TERMS; i++) {
      for (int j = 0; j < MAX_TERMS; j++) {
        double s = 0;
        for (int k = 0; k < MAX_TERMS; k++) {
          for (int l = 0; l < MAX_TERMS; l++) {
            s += t[i][k] * cov3[k][l] * t[j][l];
          }
        }
        c[i][j] = s;
      }
    }
    return c;
  }

  /** Every point read back through the curve. */
  private List<BackCalculation> readBack(double[] x, double[] y, double[] fitted) {
    List<BackCalculation> back = new ArrayList<>(x.length);
    for (int i = 0; i < x.length; i++) {
      back.add(readBack(x[i], y[i], weights[i], fitted[i]));
    }
    return back;
  }

  private BackCalculation readBack(double x, double y, double weight, double fitted) {
    OptionalDouble xb = solveU(y, (x - xc) / xs, false).stream()
        .map(u -> xc + xs * u).findFirst();
    OptionalDouble pct = x != 0 && xb.isPresent()
        ? OptionalDouble.of((xb.getAsDouble() - x) / x * 100)
        : OptionalDouble.empty();
    return new BackCalculation(x, y, weight, fitted, y - fitted, xb, pct);
  }

  /**
   * Fits a calibration curve.
   *
   * @param points the calibration points, in any order (numbered from 1 in messages)
   * @param options the curve and weighting
   * @throws CalibrationException when the points cannot be fitted as asked: fewer points than the
   *     curve has parameters, no spread in x, a value that is not finite, a negative SD, or a
   *     weighting the data cannot carry (the message names the point and suggests a remedy)
   */
  public static CalibrationFit fit(List<CalibrationPoint> points, FitOptions options) {
    validate(points, options);
    return new CalibrationFit(points, options);
  }

  private static void validate(List<CalibrationPoint> pts, FitOptions options) {
    CurveModel curve = options.curve();
    Weighting w = options.weighting();
    if (pts.isEmpty()) {
      throw new CalibrationException("there are no calibration points to fit");
    }
    for (int i = 0; i < pts.size(); i++) {
      CalibrationPoint pt = pts.get(i);
      String where = "calibration point " + (i + 1);
      if (!Double.isFinite(pt.x())) {
        throw new CalibrationException(where + ": concentration x is " + pt.x() + " (expected a finite number)");
      }
      if (!Double.isFinite(pt.y())) {
        throw new CalibrationException(where + ": signal y is " + pt.y() + " (expected a finite number)");
      }
      if (pt.sd().isPresent()) {
        double sd = pt.sd().getAsDouble();
        if (!Double.isFinite(sd)) {
          throw new CalibrationException(where + ": standard deviation is " + sd + " (expected a finite number)");
        }
        if (sd < 0) {
          throw new CalibrationException(where + ": standard deviation " + sd + " is negative (expected 0 or more)");
        }
      }
    }
    int p = curve.parameterCount();
    if (pts.size() < p) {
      throw new CalibrationException(
          "a " + curve.token() + " curve needs at least " + p + " calibration point" + (p > 1 ? "s" : "")
              + ", got " + pts.size());
    }
    long distinct = pts.stream().mapToDouble(CalibrationPoint::x).distinct().count();
    if (curve == CurveModel.THROUGH_ZERO) {
      if (pts.stream().allMatch(pt -> pt.x() == 0)) {
        throw new CalibrationException(
            "every calibration point has concentration x = 0: a through-zero curve needs a standard above zero");
      }
    } else if (distinct < p) {
      throw new CalibrationException(
          (distinct == 1
                  ? "every calibration point has the same concentration x = " + pts.get(0).x()
                  : "the calibration points have only " + distinct + " different concentrations")
              + ": a " + curve.token() + " curve needs at least " + p + " different concentrations");
    }
    for (int i = 0; i < pts.size(); i++) {
      CalibrationPoint pt = pts.get(i);
      String where = "calibration point " + (i + 1);
      if (w.usesX() && !(pt.x() > 0)) {
        throw new CalibrationException(
            where + " (x = " + pt.x() + "): weighting " + w.token() + " needs x > 0; "
                + "subtract the blank instead of fitting it as a point, or choose weighting 1/s2 or none");
      }
      if (w.usesY() && !(pt.y() > 0)) {
        throw new CalibrationException(
            where + " (y = " + pt.y() + "): weighting " + w.token() + " needs a positive signal; "
                + "remove the point, or choose weighting 1/x2, 1/s2 or none");
      }
      if (w.needsSd()) {
        if (pt.sd().isEmpty()) {
          throw new CalibrationException(
              where + " has no standard deviation: weighting 1/s2 needs one for every point "
                  + "(give an sd for each point, or choose another weighting)");
        }
        if (pt.sd().getAsDouble() == 0) {
          throw new CalibrationException(
              where + " has standard deviation 0, which would give it infinite weight under 1/s2 "
                  + "(check the replicate readings, or choose another weighting)");
        }
      }
    }
  }

  private static double weightArgument(Weighting w, CalibrationPoint pt) {
    if (w.usesX()) {
      return pt.x();
    }
    if (w.usesY()) {
      return pt.y();
    }
    if (w.needsSd()) {
      return pt.sd().getAsDouble();
    }
    return 1.0;
  }

  // ---------------------------------------------------------------- the fitted curve

  /** The options this curve was fitted with. */
  public FitOptions options() {
    return options;
  }

  /** The curve model. */
  public CurveModel curve() {
    return options.curve();
  }

  /** The weighting. */
  public Weighting weighting() {
    return options.weighting();
  }

  /** The fitted points, in the order given. */
  public List<CalibrationPoint> points() {
    return points;
  }

  /** The number of points n. */
  public int n() {
    return n;
  }

  /** Degrees of freedom n - p. */
  public int dof() {
    return dof;
  }

  /**
   * The coefficient of x^power (0, 1 or 2); 0 for a term the model lacks (check {@link
   * CurveModel#hasTerm(int)}).
   */
  public double coefficient(int power) {
    checkPower(power);
    return coefficients[power];
  }

  /** The coefficients of the model's own terms, in the order of {@link CurveModel#powers()}. */
  public double[] coefficients() {
    double[] c = new double[p];
    for (int i = 0; i < p; i++) {
      c[i] = coefficients[powers[i]];
    }
    return c;
  }

  /** The standard error of the coefficient of x^power; empty if the model lacks it or dof = 0. */
  public OptionalDouble standardError(int power) {
    checkPower(power);
    if (dof == 0 || !curve().hasTerm(power)) {
      return OptionalDouble.empty();
    }
    return OptionalDouble.of(sYx * Math.sqrt(unscaledCovX[power][power]));
  }

  /**
   * The covariance matrix of the model's own coefficients (order of {@link CurveModel#powers()}),
   * s_y/x^2 (X'WX)^-1; empty when dof = 0.
   */
  public Optional<double[][]> covariance() {
    if (dof == 0) {
      return Optional.empty();
    }
    double s2 = sYx * sYx;
    double[][] c = new double[p][p];
    for (int i = 0; i < p; i++) {
      for (int j = 0; j < p; j++) {
        c[i][j] = s2 * unscaledCovX[powers[i]][powers[j]];
      }
    }
    return Optional.of(c);
  }

  /** The (weighted) residual standard deviation s_y/x = sqrt(sum w r^2 / (n - p)); empty when dof = 0. */
  public OptionalDouble sYx() {
    return dof > 0 ? OptionalDouble.of(sYx) : OptionalDouble.empty();
  }

  /**
   * The coefficient of determination: 1 - sum w r^2 / sum w (y - ybar_w)^2; for a through-zero
   * curve the uncentred 1 - sum w r^2 / sum w y^2.
   */
  public double r2() {
    return r2;
  }

  /** The normalised weights (they sum to n), in the order of the points. */
  public double[] weights() {
    return weights.clone();
  }

  /** The residuals y - fitted, in the order of the points. */
  public double[] residuals() {
    return backCalculations.stream().mapToDouble(BackCalculation::residual).toArray();
  }

  /** Each point read back through the curve, in the order of the points. */
  public List<BackCalculation> backCalculations() {
    return backCalculations;
  }

  /** The lowest concentration among the fitted points. */
  public double xMin() {
    return xMin;
  }

  /** The highest concentration among the fitted points. */
  public double xMax() {
    return xMax;
  }

  /** For a quadratic, the x of the curve's turning point; empty for straight lines. */
  public OptionalDouble vertex() {
    return vertex;
  }

  /** False when a quadratic's turning point lies inside the calibrated range (such a fit must be rejected). */
  public boolean isMonotonic() {
    return monotonic;
  }

  /** The signal the curve gives at concentration x. */
  public double signalAt(double x) {
    return evalU((x - xc) / xs);
  }

  /** The slope dy/dx of the curve at concentration x (the sensitivity). */
  public double slopeAt(double x) {
    return derivU((x - xc) / xs) / xs;
  }

  /**
   * The normalised weight the fit would give a point at concentration x with signal y: the
   * weighting's rule evaluated there and scaled like the fit's own weights. For 1/s^2 the SD is
   * interpolated linearly in x between neighbouring standards and held constant beyond the ends;
   * for 1/x-type and 1/y-type weightings a value that is not positive is replaced by the lowest
   * positive one among the standards (a weight model is not extrapolated through zero).
   */
  public double weightAt(double x, double y) {
    Weighting w = weighting();
    double v;
    if (w.usesX()) {
      v = x > 0 ? x : minPositiveX;
    } else if (w.usesY()) {
      v = y > 0 ? y : minPositiveY;
    } else if (w.needsSd()) {
      v = interpolateSd(x);
    } else {
      return 1.0;
    }
    return w.rawWeight(v) * weightScale;
  }

  // ---------------------------------------------------------------- inverse prediction

  /** {@link #predict(double, int, double)} for one measurement at 95 % confidence. */
  public InversePrediction predict(double y0) {
    return predict(y0, 1, 0.95);
  }

  /**
   * The concentration for a mean signal y0 of m independent measurements.
   *
   * <p>x0 solves y0 = f(x0) (for a quadratic, the root inside the calibrated range). Its standard
   * error is by the delta method, Var(x0) = (s_y/x^2 / (w0 m) + g' Cov(c) g) / f'(x0)^2, with g the
   * model's terms at x0 and w0 the normalised weight at x0 ({@link #weightAt(double, double)}); for
   * straight lines this equals the textbook formulas. The half-width is t(1 - alpha/2, dof) s_x0.
   *
   * @param y0 the mean signal, a finite number
   * @param m the number of independent measurements averaged into y0, at least 1
   * @param confidence two-sided confidence level, strictly between 0 and 1
   */
  public InversePrediction predict(double y0, int m, double confidence) {
    if (!Double.isFinite(y0)) {
      throw new IllegalArgumentException("signal y0 is " + y0 + " (expected a finite number)");
    }
    if (m < 1) {
      throw new IllegalArgumentException("number of measurements m is " + m + " (expected 1 or more)");
    }
    StudentT.checkConfidence(confidence);
    OptionalDouble root = solveU(y0, 0, true);
    if (root.isEmpty()) {
      OptionalDouble nearest = curve() == CurveModel.QUADRATIC
          ? solveU(y0, (uMin + uMax) / 2, false).stream()
              .map(u -> xc + xs * u).findFirst()
          : OptionalDouble.empty();
      return new InversePrediction(y0, m, confidence, PredictionStatus.NO_ROOT_IN_RANGE,
          OptionalDouble.empty(), OptionalDouble.empty(), OptionalDouble.empty(),
          OptionalDouble.empty(), signalPosition(y0), nearest);
    }
    double u0 = root.getAsDouble();
    double x0 = xc + xs * u0;
    RangePosition position = position(x0);
    if (dof == 0) {
      return new InversePrediction(y0, m, confidence, PredictionStatus.QUANTIFIED,
          OptionalDouble.of(x0), OptionalDouble.empty(), OptionalDouble.empty(),
          OptionalDouble.empty(), position, OptionalDouble.empty());
    }
    double w0 = weightAt(x0, y0);
    double gCg = 0;
    for (int i = 0; i < p; i++) {
      double gi = pow(u0, powers[i]);
      for (int j = 0; j < p; j++) {
        gCg += gi * unscaledCovU[i][j] * pow(u0, powers[j]);
      }
    }
    double dydu = derivU(u0);
    double s2 = sYx * sYx;
    double varU = (s2 / (w0 * m) + s2 * gCg) / (dydu * dydu);
    double sx0 = xs * Math.sqrt(varU);
    double t = StudentT.twoSided(confidence, dof);
    return new InversePrediction(y0, m, confidence, PredictionStatus.QUANTIFIED,
        OptionalDouble.of(x0), OptionalDouble.of(sx0), OptionalDouble.of(t),
        OptionalDouble.of(t * sx0), position, OptionalDouble.empty());
  }

  private RangePosition position(double x0) {
    double tol = RANGE_TOLERANCE * Math.max(xMax - xMin, Math.abs(xMax));
    if (x0 < xMin - tol) {
      return RangePosition.BELOW_RANGE;
    }
    if (x0 > xMax + tol) {
      return RangePosition.ABOVE_RANGE;
    }
    return RangePosition.IN_RANGE;
  }

  private RangePosition signalPosition(double y0) {
    double yLow = evalU(uMin);
    double yHigh = evalU(uMax);
    boolean rising = yHigh >= yLow;
    if (rising ? y0 > yHigh : y0 < yHigh) {
      return RangePosition.ABOVE_RANGE;
    }
    if (rising ? y0 < yLow : y0 > yLow) {
      return RangePosition.BELOW_RANGE;
    }
    return RangePosition.IN_RANGE;
  }

  /**
   * Solves f(u) = y0 in the scaled variable. Straight lines have one root (none when the slope is
   * zero). For a quadratic: with {@code inRangeOnly}, the root inside [uMin, uMax] (if both are,
   * the one on the branch that rises or falls like the curve over the whole range); otherwise the
   * real root nearest to {@code near}.
   */
  private OptionalDouble solveU(double y0, double near, boolean inRangeOnly) {
    double a = curve().hasIntercept() ? beta[0] : 0;
    double b = curve().hasIntercept() ? beta[1] : beta[0];
    double c = curve() == CurveModel.QUADRATIC ? beta[2] : 0;
    double[] roots;
    if (c == 0) {
      if (b == 0) {
        return OptionalDouble.empty();
      }
      roots = new double[] {(y0 - a) / b};
      if (curve() != CurveModel.QUADRATIC || !inRangeOnly) {
        return OptionalDouble.of(roots[0]);
      }
    } else {
      double k = a - y0;
      double disc = b * b - 4 * c * k;
      if (disc < 0) {
        return OptionalDouble.empty();
      }
      double q = -0.5 * (b + Math.copySign(Math.sqrt(disc), b));
      roots = q == 0 ? new double[] {0.0} : new double[] {q / c, k / q};
    }
    if (!inRangeOnly) {
      double best = roots[0];
      for (double r : roots) {
        if (Math.abs(r - near) < Math.abs(best - near)) {
          best = r;
        }
      }
      return OptionalDouble.of(best);
    }
    double tol = RANGE_TOLERANCE * (uMax - uMin);
    double direction = Math.signum(evalU(uMax) - evalU(uMin));
    OptionalDouble chosen = OptionalDouble.empty();
    for (double r : roots) {
      if (r >= uMin - tol && r <= uMax + tol) {
        if (chosen.isEmpty() || Math.signum(derivU(r)) == direction) {
          chosen = OptionalDouble.of(r);
        }
      }
    }
    return chosen;
  }

  private double evalU(double u) {
    double s = 0;
    for (int j = p - 1; j >= 0; j--) {
      s += beta[j] * pow(u, powers[j]);
    }
    return s;
  }

  private double derivU(double u) {
    double s = 0;
    for (int j = 0; j < p; j++) {
      if (powers[j] > 0) {
        s += powers[j] * beta[j] * pow(u, powers[j] - 1);
      }
    }
    return s;
  }

  private double interpolateSd(double x) {
    int last = sdX.length - 1;
    if (x <= sdX[0]) {
      return sdAtX[0];
    }
    if (x >= sdX[last]) {
      return sdAtX[last];
    }
    int hi = Arrays.binarySearch(sdX, x);
    if (hi >= 0) {
      return sdAtX[hi];
    }
    hi = -hi - 1;
    int lo = hi - 1;
    double f = (x - sdX[lo]) / (sdX[hi] - sdX[lo]);
    return sdAtX[lo] + f * (sdAtX[hi] - sdAtX[lo]);
  }

  /** Distinct x ascending, with the root-mean-square SD of the points at each x. */
  private static double[][] pooledSdByX(List<CalibrationPoint> pts) {
    double[] xs = pts.stream().mapToDouble(CalibrationPoint::x).distinct().sorted().toArray();
    double[] sd = new double[xs.length];
    for (int i = 0; i < xs.length; i++) {
      double sum = 0;
      int count = 0;
      for (CalibrationPoint pt : pts) {
        if (pt.x() == xs[i]) {
          double s = pt.sd().getAsDouble();
          sum += s * s;
          count++;
        }
      }
      sd[i] = Math.sqrt(sum / count);
    }
    return new double[][] {xs, sd};
  }

  // ---------------------------------------------------------------- helpers

  /** c = T beta: from the coefficients in u = (x - xc) / xs to those in x, for powers 0..2. */
  private static double[][] transform(double xc, double xs) {
    double h = xc / xs;
    return new double[][] {
      {1, -h, h * h},
      {0, 1 / xs, -2 * h / xs},
      {0, 0, 1 / (xs * xs)}
    };
  }

  private static double[][] upperTriangularInverse(RealMatrix r, int p) {
    double[][] inv = new double[p][p];
    for (int j = p - 1; j >= 0; j--) {
      inv[j][j] = 1 / r.getEntry(j, j);
      for (int i = j - 1; i >= 0; i--) {
        double s = 0;
        for (int k = i + 1; k <= j; k++) {
          s += r.getEntry(i, k) * inv[k][j];
        }
        inv[i][j] = -s / r.getEntry(i, i);
      }
    }
    return inv;
  }

  private static double pow(double u, int power) {
    switch (power) {
      case 0:
        return 1;
      case 1:
        return u;
      case 2:
        return u * u;
      default:
        return Math.pow(u, power);
    }
  }

  private static void checkPower(int power) {
    if (power < 0 || power >= MAX_TERMS) {
      throw new IllegalArgumentException("power must be 0, 1 or 2, was " + power);
    }
  }

  private static double min(double[] v) {
    double m = v[0];
    for (double d : v) {
      m = Math.min(m, d);
    }
    return m;
  }

  private static double max(double[] v) {
    double m = v[0];
    for (double d : v) {
      m = Math.max(m, d);
    }
    return m;
  }

  private static double minPositive(double[] v) {
    double m = Double.POSITIVE_INFINITY;
    for (double d : v) {
      if (d > 0) {
        m = Math.min(m, d);
      }
    }
    return m;
  }

  /** Two fits are equal when they were made from equal points with equal options (the fit is a function of them). */
  @Override
  public boolean equals(Object o) {
    return o instanceof CalibrationFit f && f.options.equals(options) && f.points.equals(points);
  }

  @Override
  public int hashCode() {
    return 31 * options.hashCode() + points.hashCode();
  }

  @Override
  public String toString() {
    return "CalibrationFit[" + curve().token() + ", " + weighting().token() + ", n=" + n
        + ", coefficients=" + Arrays.toString(coefficients()) + ", r2=" + r2 + "]";
  }
}
