package org.quantrun.importer.delimited;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import org.junit.jupiter.api.DisplayName;
import org.junit.jupiter.api.Test;

/** Delimiter detection; the cases are common practice of instrument and spreadsheet exports. */
class DelimiterSnifferTest {

  static char sniff(String text) {
    return DelimiterSniffer.sniff(text, false, '"', true).orElseThrow().delimiter();
  }

  @Test
  @DisplayName("semicolon wins over the decimal commas inside its fields")
  void semicolonOverDecimalComma() {
    assertEquals(';', sniff("Sample;Element;Intensity\nA;Cd;1,5\nB;Cd;2,5\nC;Cd;3\n"));
  }

  @Test
  @DisplayName("a comma file with a stray semicolon in a remark stays comma")
  void commaWithStraySemicolon() {
    assertEquals(',', sniff("Sample,Element,Intensity,Remark\nA,Cd,1.5,\nB,Cd,2.5,see note; rerun\nC,Cd,3,\nD,Cd,4,\n"));
  }

  @Test
  @DisplayName("a preamble of key/value lines does not hide the table's delimiter")
  void preamble() {
    assertEquals('\t', sniff("Lab\tInvented\nRun\tR1\n\nSample\tElement\tIntensity\tUnit\nA\tCd\t1\tcps\nB\tCd\t2\tcps\n"));
  }

  @Test
  @DisplayName("delimiters inside quotes are not counted")
  void quotes() {
    assertEquals('|', sniff("Sample|Element|Remark\n\"a;b;c;d\"|Cd|x\n\"e;f;g;h\"|Pb|y\n"));
  }

  @Test
  @DisplayName("prose has no delimiter")
  void prose() {
    assertTrue(DelimiterSniffer.sniff("just words here\nand more words\n", false, '"', true).isEmpty());
  }
}
