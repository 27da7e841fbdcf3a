package org.quantrun.core.importer;

/** How a table of readings is laid out. */
public enum Layout {
  /**
   * A row per injection and analyte line (and possibly per replicate): columns name the sample,
   * the analyte line and the reading(s).
   */
  LONG,
  /**
   * A row per injection (or per replicate): one column per analyte line, recognised by a header
   * pattern with named groups.
   */
  WIDE
}
