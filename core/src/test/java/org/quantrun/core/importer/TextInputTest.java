package org.quantrun.core.importer;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.BufferedReader;
import java.io.ByteArrayInputStream;
import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.util.Arrays;
import org.junit.jupiter.api.DisplayName;
import org.junit.jupiter.api.Test;

class TextInputTest {

  static String readAll(byte[] bytes, ImportSettings s) throws ImportException {
    TextInput t = TextInput.open(new ByteArrayInputStream(bytes), s, "x.txt");
    StringBuilder sb = new StringBuilder();
    try (BufferedReader r = new BufferedReader(t)) {
      String line;
      while ((line = r.readLine()) != null) {
        sb.append(line).append('\n');
      }
    } catch (IOException e) {
      throw t.problem(e, t.line());
    }
    return sb.toString();
  }

  static byte[] concat(byte[] a, byte[] b) {
    byte[] out = Arrays.copyOf(a, a.length + b.length);
    System.arraycopy(b, 0, out, a.length, b.length);
    return out;
  }

  // byte-order marks EF BB BF (UTF-8), FF FE (UTF-16 LE), FE FF (UTF-16 BE): the Unicode
  // standard's values, from memory
  @Test
  @DisplayName("byte-order marks pick UTF-8 or UTF-16 and are not part of the text")
  void byteOrderMarks() throws ImportException {
    String text = "Ünit µg/L\n";
    byte[] u8 = concat(new byte[] {(byte) 0xEF, (byte) 0xBB, (byte) 0xBF}, text.getBytes(StandardCharsets.UTF_8));
    byte[] le = concat(new byte[] {(byte) 0xFF, (byte) 0xFE}, text.getBytes(StandardCharsets.UTF_16LE));
    byte[] be = concat(new byte[] {(byte) 0xFE, (byte) 0xFF}, text.getBytes(StandardCharsets.UTF_16BE));
    for (byte[] b : new byte[][] {u8, le, be}) {
      assertEquals(text, readAll(b, ImportSettings.DEFAULT));
    }
    // a declared UTF-16 uses the mark for the byte order
    assertEquals(text, readAll(be, ImportSettings.DEFAULT.toBuilder().charset(StandardCharsets.UTF_16).build()));
  }

  @Test
  @DisplayName("text that is not valid UTF-8 is read as Windows-1252")
  void windows1252Fallback() throws ImportException {
    byte[] b = "21,5 °C\n".getBytes(TextInput.WINDOWS_1252);
    assertEquals("21,5 °C\n", readAll(b, ImportSettings.DEFAULT));
  }

  @Test
  @DisplayName("UTF-16 without a byte-order mark and binary data are refused with a hint")
  void binaryAndBomlessUtf16() {
    ImportException u = assertThrows(ImportException.class,
        () -> readAll("Sample,Cd\n".getBytes(StandardCharsets.UTF_16LE), ImportSettings.DEFAULT));
    assertTrue(u.getMessage().contains("UTF-16"), u.getMessage());
    ImportException bin = assertThrows(ImportException.class,
        () -> readAll(new byte[] {1, 2, 3, 0, 5, 6, 7, 8, 9, 10}, ImportSettings.DEFAULT));
    assertTrue(bin.getMessage().contains("binary"), bin.getMessage());
  }

  @Test
  @DisplayName("invalid bytes in a declared charset are an error naming the line")
  void invalidBytesNameTheLine() {
    StringBuilder sb = new StringBuilder();
    for (int i = 1; i < 5000; i++) {
      sb.append("line ").append(i).append(",1.0\n");
    }
    byte[] good = sb.toString().getBytes(StandardCharsets.UTF_8);
    byte[] bad = concat(good, "Op\u00e9rateur\n".getBytes(TextInput.WINDOWS_1252));
    ImportSettings utf8 = ImportSettings.DEFAULT.toBuilder().charset(StandardCharsets.UTF_8).build();
    ImportException e = assertThrows(ImportException.class, () -> readAll(bad, utf8));
    assertEquals(5000, e.position().line(), e.getMessage());
    assertTrue(e.getMessage().contains("not valid UTF-8"), e.getMessage());
  }

  @Test
  @DisplayName("a line longer than the limit and a NUL character later in the file are errors naming the line")
  void longLinesAndLateNul() {
    ImportSettings s = ImportSettings.DEFAULT.toBuilder().maxLineLength(100).build();
    ImportException e = assertThrows(ImportException.class,
        () -> readAll(("a\nb\n" + "x".repeat(101) + "\n").getBytes(StandardCharsets.UTF_8), s));
    assertEquals(3, e.position().line());
    byte[] nul = ("a\n".repeat(40_000) + "b\u0000c\n").getBytes(StandardCharsets.UTF_8);
    ImportException n = assertThrows(ImportException.class, () -> readAll(nul, ImportSettings.DEFAULT));
    assertEquals(40_001, n.position().line());
  }

  @Test
  @DisplayName("the head text for detection never throws and is empty for binary data")
  void headText() {
    assertEquals("", TextInput.headText(new byte[] {0, 1, 2, 0, 4}));
    assertEquals("a,b", TextInput.headText(new byte[] {(byte) 0xEF, (byte) 0xBB, (byte) 0xBF, 'a', ',', 'b'}));
    assertEquals("", TextInput.headText(new byte[0]));
  }
}
