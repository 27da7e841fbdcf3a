package org.quantrun.runner.generate;

import java.util.Locale;

/** The method file that matches a synthetic run: its analyte lines, levels, ID rules and QC plan. */
final class MethodText {
  private MethodText() {}

  static String of(SyntheticRun run, String profileFile, boolean soil) {
    StringBuilder y = new StringBuilder();
    y.append("# Method for the synthetic run ").append(run.runId).append(", written by 'quantrun generate'.\n");
    y.append("# Invented data for training and validation; real results need review by a qualified analyst,\n");
    y.append("# and the lab's accredited method and local regulations govern.\n");
    y.append("method:\n  id: SYN-").append(run.runId).append("\n  version: \"1\"\n");
    y.append("  description: synthetic run ").append(run.runId).append(soil ? " (soil digests)" : " (waters)").append("\n");
    y.append("  unit: ug/L\n\nimport:\n  importer: auto\n  profile: ").append(profileFile).append("\n\nanalytes:\n");
    for (SyntheticRun.Line l : run.lines) {
      y.append(String.format(Locale.ROOT, "  - {name: %s, line: \"%s\", weighting: 1/x, mdl: %s, reporting-limit: %s}%n",
          l.element(), l.wavelength(), num(l.reportingLimit() / 3), num(l.reportingLimit())));
    }
    y.append("\nstandards:\n");
    for (int i = 0; i < SyntheticRun.LEVEL_FRACTIONS.length; i++) {
      y.append("  - level: STD-").append(i + 1).append("\n    concentrations: {");
      appendAll(y, run, SyntheticRun.LEVEL_FRACTIONS[i]);
      y.append("}\n");
    }
    y.append("""

        blanks: {calibration-blank: subtract, method-blank: report-only}

        identification:
          rules:
            - {pattern: 'CAL-BLK', role: calibration-blank}
            - {pattern: '(STD-\\d)', role: standard, level: '$1'}
            - {pattern: 'ICV', role: icv}
            - {pattern: 'ICB', role: icb}
            - {pattern: 'CCV-\\d+', role: ccv}
            - {pattern: 'CCB-X?\\d+', role: ccb}
            - {pattern: 'MB-\\w+', role: method-blank}
            - {pattern: 'LCS-\\w+', role: lcs}
            - {pattern: '(SMP-\\d+)-DUP', role: duplicate, of: '$1'}
            - {pattern: '(SMP-\\d+)-MS', role: spike, of: '$1'}
            - {pattern: 'SMP-\\d+', role: sample}
          unmatched: reject

        """);
    if (soil) {
      y.append("""
          dilution:
            prep-sheet:
              columns: {sample-id: Sample, prep-batch: Batch, dilution-factor: DF, sample-mass: Mass_g,
                        final-volume: Volume_mL, solids-fraction: Solids}
              report-unit: mg/kg
              basis: dry-weight

          """);
    }
    y.append("limits: {order: [method, run-blanks, calibration]}\n\nqc:\n");
    y.append("  calibration: {min-r: 0.998, max-back-calc-error: 10, max-back-calc-error-lowest: 20}\n");
    y.append("  icv:\n    true-values: {");
    appendAll(y, run, 0.4);
    y.append("}\n  ccv:\n    true-values: {");
    appendAll(y, run, 0.2);
    y.append("}\n    frequency: ").append(SyntheticRun.SAMPLES_PER_CCV).append("\n  lcs:\n    true-values: {");
    appendAll(y, run, 0.2);
    y.append("}\n  matrix-spike:\n    added: {");
    appendAll(y, run, 0.2);
    y.append("}\n\nreporting: {significant-figures: 3}\n");
    return y.toString();
  }

  private static void appendAll(StringBuilder y, SyntheticRun run, double fraction) {
    for (int k = 0; k < run.lines.size(); k++) {
      SyntheticRun.Line l = run.lines.get(k);
      y.append(k == 0 ? "" : ", ").append(l.element()).append(": ").append(num(l.top() * fraction));
    }
  }

  static String num(double v) {
    return v == Math.rint(v) ? Long.toString((long) v) : Double.toString(v);
  }
}
