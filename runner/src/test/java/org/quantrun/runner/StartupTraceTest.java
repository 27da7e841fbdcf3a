package org.quantrun.runner;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.ByteArrayOutputStream;
import java.io.PrintStream;
import java.nio.charset.StandardCharsets;
import java.util.List;
import org.junit.jupiter.api.DisplayName;
import org.junit.jupiter.api.Test;

class StartupTraceTest {

  @Test
  @DisplayName("the trace prints each phase in order, its time since the process start growing and each phase's own time")
  void printsPhasesInOrder() throws InterruptedException {
    StartupTrace.turnOn();
    StartupTrace.mark("first phase");
    Thread.sleep(20);
    StartupTrace.mark("second phase");
    ByteArrayOutputStream bytes = new ByteArrayOutputStream();
    StartupTrace.print(new PrintStream(bytes, true, StandardCharsets.UTF_8));
    List<String> lines = bytes.toString(StandardCharsets.UTF_8).lines().toList();
    assertTrue(lines.get(0).startsWith("quantrun start-up trace"), lines.toString());
    int first = -1;
    int second = -1;
    for (int i = 0; i < lines.size(); i++) {
      if (lines.get(i).contains("first phase")) {
        first = i;
      } else if (lines.get(i).contains("second phase")) {
        second = i;
      }
    }
    assertTrue(first > 0 && second == first + 1, lines.toString());
    String[] a = lines.get(first).trim().split("\\s+");
    String[] b = lines.get(second).trim().split("\\s+");
    long sinceA = Long.parseLong(a[a.length - 2]);
    long sinceB = Long.parseLong(b[b.length - 2]);
    long phaseB = Long.parseLong(b[b.length - 1]);
    assertTrue(phaseB >= 20, "the second phase slept 20 ms: " + lines.get(second));
    assertEquals(sinceB - sinceA, phaseB, 1, "the columns agree");
  }
}
