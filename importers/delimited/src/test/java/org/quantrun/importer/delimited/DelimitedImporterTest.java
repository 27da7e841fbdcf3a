package org.quantrun.importer.delimited;

import static org.junit.jupiter.api.Assertions.assertDoesNotThrow;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.ByteArrayInputStream;
import java.io.IOException;
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
import org.quantrun.core.importer.ImportException;
import org.quantrun.core.importer.ImportProfiles;
import org.quantrun.core.importer.ImportSettings;
import org.quantrun.core.importer.Injection;
import org.quantrun.core.importer.Layout;
import org.quantrun.core.importer.LineReadings;
import org.quantrun.core.importer.RawRun;
import org.quantrun.core.importer.Reading;
import org.quantrun.core.importer.RunImporter;
import org.quantrun.importer.testkit.ImporterContract;

class DelimitedImporterTest extends ImporterContract {

  static final Path REPO = Path.of("../..");

  static final String LONG = """
      Seq,Sample ID,Element,Wavelength,Rep,Intensity,Unit
      1,CAL-BLK,Cd,228.802,1,101.5,cps
      1,CAL-BLK,Cd,228.802,2,99.5,cps
      1,CAL-BLK,Pb,220.353,1,230.0,cps
      2,STD-1,Cd,228.802,1,2201.0,cps
      2,STD-1,Cd,228.802,2,OVER,cps
      2,STD-1,Pb,220.353,1,410.25,cps
      """;

  @Override
  protected RunImporter importer() {
    return new DelimitedImporter();
  }

  @Override
  protected byte[] validSample() {
    return utf8(LONG);
  }

  @Override
  protected byte[] headerOnly() {
    return utf8("Seq,Sample ID,Element,Wavelength,Rep,Intensity,Unit\n");
  }

  @Override
  protected byte[] truncatedLastLine() {
    return utf8(LONG.substring(0, LONG.length() - 12));
  }

  @Override
  protected byte[] duplicateHeaders() {
    return utf8("Sample ID,Element,Intensity,Sample Name\nA,Cd,1,A\n");
  }

  @Override
  protected byte[] missingRequiredColumn() {
    return utf8("Run,R1\nSample ID,Element,Wavelength,Unit\nA,Cd,228.802,cps\n");
  }

  @Override
  protected int missingColumnLine() {
    return 2;
  }

  @Override
  protected byte[] wrongEncoding() {
    return LONG.replace("cps", "µg/L").getBytes(StandardCharsets.UTF_16LE);
  }

  private static RawRun read(String text, ImportSettings s) throws ImportException {
    return new DelimitedImporter().read(new ByteArrayInputStream(text.getBytes(StandardCharsets.UTF_8)), s, "run.csv");
  }

  // Two columns whose names both mean one field (common practice: exports often carry a "Sample
  // Name" beside a "Sample ID", or a "Type" beside a "Sample Type").
  static final String TWO_IDS = """
      Seq,Sample ID,Sample Type,Element,Wavelength,Intensity,Sample Name,Type
      1,CAL-BLK,BLANK,Cd,228.802,101.5,blank of day,X
      2,W-17,SAMPLE,Cd,228.802,2201.0,well 17 north,Y
      """;

  @Test
  @DisplayName("two header names for one field refuse the read, naming both columns and the profile key that settles it")
  void twoNamesForOneFieldAreRefusedWithTheWayOut() {
    ImportException e = assertThrows(ImportException.class, () -> read(TWO_IDS, ImportSettings.DEFAULT));
    assertEquals("run.csv:1:7: duplicate header: columns 2 (\"Sample ID\") and 7 (\"Sample Name\") both give sample_id"
        + " (the import profile's columns.sample_id can name the one to read)", e.getMessage());
  }

  @Test
  @DisplayName("a header name the profile gives for a field wins over a built-in name; the other is a plain column")
  void profileNameWinsOverBuiltInName() throws ImportException {
    ImportSettings s = ImportSettings.DEFAULT.toBuilder().alias("sample_id", List.of("Sample Name"))
        .alias("sample_type", List.of("Sample Type")).build();
    RawRun run = read(TWO_IDS, s);
    assertEquals(List.of("blank of day", "well 17 north"), run.injections().stream().map(Injection::sampleId).toList());
    assertEquals(Optional.of("SAMPLE"), run.injections().get(1).sampleType());
    assertTrue(run.hasColumn("Sample ID") && run.hasColumn("Type"), run.columns().toString());
    // two names the profile gives, both in the header, are as ambiguous as two built-in ones
    ImportSettings both = ImportSettings.DEFAULT.toBuilder().alias("sample_id", List.of("Sample Name", "Sample ID")).build();
    ImportException e = assertThrows(ImportException.class, () -> read(TWO_IDS, both));
    assertTrue(e.getMessage().startsWith("run.csv:1:7: duplicate header: columns 2 (\"Sample ID\") and 7"), e.getMessage());
  }

  @Test
  @DisplayName("a header name with its unit in brackets after it is the column of that name, and gives the unit")
  void headerNameWithUnitInBrackets() throws ImportException {
    // common practice: many exports write the unit after the column name, "Intensity (cps)"
    String text = "Sample ID;Element;Wavelength (nm);Intensity (cps)\nA;Cd;228.802;1.5E+03\nB;Cd;228.802;20\n";
    RawRun run = read(text, ImportSettings.DEFAULT);
    LineReadings a = run.injections().get(0).lines().get(0);
    assertEquals(AnalyteLine.of("Cd", "228.802"), a.analyteLine());
    assertReading(a.replicates().get(0), 1500.0);
    assertEquals(Optional.of("cps"), a.unit());
    // a unit column wins over the unit in brackets
    RawRun withUnit = read("Sample ID,Element,Signal [counts],Unit\nA,Cd 228.802,7,cps\n", ImportSettings.DEFAULT);
    assertEquals(Optional.of("cps"), withUnit.injections().get(0).lines().get(0).unit());
  }

  @Test
  @DisplayName("the header repeated further down (an export printed page by page) is skipped; a row that only starts like it is data")
  void repeatedHeaderIsSkipped() throws ImportException {
    // common practice: exports printed or saved page by page repeat the header on every page
    String header = LONG.lines().findFirst().orElseThrow();
    String paged = LONG.replace("2,STD-1,Cd,228.802,1,", header + "\n2,STD-1,Cd,228.802,1,");
    assertEquals(LONG.lines().count() + 1, paged.lines().count());
    RawRun run = read(paged, ImportSettings.DEFAULT);
    RawRun plain = read(LONG, ImportSettings.DEFAULT);
    assertEquals(plain.injections().stream().map(i -> i.sampleId() + i.lines().size()).toList(),
        run.injections().stream().map(i -> i.sampleId() + i.lines().size()).toList());
    String almost = LONG.replace("2,STD-1,Cd,228.802,1,", "Seq,Sample ID,Element,Wavelength,Rep,Intensity,cps\n2,STD-1,Cd,228.802,1,");
    ImportException e = assertThrows(ImportException.class, () -> read(almost, ImportSettings.DEFAULT));
    assertTrue(e.getMessage().startsWith("run.csv:5:1: sequence \"Seq\" is not a whole number"), e.getMessage());
  }

  @Test
  @DisplayName("with a decimal comma, a wavelength written 228,802 is line 228.802, the way a method writes it")
  void decimalCommaWavelengthIsTheLine() throws ImportException {
    // common practice: exports of labs that write decimal commas write wavelengths the same way
    ImportSettings eu = ImportSettings.DEFAULT.toBuilder().delimiter(';').decimalSeparator(',').build();
    RawRun longRun = read("Sample ID;Element;Wavelength;Intensity\nA;Cd;228,802;1,5\nA;Cd;111;2\n", eu);
    assertEquals(List.of(AnalyteLine.of("Cd", "228.802"), AnalyteLine.of("Cd", "111")),
        longRun.injections().get(0).lines().stream().map(LineReadings::analyteLine).toList());
    assertReading(longRun.injections().get(0).lines().get(0).replicates().get(0), 1.5);
    RawRun wide = read("Sample;Cd 228,802 [cps];Pb 220,353 [cps]\nA;10,5;20\n", eu.toBuilder().layout(Layout.WIDE).build());
    assertEquals(List.of(AnalyteLine.of("Cd", "228.802"), AnalyteLine.of("Pb", "220.353")),
        wide.injections().get(0).lines().stream().map(LineReadings::analyteLine).toList());
    // with a decimal point the text stays as written
    RawRun point = read("Sample ID;Element;Wavelength;Intensity\nA;Cd;228,802;1.5\n", ImportSettings.DEFAULT.toBuilder()
        .delimiter(';').build());
    assertEquals(AnalyteLine.of("Cd", "228,802"), point.injections().get(0).lines().get(0).analyteLine());
  }

  @Test
  @DisplayName("a replicate number given twice for one line of an injection is refused, naming both lines")
  void replicateGivenTwiceIsRefused() {
    // common practice: a row exported twice would count its reading twice in the mean
    String twice = LONG.replace("1,CAL-BLK,Cd,228.802,2,99.5,cps\n", "1,CAL-BLK,Cd,228.802,1,101.5,cps\n");
    ImportException e = assertThrows(ImportException.class, () -> read(twice, ImportSettings.DEFAULT));
    assertEquals("run.csv:3:5: replicate 1 of Cd 228.802 is given twice for injection 1 'CAL-BLK' (lines 2 and 3)",
        e.getMessage());
    String noSeq = "Sample ID,Element,Rep,Intensity\nA,Cd,1,5\nA,Cd,2,6\nA,Cd,1,7\n";
    ImportException n = assertThrows(ImportException.class, () -> read(noSeq, ImportSettings.DEFAULT));
    assertTrue(n.getMessage().startsWith("run.csv:4:3: replicate 1 of Cd is given twice for injection 1 'A' (lines 2 and 4);"
        + " without a sequence column"), n.getMessage());
    // the same replicate number on two lines of one injection is no repeat
    assertDoesNotThrow(() -> read(LONG, ImportSettings.DEFAULT));
  }

  @Test
  @DisplayName("ICP-MS channel labels written mass first, or with a hyphen, give the element and the mass")
  void massFirstChannelLabels() throws ImportException {
    // common practice: ICP-MS software labels isotopes "111Cd", "208Pb (He)" or "Cd-111"
    String text = "Sample ID,Channel,Intensity\nA,111Cd,1\nA,208Pb (He),2\nA,Cu-63,3\nA,7Li [NoGas],4\nA,Unknown X,5\n";
    RawRun run = read(text, ImportSettings.DEFAULT);
    assertEquals(List.of(AnalyteLine.of("Cd", "111"), AnalyteLine.of("Pb", "208 (He)"), AnalyteLine.of("Cu", "63"),
        AnalyteLine.of("Li", "7 [NoGas]"), AnalyteLine.of("Unknown X", "")),
        run.injections().get(0).lines().stream().map(LineReadings::analyteLine).toList());
    RawRun wide = read("Sample,111Cd [cps],208Pb [cps],208Pb sd\nA,10,20,0.5\n",
        ImportSettings.DEFAULT.toBuilder().layout(Layout.WIDE).build());
    LineReadings pb = wide.injections().get(0).lines().get(1);
    assertEquals(List.of(AnalyteLine.of("Cd", "111"), AnalyteLine.of("Pb", "208")),
        wide.injections().get(0).lines().stream().map(LineReadings::analyteLine).toList());
    assertEquals(Optional.of("cps"), pb.unit());
    assertReading(pb.reportedSd().orElseThrow(), 0.5);
  }

  @Test
  @DisplayName("with the profile's delimiter wrong for the file, the missing header error names the delimiter the lines show")
  void wrongFixedDelimiterIsNamed() {
    ImportSettings comma = ImportSettings.DEFAULT.toBuilder().delimiter(',').build();
    ImportException e = assertThrows(ImportException.class, () -> read(LONG.replace(',', ';'), comma));
    assertTrue(e.getMessage().startsWith("run.csv: no header line with the required columns found"), e.getMessage());
    assertTrue(e.getMessage().endsWith("; the import profile sets the delimiter ',', but the lines look separated by ';'"
        + " (delimiter: auto detects it)"), e.getMessage());
    // the same file with the delimiter detected reads
    assertDoesNotThrow(() -> read(LONG.replace(',', ';'), ImportSettings.DEFAULT));
  }

  @Test
  @DisplayName("long layout groups rows into injections and analyte lines, keeping line and column of each reading")
  void longLayoutGroupsRows() throws ImportException {
    RawRun run = read(LONG, ImportSettings.DEFAULT);
    assertEquals(2, run.injections().size());
    Injection std = run.injections().get(1);
    assertEquals(2, std.sequence());
    assertEquals("STD-1", std.sampleId());
    LineReadings cd = std.line(AnalyteLine.of("Cd", "228.802")).orElseThrow();
    assertEquals(Optional.of("cps"), cd.unit());
    assertReading(cd.replicates().get(0), 2201.0);
    assertEquals(5, cd.replicates().get(0).line());
    assertEquals(6, cd.replicates().get(0).column());
    Reading over = cd.replicates().get(1);
    assertFalse(over.isValid());
    assertTrue(over.invalidReason().orElseThrow().contains("OVER"));
    assertEquals(6, over.line());
  }

  @Test
  @DisplayName("a semicolon file with decimal commas and thousands points is read once the separators are set")
  void decimalCommaAndGrouping() throws ImportException {
    String text = "Sample;Element;Intensity\nA;Cd;1.234,5\nA;Pb;12,25\n";
    ImportSettings s = ImportSettings.DEFAULT.toBuilder().decimalSeparator(',').groupingSeparator('.').build();
    RawRun run = read(text, s);
    assertReading(run.injections().get(0).lines().get(0).replicates().get(0), 1234.5);
    assertReading(run.injections().get(0).lines().get(1).replicates().get(0), 12.25);
  }

  @Test
  @DisplayName("a number in the wrong format is an import error naming line, column and the text")
  void badNumberNamesLineAndColumn() {
    String text = "Sample,Element,Intensity\nA,Cd,1\nB,Cd,\"12,5.3\"\n";
    ImportException e = assertThrows(ImportException.class, () -> read(text, ImportSettings.DEFAULT));
    assertTrue(e.getMessage().startsWith("run.csv:3:3: Intensity \"12,5.3\" is not a number"), e.getMessage());
  }

  @Test
  @DisplayName("empty cells and instrument markers become invalid readings with a reason, not errors")
  void markersAreInvalidReadings() throws ImportException {
    String text = "Sample,Element,Intensity\nA,Cd,----\nA,Pb,n/a\nA,Zn,\n";
    RawRun run = read(text, ImportSettings.DEFAULT);
    for (LineReadings l : run.injections().get(0).lines()) {
      assertFalse(l.replicates().get(0).isValid(), l.analyteLine().label());
      assertTrue(l.replicates().get(0).invalidReason().isPresent());
    }
  }

  @Test
  @DisplayName("the delimiter is detected among comma, semicolon, tab and pipe")
  void delimiterIsDetected() throws ImportException {
    for (String d : List.of(",", ";", "\t", "|")) {
      String text = String.join(d, "Sample", "Element", "Intensity") + "\n" + String.join(d, "A", "Cd", "5") + "\n"
          + String.join(d, "B", "Cd", "6") + "\n";
      RawRun run = read(text, ImportSettings.DEFAULT);
      assertEquals(2, run.injections().size(), "delimiter '" + d + "'");
    }
  }

  @Test
  @DisplayName("quoted fields may hold the delimiter and line breaks; line numbers still count source lines")
  void quotedFields() throws ImportException {
    String text = "Sample,Element,Intensity,Remark\n\"A,1\",Cd,5,\"two\nlines\"\nB,Cd,6,\n";
    RawRun run = read(text, ImportSettings.DEFAULT);
    assertEquals("A,1", run.injections().get(0).sampleId());
    assertEquals(Optional.of("two\nlines"), run.injections().get(0).lines().get(0).remark());
    assertEquals(4, run.injections().get(1).position().line());
  }

  @Test
  @DisplayName("UTF-8 with a BOM, UTF-16 with a BOM and Windows-1252 all read the same")
  void charsets() throws ImportException {
    String text = "Sample,Element,Intensity,Unit\nA,Cd,5,µg/L\nB,Cd,6,µg/L\n";
    RawRun plain = read(text, ImportSettings.DEFAULT);
    byte[] bom8 = concat(new byte[] {(byte) 0xEF, (byte) 0xBB, (byte) 0xBF}, text.getBytes(StandardCharsets.UTF_8));
    byte[] bom16 = concat(new byte[] {(byte) 0xFF, (byte) 0xFE}, text.getBytes(StandardCharsets.UTF_16LE));
    byte[] cp1252 = text.getBytes(Charset.forName("windows-1252"));
    for (byte[] b : List.of(bom8, bom16, cp1252)) {
      RawRun r = new DelimitedImporter().read(new ByteArrayInputStream(b), ImportSettings.DEFAULT, "run.csv");
      assertEquals(plain, r);
      assertEquals(Optional.of("µg/L"), r.injections().get(0).lines().get(0).unit());
    }
  }

  @Test
  @DisplayName("metadata lines before the header become key/value entries with their lines")
  void preambleIsMetadata() throws ImportException {
    String text = "Laboratory,Invented Lab\nRun: R1\n\nSample,Element,Intensity\nA,Cd,5\n";
    RawRun run = read(text, ImportSettings.DEFAULT);
    assertEquals(Optional.of("Invented Lab"), run.metadataValue("laboratory"));
    assertEquals(Optional.of("R1"), run.metadataValue("Run"));
    assertEquals(2, run.metadata().get(1).position().line());
  }

  @Test
  @DisplayName("wide layout reads one column per analyte line from the header pattern, a row per replicate")
  void wideLayout() throws ImportException {
    String text = "Sample,Rep,Cd 228.802 [cps],Pb220.353 (cps),Cd 228.802 mean\nA,1,10,20,11\nA,2,12,22,\nB,1,30,40,\n";
    RawRun run = read(text, ImportSettings.DEFAULT.toBuilder().layout(Layout.WIDE).build());
    assertEquals(2, run.injections().size());
    LineReadings cd = run.injections().get(0).line(AnalyteLine.of("Cd", "228.802")).orElseThrow();
    assertEquals(2, cd.replicates().size());
    assertReading(cd.replicates().get(1), 12);
    assertReading(cd.reportedMean().orElseThrow(), 11);
    assertEquals(Optional.of("cps"), cd.unit());
    assertTrue(run.injections().get(0).line(AnalyteLine.of("Pb", "220.353")).isPresent());
  }

  @Test
  @DisplayName("wide layout with replicate columns in one row per injection reads every replicate")
  void wideReplicateColumns() throws ImportException {
    String text = "Sample,Cd 228.802 rep 1,Cd 228.802 rep 2,Cd 228.802 sd\nA,10,12,1.4\nB,30,31,0.7\n";
    RawRun run = read(text, ImportSettings.DEFAULT.toBuilder().layout(Layout.WIDE).build());
    LineReadings b = run.injections().get(1).lines().get(0);
    assertEquals(List.of(30.0, 31.0), b.replicates().stream().map(Reading::value).toList());
    assertReading(b.reportedSd().orElseThrow(), 0.7);
    ImportException dup = assertThrows(ImportException.class,
        () -> read("Sample,Cd 228.802 rep 1,Cd 228.802 rep 1\nA,1,2\n", ImportSettings.DEFAULT.toBuilder().layout(Layout.WIDE).build()));
    assertTrue(dup.getMessage().startsWith("run.csv:1:3: duplicate header"), dup.getMessage());
  }

  @Test
  @DisplayName("long layout with replicate columns, a combined analyte-line column, mean and SD reads them all")
  void longReplicateColumns() throws ImportException {
    String text = "Sample\tChannel\tReading 1\tReading 2\tReading 3\tMean\tSD\tFlag\n"
        + "A\tCd228.802\t10\t11\t12\t11\t1\t\nA\tPb 220.353\t20\tOVER\t22\t21\t1.41\tcheck\n";
    RawRun run = read(text, ImportSettings.DEFAULT);
    assertEquals(1, run.injections().size());
    LineReadings cd = run.injections().get(0).line(AnalyteLine.of("Cd", "228.802")).orElseThrow();
    assertEquals(List.of(10.0, 11.0, 12.0), cd.replicates().stream().map(Reading::value).toList());
    assertReading(cd.reportedMean().orElseThrow(), 11);
    LineReadings pb = run.injections().get(0).line(AnalyteLine.of("Pb", "220.353")).orElseThrow();
    assertFalse(pb.replicates().get(1).isValid());
    assertEquals(Optional.of("check"), pb.remark());
    assertEquals(4, pb.replicates().get(1).column());
  }

  @Test
  @DisplayName("skip and end rules drop summary and footer rows")
  void skipAndEndRules() throws ImportException {
    String text = "Sample,Element,Intensity\nA,Cd,5\nAverage,Cd,5\nB,Cd,6\nEnd of data\ngarbage,,\n";
    ImportSettings s = ImportSettings.DEFAULT.toBuilder().skip(Pattern.compile("^Average,"))
        .endPattern(Pattern.compile("^End of data")).build();
    RawRun run = read(text, s);
    assertEquals(List.of("A", "B"), run.injections().stream().map(Injection::sampleId).toList());
  }

  @Test
  @DisplayName("a profile's column aliases map unusual header names")
  void aliases() throws ImportException {
    String text = "Probe,Elem,Counts\nA,Cd,5\n";
    ImportSettings s = ImportSettings.DEFAULT.toBuilder().alias("sample_id", List.of("Probe"))
        .alias("analyte", List.of("Elem")).build();
    assertEquals("A", read(text, s).injections().get(0).sampleId());
  }

  @Test
  @DisplayName("a delimited file is detected with more confidence than an unrelated text")
  void detection() {
    DelimitedImporter d = new DelimitedImporter();
    assertTrue(d.detect("run.csv", utf8(LONG)) > 0.6);
    assertEquals(0, d.detect("notes.txt", utf8("just a line of prose\nand another\n")));
  }

  // --- the demo exports, read with their example profiles ---------------------------------

  static RawRun demo(String export, String profile) throws IOException, ImportException {
    Path p = REPO.resolve("config-examples/importers").resolve(profile);
    ImportSettings s = ImportProfiles.parse(Files.readString(p), profile);
    try (var in = Files.newInputStream(REPO.resolve("demo-data").resolve(export))) {
      return new DelimitedImporter().read(in, s, export);
    }
  }

  @Test
  @DisplayName("the long demo export reads 38 injections of 15 lines with 3 readings each")
  void longDemo() throws Exception {
    RawRun run = demo("run-R2611A-long.csv", "long-csv.yaml");
    assertEquals(38, run.injections().size());
    assertEquals(15, run.analyteLines().size());
    assertEquals(38 * 15 * 3, run.readingCount());
    // first data row of the file: "1,CAL-BLK,...,As,188.980,1,207.7,cps,"
    Reading first = run.injections().get(0).lines().get(0).replicates().get(0);
    assertReading(first, 207.7);
    assertEquals(2, first.line());
    assertEquals(8, first.column());
  }

  @Test
  @DisplayName("the wide semicolon demo export gives the same readings as the long one")
  void wideDemoMatchesLong() throws Exception {
    RawRun wide = demo("run-R2611A-wide.txt", "wide-semicolon.yaml");
    RawRun lng = demo("run-R2611A-long.csv", "long-csv.yaml");
    assertEquals(Optional.of("Kestrel Brook Water Laboratory"), wide.metadataValue("Laboratory"));
    assertEquals(Optional.of("21,5 °C"), wide.metadataValue("Room temperature"));
    assertSameReadings(lng, wide);
  }

  @Test
  @DisplayName("the wide demo export reads the same with its delimiter and charset detected instead of set")
  void wideDemoDetected() throws Exception {
    ImportSettings profile = ImportProfiles.parse(
        Files.readString(REPO.resolve("config-examples/importers/wide-semicolon.yaml")), "wide-semicolon.yaml");
    ImportSettings detected = profile.toBuilder().detectDelimiter().detectCharset().build();
    try (var in = Files.newInputStream(REPO.resolve("demo-data/run-R2611A-wide.txt"))) {
      RawRun run = new DelimitedImporter().read(in, detected, "run-R2611A-wide.txt");
      assertSameReadings(demo("run-R2611A-wide.txt", "wide-semicolon.yaml"), run);
      assertEquals(Optional.of("21,5 °C"), run.metadataValue("Room temperature"));
    }
  }

  @Test
  @DisplayName("a profile giving one character as delimiter and decimal separator is an import error")
  void delimiterDecimalClash() {
    ImportSettings s = ImportSettings.DEFAULT.toBuilder().delimiter(',').decimalSeparator(',').build();
    assertThrows(ImportException.class, () -> read("Sample,Element,Intensity\nA,Cd,1\n", s));
  }

  @Test
  @DisplayName("the tab profile with renamed columns reads its example rows")
  void tabProfile() throws Exception {
    ImportSettings s = ImportProfiles.parse(
        Files.readString(REPO.resolve("config-examples/importers/tab-renamed-columns.yaml")), "tab-renamed-columns.yaml");
    String text = "Probe\tElem\tLine\tR1\tR2\tR3\tAvg\tStdev\tNote\n"
        + "W-01\tCd\t228.802\t101.5\t99.5\t<LOD>\t100.4\t1.0\t\n"
        + "Sample summary\tW-01\t\t\t\t\t\t\t\n"
        + "W-02\tCd\t228.802\t201.5\t199.5\t200.1\t200.4\t1.0\tok\n";
    RawRun run = read(text, s);
    assertEquals(List.of("W-01", "W-02"), run.injections().stream().map(Injection::sampleId).toList());
    LineReadings w1 = run.injections().get(0).lines().get(0);
    assertEquals(3, w1.replicates().size());
    assertFalse(w1.replicates().get(2).isValid());
    assertReading(w1.reportedSd().orElseThrow(), 1.0);
  }

  static void assertSameReadings(RawRun a, RawRun b) {
    assertEquals(a.injections().size(), b.injections().size());
    for (int i = 0; i < a.injections().size(); i++) {
      Injection x = a.injections().get(i);
      Injection y = b.injections().get(i);
      assertEquals(x.sequence(), y.sequence());
      assertEquals(x.sampleId(), y.sampleId());
      assertEquals(x.sampleType(), y.sampleType());
      assertEquals(x.lines().size(), y.lines().size());
      for (int j = 0; j < x.lines().size(); j++) {
        LineReadings l = x.lines().get(j);
        LineReadings m = y.lines().get(j);
        assertEquals(l.analyteLine(), m.analyteLine());
        assertEquals(l.unit(), m.unit());
        List<Double> lv = l.replicates().stream().map(Reading::value).toList();
        List<Double> mv = m.replicates().stream().map(Reading::value).toList();
        assertEquals(lv, mv, x.sampleId() + " " + l.analyteLine().label());
      }
    }
  }

  private static byte[] concat(byte[] a, byte[] b) {
    byte[] out = new byte[a.length + b.length];
    System.arraycopy(a, 0, out, 0, a.length);
    System.arraycopy(b, 0, out, a.length, b.length);
    return out;
  }
}
