package org.quantrun.core.model;

import java.util.Optional;
import java.util.OptionalDouble;
import org.quantrun.core.qc.Verdict;

/**
 * One QC check of one analyte line (or of the run, for run-level checks).
 *
 * @param position the sequence position of the QC injection (0 for a run-level check)
 * @param sampleId its sample id (empty text for a run-level check)
 * @param check what kind of check
 * @param analyteKey the analyte line checked (empty text for a run-level check)
 * @param measured the measured concentration (or signal, for an internal standard), if any
 * @param expected the true value, spike amount or reference result it is compared with, if any
 * @param result what the formula gives (a recovery or RPD in %, a difference), if computed
 * @param unitOfResult the unit of {@code result}
 * @param windowLow the lowest acceptable result, if the window has a lower end
 * @param windowHigh the highest acceptable result, if the window has an upper end
 * @param verdict passed, failed or not evaluated
 * @param reason why it failed or was not evaluated, in plain words
 */
public record QcCheck(
    int position,
    String sampleId,
    QcKind check,
    String analyteKey,
    OptionalDouble measured,
    OptionalDouble expected,
    OptionalDouble result,
    String unitOfResult,
    OptionalDouble windowLow,
    OptionalDouble windowHigh,
    Verdict verdict,
    Optional<String> reason) {}
