package org.quantrun.core.model;

import java.util.Optional;
import org.quantrun.core.method.SampleRole;

/**
 * One injection as the method classified it.
 *
 * @param position the 1-based sequence position
 * @param sampleId the sample id as exported
 * @param role what the injection is (standard, CCV, sample, duplicate, ...)
 * @param level for a standard, its level's name
 * @param parentSampleId for a duplicate, spike or serial dilution, the sample it was made from
 * @param prepBatch the preparation batch from the prep sheet, if any
 * @param dilutionFactor the product of every dilution step applied to the sample before measurement
 * @param timestamp the acquisition time stamp as exported, if any
 * @param identifiedBy which rule classified it, in plain words (e.g. {@code rule 3: 'STD-(\d)'})
 */
public record InjectionRecord(
    int position,
    String sampleId,
    SampleRole role,
    Optional<String> level,
    Optional<String> parentSampleId,
    Optional<String> prepBatch,
    double dilutionFactor,
    Optional<String> timestamp,
    String identifiedBy) {}
