package org.quantrun.core.model;

import java.util.OptionalInt;

/**
 * One sample that must be measured again for one analyte line.
 *
 * @param position the sequence position of the injection to rerun
 * @param sampleId its sample id
 * @param analyteKey the analyte line
 * @param reason why, in plain words
 * @param dilution the further dilution to prepare, when the reason is an over-range result
 */
public record RerunRequest(int position, String sampleId, String analyteKey, String reason, OptionalInt dilution) {}
