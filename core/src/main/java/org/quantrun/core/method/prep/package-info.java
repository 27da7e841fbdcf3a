/**
 * Prep sheets: the CSV file, one row per prepared sample, that gives each sample's prep batch,
 * mass digested, final volume, further dilution and solids fraction, read by the column names a
 * method's {@link org.quantrun.core.method.PrepSheetLayout} gives.
 */
package org.quantrun.core.method.prep;
