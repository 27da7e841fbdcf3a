package org.quantrun.runner.process;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.PrintWriter;
import java.io.StringWriter;
import org.junit.jupiter.api.DisplayName;
import org.junit.jupiter.api.Test;

class ProgressTest {

  static String draw(boolean interactive, int total) {
    StringWriter err = new StringWriter();
    StringWriter out = new StringWriter();
    Progress p = new Progress(new PrintWriter(err), total, interactive);
    for (int i = 0; i < total; i++) {
      p.start("run-" + i + ".csv");
      p.println(new PrintWriter(out), "line " + i);
      p.step();
    }
    p.finish();
    return err.toString();
  }

  @Test
  @DisplayName("on a terminal with several exports the bar fills up to n/n and is cleared at the end")
  void drawnOnATerminal() {
    String s = draw(true, 4);
    assertTrue(s.contains("[" + "#".repeat(30) + "] 4/4"), s);
    assertTrue(s.contains("] 2/4 run-2.csv"), s);
    assertTrue(s.endsWith("\r"), "the last thing is a cleared line");
  }

  @Test
  @DisplayName("it stays quiet when the output is not a terminal, and for a single export")
  void quietOtherwise() {
    assertEquals("", draw(false, 5));
    assertEquals("", draw(true, 1));
  }
}
