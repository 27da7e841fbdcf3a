package org.quantrun.importer.delimited;

import java.io.BufferedWriter;
import java.io.IOException;
import java.io.InputStream;
import java.io.InputStreamReader;
import java.io.Reader;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Locale;
import java.util.Random;
import org.apache.commons.csv.CSVFormat;
import org.apache.commons.csv.CSVParser;
import org.apache.commons.csv.CSVRecord;
import org.quantrun.core.importer.ImportException;
import org.quantrun.core.importer.ImportSettings;
import org.quantrun.core.importer.RawRun;

/**
 * Throughput benchmark (not a unit test): the delimited importer against a bare Commons CSV
 * parse of the same generated long-layout file of 1,000,000 readings, in the same JVM. Prints
 * both MB/s figures and their ratio; the goal is a ratio of at least 0.5 in a 256 MB heap.
 *
 * <p>Run from the repository root: {@code mvn -B -q -pl importers/delimited -am test-compile exec:exec@bench -Dexec.skip=true -Dexec.executable=java}
 * (the delimited module's {@code bench} execution runs this class with {@code -Xmx256m}).
 */
public final class DelimitedThroughputBenchmark {

  static final int READINGS = 1_000_000;
  static final String[] LINES = {"As 188.980", "As 193.696", "Ba 455.403", "Cd 214.439", "Cd 228.802", "Co 228.616",
      "Cr 267.716", "Cu 324.754", "Fe 259.940", "Mn 257.610", "Ni 231.604", "Pb 220.353", "Se 196.026",
      "Zn 206.200", "Zn 213.857"};

  private DelimitedThroughputBenchmark() {}

  /**
   * Runs the benchmark.
   *
   * @param args ignored
   * @throws Exception on failure
   */
  public static void main(String[] args) throws Exception {
    Path file = Files.createTempFile("quantrun-bench-", ".csv");
    try {
      generate(file);
      double mb = Files.size(file) / 1e6;
      System.out.printf(Locale.ROOT, "file: %,d readings, %.1f MB; max heap %d MB%n", READINGS, mb,
          Runtime.getRuntime().maxMemory() >> 20);
      for (int i = 0; i < 2; i++) { // warm-up
        bareParse(file);
        importerRead(file);
      }
      double bare = Double.MAX_VALUE;
      double importer = Double.MAX_VALUE;
      for (int i = 0; i < 5; i++) {
        bare = Math.min(bare, bareParse(file));
        importer = Math.min(importer, importerRead(file));
      }
      System.out.printf(Locale.ROOT, "bare Commons CSV parse: %.1f MB/s (best of 5: %.3f s)%n", mb / bare, bare);
      System.out.printf(Locale.ROOT, "delimited importer:     %.1f MB/s (best of 5: %.3f s)%n", mb / importer, importer);
      System.out.printf(Locale.ROOT, "ratio importer/bare:    %.2f (goal >= 0.50)%n", bare / importer);
    } finally {
      Files.deleteIfExists(file);
    }
  }

  static void generate(Path file) throws IOException {
    Random rnd = new Random(42);
    try (BufferedWriter w = Files.newBufferedWriter(file, StandardCharsets.UTF_8)) {
      w.write("Seq,Sample ID,Type,Acquired,Element,Wavelength,Rep,Intensity,Unit,Remark\r\n");
      int n = 0;
      int seq = 0;
      while (n < READINGS) {
        seq++;
        String sample = String.format(Locale.ROOT, "W%04d-%03d", seq / 1000, seq % 1000);
        String time = String.format(Locale.ROOT, "2026-11-26 %02d:%02d:%02d", (seq / 3600) % 24, (seq / 60) % 60, seq % 60);
        for (String line : LINES) {
          String[] parts = line.split(" ");
          for (int rep = 1; rep <= 3 && n < READINGS; rep++, n++) {
            double v = 200 + rnd.nextDouble() * 50000;
            w.write(seq + "," + sample + ",SAMPLE," + time + "," + parts[0] + "," + parts[1] + "," + rep + ","
                + String.format(Locale.ROOT, "%.1f", v) + ",cps,\r\n");
          }
        }
      }
    }
  }

  static double bareParse(Path file) throws IOException {
    long start = System.nanoTime();
    long fields = 0;
    try (Reader r = new InputStreamReader(Files.newInputStream(file), StandardCharsets.UTF_8);
        CSVParser p = CSVParser.builder().setReader(r).setFormat(CSVFormat.DEFAULT).get()) {
      for (CSVRecord rec : p) {
        fields += rec.size();
      }
    }
    double s = (System.nanoTime() - start) / 1e9;
    if (fields < READINGS) {
      throw new IllegalStateException("parse lost records");
    }
    return s;
  }

  static double importerRead(Path file) throws IOException, ImportException {
    long start = System.nanoTime();
    RawRun run;
    try (InputStream in = Files.newInputStream(file)) {
      run = new DelimitedImporter().read(in, ImportSettings.DEFAULT, file.getFileName().toString());
    }
    double s = (System.nanoTime() - start) / 1e9; // the checks below are not timed
    if (run.readingCount() != READINGS) {
      throw new IllegalStateException("importer read " + run.readingCount() + " readings");
    }
    return s;
  }
}
