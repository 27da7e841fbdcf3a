package org.quantrun.core.processing;

import java.util.ArrayList;
import java.util.List;
import java.util.Optional;
import java.util.OptionalDouble;
import org.quantrun.core.method.InternalStandard;
import org.quantrun.core.method.SampleRole;
import org.quantrun.core.model.QcCheck;
import org.quantrun.core.model.QcKind;
import org.quantrun.core.qc.CheckOutcome;
import org.quantrun.core.qc.QcFormulas;
import org.quantrun.core.qc.Verdict;
import org.quantrun.core.qc.Window;

/**
 * One internal standard through the run: its signal in every injection, its reference (the mean of
 * its signal in the calibration blanks), the correction ratio reference / signal for each
 * injection, and its recovery signal / reference * 100 checked against the method's window.
 */
final class InternalStandardWork {
  private final InternalStandard standard;
  private final List<Classified> injections;
  private final Signal[] signals;
  private final Window window;
  private double reference = Double.NaN;
  private final List<QcCheck> checks = new ArrayList<>();
  private final boolean[] outOfWindow;

  InternalStandardWork(InternalStandard standard, List<Classified> injections, Signal[] signals, Window window) {
    this.standard = standard;
    this.injections = injections;
    this.signals = signals;
    this.window = window;
    this.outOfWindow = new boolean[signals.length];
  }

  InternalStandardWork run() {
    List<Double> ref = new ArrayList<>();
    for (Classified c : injections) {
      Signal s = signals[c.index()];
      if (c.role() == SampleRole.CALIBRATION_BLANK && s != null && s.hasValue()) {
        ref.add(s.mean());
      }
    }
    if (!ref.isEmpty()) {
      reference = Signal.mean(ref.stream().mapToDouble(Double::doubleValue).toArray());
    }
    for (Classified c : injections) {
      if (c.role() == SampleRole.IGNORE) {
        continue;
      }
      Signal s = signals[c.index()];
      OptionalDouble measured = s != null && s.hasValue() ? OptionalDouble.of(s.mean()) : OptionalDouble.empty();
      OptionalDouble expected = Double.isNaN(reference) ? OptionalDouble.empty() : OptionalDouble.of(reference);
      CheckOutcome o;
      if (measured.isEmpty() || expected.isEmpty()) {
        o = new CheckOutcome(OptionalDouble.empty(), "%", window, Verdict.NOT_EVALUATED, Optional.of(
            measured.isEmpty() ? "no valid reading of the internal standard" : "no calibration blank to refer the internal standard to"));
      } else {
        o = QcFormulas.recovery(measured.getAsDouble(), reference, window);
      }
      outOfWindow[c.index()] = o.verdict() == Verdict.FAILED;
      checks.add(new QcCheck(c.position(), c.sampleId(), QcKind.INTERNAL_STANDARD, standard.name(), measured, expected,
          o.value(), "%", OptionalDouble.of(window.low()), OptionalDouble.of(window.high()), o.verdict(), o.reason()));
    }
    return this;
  }

  String name() {
    return standard.name();
  }

  List<QcCheck> checks() {
    return checks;
  }

  /** The correction an analyte line corrected by this internal standard gets. */
  Correction correction() {
    return new Correction(this);
  }

  /** No internal standard: every ratio is 1. */
  static Correction none() {
    return new Correction(null);
  }

  /** The correction of one analyte line: ratio per injection, and what prevents it. */
  static final class Correction {
    private final InternalStandardWork work;

    private Correction(InternalStandardWork work) {
      this.work = work;
    }

    boolean active() {
      return work != null;
    }

    String name() {
      return work == null ? "" : work.name();
    }

    /** reference / signal, or 1 without an internal standard (NaN when it cannot be formed). */
    double ratio(int index) {
      if (work == null) {
        return 1;
      }
      Signal s = work.signals[index];
      if (Double.isNaN(work.reference) || s == null || !s.hasValue() || s.mean() == 0) {
        return Double.NaN;
      }
      return work.reference / s.mean();
    }

    /** Why the ratio cannot be formed for an injection, if it cannot. */
    Optional<String> problem(int index) {
      if (work == null) {
        return Optional.empty();
      }
      if (Double.isNaN(work.reference)) {
        return Optional.of("internal standard " + work.name() + " has no valid reading in a calibration blank");
      }
      Signal s = work.signals[index];
      if (s == null || !s.hasValue() || s.mean() == 0) {
        return Optional.of("internal standard " + work.name() + " has no valid reading in this injection");
      }
      return Optional.empty();
    }

    boolean outOfWindow(int index) {
      return work != null && work.outOfWindow[index];
    }
  }
}
