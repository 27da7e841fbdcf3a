package org.quantrun.importer.fixedwidth;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.ByteArrayInputStream;
import java.nio.charset.Charset;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.Optional;
import java.util.regex.Pattern;
import org.junit.jupiter.api.DisplayName;
import org.junit.jupiter.api.Test;
import org.quantrun.core.importer.AnalyteLine;
import org.quantrun.core.importer.FixedField;
import org.quantrun.core.importer.ImportException;
import org.quantrun.core.importer.ImportProfiles;
import org.quantrun.core.importer.ImportSettings;
import org.quantrun.core.importer.Injection;
import org.quantrun.core.importer.LineReadings;
import org.quantrun.core.importer.RawRun;
import org.quantrun.core.importer.Reading;
import org.quantrun.core.importer.RunImporter;
import org.quantrun.importer.testkit.ImporterContract;

class FixedWidthImporterTest extends ImporterContract {

  static final Path REPO = Path.of("../..");

  static final String TABLE = """
      Invented lab listing
      Operator: A. Nonymous

      Seq  Sample          Line          Reading 1  Reading 2
      ---  --------------  ------------  ---------  ---------
        1  CAL-BLK         Cd 228.802        101.5       99.5
        1  CAL-BLK         Pb 220.353        230.0      231.0
        2  STD-1           Cd 228.802       2201.0       OVER
        2  STD-1           Pb 220.353       410.25      411.0
      """;

  @Override
  protected RunImporter importer() {
    return new FixedWidthImporter();
  }

  @Override
  protected ImportSettings settings() {
    return ImportSettings.DEFAULT.toBuilder().alias("analyte_line", List.of("Line")).build();
  }

  @Override
  protected byte[] validSample() {
    return utf8(TABLE);
  }

  @Override
  protected byte[] headerOnly() {
    return utf8(TABLE.substring(0, TABLE.indexOf("  1  CAL-BLK")));
  }

  @Override
  protected byte[] truncatedLastLine() {
    return utf8(TABLE.substring(0, TABLE.length() - 20));
  }

  @Override
  protected byte[] duplicateHeaders() {
    return utf8("Sample   Line        Sample  Reading 1\n-------  ----------  ------  ---------\nA        Cd 228.802  A       1.0\n");
  }

  @Override
  protected byte[] missingRequiredColumn() {
    return utf8("Listing\nSample   Line        Unit\n-------  ----------  ----\nA        Cd 228.802  cps\n");
  }

  @Override
  protected int missingColumnLine() {
    return 2;
  }

  @Override
  protected byte[] wrongEncoding() {
    return TABLE.replace("Operator", "Opérateur").getBytes(Charset.forName("windows-1252"));
  }

  @Override
  protected ImportSettings wrongEncodingSettings() {
    return settings().toBuilder().charset(StandardCharsets.UTF_8).build();
  }

  @Test
  @DisplayName("fields found from the underline row give readings with their character columns")
  void underlineGivesFields() throws ImportException {
    RawRun run = read(validSample(), settings());
    assertEquals(2, run.injections().size());
    assertEquals(Optional.of("A. Nonymous"), run.metadataValue("Operator"));
    LineReadings cd = run.injections().get(1).line(AnalyteLine.of("Cd", "228.802")).orElseThrow();
    assertReading(cd.replicates().get(0), 2201.0);
    assertEquals(8, cd.replicates().get(0).line());
    assertEquals(36, cd.replicates().get(0).column());
    assertFalse(cd.replicates().get(1).isValid());
  }

  @Test
  @DisplayName("fields given by start column and width read the same table without an underline")
  void explicitFields() throws ImportException {
    String body = TABLE.lines().skip(5).reduce("", (a, b) -> a + b + "\n");
    ImportSettings s = settings().toBuilder()
        .fixedField(new FixedField("Seq", 1, 3)).fixedField(new FixedField("Sample", 6, 14))
        .fixedField(new FixedField("Line", 22, 12)).fixedField(new FixedField("Reading 1", 36, 9))
        .fixedField(new FixedField("Reading 2", 47, 9)).build();
    RawRun a = new FixedWidthImporter().read(new ByteArrayInputStream(utf8(body)), s, SOURCE);
    RawRun b = read(validSample(), settings());
    assertEquals(b.injections().stream().map(Injection::sampleId).toList(), a.injections().stream().map(Injection::sampleId).toList());
    assertEquals(b.injections().get(1).lines().get(1).replicates().get(0).value(),
        a.injections().get(1).lines().get(1).replicates().get(0).value());
  }

  @Test
  @DisplayName("the column-field profile reads its example listing, skipping page headers")
  void columnFieldProfile() throws Exception {
    ImportSettings s = ImportProfiles.parse(
        Files.readString(REPO.resolve("config-examples/importers/fixed-width-columns.yaml")), "fixed-width-columns.yaml");
    String text = "Page 1 of 1\n"
        + "0001 W2611-001        Cd 228.802       1201.5    1199.0    1210.2\n"
        + "0001 W2611-001        Pb 220.353        310.0     312.5      OVER\n"
        + "Page 2 of 2\n"
        + "0002 W2611-002        Cd 228.802        501.5     499.0     510.2\n";
    RawRun run = new FixedWidthImporter().read(new ByteArrayInputStream(text.getBytes(Charset.forName("windows-1252"))), s, "l.txt");
    assertEquals(2, run.injections().size());
    assertEquals(2, run.injections().get(1).sequence());
    LineReadings pb = run.injections().get(0).line(AnalyteLine.of("Pb", "220.353")).orElseThrow();
    assertReading(pb.replicates().get(1), 312.5);
    assertFalse(pb.replicates().get(2).isValid());
    assertEquals(58, pb.replicates().get(2).column());
  }

  @Test
  @DisplayName("skip patterns drop matching lines and the data pattern selects the record type")
  void skipAndRecordSelection() throws ImportException {
    String text = TABLE + "  2  STD-1           Note: check\n  average line to skip\n";
    ImportSettings s = settings().toBuilder().skip(Pattern.compile("average"))
        .dataRecordPattern(Pattern.compile("^\\s+\\d+\\s+\\S+\\s+[A-Z][a-z]? \\d")).build();
    assertEquals(2, read(utf8(text), s).injections().size());
  }

  @Test
  @DisplayName("the fixed-width demo report gives the same readings as the long CSV export, plus means and SDs")
  void demoReportMatchesLongExport() throws Exception {
    ImportSettings s = ImportProfiles.parse(
        Files.readString(REPO.resolve("config-examples/importers/fixed-width-report.yaml")), "fixed-width-report.yaml");
    RawRun report;
    try (var in = Files.newInputStream(REPO.resolve("demo-data/run-R2611A-report.txt"))) {
      report = new FixedWidthImporter().read(in, s, "run-R2611A-report.txt");
    }
    assertEquals(38, report.injections().size());
    assertEquals(Optional.of("R2611A"), report.metadataValue("Run"));
    assertEquals(38 * 15 * 5, report.readingCount()); // 3 readings, mean and SD per line
    // values as written in the long CSV export: "29,...? " -- compared field by field below
    List<String> csv = Files.readAllLines(REPO.resolve("demo-data/run-R2611A-long.csv"));
    int row = 1;
    for (Injection i : report.injections()) {
      for (LineReadings l : i.lines()) {
        for (Reading r : l.replicates()) {
          String[] f = csv.get(row++).split(",", -1);
          assertEquals(Integer.parseInt(f[0]), i.sequence());
          assertEquals(f[1], i.sampleId());
          assertEquals(f[4] + " " + f[5], l.analyteLine().label());
          if (r.isValid()) {
            assertEquals(Double.parseDouble(f[7]), r.value(), 0.0);
          } else {
            assertTrue(f[7].equals("OVER") || f[7].equals("----"), f[7]);
          }
        }
      }
    }
    LineReadings fe = report.injections().get(26).line(AnalyteLine.of("Fe", "259.940")).orElseThrow();
    assertEquals("W2611-013", report.injections().get(26).sampleId());
    assertFalse(fe.reportedMean().orElseThrow().isValid());
    assertEquals(Optional.of("over range"), fe.remark());
  }
}
