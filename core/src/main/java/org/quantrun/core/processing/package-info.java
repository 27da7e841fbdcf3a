/** The run processor: from a raw run and a method to QC-checked results for every analyte. */
package org.quantrun.core.processing;
