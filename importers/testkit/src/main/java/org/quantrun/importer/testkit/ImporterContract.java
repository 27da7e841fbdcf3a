package org.quantrun.importer.testkit;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertNotNull;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;
import static org.junit.jupiter.api.Assertions.fail;

import java.io.ByteArrayInputStream;
import java.nio.charset.StandardCharsets;
import java.util.Arrays;
import java.util.Optional;
import java.util.Random;
import org.junit.jupiter.api.DisplayName;
import org.junit.jupiter.api.Test;
import org.quantrun.core.importer.ImportException;
import org.quantrun.core.importer.ImportSettings;
import org.quantrun.core.importer.Injection;
import org.quantrun.core.importer.LineReadings;
import org.quantrun.core.importer.RawRun;
import org.quantrun.core.importer.Reading;
import org.quantrun.core.importer.RunImporter;

/**
 * The contract every importer must keep, as JUnit 5 tests. An importer's test class extends this
 * and supplies its sample files; the kit supplies the generic hostile ones (empty file, binary
 * garbage, a 10 MB line, random corruptions of the valid sample).
 *
 * <p>What is checked: an empty file, binary garbage and a missing required column are import
 * errors (the last naming the line and column the subclass expects); the limits of the settings
 * (file size, also of an endless stream, injections, analyte lines) are import errors naming the
 * limit; every other sample either
 * reads or is an import error, never any other exception; reading the same bytes twice gives
 * equal runs; detection never throws and stays within 0..1; a valid sample reads with positions
 * on every reading.
 */
public abstract class ImporterContract {

  /** The source name the kit reads every sample under. */
  protected static final String SOURCE = "sample.txt";

  /** @return the importer under test */
  protected abstract RunImporter importer();

  /** @return the settings the samples are read with */
  protected ImportSettings settings() {
    return ImportSettings.DEFAULT;
  }

  /** @return a valid export in the importer's format with at least two injections */
  protected abstract byte[] validSample();

  /** @return the header (and any preamble) of a valid export, no data rows */
  protected abstract byte[] headerOnly();

  /** @return a valid export whose last line is cut in the middle */
  protected abstract byte[] truncatedLastLine();

  /** @return an export whose header gives the same column twice */
  protected abstract byte[] duplicateHeaders();

  /** @return an export whose header lacks a required column */
  protected abstract byte[] missingRequiredColumn();

  /** @return the 1-based line the missing-column error must name */
  protected abstract int missingColumnLine();

  /**
   * An export in the wrong encoding for the {@linkplain #settings() settings}, e.g. UTF-16
   * without a byte-order mark, or Windows-1252 bytes where UTF-8 is declared.
   *
   * @return the bytes
   */
  protected abstract byte[] wrongEncoding();

  /** @return the settings {@link #wrongEncoding()} is read with (default {@link #settings()}) */
  protected ImportSettings wrongEncodingSettings() {
    return settings();
  }

  /** @return a valid sample with one 10 MB line appended; override to place it elsewhere */
  protected byte[] tenMegabyteLine() {
    byte[] start = validSample();
    byte[] out = Arrays.copyOf(start, start.length + 10 * 1024 * 1024 + 1);
    Arrays.fill(out, start.length, out.length - 1, (byte) '7');
    out[out.length - 1] = '\n';
    return out;
  }

  /** @return 64 KB of random bytes (fixed seed) */
  protected static byte[] binaryGarbage() {
    byte[] b = new byte[64 * 1024];
    new Random(20261126L).nextBytes(b);
    return b;
  }

  /**
   * UTF-8 bytes of a text.
   *
   * @param text the text
   * @return the bytes
   */
  protected static byte[] utf8(String text) {
    return text.getBytes(StandardCharsets.UTF_8);
  }

  /**
   * Reads bytes with the importer.
   *
   * @param bytes the export
   * @param settings the settings
   * @return the run
   * @throws ImportException as the importer throws it
   */
  protected final RawRun read(byte[] bytes, ImportSettings settings) throws ImportException {
    return importer().read(new ByteArrayInputStream(bytes), settings, SOURCE);
  }

  /**
   * Reads bytes and fails the test for any exception other than {@link ImportException}.
   *
   * @param bytes the export
   * @param settings the settings
   * @return the run, or empty when the importer reported an import error
   */
  protected final Optional<RawRun> readOrImportError(byte[] bytes, ImportSettings settings) {
    try {
      return Optional.of(read(bytes, settings));
    } catch (ImportException e) {
      assertTrue(e.getMessage().startsWith(SOURCE), () -> "message must start with the source name: " + e.getMessage());
      assertFalse(e.problem().isBlank(), "an import error says what is wrong");
      return Optional.empty();
    } catch (RuntimeException | Error e) {
      throw new AssertionError("only ImportException may escape read, got " + e, e);
    }
  }

  private void readsTwiceEqual(byte[] bytes, ImportSettings settings) {
    Optional<RawRun> first = readOrImportError(bytes, settings);
    Optional<RawRun> second = readOrImportError(bytes, settings);
    assertEquals(first, second, "reading the same bytes twice gives equal runs (or the same failure)");
  }

  @Test
  @DisplayName("the id is lower case and not 'auto', and there is a description")
  void idAndDescriptionAreUsable() {
    assertTrue(importer().id().matches("[a-z][a-z0-9-]*"), importer().id());
    assertFalse(importer().id().equals(ImportSettings.AUTO));
    assertFalse(importer().description().isBlank());
  }

  @Test
  @DisplayName("a valid sample reads into injections whose readings all carry a source line")
  void validSampleReads() throws ImportException {
    RawRun run = read(validSample(), settings());
    assertEquals(SOURCE, run.sourceName());
    assertEquals(importer().id(), run.importerId());
    assertTrue(run.injections().size() >= 2, "at least two injections");
    for (Injection i : run.injections()) {
      assertFalse(i.sampleId().isBlank());
      assertTrue(i.position().line() >= 1);
      for (LineReadings l : i.lines()) {
        for (Reading r : l.replicates()) {
          assertTrue(r.line() >= 1 && r.column() >= 1, () -> "reading without a position in " + i.sampleId());
        }
      }
    }
  }

  @Test
  @DisplayName("reading the same valid bytes twice gives equal runs")
  void readingIsRepeatable() throws ImportException {
    assertEquals(read(validSample(), settings()), read(validSample(), settings()));
  }

  @Test
  @DisplayName("an empty file is an import error")
  void emptyFileIsAnImportError() {
    ImportException e = assertThrows(ImportException.class, () -> read(new byte[0], settings()));
    assertTrue(e.getMessage().startsWith(SOURCE));
  }

  @Test
  @DisplayName("a header with no data rows gives no exception other than an import error")
  void headerOnlyIsHandled() {
    readsTwiceEqual(headerOnly(), settings());
    readOrImportError(headerOnly(), settings()).ifPresent(run -> assertTrue(run.injections().isEmpty()));
  }

  @Test
  @DisplayName("a truncated last line gives a run or an import error, the same each time")
  void truncatedLastLineIsHandled() {
    readsTwiceEqual(truncatedLastLine(), settings());
  }

  @Test
  @DisplayName("binary garbage is an import error")
  void binaryGarbageIsAnImportError() {
    assertTrue(readOrImportError(binaryGarbage(), settings()).isEmpty(), "binary garbage must not read as a run");
  }

  @Test
  @DisplayName("a 10 MB line gives a run or an import error, never another exception")
  void tenMegabyteLineIsHandled() {
    readOrImportError(tenMegabyteLine(), settings());
  }

  @Test
  @DisplayName("text in the wrong encoding gives a run or an import error, the same each time")
  void wrongEncodingIsHandled() {
    readsTwiceEqual(wrongEncoding(), wrongEncodingSettings());
  }

  @Test
  @DisplayName("a header giving the same column twice is an import error naming its line")
  void duplicateHeadersAreAnImportError() {
    ImportException e = assertThrows(ImportException.class, () -> read(duplicateHeaders(), settings()));
    assertTrue(e.position().line() >= 1, e.getMessage());
  }

  @Test
  @DisplayName("a missing required column is an import error naming line and column")
  void missingRequiredColumnNamesLineAndColumn() {
    ImportException e = assertThrows(ImportException.class, () -> read(missingRequiredColumn(), settings()));
    assertEquals(missingColumnLine(), e.position().line(), e.getMessage());
    assertTrue(e.position().column() >= 1, () -> "no column in: " + e.getMessage());
    assertTrue(e.getMessage().startsWith(SOURCE + ":" + missingColumnLine() + ":" + e.position().column() + ": "),
        e.getMessage());
  }

  @Test
  @DisplayName("300 random corruptions of the valid sample give runs or import errors, never another exception")
  void corruptedSamplesGiveOnlyImportErrors() {
    byte[] valid = validSample();
    byte[] noise = {',', ';', '\t', '|', '"', '\n', '\r', ' ', '-', '.', 'x', '0', '9', '[', ']', '=', '#', ':',
        (byte) 0xFF, (byte) 0xC3, 0};
    Random rnd = new Random(7);
    for (int i = 0; i < 300; i++) {
      byte[] b = valid.clone();
      int edits = 1 + rnd.nextInt(4);
      for (int k = 0; k < edits && b.length > 0; k++) {
        switch (rnd.nextInt(3)) {
          case 0 -> b[rnd.nextInt(b.length)] = noise[rnd.nextInt(noise.length)];
          case 1 -> b = Arrays.copyOf(b, rnd.nextInt(b.length));
          default -> {
            int at = rnd.nextInt(b.length);
            int len = Math.min(b.length - at, 1 + rnd.nextInt(40));
            byte[] out = Arrays.copyOf(b, b.length - len);
            System.arraycopy(b, at + len, out, at, b.length - at - len);
            b = out;
          }
        }
      }
      byte[] sample = b;
      readsTwiceEqual(sample, settings());
      importer().detect("sample.txt", head(sample));
    }
  }

  @Test
  @DisplayName("an export larger than max_file_bytes is an import error that names the limit")
  void fileSizeLimitIsAnImportError() {
    byte[] valid = validSample();
    ImportSettings small = settings().toBuilder().maxFileBytes(valid.length / 2).build();
    ImportException e = assertThrows(ImportException.class, () -> read(valid, small));
    assertTrue(e.getMessage().contains("max_file_bytes"), e.getMessage());
    assertTrue(e.getMessage().startsWith(SOURCE), e.getMessage());
  }

  @Test
  @DisplayName("an endless stream is refused at max_file_bytes, not read until memory runs out")
  void endlessStreamIsRefusedAtTheSizeLimit() {
    byte[] valid = validSample();
    java.io.InputStream endless = new java.io.InputStream() {
      private long at;

      @Override
      public int read() {
        return valid[(int) (at++ % valid.length)] & 0xFF;
      }

      @Override
      public int read(byte[] b, int off, int len) {
        for (int i = 0; i < len; i++) {
          b[off + i] = valid[(int) (at++ % valid.length)];
        }
        return len;
      }
    };
    ImportSettings limited = settings().toBuilder().maxFileBytes(4L << 20).build();
    try {
      importer().read(endless, limited, SOURCE);
      fail("an endless stream must not read as a run");
    } catch (ImportException e) {
      assertTrue(e.getMessage().startsWith(SOURCE), e.getMessage());
    }
  }

  @Test
  @DisplayName("more injections than max_injections is an import error that names the limit")
  void injectionLimitIsAnImportError() {
    ImportSettings one = settings().toBuilder().maxInjections(1).build();
    ImportException e = assertThrows(ImportException.class, () -> read(validSample(), one));
    assertTrue(e.getMessage().contains("more than 1 injections (max_injections"), e.getMessage());
    assertTrue(e.position().line() >= 1, e.getMessage());
  }

  @Test
  @DisplayName("more analyte lines than max_analyte_lines is an import error that names the limit")
  void analyteLineLimitIsAnImportError() throws ImportException {
    int lines = read(validSample(), settings()).analyteLines().size();
    org.junit.jupiter.api.Assumptions.assumeTrue(lines >= 2, "the valid sample has a single analyte line");
    ImportSettings fewer = settings().toBuilder().maxAnalyteLines(lines - 1).build();
    ImportException e = assertThrows(ImportException.class, () -> read(validSample(), fewer));
    assertTrue(e.getMessage().contains("analyte lines (max_analyte_lines"), e.getMessage());
  }

  @Test
  @DisplayName("detection never throws and stays within 0..1 for every sample, and is above 0 for a valid one")
  void detectionIsSafe() {
    byte[][] samples = {new byte[0], binaryGarbage(), headerOnly(), truncatedLastLine(), duplicateHeaders(),
        missingRequiredColumn(), wrongEncoding(), head(validSample())};
    for (byte[] s : samples) {
      double c;
      try {
        c = importer().detect("sample.txt", head(s));
      } catch (RuntimeException e) {
        fail("detect threw " + e);
        return;
      }
      assertTrue(c >= 0 && c <= 1, "confidence " + c);
    }
    assertTrue(importer().detect("sample.txt", head(validSample())) > 0, "a valid sample is recognised");
  }

  private static byte[] head(byte[] all) {
    return Arrays.copyOf(all, Math.min(all.length, RunImporter.DETECT_HEAD_BYTES));
  }

  /**
   * Checks a reading is valid with a value.
   *
   * @param r the reading
   * @param expected the expected value
   */
  protected static void assertReading(Reading r, double expected) {
    assertNotNull(r);
    assertTrue(r.isValid(), () -> "invalid: " + r.invalidReason());
    assertEquals(expected, r.value(), Math.abs(expected) * 1e-12);
  }
}
