package org.quantrun.core.model;

import java.util.List;
import java.util.Objects;

/**
 * Everything quantrun concluded about one run: the injections as classified, each analyte line's
 * calibration, a result per injection and analyte line, the QC checks, what must be rerun, and
 * the run's overall verdict.
 *
 * @param run what was processed, with what
 * @param injections every injection, in sequence order, as the method classified it
 * @param calibrations one per analyte line of the method, in method order
 * @param results one per non-calibration injection and analyte line, in sequence then method order
 * @param qc every QC check, in sequence order
 * @param reruns what must be rerun, in sequence order
 * @param verdict the run's overall verdict
 * @param findings run-level findings in plain words (e.g. a missing CCV), in the order found
 */
public record RunResult(
    RunInfo run,
    List<InjectionRecord> injections,
    List<CalibrationResult> calibrations,
    List<AnalyteResult> results,
    List<QcCheck> qc,
    List<RerunRequest> reruns,
    RunVerdict verdict,
    List<String> findings) {

  /** Copies the lists. */
  public RunResult {
    Objects.requireNonNull(run, "run");
    injections = List.copyOf(injections);
    calibrations = List.copyOf(calibrations);
    results = List.copyOf(results);
    qc = List.copyOf(qc);
    reruns = List.copyOf(reruns);
    Objects.requireNonNull(verdict, "verdict");
    findings = List.copyOf(findings);
  }
}
