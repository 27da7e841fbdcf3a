package org.quantrun.core.importer;

import java.io.InputStream;
import org.pf4j.ExtensionPoint;

/**
 * The importer extension point: reads one family of instrument exports into a {@link RawRun}.
 *
 * <p>Detection is kept apart from reading. {@link #detect} looks only at the file name and the
 * first {@link #DETECT_HEAD_BYTES} bytes and says how sure it is that {@link #read} will succeed;
 * {@link #read} then reads the whole stream. Implementations are PF4J extensions
 * ({@code @org.pf4j.Extension}) in a plugin jar, and must be stateless and thread-safe.
 *
 * <p>Contract for {@link #read}: the only exception it throws for bad input of any kind is
 * {@link ImportException}; values that cannot be read become invalid {@link Reading}s; reading the
 * same bytes with the same settings twice gives equal runs; the stream is read, never closed.
 */
public interface RunImporter extends ExtensionPoint {

  /**
   * The version of this extension point, as plugins name it in {@code Plugin-Requires}
   * (e.g. {@code >=1.0.0 & <2.0.0}): the major part changes when the interface or the model
   * changes incompatibly.
   */
  String API_VERSION = "1.0.0";

  /** How many leading bytes of a file {@link #detect} is given (at most). */
  int DETECT_HEAD_BYTES = 8192;

  /**
   * The importer's id, as a method or {@code --importer} names it: lower case letters, digits and
   * hyphens, e.g. {@code delimited}. Never {@code auto}.
   *
   * @return the id
   */
  String id();

  /**
   * One line saying which exports this importer reads.
   *
   * @return the description
   */
  String description();

  /**
   * How confident the importer is that it can read a file, from its name and first bytes only.
   * Never throws for any input.
   *
   * @param fileName the file name without folders (may be empty)
   * @param head the first bytes of the file, at most {@link #DETECT_HEAD_BYTES}
   * @return a confidence from 0 (cannot read it) to 1 (certain)
   */
  double detect(String fileName, byte[] head);

  /**
   * Reads an export into a run.
   *
   * @param in the export's bytes; read to the end (or to the end of its data), not closed
   * @param settings how this export variant is laid out
   * @param sourceName the name used in messages, usually the file name
   * @return the run
   * @throws ImportException when the export cannot be read as a run; the message names the source,
   *     line and column
   */
  RawRun read(InputStream in, ImportSettings settings, String sourceName) throws ImportException;
}
