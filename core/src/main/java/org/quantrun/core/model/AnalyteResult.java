package org.quantrun.core.model;

import java.util.List;
import java.util.Objects;
import java.util.Optional;
import java.util.OptionalDouble;
import java.util.OptionalInt;
import org.quantrun.core.calibration.LimitSource;
import org.quantrun.core.method.ResultFlag;
import org.quantrun.core.method.SampleRole;

/**
 * The result of one analyte line in one injection, in the original sample.
 *
 * <p>{@code value}, {@code ciHalfWidth}, {@code lod} and {@code loq} are in the original sample
 * (dilution and preparation factors applied), unrounded; {@code reported} is the text the
 * method's reporting rules give. A result that cannot be reported (its calibration was rejected,
 * no reading was valid) has an empty value and says why in {@code reported} and the trace.
 *
 * <p>A run may hold hundreds of thousands of results, so the optional numbers are kept as plain
 * doubles and a bit each saying whether they are present; the accessors give the same
 * {@code OptionalDouble}s as were passed in. Equal results compare equal as records do: every
 * component equal.
 */
public final class AnalyteResult {
  private final int position;
  private final String sampleId;
  private final SampleRole role;
  private final String analyteKey;
  private final String analyte;
  private final Optional<String> line;
  private final boolean reportedLine;
  private final double value;
  private final String reported;
  private final String unit;
  private final double ciHalfWidth;
  private final double lod;
  private final double loq;
  private final double dilutionFactor;
  private final List<ResultFlag> flags;
  private final double signalMean;
  private final double signalRsdPct;
  private final int replicates;
  private final Optional<LimitSource> limitsFrom;
  private final double solutionConcentration;
  private final int suggestedDilution;
  private final List<String> trace;
  /**
   * Which optional numbers are present, a bit each: value 0, ciHalfWidth 1, lod 2, loq 3,
   * signalMean 4, signalRsdPct 5, solutionConcentration 6, suggestedDilution 7.
   */
  private final int present;

  /**
   * Copies the lists.
   *
   * @param position the injection's sequence position
   * @param sampleId the sample id
   * @param role the injection's role
   * @param analyteKey the method's key of the analyte line
   * @param analyte the analyte name
   * @param line the line or mass, if any
   * @param reportedLine whether this line is the one reported for the analyte
   * @param value the concentration in the original sample, signed; empty when not quantified
   * @param reported the reported text, e.g. {@code "< 2.0"} or {@code "12.3"}
   * @param unit the unit of value, limits and half-width
   * @param ciHalfWidth confidence half-width of the calibration scatter (not the measurement uncertainty)
   * @param lod the limit of detection in the original sample
   * @param loq the limit of quantitation in the original sample
   * @param dilutionFactor every dilution and preparation factor applied, multiplied
   * @param flags the flags raised, in a fixed order
   * @param signalMean the mean of the valid readings (as measured, before corrections)
   * @param signalRsdPct their %RSD, when there were at least two
   * @param replicates how many valid readings went into the mean
   * @param limitsFrom where the limits came from
   * @param solutionConcentration the concentration in the measured solution, before dilution factors
   * @param suggestedDilution for an over-range result, the further dilution suggested
   * @param trace how the value was made, step by step, in plain words
   */
  public AnalyteResult(
      int position,
      String sampleId,
      SampleRole role,
      String analyteKey,
      String analyte,
      Optional<String> line,
      boolean reportedLine,
      OptionalDouble value,
      String reported,
      String unit,
      OptionalDouble ciHalfWidth,
      OptionalDouble lod,
      OptionalDouble loq,
      double dilutionFactor,
      List<ResultFlag> flags,
      OptionalDouble signalMean,
      OptionalDouble signalRsdPct,
      int replicates,
      Optional<LimitSource> limitsFrom,
      OptionalDouble solutionConcentration,
      OptionalInt suggestedDilution,
      List<String> trace) {
    int p = 0;
    this.position = position;
    this.sampleId = sampleId;
    this.role = role;
    this.analyteKey = analyteKey;
    this.analyte = analyte;
    this.line = line;
    this.reportedLine = reportedLine;
    this.value = value.isPresent() ? value.getAsDouble() : Double.NaN;
    p |= value.isPresent() ? 1 << 0 : 0;
    this.reported = reported;
    this.unit = unit;
    this.ciHalfWidth = ciHalfWidth.isPresent() ? ciHalfWidth.getAsDouble() : Double.NaN;
    p |= ciHalfWidth.isPresent() ? 1 << 1 : 0;
    this.lod = lod.isPresent() ? lod.getAsDouble() : Double.NaN;
    p |= lod.isPresent() ? 1 << 2 : 0;
    this.loq = loq.isPresent() ? loq.getAsDouble() : Double.NaN;
    p |= loq.isPresent() ? 1 << 3 : 0;
    this.dilutionFactor = dilutionFactor;
    this.flags = List.copyOf(flags);
    this.signalMean = signalMean.isPresent() ? signalMean.getAsDouble() : Double.NaN;
    p |= signalMean.isPresent() ? 1 << 4 : 0;
    this.signalRsdPct = signalRsdPct.isPresent() ? signalRsdPct.getAsDouble() : Double.NaN;
    p |= signalRsdPct.isPresent() ? 1 << 5 : 0;
    this.replicates = replicates;
    this.limitsFrom = limitsFrom;
    this.solutionConcentration = solutionConcentration.isPresent() ? solutionConcentration.getAsDouble() : Double.NaN;
    p |= solutionConcentration.isPresent() ? 1 << 6 : 0;
    this.suggestedDilution = suggestedDilution.isPresent() ? suggestedDilution.getAsInt() : 0;
    p |= suggestedDilution.isPresent() ? 1 << 7 : 0;
    this.trace = List.copyOf(trace);
    this.present = p;
  }

  /**
   * Returns the injection's sequence position.
   *
   * @return the injection's sequence position
   */
  public int position() {
    return position;
  }

  /**
   * Returns the sample id.
   *
   * @return the sample id
   */
  public String sampleId() {
    return sampleId;
  }

  /**
   * Returns the injection's role.
   *
   * @return the injection's role
   */
  public SampleRole role() {
    return role;
  }

  /**
   * Returns the method's key of the analyte line.
   *
   * @return the method's key of the analyte line
   */
  public String analyteKey() {
    return analyteKey;
  }

  /**
   * Returns the analyte name.
   *
   * @return the analyte name
   */
  public String analyte() {
    return analyte;
  }

  /**
   * Returns the line or mass, if any.
   *
   * @return the line or mass, if any
   */
  public Optional<String> line() {
    return line;
  }

  /**
   * Returns whether this line is the one reported for the analyte.
   *
   * @return whether this line is the one reported for the analyte
   */
  public boolean reportedLine() {
    return reportedLine;
  }

  /**
   * Returns the concentration in the original sample, signed; empty when not quantified.
   *
   * @return the concentration in the original sample, signed; empty when not quantified
   */
  public OptionalDouble value() {
    return (present & 1 << 0) != 0 ? OptionalDouble.of(value) : OptionalDouble.empty();
  }

  /**
   * Returns the reported text, e.g. {@code "< 2.0"} or {@code "12.3"}.
   *
   * @return the reported text, e.g. {@code "< 2.0"} or {@code "12.3"}
   */
  public String reported() {
    return reported;
  }

  /**
   * Returns the unit of value, limits and half-width.
   *
   * @return the unit of value, limits and half-width
   */
  public String unit() {
    return unit;
  }

  /**
   * Returns confidence half-width of the calibration scatter (not the measurement uncertainty).
   *
   * @return confidence half-width of the calibration scatter (not the measurement uncertainty)
   */
  public OptionalDouble ciHalfWidth() {
    return (present & 1 << 1) != 0 ? OptionalDouble.of(ciHalfWidth) : OptionalDouble.empty();
  }

  /**
   * Returns the limit of detection in the original sample.
   *
   * @return the limit of detection in the original sample
   */
  public OptionalDouble lod() {
    return (present & 1 << 2) != 0 ? OptionalDouble.of(lod) : OptionalDouble.empty();
  }

  /**
   * Returns the limit of quantitation in the original sample.
   *
   * @return the limit of quantitation in the original sample
   */
  public OptionalDouble loq() {
    return (present & 1 << 3) != 0 ? OptionalDouble.of(loq) : OptionalDouble.empty();
  }

  /**
   * Returns every dilution and preparation factor applied, multiplied.
   *
   * @return every dilution and preparation factor applied, multiplied
   */
  public double dilutionFactor() {
    return dilutionFactor;
  }

  /**
   * Returns the flags raised, in a fixed order.
   *
   * @return the flags raised, in a fixed order
   */
  public List<ResultFlag> flags() {
    return flags;
  }

  /**
   * Returns the mean of the valid readings (as measured, before corrections).
   *
   * @return the mean of the valid readings (as measured, before corrections)
   */
  public OptionalDouble signalMean() {
    return (present & 1 << 4) != 0 ? OptionalDouble.of(signalMean) : OptionalDouble.empty();
  }

  /**
   * Returns their %RSD, when there were at least two.
   *
   * @return their %RSD, when there were at least two
   */
  public OptionalDouble signalRsdPct() {
    return (present & 1 << 5) != 0 ? OptionalDouble.of(signalRsdPct) : OptionalDouble.empty();
  }

  /**
   * Returns how many valid readings went into the mean.
   *
   * @return how many valid readings went into the mean
   */
  public int replicates() {
    return replicates;
  }

  /**
   * Returns where the limits came from.
   *
   * @return where the limits came from
   */
  public Optional<LimitSource> limitsFrom() {
    return limitsFrom;
  }

  /**
   * Returns the concentration in the measured solution, before dilution factors.
   *
   * @return the concentration in the measured solution, before dilution factors
   */
  public OptionalDouble solutionConcentration() {
    return (present & 1 << 6) != 0 ? OptionalDouble.of(solutionConcentration) : OptionalDouble.empty();
  }

  /**
   * Returns for an over-range result, the further dilution suggested.
   *
   * @return for an over-range result, the further dilution suggested
   */
  public OptionalInt suggestedDilution() {
    return (present & 1 << 7) != 0 ? OptionalInt.of(suggestedDilution) : OptionalInt.empty();
  }

  /**
   * Returns how the value was made, step by step, in plain words.
   *
   * @return how the value was made, step by step, in plain words
   */
  public List<String> trace() {
    return trace;
  }

  /**
   * Whether another result has every component equal (numbers compared as {@link Double#compare} does).
   *
   * @param obj the other object
   * @return {@code true} when equal
   */
  @Override
  public boolean equals(Object obj) {
    if (this == obj) {
      return true;
    }
    if (!(obj instanceof AnalyteResult o)) {
      return false;
    }
    return present == o.present
        && position == o.position
        && Objects.equals(sampleId, o.sampleId)
        && Objects.equals(role, o.role)
        && Objects.equals(analyteKey, o.analyteKey)
        && Objects.equals(analyte, o.analyte)
        && Objects.equals(line, o.line)
        && reportedLine == o.reportedLine
        && Double.compare(value, o.value) == 0
        && Objects.equals(reported, o.reported)
        && Objects.equals(unit, o.unit)
        && Double.compare(ciHalfWidth, o.ciHalfWidth) == 0
        && Double.compare(lod, o.lod) == 0
        && Double.compare(loq, o.loq) == 0
        && Double.compare(dilutionFactor, o.dilutionFactor) == 0
        && Objects.equals(flags, o.flags)
        && Double.compare(signalMean, o.signalMean) == 0
        && Double.compare(signalRsdPct, o.signalRsdPct) == 0
        && replicates == o.replicates
        && Objects.equals(limitsFrom, o.limitsFrom)
        && Double.compare(solutionConcentration, o.solutionConcentration) == 0
        && suggestedDilution == o.suggestedDilution
        && Objects.equals(trace, o.trace);
  }

  /**
   * A hash of every component, consistent with {@link #equals}.
   *
   * @return the hash
   */
  @Override
  public int hashCode() {
    return Objects.hash(position(), sampleId(), role(), analyteKey(), analyte(), line(), reportedLine(),
        value(), reported(), unit(), ciHalfWidth(), lod(), loq(), dilutionFactor(), flags(), signalMean(),
        signalRsdPct(), replicates(), limitsFrom(), solutionConcentration(), suggestedDilution(), trace());
  }

  /**
   * Every component by name, as a record shows itself.
   *
   * @return the text
   */
  @Override
  public String toString() {
    return "AnalyteResult["
        + "position=" + position()
        + ", sampleId=" + sampleId()
        + ", role=" + role()
        + ", analyteKey=" + analyteKey()
        + ", analyte=" + analyte()
        + ", line=" + line()
        + ", reportedLine=" + reportedLine()
        + ", value=" + value()
        + ", reported=" + reported()
        + ", unit=" + unit()
        + ", ciHalfWidth=" + ciHalfWidth()
        + ", lod=" + lod()
        + ", loq=" + loq()
        + ", dilutionFactor=" + dilutionFactor()
        + ", flags=" + flags()
        + ", signalMean=" + signalMean()
        + ", signalRsdPct=" + signalRsdPct()
        + ", replicates=" + replicates()
        + ", limitsFrom=" + limitsFrom()
        + ", solutionConcentration=" + solutionConcentration()
        + ", suggestedDilution=" + suggestedDilution()
        + ", trace=" + trace() + "]";
  }
}
