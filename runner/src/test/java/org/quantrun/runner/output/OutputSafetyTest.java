package org.quantrun.runner.output;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.stream.Stream;
import org.junit.jupiter.api.DisplayName;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;
import org.junit.jupiter.params.provider.ValueSource;

class OutputSafetyTest {
  @TempDir Path dir;

  @ParameterizedTest(name = "[{0}] is neutralised")
  @ValueSource(strings = {
    // OWASP "CSV injection" guidance (from memory): cells starting with = + - @ tab or CR.
    "=1+1", "=HYPERLINK(\"http://example.invalid\",\"x\")", "+cmd|' /C calc'!A0", "-2+3", "@SUM(A1:A2)",
    "\tx", "\rx", "\u0000x"})
  void formulasAreNeutralised(String hostile) {
    String safe = SpreadsheetSafe.cell(hostile);
    assertEquals("'" + hostile, safe);
  }

  @ParameterizedTest(name = "[{0}] is left as it is")
  @ValueSource(strings = {"-0.25", "+3e-4", "12.5", "-1", "< 2.0", "W2611-007", "Pb 220.353", ""})
  void numbersAndPlainTextAreUntouched(String text) {
    assertEquals(text, SpreadsheetSafe.cell(text));
  }

  @ParameterizedTest(name = "[{0}] becomes [{1}]")
  @CsvSource({
    "R2611A, R2611A",
    "../../etc/passwd, etc_passwd",
    "/abs/path, abs_path",
    "C:\\\\Windows\\\\x, C_Windows_x",
    "CON, _CON",
    "nul.txt, _nul.txt",
    ".hidden, hidden",
    "run 26/11 (B), run_26_11_B",
    "Müller, Muller",
  })
  void hostileNamesBecomeSafe(String raw, String expected) {
    assertEquals(expected, SafeNames.of(raw, "run"));
  }

  @Test
  @DisplayName("a name with nothing usable gets the fallback")
  void fallback() {
    assertEquals("run", SafeNames.of("../..", "run"));
    assertEquals("run", SafeNames.of("", "run"));
    assertTrue(SafeNames.of("x".repeat(500), "run").length() <= 80);
  }

  @Test
  @DisplayName("a published folder never overwrites an earlier one")
  void publishNeverOverwrites() throws IOException {
    Path first;
    try (OutputFolder out = OutputFolder.create(dir, "R2611A")) {
      Files.writeString(out.staging().resolve("results.csv"), "first", StandardCharsets.UTF_8);
      first = out.publish();
    }
    Path second;
    try (OutputFolder out = OutputFolder.create(dir, "R2611A")) {
      Files.writeString(out.staging().resolve("results.csv"), "second", StandardCharsets.UTF_8);
      second = out.publish();
    }
    assertEquals(dir.resolve("R2611A"), first);
    assertEquals(dir.resolve("R2611A-2"), second);
    assertEquals("first", Files.readString(first.resolve("results.csv")));
    assertEquals("second", Files.readString(second.resolve("results.csv")));
    try (Stream<Path> s = Files.list(dir)) {
      assertEquals(2, s.count(), "no staging folder is left behind");
    }
  }

  @Test
  @DisplayName("a folder whose work fails leaves nothing behind")
  void failedWorkLeavesNothing() throws IOException {
    assertThrows(IllegalStateException.class, () -> {
      try (OutputFolder out = OutputFolder.create(dir, "R2611B")) {
        Files.writeString(out.staging().resolve("results.csv"), "half", StandardCharsets.UTF_8);
        throw new IllegalStateException("writer failed");
      }
    });
    try (Stream<Path> s = Files.list(dir)) {
      assertEquals(0, s.count());
    }
    assertFalse(Files.exists(dir.resolve("R2611B")));
    assertThrows(IllegalArgumentException.class, () -> OutputFolder.create(dir, "../x"));
  }

  @Test
  @DisplayName("the SHA-256 of 'abc' is the FIPS 180-2 test vector")
  void sha256() throws IOException {
    // FIPS 180-2, appendix B.1: SHA-256("abc").
    String expected = "ba7816bf8f01cfea414140de5dae2223b00361a396177a9cb410ff61f20015ad";
    assertEquals(expected, Digests.sha256("abc".getBytes(StandardCharsets.US_ASCII)));
    Path f = dir.resolve("abc.txt");
    Files.writeString(f, "abc", StandardCharsets.US_ASCII);
    assertEquals(expected, Digests.sha256(f));
  }
}
