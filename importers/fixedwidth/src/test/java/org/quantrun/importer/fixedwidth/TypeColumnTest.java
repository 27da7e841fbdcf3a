package org.quantrun.importer.fixedwidth;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;

import java.io.ByteArrayInputStream;
import java.nio.charset.StandardCharsets;
import java.util.List;
import java.util.Locale;
import java.util.Optional;
import org.junit.jupiter.api.DisplayName;
import org.junit.jupiter.api.Test;
import org.quantrun.core.importer.ImportException;
import org.quantrun.core.importer.ImportSettings;
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
 * {@code identification.type-column} in a fixed-width report whose header names its fields: the
 * method's {@code Kind} field gives each injection its type (METHOD-REFERENCE.md, identification),
 * although a context record names another type. Invented report with an exact calibration (blank
 * 100, standards 10 / 50 / 100 ug/L at 300 / 1100 / 2100: a signal of 260 is 8 ug/L after the blank
 * is subtracted, hand-computed).
 */
class TypeColumnTest {

  private static final String METHOD = """
      method: {id: T-FW, version: "1", unit: ug/L}
      analytes: [{name: Cd, line: "228.802", mdl: 0.5, reporting-limit: 2}]
      standards: [{level: S1, concentrations: {Cd: 10}}, {level: S2, concentrations: {Cd: 50}}, {level: S3, concentrations: {Cd: 100}}]
      identification:
        type-column: Kind
        type-values: {BLK: calibration-blank, QC1: icv, QC2: ccv, SMP: sample}
        rules: [{pattern: 'STD-(\\d)', role: standard, level: 'S$1'}]
        unmatched: reject
      limits: {order: [method]}
      qc: {icv: {true-values: {Cd: 50}}, ccv: {from-level: S2}}
      """;

  /** Fields start at 1, 6, 22, 36 and 47; a context record before each injection gives a (wrong) type. */
  private static String block(String seq, String sample, String kind, String reading) {
    return "Injection " + seq + " Type: WRONG\n"
        + String.format(Locale.ROOT, "%3s  %-14s  %-12s  %9s  %s", seq, sample, "Cd 228.802", reading, kind).stripTrailing() + "\n";
  }

  private static final String REPORT = "Invented lab listing\n\n"
      + String.format(Locale.ROOT, "%3s  %-14s  %-12s  %9s  %s", "Seq", "Sample", "Line", "Reading 1", "Kind") + "\n"
      + "---  " + "-".repeat(14) + "  " + "-".repeat(12) + "  " + "-".repeat(9) + "  ----\n"
      + block("1", "first", "BLK", "100") + block("2", "STD-1", "", "300") + block("3", "STD-2", "", "1100")
      + block("4", "STD-3", "", "2100") + block("5", "second", "QC1", "1100") + block("6", "third", "SMP", "260")
      + block("7", "fourth", "QC2", "1100");

  private static Method method() {
    try {
      return MethodLoader.load(METHOD, "fw.yaml");
    } catch (MethodException e) {
      throw new AssertionError(e.getMessage(), e);
    }
  }

  private static RawRun read(String text, Method m) throws ImportException {
    ImportSettings.Builder b = ImportSettings.DEFAULT.toBuilder().alias("analyte_line", List.of("Line"))
        .contextPattern(java.util.regex.Pattern.compile("^Injection (?<sequence>\\d+) Type: (?<sampleType>\\S+)$"));
    m.injectionColumns().forEach(b::injectionColumn);
    return new FixedWidthImporter().read(new ByteArrayInputStream(text.getBytes(StandardCharsets.UTF_8)), b.build(), "run-FK.txt");
  }

  private static InjectionRecord record(RunResult res, String sampleId) {
    return res.injections().stream().filter(i -> i.sampleId().equals(sampleId)).findFirst().orElseThrow();
  }

  @Test
  @DisplayName("the header's 'Kind' field gives the type; the context record's type is not read")
  void kindFieldGivesTheType() throws ImportException {
    Method m = method();
    RawRun run = read(REPORT, m);
    assertEquals(Optional.of("WRONG"), run.injections().get(0).sampleType());
    RunResult res = RunProcessor.process(run, m, Optional.empty());
    assertEquals(SampleRole.CALIBRATION_BLANK, record(res, "first").role());
    assertEquals(Optional.of("S2"), record(res, "STD-2").level());
    assertEquals(SampleRole.ICV, record(res, "second").role());
    assertEquals("type column 'SMP'", record(res, "third").identifiedBy());
    assertEquals(SampleRole.CCV, record(res, "fourth").role());
    assertEquals(8.0, res.results().stream().filter(r -> r.sampleId().equals("third")).findFirst().orElseThrow()
        .value().getAsDouble(), 1e-9);
  }

  @Test
  @DisplayName("a report without the field is refused by the processor, naming key, column and the report's columns")
  void missingFieldIsRefused() throws ImportException {
    Method m = method();
    RawRun run = read(REPORT.replace("Reading 1  Kind", "Reading 1  Sort"), m);
    ProcessingException e = assertThrows(ProcessingException.class, () -> RunProcessor.process(run, m, Optional.empty()));
    assertEquals("run-FK.txt: the method's identification.type-column names the column 'Kind', which the export does not"
        + " have (its columns: 'Seq', 'Sample', 'Line', 'Reading 1', 'Sort', 'sequence', 'sampleType')", e.getMessage());
  }
}
