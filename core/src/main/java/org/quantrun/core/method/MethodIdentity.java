package org.quantrun.core.method;

/**
 * Who the method is.
 *
 * @param id the lab's identifier of the method, never blank
 * @param version the method's version as the lab writes it, never blank
 * @param description free text, possibly empty
 * @param defaultUnit the unit of every analyte that names none
 */
public record MethodIdentity(String id, String version, String description, ConcentrationUnit defaultUnit) {}
