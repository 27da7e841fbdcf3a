package org.quantrun.runner.process;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.concurrent.atomic.AtomicReference;
import org.junit.jupiter.api.DisplayName;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.quantrun.core.importer.RawRun;
import org.quantrun.runner.CommandRun;
import org.quantrun.runner.write.InventedRun;

/**
 * The runner hands the columns a method reads per injection to the importer: the demo method with
 * a factor column, on the demo export with an invented {@code Dil} column added.
 */
class InjectionColumnsCommandTest {
  @TempDir Path dir;

  private Path method() throws IOException {
    String demo = Files.readString(Path.of(ProcessCommandTest.DEMO_METHOD), StandardCharsets.UTF_8);
    String withColumn = demo.replace("dilution:\n  default-factor: 1\n", "dilution:\n  default-factor: 1\n  factor-column: Dil\n");
    assertTrue(withColumn.contains("factor-column: Dil"), "the demo method's dilution section is where it was");
    Path m = dir.resolve("demo-with-dil.yaml");
    Files.writeString(m, withColumn, StandardCharsets.UTF_8);
    return m;
  }

  /** The demo export with a Dil column: 4 on every row of the injections whose sample id starts with {@code prefix}. */
  private Path export(String prefix) throws IOException {
    List<String> lines = Files.readAllLines(Path.of(ProcessCommandTest.DEMO), StandardCharsets.UTF_8);
    StringBuilder b = new StringBuilder();
    for (int i = 0; i < lines.size(); i++) {
      String l = lines.get(i);
      if (i == 0) {
        b.append(l).append(",Dil\n");
      } else if (l.contains(",") && !l.startsWith("End of data")) {
        b.append(l).append(',').append(l.split(",", 3)[1].startsWith(prefix) ? "4" : "").append('\n');
      } else {
        b.append(l).append('\n');
      }
    }
    Path e = dir.resolve("run-R2611A-dil.csv");
    Files.writeString(e, b, StandardCharsets.UTF_8);
    return e;
  }

  @Test
  @DisplayName("process passes the method's factor column into the import settings: every injection carries its cell")
  void processPassesTheColumn() throws IOException {
    AtomicReference<RawRun> seen = new AtomicReference<>();
    CommandRun r = ProcessCommandTest.run((raw, m, p) -> {
      seen.set(raw);
      return InventedRun.run();
    }, "process", export("W").toString(), "--method", method().toString(), "--profile", ProcessCommandTest.LONG_PROFILE,
        "--out", dir.resolve("out").toString());
    assertTrue(r.exitCode() <= 1, r.err());
    RawRun raw = seen.get();
    assertTrue(raw.hasColumn("Dil"), raw.columns().toString());
    assertTrue(raw.injections().stream().allMatch(i -> i.column("Dil").isPresent()));
    assertTrue(raw.injections().stream().filter(i -> i.sampleId().startsWith("W"))
        .allMatch(i -> i.column("Dil").orElseThrow().text().equals("4")));
    assertTrue(raw.injections().stream().filter(i -> i.sampleId().startsWith("CAL"))
        .allMatch(i -> i.column("Dil").orElseThrow().isBlank()));
  }

  @Test
  @DisplayName("through the real processor, an export without the method's factor column exits 2 naming key, column and columns")
  void missingColumnExitsTwo() throws IOException {
    CommandRun r = CommandRun.of("process", ProcessCommandTest.DEMO, "--method", method().toString(), "--profile",
        ProcessCommandTest.LONG_PROFILE, "--out", dir.resolve("out").toString());
    assertEquals(2, r.exitCode(), r.err());
    assertTrue(r.err().contains("run-R2611A-long.csv: the method's dilution.factor-column names the column 'Dil', which the"
        + " export does not have (its columns: 'Seq', 'Sample ID', 'Type', 'Acquired', 'Element', 'Wavelength', 'Rep',"
        + " 'Intensity', 'Unit', 'Remark')"), r.err());
    assertTrue(!r.err().contains("csv: run-R2611A-long.csv"), "the export is named once: " + r.err());
  }

  @Test
  @DisplayName("the method's type column is the export's type column even when a built-in name finds another one")
  void methodTypeColumnSettlesTwoTypeColumns() throws IOException {
    List<String> lines = Files.readAllLines(Path.of(ProcessCommandTest.DEMO), StandardCharsets.UTF_8);
    StringBuilder b = new StringBuilder();
    for (int i = 0; i < lines.size(); i++) {
      String l = lines.get(i);
      if (i == 0) {
        assertTrue(l.startsWith("Seq,Sample ID,Type,"), l);
        b.append(l.replace("Seq,Sample ID,Type,", "Seq,Sample ID,Sample Type,")).append(",Type\n");
      } else {
        b.append(l).append(l.contains(",") ? ",ignored by the method\n" : "\n");
      }
    }
    Path export = dir.resolve("run-R2611A-types.csv");
    Files.writeString(export, b, StandardCharsets.UTF_8);
    Path out = dir.resolve("out");
    CommandRun refused = CommandRun.of("process", export.toString(), "--method", ProcessCommandTest.DEMO_METHOD, "--profile",
        ProcessCommandTest.LONG_PROFILE, "--out", out.toString());
    assertEquals(2, refused.exitCode(), refused.err());
    assertTrue(refused.err().contains("duplicate header: columns 3 (\"Sample Type\") and 11 (\"Type\") both give sample_type"),
        refused.err());

    String demo = Files.readString(Path.of(ProcessCommandTest.DEMO_METHOD), StandardCharsets.UTF_8);
    String typed = demo.replace("identification:\n  order: rules-first\n",
        "identification:\n  order: rules-first\n  type-column: Sample Type\n  type-values: {BLANK: calibration-blank}\n");
    assertTrue(typed.contains("type-column: Sample Type"), "the demo method's identification section is where it was");
    Path m = dir.resolve("demo-typed.yaml");
    Files.writeString(m, typed, StandardCharsets.UTF_8);
    CommandRun r = CommandRun.of("process", export.toString(), "--method", m.toString(), "--profile",
        ProcessCommandTest.LONG_PROFILE, "--out", out.toString());
    assertTrue(r.exitCode() <= 1, r.err());
  }
}
