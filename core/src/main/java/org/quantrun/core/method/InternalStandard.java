package org.quantrun.core.method;

import java.util.Optional;

/**
 * An internal standard added to every solution of the run.
 *
 * @param name the name analytes refer to it by, e.g. {@code In115}
 * @param element the element, e.g. {@code In}
 * @param line the emission line measured, as the export labels it
 * @param mass the mass measured (ICP-MS)
 */
public record InternalStandard(String name, String element, Optional<String> line, Optional<Integer> mass) {}
