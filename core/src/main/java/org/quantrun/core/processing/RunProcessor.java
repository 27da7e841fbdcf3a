package org.quantrun.core.processing;

import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.LinkedHashSet;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Optional;
import java.util.OptionalInt;
import java.util.Set;
import org.quantrun.core.importer.AnalyteLine;
import org.quantrun.core.importer.Injection;
import org.quantrun.core.importer.LineReadings;
import org.quantrun.core.importer.MetadataEntry;
import org.quantrun.core.importer.RawRun;
import org.quantrun.core.method.Analyte;
import org.quantrun.core.method.InternalStandard;
import org.quantrun.core.method.Method;
import org.quantrun.core.method.ResultFlag;
import org.quantrun.core.method.prep.PrepSheet;
import org.quantrun.core.model.AnalyteResult;
import org.quantrun.core.model.CalibrationResult;
import org.quantrun.core.model.CalibrationStatus;
import org.quantrun.core.model.InjectionRecord;
import org.quantrun.core.model.QcCheck;
import org.quantrun.core.model.RerunRequest;
import org.quantrun.core.model.RunInfo;
import org.quantrun.core.model.RunResult;
import org.quantrun.core.model.RunVerdict;
import org.quantrun.core.qc.Verdict;

/**
 * The run processor: a pure function from an imported run, a method and an optional prep sheet to
 * the run's results. Same input, same output; no clock, no randomness, no files.
 *
 * <p>Per analyte line, in this order: replicate statistics (invalid readings left out with their
 * reason), internal-standard ratio, calibration-blank correction, calibration and its acceptance,
 * limits (from the method's source order), quantitation of every injection that is not a
 * calibration solution with its interval, dilution and preparation factors; then the QC of the run
 * (recoveries, blanks, duplicates, spikes, serial dilutions, bracketing, CCV frequency), the
 * reporting flags, possible carry-over, the rerun list and the run's verdict.
 */
public final class RunProcessor {
  /** Metadata keys that name the run, tried in order (letter case ignored). */
  private static final List<String> RUN_ID_KEYS = List.of("run id", "run_id", "run-id", "run", "sequence", "batch");

  private RunProcessor() {}

  /**
   * Processes a run.
   *
   * @param run the imported run
   * @param method the lab's method
   * @param prep the prep sheet, when the method uses one
   * @return the results
   * @throws ProcessingException when the run cannot be processed with this method (the message says
   *     why and what to do)
   */
  public static RunResult process(RawRun run, Method method, Optional<PrepSheet> prep) {
    if (method.dilution().prepSheet().isPresent() && prep.isEmpty()) {
      throw new ProcessingException(run.sourceName() + ": the method " + method.identity().id()
          + " reports through a prep sheet, and none was given (pass the prep sheet CSV)");
    }
    List<Classified> injections = InjectionClassifier.classify(run, method);
    List<String> findings = new ArrayList<>();
    method.dilution().factorColumn().ifPresent(col -> findings.add("dilution.factor-column '" + col
        + "' was not applied: the importers do not pass per-injection columns; every sample got the default factor "
        + Text.num(method.dilution().defaultFactor()) + " (use a prep sheet for per-sample factors)"));
    SignalTable table = new SignalTable(run, injections);

    Map<String, InternalStandardWork> isWorks = new LinkedHashMap<>();
    for (InternalStandard is : method.internalStandards()) {
      Optional<String> lineOrMass = is.line().or(() -> is.mass().map(String::valueOf));
      Signal[] s = table.signals(is.element(), lineOrMass);
      if (s == null) {
        findings.add("the export has no line of internal standard " + is.name() + " (" + is.element()
            + lineOrMass.map(l -> " " + l).orElse("") + ")");
        s = new Signal[injections.size()];
      }
      isWorks.put(is.name(), new InternalStandardWork(is, injections, s, method.qc().internalStandardRecovery()).run());
    }

    SamplePrep samplePrep = new SamplePrep(method, prep, injections);
    QcEvaluator qc = new QcEvaluator(method, injections, samplePrep);
    List<Classified> unbracketed = QcEvaluator.unbracketed(injections);
    Set<Integer> unbracketedSet = new java.util.HashSet<>();
    unbracketed.forEach(c -> unbracketedSet.add(c.index()));

    // One analyte line at a time, start to finish: its QC reads only its own drafts, so each
    // line's drafts and signals are dropped as soon as its results are frozen.
    List<Analyte> analytes = method.analytes();
    List<CalibrationResult> calibrations = new ArrayList<>(analytes.size());
    AnalyteResult[][] resultsByLine = new AnalyteResult[analytes.size()][];
    RerunRequest[][] rerunsByLine = new RerunRequest[analytes.size()][];
    Shared shared = new Shared();
    for (int k = 0; k < analytes.size(); k++) {
      Analyte a = analytes.get(k);
      Optional<String> lineOrMass = a.line().or(() -> a.mass().map(String::valueOf));
      Signal[] s = table.signals(a.name(), lineOrMass);
      if (s == null) {
        findings.add("the export has no line " + a.key() + " (it has: " + table.exportedLabels() + ")");
        s = new Signal[injections.size()];
      }
      InternalStandardWork.Correction corr = a.internalStandard().map(n -> isWorks.get(n).correction())
          .orElse(InternalStandardWork.none());
      AnalyteLineWork work = new AnalyteLineWork(method, a, injections, s, corr, samplePrep).run();
      qc.evaluate(work);
      Draft[] d = work.drafts();
      carryOver(d, injections);
      AnalyteResult[] res = new AnalyteResult[injections.size()];
      RerunRequest[] rr = new RerunRequest[injections.size()];
      for (Classified c : injections) {
        Draft x = d[c.index()];
        if (x == null) {
          continue;
        }
        res[c.index()] = ResultWriter.freeze(x, method.reporting(), shared);
        if (c.isRealSample() && x.reportedLine) {
          rr[c.index()] = rerunOf(x, unbracketedSet.contains(c.index()), shared).orElse(null);
        }
      }
      resultsByLine[k] = res;
      rerunsByLine[k] = rr;
      calibrations.add(work.calibration());
    }
    qc.ccvFrequency();

    List<AnalyteResult> results = new ArrayList<>();
    List<RerunRequest> reruns = new ArrayList<>();
    for (Classified c : injections) {
      for (int k = 0; k < analytes.size(); k++) {
        AnalyteResult r = resultsByLine[k][c.index()];
        if (r != null) {
          results.add(r);
        }
        RerunRequest q = rerunsByLine[k][c.index()];
        if (q != null) {
          reruns.add(q);
        }
      }
    }
    if (!unbracketed.isEmpty()) {
      findings.add("the last " + unbracketed.size() + " real sample" + (unbracketed.size() == 1 ? " is" : "s are")
          + " not followed by a CCV");
    }
    findings.addAll(qc.findings());

    List<QcCheck> checks = new ArrayList<>();
    isWorks.values().forEach(w -> checks.addAll(w.checks()));
    checks.addAll(qc.checks());
    checks.sort(java.util.Comparator.comparingInt(QcCheck::position));

    calibrations = List.copyOf(calibrations);
    boolean anyAccepted = calibrations.stream().anyMatch(c -> c.reportedLine() && c.status() == CalibrationStatus.ACCEPTED);
    if (!anyAccepted) {
      findings.add("no reported analyte line has an accepted calibration");
    }
    boolean qcFailed = checks.stream().anyMatch(c -> c.verdict() == Verdict.FAILED);
    RunVerdict verdict = qc.runFailed() || !anyAccepted ? RunVerdict.OUT_OF_CONTROL
        : !reruns.isEmpty() || qcFailed || calibrations.stream().anyMatch(c -> c.status() == CalibrationStatus.REJECTED)
            ? RunVerdict.RERUNS_NEEDED : RunVerdict.IN_CONTROL;

    List<InjectionRecord> records = new ArrayList<>();
    for (Classified c : injections) {
      String batch = samplePrep.batch(c);
      double df = samplePrep.of(c, method.identity().defaultUnit()).dilutionFactor();
      records.add(new InjectionRecord(c.position(), c.sampleId(), c.role(), c.level(), c.parent(),
          batch.isEmpty() ? Optional.empty() : Optional.of(batch), df, c.injection().timestamp(), c.identifiedBy()));
    }
    Map<String, String> metadata = new LinkedHashMap<>();
    for (MetadataEntry m : run.metadata()) {
      metadata.putIfAbsent(m.key(), m.value());
    }
    RunInfo info = new RunInfo(runId(run), run.sourceName(), run.importerId(), method.identity().id(),
        method.identity().version(), metadata);
    return new RunResult(info, records, calibrations, results, checks, reruns, verdict, findings);
  }

  /** Sets the limit flags of one line's drafts and marks a possible carry-over after an over-range injection. */
  private static void carryOver(Draft[] d, List<Classified> injections) {
    Draft previous = null;
    for (Classified c : injections) {
      Draft x = d[c.index()];
      if (x != null) {
        ResultWriter.limitFlags(x);
        if (previous != null && previous.flags.contains(ResultFlag.OVER_RANGE) && x.quantified()
            && x.x0 > (Double.isNaN(x.loq) ? 0 : x.loq)) {
          x.flags.add(ResultFlag.CARRY_OVER_SUSPECT);
          x.trace.add("measured right after the over-range injection " + previous.injection.sampleId()
              + " (position " + previous.injection.position() + "): possible carry-over");
        }
      }
      if (c.role() != org.quantrun.core.method.SampleRole.IGNORE) {
        previous = x;
      }
    }
  }

  private static Optional<RerunRequest> rerunOf(Draft x, boolean unbracketed, Shared shared) {
    List<String> reasons = new ArrayList<>();
    Set<ResultFlag> f = x.flags;
    if (f.contains(ResultFlag.CALIBRATION_FAILED) || f.contains(ResultFlag.NOT_CALIBRATED)) {
      reasons.add(x.notReportable.orElse("not calibrated"));
    }
    if (f.contains(ResultFlag.OVER_RANGE)) {
      if (x.suggestedDilution.isPresent()) {
        reasons.add("over range: dilute 1:" + x.suggestedDilution.getAsInt() + " and rerun");
      } else if (x.quantified()) {
        reasons.add("over range by more than a 1:1000 dilution brings into range: dilute stepwise and rerun");
      } else {
        reasons.add("over range (" + x.notReportable.orElse("no estimate of the concentration")
            + "): dilute, e.g. 1:10, and rerun");
      }
    } else if (f.contains(ResultFlag.NO_ROOT_IN_RANGE)) {
      reasons.add(x.notReportable.orElse("no root in range"));
    }
    if (f.contains(ResultFlag.NO_VALID_READINGS) && !f.contains(ResultFlag.OVER_RANGE)) {
      reasons.add(x.notReportable.orElse("no valid reading"));
    }
    if (f.contains(ResultFlag.INTERNAL_STANDARD_FAILED)) {
      reasons.add(x.notReportable.orElse("internal standard recovery outside its window"));
    }
    if (f.contains(ResultFlag.CARRY_OVER_SUSPECT)) {
      reasons.add("possible carry-over from the over-range injection before it");
    }
    reasons.addAll(x.rerunReasons);
    if (unbracketed) {
      reasons.add("not bracketed by a closing CCV");
    }
    if (reasons.isEmpty()) {
      return Optional.empty();
    }
    Set<String> unique = new LinkedHashSet<>(reasons);
    OptionalInt dilution = f.contains(ResultFlag.OVER_RANGE) ? x.suggestedDilution : OptionalInt.empty();
    return Optional.of(new RerunRequest(x.injection.position(), x.injection.sampleId(), x.analyteKey,
        shared.text(String.join("; ", unique)), dilution));
  }

  private static String runId(RawRun run) {
    for (String key : RUN_ID_KEYS) {
      Optional<String> v = run.metadataValue(key).map(String::strip).filter(s -> !s.isEmpty());
      if (v.isPresent()) {
        return v.get();
      }
    }
    String name = run.sourceName();
    int slash = Math.max(name.lastIndexOf('/'), name.lastIndexOf('\\'));
    name = name.substring(slash + 1);
    int dot = name.lastIndexOf('.');
    return dot > 0 ? name.substring(0, dot) : name;
  }

  /** The signals of every analyte line of the run, per injection, found once. */
  private static final class SignalTable {
    private final List<Classified> injections;
    private final Map<AnalyteLine, Integer> lineIndex = new LinkedHashMap<>();
    private final List<LineReadings[]> columns = new ArrayList<>();

    SignalTable(RawRun run, List<Classified> injections) {
      this.injections = injections;
      for (Classified c : injections) {
        Injection inj = c.injection();
        for (LineReadings lr : inj.lines()) {
          Integer k = lineIndex.get(lr.analyteLine());
          if (k == null) {
            k = columns.size();
            lineIndex.put(lr.analyteLine(), k);
            columns.add(new LineReadings[injections.size()]);
          }
          columns.get(k)[c.index()] = lr;
        }
      }
    }

    /** The signals of the exported line matching a method line, or null when the export has none. */
    Signal[] signals(String name, Optional<String> lineOrMass) {
      for (Map.Entry<AnalyteLine, Integer> e : lineIndex.entrySet()) {
        if (LineMatcher.matches(name, lineOrMass, e.getKey())) {
          LineReadings[] col = columns.get(e.getValue());
          Signal[] s = new Signal[col.length];
          for (int j = 0; j < col.length; j++) {
            s[j] = col[j] == null ? null : Signal.of(col[j]);
          }
          return s;
        }
      }
      return null;
    }

    String exportedLabels() {
      List<String> labels = lineIndex.keySet().stream().map(AnalyteLine::label).toList();
      return labels.size() <= 8 ? String.join(", ", labels)
          : String.join(", ", labels.subList(0, 8)) + String.format(Locale.ROOT, ", ... (%d in all)", labels.size());
    }
  }
}
