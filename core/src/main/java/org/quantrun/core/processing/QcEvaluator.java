package org.quantrun.core.processing;

import java.util.ArrayList;
import java.util.EnumMap;
import java.util.HashMap;
import java.util.HashSet;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.OptionalDouble;
import java.util.Set;
import org.quantrun.core.method.Analyte;
import org.quantrun.core.method.CheckStandard;
import org.quantrun.core.method.Method;
import org.quantrun.core.method.MethodBlankHandling;
import org.quantrun.core.method.PairRule;
import org.quantrun.core.method.QcPlan;
import org.quantrun.core.method.ResultFlag;
import org.quantrun.core.method.SampleRole;
import org.quantrun.core.method.SerialDilutionRule;
import org.quantrun.core.method.SpikeRule;
import org.quantrun.core.model.QcCheck;
import org.quantrun.core.model.QcKind;
import org.quantrun.core.qc.CheckOutcome;
import org.quantrun.core.qc.QcFormulas;
import org.quantrun.core.qc.Verdict;
import org.quantrun.core.qc.Window;

/**
 * The QC of a run, per analyte line, judged on unrounded solution concentrations against the
 * method's windows, and what each failure means for the samples:
 *
 * <ul>
 *   <li>ICV and low-level check recovery; a failed ICV leaves the calibration unverified for every
 *       sample of that analyte line.
 *   <li>Bracketing: CCVs (the ICV opening the chain) and blanks (ICB, CCBs) bracket the samples
 *       between them. A sample whose preceding or following check failed is in doubt for that
 *       analyte line; after a high-biased CCV, non-detects may stand if the method allows it.
 *   <li>CCV frequency: at most so many real samples between CCVs, and a CCV after the last sample;
 *       a gap is a run-level failure.
 *   <li>Method blank and LCS: they apply to the samples of their prep batch (the whole run without
 *       a prep sheet); with "subtract" the batch's mean method-blank concentration is subtracted
 *       from its samples.
 *   <li>Duplicates and matrix spike duplicates (RPD or absolute difference), matrix spikes
 *       (recovery, the 4x rule; an unspiked result below the LOD counts as 0), serial dilutions
 *       (%D above the threshold).
 * </ul>
 */
final class QcEvaluator {
  private final Method method;
  private final QcPlan plan;
  private final List<Classified> injections;
  private final SamplePrep prep;
  private final List<QcCheck> checks = new ArrayList<>();
  private final List<String> findings = new ArrayList<>();
  private boolean runFailed;
  /** The real samples of each prep batch, in run order. */
  private final Map<String, List<Classified>> samplesByBatch = new HashMap<>();
  /** The injections of role sample of each sample id, in run order. */
  private final Map<String, List<Classified>> samplesById = new HashMap<>();
  /** The spikes of each parent sample id, in run order. */
  private final Map<String, List<Classified>> spikesByParent = new HashMap<>();
  /** The batches whose samples got each batch-wide flag, for the analyte line being evaluated. */
  private final Map<ResultFlag, Set<String>> flaggedBatches = new EnumMap<>(ResultFlag.class);

  QcEvaluator(Method method, List<Classified> injections, SamplePrep prep) {
    this.method = method;
    this.plan = method.qc();
    this.injections = injections;
    this.prep = prep;
    for (Classified c : injections) {
      if (c.isRealSample()) {
        samplesByBatch.computeIfAbsent(prep.batch(c), b -> new ArrayList<>()).add(c);
      }
      if (c.role() == SampleRole.SAMPLE) {
        samplesById.computeIfAbsent(c.sampleId(), b -> new ArrayList<>()).add(c);
      }
      if (c.role() == SampleRole.SPIKE && c.parent().isPresent()) {
        spikesByParent.computeIfAbsent(c.parent().get(), b -> new ArrayList<>()).add(c);
      }
    }
  }

  List<QcCheck> checks() {
    return checks;
  }

  List<String> findings() {
    return findings;
  }

  boolean runFailed() {
    return runFailed;
  }

  /** Runs every check of one analyte line, adding flags and rerun reasons to its drafts. */
  void evaluate(AnalyteLineWork work) {
    Draft[] d = work.drafts();
    Analyte a = work.analyte();
    flaggedBatches.clear();
    subtractMethodBlanks(d, a);
    List<Check> ccvChain = new ArrayList<>();
    List<Check> blankChain = new ArrayList<>();
    for (Classified c : injections) {
      Draft x = d[c.index()];
      if (x == null) {
        continue;
      }
      replicates(x);
      check(d, a, c, x, ccvChain, blankChain);
    }
    bracket(d, a, ccvChain, true);
    bracket(d, a, blankChain, false);
  }

  /** The check its role asks of one injection; ICV, CCV and blank checks join their chain. */
  private void check(Draft[] d, Analyte a, Classified c, Draft x, List<Check> ccvChain, List<Check> blankChain) {
    switch (c.role()) {
      case ICV: {
        Check k = recovery(x, QcKind.ICV, plan.icv());
        ccvChain.add(k);
        if (k.verdict == Verdict.FAILED) {
          icvFailed(d, a, c, k);
        }
        break;
      }
      case LOW_CHECK:
        plan.lowCheck().ifPresent(cs -> recovery(x, QcKind.LOW_CHECK, cs));
        break;
      case CCV:
        ccvChain.add(recovery(x, QcKind.CCV, plan.ccv().standard()));
        break;
      case ICB:
        blankChain.add(blank(x, QcKind.ICB, plan.blanks().calibrationBlankFraction()));
        break;
      case CCB:
        blankChain.add(blank(x, QcKind.CCB, plan.blanks().calibrationBlankFraction()));
        break;
      case LCS:
        plan.lcs().ifPresent(cs -> batchEffect(d, c, recovery(x, QcKind.LCS, cs), ResultFlag.LCS_FAILED));
        break;
      case METHOD_BLANK:
        batchEffect(d, c, blank(x, QcKind.METHOD_BLANK, plan.blanks().methodBlankFraction()), ResultFlag.METHOD_BLANK_FAILED);
        break;
      case DUPLICATE:
        parent(d, c).ifPresent(p -> duplicate(p, x, QcKind.DUPLICATE, plan.duplicate(), ResultFlag.DUPLICATE_FAILED));
        break;
      case SPIKE:
        parent(d, c).ifPresent(p -> plan.spike().ifPresent(rule -> spike(p, x, QcKind.SPIKE, rule)));
        break;
      case SPIKE_DUPLICATE:
        parent(d, c).ifPresent(p -> plan.spike().ifPresent(rule -> {
          spike(p, x, QcKind.SPIKE_DUPLICATE, rule);
          spikeOf(d, c).ifPresent(ms -> duplicate(ms, x, QcKind.SPIKE_DUPLICATE, rule.duplicate(), ResultFlag.SPIKE_FAILED));
        }));
        break;
      case SERIAL_DILUTION:
        parent(d, c).ifPresent(p -> serialDilution(p, x, plan.serialDilution()));
        break;
      default:
        break;
    }
  }

  /** A failed ICV leaves the calibration unverified for every sample of the line. */
  private void icvFailed(Draft[] d, Analyte a, Classified icv, Check k) {
    forSamples(d, s -> true, s -> {
      s.flags.add(ResultFlag.ICV_FAILED);
      s.rerunReasons.add("the ICV at position " + icv.position() + " failed for " + a.key() + " (" + k.reason + ")");
    });
  }

  /** Runs the run-level CCV frequency check once. */
  void ccvFrequency() {
    int frequency = plan.ccv().frequency();
    int since = 0;
    int lastCheck = 0;
    String lastId = "the start of the run";
    for (Classified c : injections) {
      if (c.role() == SampleRole.ICV || c.role() == SampleRole.CCV) {
        if (since > frequency) {
          failFrequency(c.position(), c.sampleId(), since, frequency, "between " + lastId + " and " + c.sampleId());
        }
        since = 0;
        lastCheck = c.position();
        lastId = c.sampleId() + " (position " + c.position() + ")";
      } else if (c.isRealSample()) {
        since++;
      }
    }
    if (since > 0) {
      runFailed = true;
      String text = since + " real sample" + (since == 1 ? "" : "s") + " after " + lastId
          + " have no closing CCV: a CCV must follow the last sample";
      findings.add(text);
      checks.add(new QcCheck(lastCheck, "", QcKind.CCV_FREQUENCY, "", OptionalDouble.of(since), OptionalDouble.empty(),
          OptionalDouble.of(since), "samples", OptionalDouble.empty(), OptionalDouble.of(0), Verdict.FAILED, Optional.of(text)));
    }
  }

  private void failFrequency(int position, String id, int since, int frequency, String where) {
    runFailed = true;
    String text = since + " real samples " + where + " (at most " + frequency + " between CCVs)";
    findings.add(text);
    checks.add(new QcCheck(position, id, QcKind.CCV_FREQUENCY, "", OptionalDouble.of(since), OptionalDouble.of(frequency),
        OptionalDouble.of(since), "samples", OptionalDouble.empty(), OptionalDouble.of(frequency), Verdict.FAILED,
        Optional.of(text)));
  }

  /** Whether any real sample of the run comes after the last CCV (its results are unbracketed). */
  static List<Classified> unbracketed(List<Classified> injections) {
    List<Classified> after = new ArrayList<>();
    for (Classified c : injections) {
      if (c.role() == SampleRole.CCV) {
        after.clear();
      } else if (c.isRealSample()) {
        after.add(c);
      }
    }
    return after;
  }

  // ------------------------------------------------------------------ single checks

  /** A judged check and where it was made. */
  private record Check(int index, int position, String sampleId, Verdict verdict, String reason, boolean highBias) {}

  private Check recovery(Draft x, QcKind kind, CheckStandard standard) {
    Analyte a = x.analyte;
    if (standard.exempt().contains(a.name())) {
      return record(x, kind, OptionalDouble.empty(), notEvaluated("%", standard.recovery(), a.name() + " is exempt from this check"));
    }
    Optional<Double> truth = standard.trueValue(a.name());
    if (truth.isEmpty()) {
      return record(x, kind, OptionalDouble.empty(), notEvaluated("%", standard.recovery(), "no true value for " + a.name()));
    }
    OptionalDouble expected = OptionalDouble.of(truth.get());
    if (!x.quantified()) {
      return record(x, kind, expected, notEvaluated("%", standard.recovery(), "not quantified: " + x.notReportable.orElse("")));
    }
    CheckOutcome o = QcFormulas.recovery(x.x0, truth.get(), standard.recovery());
    Check k = record(x, kind, expected, o);
    return new Check(k.index, k.position, k.sampleId, k.verdict, k.reason,
        o.value().isPresent() && o.value().getAsDouble() > standard.recovery().high());
  }

  private Check blank(Draft x, QcKind kind, double fraction) {
    double limit = fraction * x.reportingLimit;
    if (!x.quantified() || Double.isNaN(limit)) {
      String why = !x.quantified() ? "not quantified: " + x.notReportable.orElse("")
          : "no reporting limit or LOQ to judge the blank against";
      return record(x, kind, OptionalDouble.empty(), notEvaluated(x.unit, new Window(0, 0), why));
    }
    return record(x, kind, OptionalDouble.of(0), QcFormulas.blank(x.x0, limit, x.analyte.unit().token()));
  }

  private void duplicate(Draft a, Draft b, QcKind kind, PairRule rule, ResultFlag flag) {
    if (!a.quantified() || !b.quantified()) {
      record(b, kind, OptionalDouble.empty(), notEvaluated("%", Window.atMost(rule.maxRpd()),
          "not quantified: " + (a.quantified() ? b : a).notReportable.orElse("")));
      return;
    }
    double rl = b.reportingLimit;
    double threshold = Double.isNaN(rl) ? 0 : rule.minMultipleOfRl() * rl;
    double absolute = Double.isNaN(rl) ? Double.NaN : rule.lowLevelMaxDifference() * rl;
    CheckOutcome o = QcFormulas.duplicate(a.x0, b.x0, threshold, rule.maxRpd(), absolute, b.analyte.unit().token());
    Check k = record(b, kind, OptionalDouble.of(a.x0), o);
    if (k.verdict == Verdict.FAILED) {
      a.flags.add(flag);
      b.flags.add(flag);
    }
  }

  private void spike(Draft parent, Draft spiked, QcKind kind, SpikeRule rule) {
    String name = spiked.analyte.name();
    Window w = rule.recovery();
    if (rule.exempt().contains(name)) {
      record(spiked, kind, OptionalDouble.empty(), notEvaluated("%", w, name + " is exempt from the spike check"));
      return;
    }
    Optional<Double> added = Optional.ofNullable(rule.added().get(name));
    if (added.isEmpty()) {
      record(spiked, kind, OptionalDouble.empty(), notEvaluated("%", w, "no spike amount for " + name));
      return;
    }
    if (!parent.quantified() || !spiked.quantified()) {
      record(spiked, kind, OptionalDouble.of(added.get()), notEvaluated("%", w,
          "not quantified: " + (parent.quantified() ? spiked : parent).notReportable.orElse("")));
      return;
    }
    double unspiked = parent.belowLod() ? 0 : parent.x0;
    CheckOutcome o = QcFormulas.spikeRecovery(spiked.x0, unspiked, added.get(), w, rule.maxBackgroundRatio());
    Check k = record(spiked, kind, OptionalDouble.of(added.get()), o);
    if (k.verdict == Verdict.FAILED) {
      parent.flags.add(ResultFlag.SPIKE_FAILED);
      spiked.flags.add(ResultFlag.SPIKE_FAILED);
    } else if (k.verdict == Verdict.NOT_EVALUATED) {
      parent.flags.add(ResultFlag.SPIKE_NOT_EVALUATED);
    }
  }

  private void serialDilution(Draft parent, Draft diluted, SerialDilutionRule rule) {
    Window w = Window.atMost(rule.maxDifference());
    if (!parent.quantified() || !diluted.quantified()) {
      record(diluted, QcKind.SERIAL_DILUTION, OptionalDouble.empty(), notEvaluated("%", w,
          "not quantified: " + (parent.quantified() ? diluted : parent).notReportable.orElse("")));
      return;
    }
    double min = Double.isNaN(parent.reportingLimit) ? 0 : rule.minMultipleOfRl() * parent.reportingLimit;
    CheckOutcome o = QcFormulas.serialDilution(parent.x0, diluted.x0, rule.factor(), rule.maxDifference(), min);
    Check k = record(diluted, QcKind.SERIAL_DILUTION, OptionalDouble.of(parent.x0), o);
    if (k.verdict == Verdict.FAILED) {
      parent.flags.add(ResultFlag.SERIAL_DILUTION_FAILED);
    }
  }

  /**
   * Replicate %RSD of the readings, judged from a multiple of the reporting limit up. Only failures
   * are recorded as QC rows (a passing %RSD on every line of every injection would bury the table);
   * the flag marks the result.
   */
  private void replicates(Draft x) {
    if (!x.quantified() || x.raw.count() < 2 || Double.isNaN(x.reportingLimit)) {
      return;
    }
    org.quantrun.core.method.ReplicateRule rule = plan.replicates();
    if (x.x0 == 0 || x.x0 < rule.minMultipleOfRl() * x.reportingLimit) {
      return; // not judged (QcFormulas.replicateRsd would say so), and only failures are recorded
    }
    CheckOutcome o = QcFormulas.replicateRsd(x.x0, x.x0 * x.raw.rsdPercent() / 100, rule.maxRsd(),
        rule.minMultipleOfRl() * x.reportingLimit);
    if (o.verdict() == Verdict.FAILED) {
      x.flags.add(ResultFlag.REPLICATE_RSD_HIGH);
      record(x, QcKind.REPLICATE_RSD, OptionalDouble.empty(), o);
    }
  }

  private static CheckOutcome notEvaluated(String unit, Window w, String reason) {
    return new CheckOutcome(OptionalDouble.empty(), unit, w, Verdict.NOT_EVALUATED, Optional.of(reason));
  }

  private Check record(Draft x, QcKind kind, OptionalDouble expected, CheckOutcome o) {
    Window w = o.window();
    OptionalDouble lo = Double.isInfinite(w.low()) ? OptionalDouble.empty() : OptionalDouble.of(w.low());
    OptionalDouble hi = Double.isInfinite(w.high()) ? OptionalDouble.empty() : OptionalDouble.of(w.high());
    OptionalDouble measured = x.quantified() ? OptionalDouble.of(x.x0) : OptionalDouble.empty();
    checks.add(new QcCheck(x.injection.position(), x.injection.sampleId(), kind, x.analyteKey, measured, expected,
        o.value(), o.unit(), lo, hi, o.verdict(), o.reason()));
    if (o.verdict() == Verdict.FAILED) {
      x.trace.add(kind.token() + " failed: " + o.reason().orElse(""));
    }
    return new Check(x.injection.index(), x.injection.position(), x.injection.sampleId(), o.verdict(),
        o.reason().orElse(""), false);
  }

  // ------------------------------------------------------------------ effects on samples

  private void bracket(Draft[] d, Analyte a, List<Check> chain, boolean ccv) {
    if (chain.isEmpty()) {
      return;
    }
    boolean standAfterHighBias = ccv && plan.ccv().nonDetectsStandAfterHighBias();
    int next = 0;
    for (Classified c : injections) {
      while (next < chain.size() && chain.get(next).index < c.index()) {
        next++;
      }
      Draft s = d[c.index()];
      if (s == null || !c.isRealSample()) {
        continue;
      }
      Check before = next > 0 ? chain.get(next - 1) : null;
      Check after = next < chain.size() ? chain.get(next) : null;
      for (Check k : new Check[] {before, after}) {
        if (k != null && k.verdict == Verdict.FAILED) {
          bracketFailed(s, a, k, ccv, standAfterHighBias);
        }
      }
    }
  }

  /** The effect on one sample of a failed check bracketing it. */
  private void bracketFailed(Draft s, Analyte a, Check k, boolean ccv, boolean standAfterHighBias) {
    if (standAfterHighBias && k.highBias && s.belowLod()) {
      s.trace.add("non-detect stands after the high-biased CCV at position " + k.position);
      return;
    }
    boolean initial = injections.get(k.index).role() == SampleRole.ICV || injections.get(k.index).role() == SampleRole.ICB;
    ResultFlag flag = ccv ? (initial ? ResultFlag.ICV_FAILED : ResultFlag.CCV_FAILED)
        : (initial ? ResultFlag.ICB_FAILED : ResultFlag.CCB_FAILED);
    if (s.flags.add(flag) || !initial) {
      s.rerunReasons.add("the bracketing " + (ccv ? (initial ? "ICV " : "CCV ") : (initial ? "ICB " : "CCB "))
          + k.sampleId + " (position " + k.position + ") failed for " + a.key() + ": " + k.reason);
    }
  }

  private void batchEffect(Draft[] d, Classified qc, Check k, ResultFlag flag) {
    if (k.verdict != Verdict.FAILED) {
      return;
    }
    String batch = prep.batch(qc);
    if (!flaggedBatches.computeIfAbsent(flag, f -> new HashSet<>()).add(batch)) {
      return; // this batch's samples have the flag already
    }
    for (Classified c : samplesByBatch.getOrDefault(batch, List.of())) {
      Draft s = d[c.index()];
      if (s != null) {
        s.flags.add(flag);
      }
    }
  }

  private void subtractMethodBlanks(Draft[] d, Analyte a) {
    if (method.blanks().methodBlank() != MethodBlankHandling.SUBTRACT) {
      return;
    }
    Map<String, List<Double>> byBatch = new LinkedHashMap<>();
    for (Classified c : injections) {
      Draft x = d[c.index()];
      if (c.role() == SampleRole.METHOD_BLANK && x != null && x.quantified()) {
        byBatch.computeIfAbsent(prep.batch(c), b -> new ArrayList<>()).add(x.x0);
      }
    }
    forSamples(d, s -> byBatch.containsKey(prep.batch(s.injection)), s -> {
      List<Double> blanks = byBatch.get(prep.batch(s.injection));
      double mb = blanks.stream().mapToDouble(Double::doubleValue).average().getAsDouble();
      if (s.quantified()) {
        s.x0 -= mb;
        s.flags.add(ResultFlag.METHOD_BLANK_SUBTRACTED);
        s.trace.add("method blank subtracted: " + Text.num(mb) + " " + a.unit().token() + " (mean of "
            + blanks.size() + " in the prep batch)");
      }
    });
  }

  private Optional<Draft> parent(Draft[] d, Classified c) {
    if (c.parent().isEmpty()) {
      return Optional.empty();
    }
    String id = c.parent().get();
    Draft found = null;
    for (Classified p : samplesById.getOrDefault(id, List.of())) {
      if (d[p.index()] != null) {
        found = d[p.index()];
        if (p.index() > c.index()) {
          break;
        }
      }
    }
    if (found == null) {
      String text = c.role().token() + " " + c.sampleId() + " (position " + c.position() + ") names sample '" + id
          + "', which the run does not hold: its check was not made";
      if (!findings.contains(text)) {
        findings.add(text);
      }
    }
    return Optional.ofNullable(found);
  }

  private Optional<Draft> spikeOf(Draft[] d, Classified msd) {
    if (msd.parent().isEmpty()) {
      return Optional.empty();
    }
    for (Classified c : spikesByParent.getOrDefault(msd.parent().get(), List.of())) {
      if (d[c.index()] != null) {
        return Optional.of(d[c.index()]);
      }
    }
    return Optional.empty();
  }

  private void forSamples(Draft[] d, java.util.function.Predicate<Draft> which, java.util.function.Consumer<Draft> action) {
    for (Classified c : injections) {
      Draft s = d[c.index()];
      if (s != null && c.isRealSample() && which.test(s)) {
        action.accept(s);
      }
    }
  }
}
