package org.quantrun.importer.example;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;

import java.nio.charset.StandardCharsets;
import java.util.Optional;
import org.junit.jupiter.api.DisplayName;
import org.junit.jupiter.api.Test;
import org.quantrun.core.importer.AnalyteLine;
import org.quantrun.core.importer.ImportException;
import org.quantrun.core.importer.LineReadings;
import org.quantrun.core.importer.RawRun;
import org.quantrun.core.importer.RunImporter;
import org.quantrun.importer.testkit.ImporterContract;

/** The example importer keeps the test kit's contract, plus tests of its own format. */
class BlockImporterTest extends ImporterContract {

  static final String SAMPLE = """
      # run: R2611A
      [CAL-BLK]
      Cd 228.802 = 101.5; 99.5; 100.1
      Pb 220.353 = 230.0; 231.0; 229.4
      [STD-1]
      Cd 228.802 = 2201.0; OVER; 2199.5
      Pb 220.353 = 410.25; 411.0; 409.8
      """;

  @Override
  protected RunImporter importer() {
    return new BlockImporter();
  }

  @Override
  protected byte[] validSample() {
    return utf8(SAMPLE);
  }

  @Override
  protected byte[] headerOnly() {
    return utf8("# run: R2611A\n[CAL-BLK]\n");
  }

  @Override
  protected byte[] truncatedLastLine() {
    return utf8(SAMPLE.substring(0, SAMPLE.length() - 9));
  }

  @Override
  protected byte[] duplicateHeaders() {
    return utf8("[A]\nCd 228.802 = 1\nCd 228.802 = 2\n");
  }

  @Override
  protected byte[] missingRequiredColumn() {
    return utf8("# run: R1\n[A]\nCd 228.802 101.5\n");
  }

  @Override
  protected int missingColumnLine() {
    return 3;
  }

  @Override
  protected byte[] wrongEncoding() {
    return SAMPLE.getBytes(StandardCharsets.UTF_16BE);
  }

  @Test
  @DisplayName("blocks become injections, '# key: value' lines metadata, OVER an invalid reading")
  void readsBlocks() throws ImportException {
    RawRun run = read(validSample(), settings());
    assertEquals(Optional.of("R2611A"), run.metadataValue("run"));
    assertEquals(2, run.injections().size());
    LineReadings cd = run.injections().get(1).line(AnalyteLine.of("Cd", "228.802")).orElseThrow();
    assertReading(cd.replicates().get(0), 2201.0);
    assertFalse(cd.replicates().get(1).isValid());
    assertEquals(6, cd.replicates().get(1).line());
  }

  // found by BlockFuzzTest (inputs kept in its Inputs folder): a blank key or a blank sample id
  // reached the model's constructors, which refuse them with IllegalArgumentException
  @Test
  @DisplayName("a metadata line with a blank key is ignored, not an exception")
  void blankMetadataKeyIsIgnored() throws ImportException {
    RawRun run = read(utf8("#   : zz\n[A]\nCd 228.802 = 1\n"), settings());
    assertEquals(0, run.metadata().size());
    assertEquals(1, run.injections().size());
  }

  @Test
  @DisplayName("a sample id of white space only (a form feed) is an import error naming its line")
  void blankSampleIdIsAnImportError() {
    ImportException e = org.junit.jupiter.api.Assertions.assertThrows(ImportException.class,
        () -> read(utf8("# run: R1\n[\f]\nCd 228.802 = 1\n"), settings()));
    assertEquals(SOURCE + ":2:1: the sample id between [ and ] is empty", e.getMessage());
  }
}
