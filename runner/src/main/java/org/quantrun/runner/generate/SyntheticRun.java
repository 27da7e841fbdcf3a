package org.quantrun.runner.generate;

import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.SplittableRandom;

/**
 * An invented run with known true concentrations: the sequence (calibration blank, five mixed
 * standards, ICV, ICB, method blank and LCS per batch of 20 samples, a duplicate and a matrix
 * spike per batch, CCV and CCB after every ten real samples and at the end), and for every
 * injection, analyte line and reading the signal an instrument would give:
 *
 * <pre>
 *   signal = blank + sensitivity x concentration x drift(injection)
 *   reading = signal x (1 + noise% x e_injection) + 0.3 noise% x sqrt(signal) x e_reading + 2 e_reading
 * </pre>
 *
 * with e standard normal draws from a seeded generator: the same settings and seed give the
 * same run, byte for byte. Nothing here touches files.
 */
final class SyntheticRun {
  /** Element symbols for analytes, in the order they are used. */
  private static final String[] ELEMENTS = {
    "Pb", "Cd", "As", "Cu", "Zn", "Ni", "Cr", "Co", "Mn", "Fe", "Ba", "Se", "Sb", "Tl", "Be", "V", "Mo", "Ag",
    "Al", "B", "Ca", "Mg", "Na", "K", "Li", "Sr", "Ti", "Sn", "Bi", "U", "Th", "Hg", "Au", "Pt", "Pd", "Rh",
    "Ru", "Ir", "W", "Ta", "Hf", "Nb", "Ga", "Ge", "In", "Te", "Cs", "Rb", "La", "Ce", "Pr", "Nd", "Sm", "Eu",
    "Gd", "Tb", "Dy", "Ho", "Er", "Tm", "Yb", "Lu", "Y", "Sc", "Zr", "Re", "Os", "P", "Si", "S"};
  /** The maximum number of analytes. */
  static final int MAX_ANALYTES = ELEMENTS.length;
  /** Standard levels as fractions of the top standard. */
  static final double[] LEVEL_FRACTIONS = {0.02, 0.1, 0.2, 0.5, 1.0};
  static final int SAMPLES_PER_BATCH = 20;
  static final int SAMPLES_PER_CCV = 10;

  /** One analyte line of the run. */
  record Line(String element, String wavelength, double top, double blank, double sensitivity, double reportingLimit) {
    String label() {
      return element + " " + wavelength;
    }
  }

  /** One injection with its true concentrations (per line, in the measured solution). */
  record Shot(int sequence, String sampleId, String type, String role, double[] truth, double[][] readings) {}

  final List<Line> lines = new ArrayList<>();
  final List<Shot> shots = new ArrayList<>();
  final String runId;

  SyntheticRun(String runId, int injections, int analytes, int replicates, double noisePercent, long seed) {
    this.runId = runId;
    SplittableRandom rnd = new SplittableRandom(seed);
    for (int k = 0; k < analytes; k++) {
      double top = k % 5 == 4 ? 5000 : 500;
      String wl = String.format(Locale.ROOT, "%.3f", 180 + rnd.nextDouble() * 240);
      double sens = 5 + rnd.nextDouble() * 300;
      double blank = 80 + rnd.nextDouble() * 400;
      lines.add(new Line(ELEMENTS[k], wl, top, blank, sens, top / 100));
    }
    List<String[]> plan = sequence(injections);
    double noise = noisePercent / 100;
    for (int j = 0; j < plan.size(); j++) {
      String id = plan.get(j)[0];
      String role = plan.get(j)[1];
      double[] truth = new double[analytes];
      for (int k = 0; k < analytes; k++) {
        truth[k] = truth(role, id, lines.get(k), rnd, plan, j, k);
      }
      double drift = 1 - 0.0005 * j;
      double[][] readings = new double[analytes][replicates];
      for (int k = 0; k < analytes; k++) {
        Line l = lines.get(k);
        double signal = l.blank() + l.sensitivity() * truth[k] * drift;
        double shot = signal * (1 + noise * gauss(rnd));
        for (int r = 0; r < replicates; r++) {
          double v = shot + 0.3 * noise * Math.sqrt(Math.abs(signal)) * gauss(rnd) + 2 * gauss(rnd);
          readings[k][r] = Math.round(v * 10) / 10.0;
        }
      }
      shots.add(new Shot(j + 1, id, typeOf(role), role, truth, readings));
    }
  }

  private double truth(String role, String id, Line l, SplittableRandom rnd, List<String[]> plan, int j, int k) {
    switch (role) {
      case "calibration-blank":
      case "icb":
      case "ccb":
      case "method-blank":
        return 0;
      case "standard":
        return l.top() * LEVEL_FRACTIONS[Integer.parseInt(id.substring(4)) - 1];
      case "icv":
        return 0.4 * l.top();
      case "ccv":
        return 0.2 * l.top();
      case "lcs":
        return 0.2 * l.top();
      case "duplicate":
      case "spike": {
        double parent = parentTruth(id, k);
        return role.equals("duplicate") ? parent : parent + 0.2 * l.top();
      }
      default: {
        // log-uniform from a fifth of the reporting limit to 80 % of the top standard
        double lo = Math.log(0.2 * l.reportingLimit());
        double hi = Math.log(0.8 * l.top());
        return Math.exp(lo + (hi - lo) * rnd.nextDouble());
      }
    }
  }

  private double parentTruth(String id, int k) {
    String parent = id.substring(0, id.lastIndexOf('-'));
    for (int i = shots.size() - 1; i >= 0; i--) {
      if (shots.get(i).sampleId().equals(parent)) {
        return shots.get(i).truth()[k];
      }
    }
    throw new IllegalStateException("no parent " + parent);
  }

  /** The amount a matrix spike adds, per line. */
  double spikeAmount(Line l) {
    return 0.2 * l.top();
  }

  private static String typeOf(String role) {
    switch (role) {
      case "calibration-blank":
      case "icb":
      case "ccb":
      case "method-blank":
        return "BLANK";
      case "standard":
        return "STD";
      case "icv":
      case "ccv":
      case "lcs":
        return "QC";
      default:
        return "SAMPLE";
    }
  }

  /**
   * The sequence of sample ids and roles, exactly {@code injections} long (at least 12): at most ten
   * real samples between CCVs (duplicates and spikes count), a CCV and CCB at the end; slots too few
   * for another CCV pair are filled with extra CCBs.
   */
  private List<String[]> sequence(int injections) {
    List<String[]> s = new ArrayList<>();
    s.add(new String[] {"CAL-BLK", "calibration-blank"});
    for (int i = 1; i <= LEVEL_FRACTIONS.length; i++) {
      s.add(new String[] {"STD-" + i, "standard"});
    }
    s.add(new String[] {"ICV", "icv"});
    s.add(new String[] {"ICB", "icb"});
    int sample = 0;
    int batch = 0;
    int sinceCcv = 0;
    int ccv = 0;
    int extra = 0;
    while (s.size() < injections - 2) {
      int room = injections - 2 - s.size();
      if (sample / SAMPLES_PER_BATCH == batch && room >= 3) {
        batch++;
        s.add(new String[] {"MB-B" + batch, "method-blank"});
        s.add(new String[] {"LCS-B" + batch, "lcs"});
        continue;
      }
      if (sinceCcv >= SAMPLES_PER_CCV) {
        if (room >= 2) {
          ccv++;
          s.add(new String[] {"CCV-" + ccv, "ccv"});
          s.add(new String[] {"CCB-" + ccv, "ccb"});
          sinceCcv = 0;
        } else {
          extra++;
          s.add(new String[] {"CCB-X" + extra, "ccb"});
        }
        continue;
      }
      sample++;
      String id = String.format(Locale.ROOT, "SMP-%04d", sample);
      s.add(new String[] {id, "sample"});
      sinceCcv++;
      if (sample % SAMPLES_PER_BATCH == 1 && sinceCcv <= SAMPLES_PER_CCV - 2 && injections - 2 - s.size() >= 2) {
        s.add(new String[] {id + "-DUP", "duplicate"});
        s.add(new String[] {id + "-MS", "spike"});
        sinceCcv += 2;
      }
    }
    ccv++;
    s.add(new String[] {"CCV-" + ccv, "ccv"});
    s.add(new String[] {"CCB-" + ccv, "ccb"});
    return s;
  }

  private static double gauss(SplittableRandom rnd) {
    // Box-Muller from the seeded generator (java.util.Random's nextGaussian is not on SplittableRandom in 17)
    double u = 1 - rnd.nextDouble();
    double v = rnd.nextDouble();
    return Math.sqrt(-2 * Math.log(u)) * Math.cos(2 * Math.PI * v);
  }
}
