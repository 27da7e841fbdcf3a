package org.quantrun.core.processing;

import java.util.ArrayList;
import java.util.Comparator;
import java.util.HashSet;
import java.util.LinkedHashMap;
import java.util.LinkedHashSet;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Optional;
import java.util.OptionalDouble;
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
    InjectionColumns.check(run, method);
    List<Classified> injections = InjectionClassifier.classify(run, method);
    List<String> findings = new ArrayList<>();
    unappliedFactors(method, injections, findings);
    repeatedPositions(injections, findings);
    SignalTable table = new SignalTable(run, injections);
    Map<String, InternalStandardWork> isWorks = internalStandards(method, injections, table, findings);

    SamplePrep samplePrep = new SamplePrep(method, prep, injections);
    QcEvaluator qc = new QcEvaluator(method, injections, samplePrep);
    List<Classified> unbracketed = QcEvaluator.unbracketed(injections);
    Set<Integer> unbracketedSet = indexes(unbracketed);

    // One analyte line at a time, start to finish: its QC reads only its own drafts, so each
    // line's drafts and signals are dropped as soon as its results are frozen.
    List<Analyte> analytes = method.analytes();
    List<CalibrationResult> calibrations = new ArrayList<>(analytes.size());
    AnalyteResult[][] resultsByLine = new AnalyteResult[analytes.size()][];
    RerunRequest[][] rerunsByLine = new RerunRequest[analytes.size()][];
    Shared shared = new Shared();
    for (int k = 0; k < analytes.size(); k++) {
      AnalyteLineWork work = analyteLine(analytes.get(k), method, injections, table, isWorks, samplePrep, findings);
      qc.evaluate(work);
      resultsByLine[k] = new AnalyteResult[injections.size()];
      rerunsByLine[k] = new RerunRequest[injections.size()];
      freeze(work.drafts(), injections, method, unbracketedSet, shared, resultsByLine[k], rerunsByLine[k]);
      calibrations.add(work.calibration());
    }
    qc.ccvFrequency();

    List<AnalyteResult> results = inRunOrder(injections, resultsByLine);
    List<RerunRequest> reruns = inRunOrder(injections, rerunsByLine);
    if (!unbracketed.isEmpty()) {
      findings.add("the last " + unbracketed.size() + " real sample" + (unbracketed.size() == 1 ? " is" : "s are")
          + " not followed by a CCV");
    }
    findings.addAll(qc.findings());
    List<QcCheck> checks = checks(isWorks, qc);

    calibrations = List.copyOf(calibrations);
    boolean anyAccepted = calibrations.stream().anyMatch(c -> c.reportedLine() && c.status() == CalibrationStatus.ACCEPTED);
    if (!anyAccepted) {
      findings.add("no reported analyte line has an accepted calibration");
    }
    RunVerdict verdict = verdict(qc.runFailed(), anyAccepted, reruns, checks, calibrations);
    List<InjectionRecord> records = records(injections, samplePrep, method);
    RunInfo info = new RunInfo(runId(run), run.sourceName(), run.importerId(), method.identity().id(),
        method.identity().version(), metadata(run));
    return new RunResult(info, records, calibrations, results, checks, reruns, verdict, findings);
  }

  // The steps of process, each a method of its own: small methods are compiled quickly and alone,
  // and no loop of a long method is compiled on its own again and again.

  /**
   * Notes every calibration solution or check whose factor cell gives a factor other than 1: they
   * are measured as made, so it is not applied.
   */
  private static void unappliedFactors(Method method, List<Classified> injections, List<String> findings) {
    Optional<String> column = method.dilution().factorColumn();
    if (column.isEmpty()) {
      return;
    }
    for (Classified c : injections) {
      OptionalDouble f = InjectionColumns.factor(c.injection(), column.get());
      if (!c.isPrepared() && f.isPresent() && f.getAsDouble() != 1) {
        findings.add("injection " + c.position() + " '" + c.sampleId() + "' (" + c.role().token() + ") has dilution factor "
            + Text.num(f.getAsDouble()) + " in the export's '" + column.get() + "' column; it was not applied, because "
            + "calibration solutions and checks are measured as made");
      }
    }
  }

  /**
   * A finding for each sequence number the export gives to more than one injection (a vial
   * position measured again, two sequences in one file): the rows of their results share that
   * position, so a LIMS keyed by it must tell them apart by sample ID and time.
   */
  private static void repeatedPositions(List<Classified> injections, List<String> findings) {
    Map<Integer, List<Classified>> byPosition = new LinkedHashMap<>();
    for (Classified c : injections) {
      byPosition.computeIfAbsent(c.position(), k -> new ArrayList<>(1)).add(c);
    }
    byPosition.forEach((position, same) -> {
      if (same.size() > 1) {
        List<String> where = same.stream().map(c -> "'" + c.sampleId() + "'"
            + (c.injection().position().line() > 0 ? " at line " + c.injection().position().line() : "")).toList();
        findings.add("the export gives sequence number " + position + " to " + same.size() + " injections ("
            + String.join(", ", where) + "): their results share position " + position
            + "; check the export's sequence column");
      }
    });
  }

  /** The work of every internal standard of the method, by name. */
  private static Map<String, InternalStandardWork> internalStandards(Method method, List<Classified> injections,
      SignalTable table, List<String> findings) {
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
    return isWorks;
  }

  private static Set<Integer> indexes(List<Classified> injections) {
    Set<Integer> set = new HashSet<>();
    injections.forEach(c -> set.add(c.index()));
    return set;
  }

  /** One analyte line through the run: corrections, calibration, limits and quantitation. */
  private static AnalyteLineWork analyteLine(Analyte a, Method method, List<Classified> injections, SignalTable table,
      Map<String, InternalStandardWork> isWorks, SamplePrep samplePrep, List<String> findings) {
    Optional<String> lineOrMass = a.line().or(() -> a.mass().map(String::valueOf));
    Signal[] s = table.signals(a.name(), lineOrMass);
    if (s == null) {
      findings.add("the export has no line " + a.key() + " (it has: " + table.exportedLabels() + ")");
      s = new Signal[injections.size()];
    }
    InternalStandardWork.Correction corr = a.internalStandard().map(n -> isWorks.get(n).correction())
        .orElse(InternalStandardWork.none());
    return new AnalyteLineWork(method, a, injections, s, corr, samplePrep).run();
  }

  /** Flags one line's drafts for carry-over, then freezes them into results and rerun requests. */
  private static void freeze(Draft[] d, List<Classified> injections, Method method, Set<Integer> unbracketed,
      Shared shared, AnalyteResult[] res, RerunRequest[] rr) {
    carryOver(d, injections);
    for (Classified c : injections) {
      Draft x = d[c.index()];
      if (x == null) {
        continue;
      }
      res[c.index()] = ResultWriter.freeze(x, method.reporting(), shared);
      if (c.isRealSample() && x.reportedLine) {
        rr[c.index()] = rerunOf(x, unbracketed.contains(c.index()), shared).orElse(null);
      }
    }
  }

  /** The non-null entries, injection by injection and, within one, analyte line by analyte line. */
  private static <T> List<T> inRunOrder(List<Classified> injections, T[][] byLine) {
    List<T> all = new ArrayList<>();
    for (Classified c : injections) {
      for (T[] line : byLine) {
        T t = line[c.index()];
        if (t != null) {
          all.add(t);
        }
      }
    }
    return all;
  }

  /** Every QC check of the run, internal standards first, ordered by position. */
  private static List<QcCheck> checks(Map<String, InternalStandardWork> isWorks, QcEvaluator qc) {
    List<QcCheck> checks = new ArrayList<>();
    isWorks.values().forEach(w -> checks.addAll(w.checks()));
    checks.addAll(qc.checks());
    checks.sort(Comparator.comparingInt(QcCheck::position));
    return checks;
  }

  private static RunVerdict verdict(boolean runFailed, boolean anyAccepted, List<RerunRequest> reruns,
      List<QcCheck> checks, List<CalibrationResult> calibrations) {
    boolean qcFailed = checks.stream().anyMatch(c -> c.verdict() == Verdict.FAILED);
    return runFailed || !anyAccepted ? RunVerdict.OUT_OF_CONTROL
        : !reruns.isEmpty() || qcFailed || calibrations.stream().anyMatch(c -> c.status() == CalibrationStatus.REJECTED)
            ? RunVerdict.RERUNS_NEEDED : RunVerdict.IN_CONTROL;
  }

  private static List<InjectionRecord> records(List<Classified> injections, SamplePrep samplePrep, Method method) {
    List<InjectionRecord> records = new ArrayList<>();
    for (Classified c : injections) {
      String batch = samplePrep.batch(c);
      double df = samplePrep.of(c, method.identity().defaultUnit()).dilutionFactor();
      records.add(new InjectionRecord(c.position(), c.sampleId(), c.role(), c.level(), c.parent(),
          batch.isEmpty() ? Optional.empty() : Optional.of(batch), df, c.injection().timestamp(), c.identifiedBy()));
    }
    return records;
  }

  /** The run's metadata, the first value of each key. */
  private static Map<String, String> metadata(RawRun run) {
    Map<String, String> metadata = new LinkedHashMap<>();
    for (MetadataEntry m : run.metadata()) {
      metadata.putIfAbsent(m.key(), m.value());
    }
    return metadata;
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
