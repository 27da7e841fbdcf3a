/** Calibration: fitting signal against concentration, inverse prediction and limits. */
package org.quantrun.core.calibration;
