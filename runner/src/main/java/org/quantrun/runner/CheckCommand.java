package org.quantrun.runner;

import java.io.PrintWriter;
import java.math.BigDecimal;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.concurrent.Callable;
import java.util.stream.Collectors;
import org.quantrun.core.calibration.LimitSource;
import org.quantrun.core.method.Analyte;
import org.quantrun.core.method.CheckStandard;
import org.quantrun.core.method.DilutionScheme;
import org.quantrun.core.method.Identification;
import org.quantrun.core.method.Method;
import org.quantrun.core.method.PairRule;
import org.quantrun.core.method.QcPlan;
import org.quantrun.core.method.ReportingRules;
import org.quantrun.core.method.StandardLevel;
import org.quantrun.core.qc.Window;
import picocli.CommandLine.Command;
import picocli.CommandLine.Parameters;
import picocli.CommandLine;

/**
 * {@code quantrun check METHOD.yaml}: loads and validates a method file, then prints a summary of
 * it (analytes, levels, QC plan) on standard output, or every problem on standard error with
 * exit code {@link Main#EXIT_INPUT_ERROR}.
 */
@Command(
    name = "check",
    mixinStandardHelpOptions = true,
    description = "Validates a method file and prints its summary (analytes, levels, QC plan), or every problem found.",
    exitCodeListHeading = "%nExit codes:%n",
    exitCodeList = {"0:the method is valid", "2:the method has problems, or cannot be read"})
public final class CheckCommand implements Callable<Integer> {

  @Parameters(index = "0", paramLabel = "METHOD.yaml", description = "the method file to check")
  Path method;

  @CommandLine.Spec CommandLine.Model.CommandSpec spec;

  /**
   * Checks the method file.
   *
   * @return 0 when the method is valid, {@link Main#EXIT_INPUT_ERROR} otherwise
   */
  @Override
  public Integer call() {
    PrintWriter out = spec.commandLine().getOut();
    PrintWriter err = spec.commandLine().getErr();
    Method m;
    try {
      m = MethodFiles.load(method, "quantrun check");
    } catch (MethodFiles.Failure f) {
      f.lines().forEach(err::println);
      err.flush();
      return Main.EXIT_INPUT_ERROR;
    }
    out.print(summary(m));
    out.println("OK: " + MethodFiles.name(method) + " is a valid method.");
    out.flush();
    return 0;
  }

  // ---- the summary ----

  static String summary(Method m) {
    StringBuilder sb = new StringBuilder();
    var id = m.identity();
    sb.append("method ").append(id.id()).append(" version ").append(id.version());
    if (!id.description().isEmpty()) {
      sb.append(": ").append(id.description());
    }
    sb.append('\n').append("default unit ").append(id.defaultUnit().token()).append("; importer ").append(m.importSettings().importer());
    m.importSettings().profile().ifPresent(p -> sb.append(", profile ").append(p));
    if (!m.importSettings().settings().isEmpty()) {
      sb.append(", settings ").append(String.join(", ", m.importSettings().settings().keySet()));
    }
    sb.append("\n\n");

    sb.append("analytes (").append(m.analytes().size()).append(" lines)\n");
    List<String[]> rows = new ArrayList<>();
    rows.add(new String[] {"line", "unit", "curve", "weighting", "fit points", "IS", "MDL", "RL", "levels", "range"});
    for (Analyte a : m.analytes()) {
      rows.add(new String[] {a.key(), a.unit().token(), a.curve().token(), a.weighting().token(), a.fitPoints().token(),
          a.internalStandard().orElse("-"), a.mdl().map(CheckCommand::num).orElse("-"), a.reportingLimit().map(CheckCommand::num).orElse("-"),
          Integer.toString(m.levelsOf(a.name()).size()),
          a.workingRange().map(r -> num(r.low()) + "-" + num(r.high())).orElse("-")});
    }
    table(sb, rows);
    if (!m.internalStandards().isEmpty()) {
      sb.append("internal standards: ").append(m.internalStandards().stream().map(s -> s.name()).collect(Collectors.joining(", "))).append('\n');
    }
    sb.append('\n');

    sb.append("standards (").append(m.standards().size()).append(" levels)\n");
    for (StandardLevel l : m.standards()) {
      sb.append("  ").append(l.name()).append(": ").append(l.concentrations().entrySet().stream()
          .map(e -> e.getKey() + " " + num(e.getValue())).collect(Collectors.joining(", "))).append('\n');
    }
    sb.append("blanks: calibration blank ").append(m.blanks().calibrationBlank().token())
        .append("; method blank ").append(m.blanks().methodBlank().token()).append('\n');
    sb.append("identification: ").append(identification(m.identification())).append('\n');
    sb.append("dilution: ").append(dilution(m.dilution())).append('\n');
    sb.append("limits: ").append(m.limits().order().stream().map(LimitSource::token).collect(Collectors.joining(" -> ")))
        .append(" (run blanks need ").append(m.limits().minBlankReplicates()).append(" replicates)\n\n");

    sb.append("QC plan\n");
    qc(sb, m.qc());
    sb.append('\n').append("reporting: ").append(reporting(m.reporting())).append("\n\n");
    sb.append("Caution: results need review by a qualified analyst; the lab's accredited method and local regulations govern.\n");
    return sb.toString();
  }

  private static String identification(Identification id) {
    List<String> parts = new ArrayList<>();
    id.typeColumn().ifPresent(c -> parts.add("type column '" + c + "' (" + id.typeValues().size() + " values)"));
    id.levelColumn().ifPresent(c -> parts.add("level column '" + c + "'"));
    parts.add(id.rules().size() + " ID rules");
    parts.add("order " + id.order().token());
    parts.add("unmatched " + id.unmatched().token());
    return String.join("; ", parts);
  }

  private static String dilution(DilutionScheme d) {
    StringBuilder sb = new StringBuilder("default factor ").append(num(d.defaultFactor()));
    d.factorColumn().ifPresent(c -> sb.append("; factor column '").append(c).append('\''));
    d.prepSheet().ifPresent(p -> sb.append("; prep sheet (sample '").append(p.sampleIdColumn()).append("', batch '").append(p.prepBatchColumn())
        .append("') reported in ").append(p.reportUnit().token()).append(' ').append(p.basis().token()));
    return sb.toString();
  }

  private static void qc(StringBuilder sb, QcPlan q) {
    List<String[]> rows = new ArrayList<>();
    var c = q.calibration();
    rows.add(new String[] {"calibration", c.minR().map(r -> "r >= " + num(r)).or(() -> c.minR2().map(r -> "r2 >= " + num(r))).orElse("")
        + "; back-calculated error <= " + num(c.maxBackCalcError()) + " % (lowest level " + num(c.maxBackCalcErrorLowest())
        + " %); over-range above +" + num(c.overRangeTolerance()) + " %"});
    rows.add(new String[] {"ICV", check(q.icv())});
    rows.add(new String[] {"CCV", check(q.ccv().standard()) + "; every " + q.ccv().frequency() + " samples; non-detects "
        + (q.ccv().nonDetectsStandAfterHighBias() ? "stand" : "do not stand") + " after a high CCV"});
    q.lowCheck().ifPresent(l -> rows.add(new String[] {"low check", check(l)}));
    rows.add(new String[] {"blanks", "ICB/CCB <= " + num(q.blanks().calibrationBlankFraction()) + " x RL; method blank <= "
        + num(q.blanks().methodBlankFraction()) + " x RL"});
    q.lcs().ifPresent(l -> rows.add(new String[] {"LCS", check(l)}));
    rows.add(new String[] {"duplicate", pair(q.duplicate())});
    q.spike().ifPresent(s -> rows.add(new String[] {"matrix spike", "recovery " + window(s.recovery()) + " for " + s.added().size()
        + " analytes, not judged above " + num(s.maxBackgroundRatio()) + "x added; MS/MSD " + pair(s.duplicate())}));
    rows.add(new String[] {"serial dilution", "1:" + num(q.serialDilution().factor()) + ", %D <= " + num(q.serialDilution().maxDifference())
        + " from " + num(q.serialDilution().minMultipleOfRl()) + " x RL"});
    rows.add(new String[] {"internal std", "recovery " + window(q.internalStandardRecovery())});
    rows.add(new String[] {"replicates", "%RSD <= " + num(q.replicates().maxRsd()) + " from " + num(q.replicates().minMultipleOfRl()) + " x RL"});
    table(sb, rows);
  }

  private static String check(CheckStandard s) {
    return "recovery " + window(s.recovery()) + " for " + s.trueValues().size() + " analytes"
        + (s.exempt().isEmpty() ? "" : ", exempt " + String.join(", ", s.exempt()));
  }

  private static String pair(PairRule p) {
    return "RPD <= " + num(p.maxRpd()) + " % from " + num(p.minMultipleOfRl()) + " x RL, else difference <= " + num(p.lowLevelMaxDifference()) + " x RL";
  }

  private static String window(Window w) {
    return num(w.low()) + "-" + num(w.high()) + " %";
  }

  private static String reporting(ReportingRules r) {
    String s = r.significantFigures() + " significant figures, " + r.rounding().token() + "; below LOD " + r.belowLod().token()
        + (r.belowLodText().isEmpty() ? "" : " '" + r.belowLodText() + "'") + "; LOD to LOQ " + r.betweenLodLoq().token();
    if (!r.qualifiers().isEmpty()) {
      s += "; qualifiers " + r.qualifiers().entrySet().stream().map(e -> e.getKey().token() + "=" + e.getValue()).collect(Collectors.joining(", "));
    }
    return s;
  }

  private static void table(StringBuilder sb, List<String[]> rows) {
    int[] width = new int[rows.get(0).length];
    for (String[] r : rows) {
      for (int i = 0; i < r.length; i++) {
        width[i] = Math.max(width[i], r[i].length());
      }
    }
    for (String[] r : rows) {
      StringBuilder line = new StringBuilder("  ");
      for (int i = 0; i < r.length; i++) {
        line.append(r[i]);
        if (i < r.length - 1) {
          line.append(" ".repeat(width[i] - r[i].length() + 2));
        }
      }
      sb.append(line.toString().stripTrailing()).append('\n');
    }
  }

  private static String num(double d) {
    return BigDecimal.valueOf(d).stripTrailingZeros().toPlainString();
  }
}
