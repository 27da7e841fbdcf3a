/**
 * Quality-control checks: the formulas of the trade (recovery, RPD, spike recovery, serial
 * dilution %D, blank limits, replicate %RSD), each judged against a window with three verdicts:
 * passed, failed, or not evaluated (with the reason).
 */
package org.quantrun.core.qc;
