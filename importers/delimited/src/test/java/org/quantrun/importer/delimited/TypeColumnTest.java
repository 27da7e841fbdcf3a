package org.quantrun.importer.delimited;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.ByteArrayInputStream;
import java.nio.charset.StandardCharsets;
import java.util.List;
import java.util.Optional;
import org.junit.jupiter.api.DisplayName;
import org.junit.jupiter.api.Test;
import org.quantrun.core.importer.ImportException;
import org.quantrun.core.importer.ImportSettings;
import org.quantrun.core.importer.Layout;
import org.quantrun.core.importer.RawRun;
import org.quantrun.core.method.Method;
import org.quantrun.core.method.MethodException;
import org.quantrun.core.method.MethodLoader;
import org.quantrun.core.method.SampleRole;
import org.quantrun.core.model.InjectionRecord;
import org.quantrun.core.model.RunResult;
import org.quantrun.core.processing.ProcessingException;
import org.quantrun.core.processing.RunProcessor;

/**
 * {@code identification.type-column} read through the delimited importer and processed: the method's
 * named column gives each injection its type (METHOD-REFERENCE.md, identification), in long and wide
 * layout, with or without a column the importer takes as the sample type by its aliases. Invented
 * exports with an exact calibration: blank 100, standards 10 / 50 / 100 ug/L at 300 / 1100 / 2100,
 * so a signal of 260 is 8 ug/L after the blank is subtracted (hand-computed). No sample ID matches an
 * ID rule (the method rejects unmatched injections): only the type column gives the roles.
 */
class TypeColumnTest {

  static final String METHOD = """
      method: {id: T-KIND, version: "1", unit: ug/L}
      analytes:
        - {name: Cd, line: "228.802", mdl: 0.5, reporting-limit: 2}
      standards:
        - {level: S1, concentrations: {Cd: 10}}
        - {level: S2, concentrations: {Cd: 50}}
        - {level: S3, concentrations: {Cd: 100}}
      blanks: {calibration-blank: subtract}
      identification:
        order: type-column-first
        type-column: Kind
        type-values: {B: calibration-blank, CAL: standard, QC1: icv, QC2: ccv, UNK: sample}
        level-column: Level
        unmatched: reject
      limits: {order: [method]}
      qc:
        icv: {true-values: {Cd: 50}}
        ccv: {from-level: S2}
      """;

  static Method method() {
    try {
      return MethodLoader.load(METHOD, "kind.yaml");
    } catch (MethodException e) {
      throw new AssertionError(e.getMessage(), e);
    }
  }

  /** The import settings as the runner makes them: the profile's, plus the columns the method reads per injection. */
  static ImportSettings settings(ImportSettings profile, Method m) {
    ImportSettings.Builder b = profile.toBuilder();
    m.injectionColumns().forEach(b::injectionColumn);
    return b.build();
  }

  private static RawRun read(String text, ImportSettings s) throws ImportException {
    return new DelimitedImporter().read(new ByteArrayInputStream(text.getBytes(StandardCharsets.UTF_8)), s, "run-K.csv");
  }

  static InjectionRecord record(RunResult res, String sampleId) {
    return res.injections().stream().filter(i -> i.sampleId().equals(sampleId)).findFirst().orElseThrow();
  }

  /** The roles and the sample's value every export of this class must give. */
  static void assertIdentifiedByKind(RunResult res) {
    assertEquals(SampleRole.CALIBRATION_BLANK, record(res, "first").role());
    assertEquals(SampleRole.STANDARD, record(res, "second").role());
    assertEquals(Optional.of("S2"), record(res, "third").level());
    assertEquals(SampleRole.ICV, record(res, "fifth").role());
    assertEquals(SampleRole.SAMPLE, record(res, "sixth").role());
    assertEquals("type column 'UNK'", record(res, "sixth").identifiedBy());
    assertEquals(SampleRole.CCV, record(res, "seventh").role());
    assertEquals(8.0, res.results().stream().filter(r -> r.sampleId().equals("sixth")).findFirst().orElseThrow()
        .value().getAsDouble(), 1e-9);
  }

  /** Long layout, two readings per injection; {@code Type} holds wrong values on purpose when given. */
  private static String longExport(boolean withTypeColumn) {
    String[][] inj = {
        {"first", "B", "", "100", "QC2"}, {"second", "CAL", "S1", "300", "UNK"}, {"third", "CAL", "S2", "1100", "B"},
        {"fourth", "CAL", "S3", "2100", "QC1"}, {"fifth", "QC1", "", "1100", "CAL"}, {"sixth", "UNK", "", "260", "QC1"},
        {"seventh", "QC2", "", "1100", "UNK"}};
    StringBuilder b = new StringBuilder("Seq,Sample ID," + (withTypeColumn ? "Type," : "") + "Element,Wavelength,Rep,Intensity,Kind,Level\n");
    for (int i = 0; i < inj.length; i++) {
      for (int rep = 1; rep <= 2; rep++) {
        b.append(i + 1).append(',').append(inj[i][0]).append(',').append(withTypeColumn ? inj[i][4] + "," : "")
            .append("Cd,228.802,").append(rep).append(',').append(inj[i][3]).append(',').append(inj[i][1]).append(',')
            .append(inj[i][2]).append('\n');
      }
    }
    return b.toString();
  }

  @Test
  @DisplayName("long layout, no column the importer takes as the sample type: the export reads and 'Kind' gives the roles")
  void longWithoutAnAliasColumn() throws ImportException {
    Method m = method();
    RawRun run = read(longExport(false), settings(ImportSettings.DEFAULT, m));
    assertTrue(run.injections().stream().allMatch(i -> i.sampleType().isEmpty()), "no sample_type column by the aliases");
    assertIdentifiedByKind(RunProcessor.process(run, m, Optional.empty()));
  }

  @Test
  @DisplayName("long layout with an alias column 'Type' and the method's 'Kind': the method's column decides")
  void longWithBothColumns() throws ImportException {
    Method m = method();
    RawRun run = read(longExport(true), settings(ImportSettings.DEFAULT, m));
    assertEquals(Optional.of("QC2"), run.injections().get(0).sampleType(), "the importer still reads 'Type' as the sample type");
    assertIdentifiedByKind(RunProcessor.process(run, m, Optional.empty()));
  }

  @Test
  @DisplayName("long layout: rows of one injection whose 'Kind' differs are refused by the importer")
  void longRowsThatDisagreeAreRefused() {
    String text = longExport(false).replace("6,sixth,Cd,228.802,2,260,UNK,", "6,sixth,Cd,228.802,2,260,QC1,");
    ImportException e = assertThrows(ImportException.class, () -> read(text, settings(ImportSettings.DEFAULT, method())));
    // header on line 1, two rows per injection: 'sixth' is on lines 12 and 13; Kind is the 7th field
    assertEquals("run-K.csv:13:7: column 'Kind' of injection 6 'sixth' is \"QC1\" here but \"UNK\" on line 12 (a column"
        + " read per injection must give one value for the whole injection)", e.getMessage());
  }

  @Test
  @DisplayName("an export without the method's type column reads, and processing refuses it naming key, column and columns")
  void missingColumnIsRefusedByTheProcessor() throws ImportException {
    Method m = method();
    String text = longExport(true).replace(",Kind,Level\n", ",Sort,Level\n");
    RawRun run = read(text, settings(ImportSettings.DEFAULT, m));
    ProcessingException e = assertThrows(ProcessingException.class, () -> RunProcessor.process(run, m, Optional.empty()));
    assertEquals("run-K.csv: the method's identification.type-column names the column 'Kind', which the export does not"
        + " have (its columns: 'Seq', 'Sample ID', 'Type', 'Element', 'Wavelength', 'Rep', 'Intensity', 'Sort', 'Level')",
        e.getMessage());
  }

  @Test
  @DisplayName("wide layout, a row per injection, no alias column for the type: 'Kind' is no analyte column and gives the roles")
  void wideLayout() throws ImportException {
    String text = """
        Sample ID;Kind;Level;Cd 228.802
        first;B;;100
        second;CAL;S1;300
        third;CAL;S2;1100
        fourth;CAL;S3;2100
        fifth;QC1;;1100
        sixth;UNK;;260
        seventh;QC2;;1100
        """;
    Method m = method();
    RawRun run = read(text, settings(ImportSettings.DEFAULT.toBuilder().delimiter(';').layout(Layout.WIDE).build(), m));
    assertEquals(List.of("Sample ID", "Kind", "Level", "Cd 228.802"), run.columns());
    assertEquals(1, run.injections().get(0).lines().size(), "one analyte line: Kind and Level are not analytes");
    assertIdentifiedByKind(RunProcessor.process(run, m, Optional.empty()));
  }
}
