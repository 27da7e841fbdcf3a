package org.quantrun.runner.plugins.hostile;

import java.io.InputStream;
import org.quantrun.core.importer.ImportSettings;
import org.quantrun.core.importer.RawRun;
import org.quantrun.core.importer.RunImporter;

/**
 * A plugin importer that breaks every rule: its detector overflows the stack and its reader
 * throws an error that is not even an exception. The tests pack it into a plugin jar by hand
 * (it is deliberately not an annotated extension, so the class path does not offer it).
 */
public final class HostileImporter implements RunImporter {

  @Override
  public String id() {
    return "hostile";
  }

  @Override
  public String description() {
    return "breaks on purpose";
  }

  @Override
  public double detect(String fileName, byte[] head) {
    return detect(fileName, head) + 1;
  }

  @Override
  public RawRun read(InputStream in, ImportSettings settings, String sourceName) {
    throw new NoClassDefFoundError("org/example/Missing");
  }
}
