/**
 * The importer extension point and the normalised model of a raw instrument run.
 *
 * <p>An importer plugin implements {@link org.quantrun.core.importer.RunImporter}: it first
 * {@linkplain org.quantrun.core.importer.RunImporter#detect detects} (gives a confidence from the
 * file name and its first few kilobytes), then {@linkplain org.quantrun.core.importer.RunImporter#read
 * reads} a stream into a {@link org.quantrun.core.importer.RawRun}. How one export variant is laid
 * out is data, an {@link org.quantrun.core.importer.ImportSettings} value, usually loaded from a YAML
 * import profile by {@link org.quantrun.core.importer.ImportProfiles}. Every failure to read is one
 * {@link org.quantrun.core.importer.ImportException} naming source, line and column.
 *
 * <p>{@link org.quantrun.core.importer.TableRunAssembler} turns rows of named cells (whatever
 * their text format) into a {@code RawRun}; the delimited and fixed-width plugins share it, and new
 * plugins may use it too. {@link org.quantrun.core.importer.ImporterSelection} picks an importer by
 * id or by the highest detection confidence.
 */
package org.quantrun.core.importer;
