package org.quantrun.core.method;

import java.util.Optional;
import org.quantrun.core.qc.Window;

/**
 * Every QC check of the method and its acceptance limits. Values are the lab's: the defaults
 * the loader fills in are examples, not rules.
 *
 * @param calibration calibration acceptance
 * @param icv the initial calibration verification
 * @param ccv the continuing calibration verification and its frequency
 * @param lowCheck the low-level check standard, when the method has one
 * @param blanks ICB, CCB and method-blank limits
 * @param lcs the laboratory control sample, when the method has one
 * @param duplicate the sample duplicate rule
 * @param spike the matrix spike, when the method has one
 * @param serialDilution the serial dilution test
 * @param internalStandardRecovery accepted internal-standard recovery, percent
 * @param replicates the readings %RSD limit
 */
public record QcPlan(
    CalibrationAcceptance calibration,
    CheckStandard icv,
    CcvPlan ccv,
    Optional<CheckStandard> lowCheck,
    BlankChecks blanks,
    Optional<CheckStandard> lcs,
    PairRule duplicate,
    Optional<SpikeRule> spike,
    SerialDilutionRule serialDilution,
    Window internalStandardRecovery,
    ReplicateRule replicates) {}
