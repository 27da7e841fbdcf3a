package org.quantrun.importer.testkit;

import java.io.ByteArrayInputStream;
import java.util.Arrays;
import java.util.List;
import org.quantrun.core.importer.ImportException;
import org.quantrun.core.importer.ImportSettings;
import org.quantrun.core.importer.Injection;
import org.quantrun.core.importer.RawRun;
import org.quantrun.core.importer.RunImporter;

/**
 * The checks a fuzz test of an importer makes on each input the fuzzer gives it: detection stays
 * within 0..1, and reading with each of the given settings either gives a well-formed run or an
 * {@link ImportException} whose message starts with the source name. Any other exception or
 * error escapes to the fuzzer, which reports it as a finding.
 *
 * <pre>{@code
 * @FuzzTest
 * void readsAnyBytes(byte[] input) {
 *   FuzzChecks.readOrImportError(new MyImporter(), input, SETTINGS);
 * }
 * }</pre>
 */
public final class FuzzChecks {

  /** The source name inputs are read under. */
  public static final String SOURCE = "fuzz-input.txt";

  private FuzzChecks() {}

  /**
   * The default settings followed by the example import profiles of the repository (read from
   * {@code config-examples/importers}, two folders above an importer module).
   *
   * @param profiles file names of example profiles
   * @return the settings, defaults first
   * @throws IllegalStateException if a profile cannot be read
   */
  public static List<ImportSettings> defaultsAndExampleProfiles(String... profiles) {
    List<ImportSettings> out = new java.util.ArrayList<>(List.of(ImportSettings.DEFAULT));
    for (String name : profiles) {
      java.nio.file.Path p = java.nio.file.Path.of("../../config-examples/importers").resolve(name);
      try {
        out.add(org.quantrun.core.importer.ImportProfiles.parse(java.nio.file.Files.readString(p), name));
      } catch (java.io.IOException | ImportException e) {
        throw new IllegalStateException("example profile " + name + " cannot be read: " + e.getMessage(), e);
      }
    }
    return List.copyOf(out);
  }

  /**
   * Detects and reads one input with each settings.
   *
   * @param importer the importer under test
   * @param input the fuzzer's bytes
   * @param settings the settings to read the input with, one read each
   * @throws IllegalStateException when a run or an import error breaks the importer contract
   */
  public static void readOrImportError(RunImporter importer, byte[] input, List<ImportSettings> settings) {
    double c = importer.detect(SOURCE, Arrays.copyOf(input, Math.min(input.length, RunImporter.DETECT_HEAD_BYTES)));
    if (!(c >= 0 && c <= 1)) {
      throw new IllegalStateException("detect gave confidence " + c + ", outside 0..1");
    }
    for (ImportSettings s : settings) {
      try {
        RawRun run = importer.read(new ByteArrayInputStream(input), s, SOURCE);
        check(run, importer);
      } catch (ImportException e) {
        if (!e.getMessage().startsWith(SOURCE) || e.problem().isBlank()) {
          throw new IllegalStateException("an import error must name the source and say what is wrong: " + e.getMessage());
        }
      }
    }
  }

  private static void check(RawRun run, RunImporter importer) {
    if (!run.sourceName().equals(SOURCE) || !run.importerId().equals(importer.id())) {
      throw new IllegalStateException("run names source '" + run.sourceName() + "' and importer '" + run.importerId() + "'");
    }
    for (Injection i : run.injections()) {
      if (i.sampleId().isBlank()) {
        throw new IllegalStateException("an injection without a sample id at " + i.position().text());
      }
    }
  }
}
