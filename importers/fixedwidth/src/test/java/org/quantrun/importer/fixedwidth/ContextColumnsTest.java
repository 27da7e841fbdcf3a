package org.quantrun.importer.fixedwidth;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;

import java.io.ByteArrayInputStream;
import java.nio.charset.StandardCharsets;
import java.util.List;
import java.util.Locale;
import java.util.Optional;
import java.util.OptionalDouble;
import java.util.regex.Pattern;
import org.junit.jupiter.api.DisplayName;
import org.junit.jupiter.api.Test;
import org.quantrun.core.importer.CellText;
import org.quantrun.core.importer.ImportException;
import org.quantrun.core.importer.ImportSettings;
import org.quantrun.core.importer.RawRun;
import org.quantrun.core.importer.SourcePosition;
import org.quantrun.core.method.Method;
import org.quantrun.core.method.MethodException;
import org.quantrun.core.method.MethodLoader;
import org.quantrun.core.method.SampleRole;
import org.quantrun.core.model.InjectionRecord;
import org.quantrun.core.model.RunResult;
import org.quantrun.core.processing.ProcessingException;
import org.quantrun.core.processing.RunProcessor;

/**
 * The named groups of a fixed-width report's context records as per-injection columns
 * (METHOD-REFERENCE.md, identification and dilution; DEVELOPERS.md, import profiles): an extra group
 * as the type, level and factor columns, the known {@code sampleType} group as the type column, and
 * a header column of the same name. Invented report with an exact calibration (blank 100, standards
 * 10 / 50 / 100 ug/L at 300 / 1100 / 2100: a signal of 260 is 8 ug/L after the blank is subtracted,
 * hand-computed).
 */
class ContextColumnsTest {

  private static final String METHOD = """
      method: {id: T-CTX, version: "1", unit: ug/L}
      analytes: [{name: Cd, line: "228.802", mdl: 0.5, reporting-limit: 2}]
      standards: [{level: S1, concentrations: {Cd: 10}}, {level: S2, concentrations: {Cd: 50}}, {level: S3, concentrations: {Cd: 100}}]
      identification:
        type-column: %s
        type-values: {BLK: calibration-blank, CAL: standard, QC1: icv, QC2: ccv, SMP: sample}
        level-column: level
        unmatched: reject
      %s
      limits: {order: [method]}
      qc: {icv: {true-values: {Cd: 50}}, ccv: {from-level: S2}}
      """;

  /** Extra groups 'kind', 'level' and 'Dil' beside the known sequence and sampleId. */
  private static final Pattern KIND_RECORD = Pattern.compile(
      "^Injection (?<sequence>\\d+) Sample: (?<sampleId>\\S+) Kind: (?<kind>\\S+)(?: Level: (?<level>\\S+))?(?: Dil: (?<Dil>\\S+))?$");
  /** The known sampleType group, with 'level' as before. */
  private static final Pattern TYPE_RECORD = Pattern.compile(
      "^Injection (?<sequence>\\d+) Sample: (?<sampleId>\\S+) Type: (?<sampleType>\\S+)(?: Level: (?<level>\\S+))?$");

  private static final String[][] INJECTIONS = {
    {"first", "BLK", "", "", "100"}, {"STD-1", "CAL", "S1", "", "300"}, {"STD-2", "CAL", "S2", "", "1100"},
    {"STD-3", "CAL", "S3", "", "2100"}, {"second", "QC1", "", "", "1100"}, {"third", "SMP", "", "10", "260"},
    {"fourth", "QC2", "", "", "1100"}};

  /** Header on line 3, underline on line 4; injection i (1-based) has its context record on line 3 + 2i. */
  private static String report(String word, String header, String extraCell) {
    StringBuilder sb = new StringBuilder("Invented lab listing\n\n");
    sb.append(String.format(Locale.ROOT, "%-12s  %9s%s", "Line", "Reading 1", header).stripTrailing()).append('\n');
    sb.append("-".repeat(12)).append("  ").append("-".repeat(9)).append(header.isEmpty() ? "" : "  ----").append('\n');
    for (int i = 0; i < INJECTIONS.length; i++) {
      sb.append(record(i + 1, word)).append('\n');
      String[] inj = INJECTIONS[i];
      String cell = extraCell.isEmpty() ? "" : "  " + (i == 5 ? extraCell : inj[1]);
      sb.append(String.format(Locale.ROOT, "%-12s  %9s%s", "Cd 228.802", inj[4], cell)).append('\n');
    }
    return sb.toString();
  }

  private static String record(int seq, String word) {
    String[] inj = INJECTIONS[seq - 1];
    return "Injection " + seq + " Sample: " + inj[0] + " " + word + ": " + inj[1] + (inj[2].isEmpty() ? "" : " Level: " + inj[2])
        + (inj[3].isEmpty() || !word.equals("Kind") ? "" : " Dil: " + inj[3]);
  }

  private static Method method(String typeColumn, String dilution) {
    try {
      return MethodLoader.load(String.format(Locale.ROOT, METHOD, typeColumn, dilution), "ctx.yaml");
    } catch (MethodException e) {
      throw new AssertionError(e.getMessage(), e);
    }
  }

  private static RawRun read(String text, Method m, Pattern contextRecord) throws ImportException {
    ImportSettings.Builder b = ImportSettings.DEFAULT.toBuilder().alias("analyte_line", List.of("Line")).contextPattern(contextRecord);
    m.injectionColumns().forEach(b::injectionColumn);
    return new FixedWidthImporter().read(new ByteArrayInputStream(text.getBytes(StandardCharsets.UTF_8)), b.build(), "run-C.txt");
  }

  private static InjectionRecord record(RunResult res, String sampleId) {
    return res.injections().stream().filter(i -> i.sampleId().equals(sampleId)).findFirst().orElseThrow();
  }

  private static double value(RunResult res, String sampleId) {
    return res.results().stream().filter(r -> r.sampleId().equals(sampleId)).findFirst().orElseThrow().value().getAsDouble();
  }

  @Test
  @DisplayName("an extra group 'kind' is the type column (named 'Kind'), 'level' the level column; roles through the processor")
  void extraGroupGivesTypeAndLevel() throws ImportException {
    Method m = method("Kind", "");
    RawRun run = read(report("Kind", "", ""), m, KIND_RECORD);
    assertEquals(List.of("Line", "Reading 1", "sequence", "sampleId", "kind", "level", "Dil"), run.columns());
    String third = record(6, "Kind");
    assertEquals(new CellText("SMP", OptionalDouble.empty(), "decimal separator '.', no thousands separator",
        new SourcePosition(15, third.indexOf("SMP") + 1)), run.injections().get(5).column("Kind").orElseThrow());
    // a group the record leaves out is a blank cell at the record's line
    assertEquals(new SourcePosition(15, 0), run.injections().get(5).column("level").orElseThrow().position());
    RunResult res = RunProcessor.process(run, m, Optional.empty());
    assertEquals(SampleRole.CALIBRATION_BLANK, record(res, "first").role());
    assertEquals(SampleRole.STANDARD, record(res, "STD-2").role());
    assertEquals(Optional.of("S2"), record(res, "STD-2").level());
    assertEquals(SampleRole.ICV, record(res, "second").role());
    assertEquals("type column 'SMP'", record(res, "third").identifiedBy());
    assertEquals(SampleRole.CCV, record(res, "fourth").role());
    assertEquals(8.0, value(res, "third"), 1e-9);
  }

  @Test
  @DisplayName("the known group 'sampleType' can be the type column, and still gives the injection's sample type")
  void sampleTypeGroupIsTheTypeColumn() throws ImportException {
    Method m = method("sampleType", "");
    RawRun run = read(report("Type", "", ""), m, TYPE_RECORD);
    assertEquals(List.of("Line", "Reading 1", "sequence", "sampleId", "sampleType", "level"), run.columns());
    assertEquals(Optional.of("QC1"), run.injections().get(4).sampleType());
    RunResult res = RunProcessor.process(run, m, Optional.empty());
    assertEquals(SampleRole.CALIBRATION_BLANK, record(res, "first").role());
    assertEquals(Optional.of("S3"), record(res, "STD-3").level());
    assertEquals(SampleRole.ICV, record(res, "second").role());
    assertEquals(SampleRole.CCV, record(res, "fourth").role());
    assertEquals(8.0, value(res, "third"), 1e-9);
  }

  @Test
  @DisplayName("a method naming the type column 'Sample Type' reads the group 'sampleType': camel-case words count apart")
  void spacedNameMatchesCamelCaseGroup() throws ImportException {
    Method m = method("Sample Type", "");
    RunResult res = RunProcessor.process(read(report("Type", "", ""), m, TYPE_RECORD), m, Optional.empty());
    assertEquals(SampleRole.ICV, record(res, "second").role());
    assertEquals(SampleRole.CCV, record(res, "fourth").role());
    assertEquals("type column 'SMP'", record(res, "third").identifiedBy());
  }

  @Test
  @DisplayName("a factor from a context group multiplies the result; a bad one is refused at the record's line and column")
  void factorFromContextGroup() throws ImportException {
    Method m = method("kind", "dilution: {factor-column: dil}");
    RunResult res = RunProcessor.process(read(report("Kind", "", ""), m, KIND_RECORD), m, Optional.empty());
    assertEquals(80.0, value(res, "third"), 1e-9);
    String bad = report("Kind", "", "").replace("Dil: 10", "Dil: ten");
    RawRun run = read(bad, m, KIND_RECORD);
    ProcessingException e = assertThrows(ProcessingException.class, () -> RunProcessor.process(run, m, Optional.empty()));
    int column = record(6, "Kind").indexOf("10") + 1;
    assertEquals("run-C.txt:15:" + column + ": dilution.factor-column 'dil' of injection 6 'third' is \"ten\": expected a"
        + " positive number (decimal separator '.', no thousands separator), or a blank cell for the method's default"
        + " factor 1", e.getMessage());
  }

  @Test
  @DisplayName("a header column and a context group of the same name: equal values agree, different ones are refused")
  void headerAndContextOfOneName() throws ImportException {
    Method m = method("kind", "");
    // the header's 'Kind' column repeats the context record's kind
    RawRun same = read(report("Kind", "  Kind", "SMP"), m, KIND_RECORD);
    assertEquals(List.of("Line", "Reading 1", "Kind", "sequence", "sampleId", "level", "Dil"), same.columns());
    assertEquals("SMP", same.injections().get(5).column("kind").orElseThrow().text());
    assertEquals(8.0, value(RunProcessor.process(same, m, Optional.empty()), "third"), 1e-9);
    ImportException e = assertThrows(ImportException.class, () -> read(report("Kind", "  Kind", "QC2"), m, KIND_RECORD));
    // the data record of injection 6 is line 16; its 'Kind' field starts at column 26 (12 + 2 + 9 + 2 + 1)
    assertEquals("run-C.txt:16:26: column 'Kind' of injection 6 'third' is \"QC2\" here but the context record on line 15"
        + " gives \"SMP\" (a column read per injection must give one value for the whole injection)", e.getMessage());
  }
}
