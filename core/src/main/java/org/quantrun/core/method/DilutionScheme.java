package org.quantrun.core.method;

import java.util.Optional;

/**
 * Where dilution factors come from. Every step multiplies: the default factor applies when the
 * export column gives none; a prep sheet's factor multiplies with it.
 *
 * @param defaultFactor the factor of an injection with no other source, at least 1
 * @param factorColumn the export column holding a per-injection factor
 * @param prepSheet the layout of the prep sheet that ties samples to prep batches and makes
 *     results mass-based
 */
public record DilutionScheme(double defaultFactor, Optional<String> factorColumn, Optional<PrepSheetLayout> prepSheet) {}
