package org.quantrun.runner.watch;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;
import static org.quantrun.runner.watch.WatchFixture.await;
import static org.quantrun.runner.watch.WatchFixture.drop;
import static org.quantrun.runner.watch.WatchFixture.export;

import java.nio.file.Files;
import java.nio.file.Path;
import java.time.Clock;
import java.time.Duration;
import java.util.List;
import java.util.Optional;
import org.junit.jupiter.api.DisplayName;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;
import org.quantrun.runner.CommandRun;

/** The watch configuration file, and the command line around it. */
class WatchConfigTest {
  static final Path EXAMPLE = Path.of("../config-examples/watch/watch.yaml").toAbsolutePath().normalize();

  @TempDir Path root;

  @Test
  @DisplayName("the example watch configuration maps a sub-folder and a file-name pattern to the demo method and two profiles")
  void exampleLoads() throws Exception {
    WatchDraft d = new WatchDraft();
    WatchConfigFile.read(EXAMPLE, d);
    WatchSettings s = d.build();
    assertEquals(2, s.routes().size());
    Route longCsv = s.routes().get(0);
    Route wide = s.routes().get(1);
    assertEquals(Optional.of("long"), longCsv.folder());
    assertTrue(longCsv.takes("long", "R1.csv") && !longCsv.takes("", "R1.csv") && !longCsv.takes("long", "R1.txt"));
    assertTrue(wide.takes("", "run-R2611A-wide.txt") && wide.takes("any/where", "x-wide.txt"));
    for (Route r : s.routes()) {
      assertTrue(Files.isRegularFile(r.method()), r.method().toString());
      assertTrue(Files.isRegularFile(r.profile().orElseThrow()), r.profile().toString());
    }
    assertEquals(Duration.ofSeconds(2), s.quietPeriod());
    assertEquals(Optional.of(".ready"), s.marker());
    assertEquals(List.of("*.bak", "Thumbs.db"), s.ignore());
    assertEquals(10L * 1024 * 1024, s.logMaxBytes());
    assertEquals(s.inbox().resolve("archive"), s.archive());
    assertEquals(s.out().resolve(".watch"), s.state());
  }

  @Test
  @DisplayName("with the example's routes, each export is read with its route's profile; a file no route takes fails")
  void exampleRoutesProcessTheirFiles() throws Exception {
    WatchDraft d = new WatchDraft();
    WatchConfigFile.read(EXAMPLE, d);
    d.inbox = root.resolve("inbox");
    d.out = root.resolve("results");
    d.quiet = Duration.ofMillis(100);
    d.poll = Duration.ofMillis(50);
    WatchSettings s = d.build();
    drop(d.inbox.resolve("long"), "K1.csv", export("k1"));
    drop(d.inbox.resolve("from-bench-2"), "run-R2611A-wide.txt",
        Files.readAllBytes(Path.of("../demo-data/run-R2611A-wide.txt")));
    drop(d.inbox, "K2.csv", export("k2"));
    Files.writeString(d.inbox.resolve("notes.bak"), "left alone");
    try (WatchFixture.Running w = new WatchFixture.Running(s, WatchFixture.coreHandler(s.routes()), Clock.systemDefaultZone())) {
      await("all three done", Duration.ofSeconds(30), () -> w.service.status().path("done").asInt() == 2
          && w.service.status().path("failed").asInt() == 1);
    }
    // the wide export names its run in its metadata (Run;R2611A); the long one is named by its file
    assertEquals(List.of("K1", "R2611A"), WatchFixture.folders(d.out));
    assertTrue(Files.exists(d.inbox.resolve("failed/K2.csv")));
    assertTrue(Files.exists(d.inbox.resolve("notes.bak")));
  }

  @Test
  @DisplayName("a bad configuration names file, line, column and key for every problem")
  void badConfigurationIsExplained() throws Exception {
    Path f = root.resolve("bad.yaml");
    Files.writeString(f, String.join("\n",
        "inbox: in",
        "quiet-period: soon",
        "colour: blue",
        "workers: 0",
        "routes:",
        "  - folder: oes",
        "    pattern: \"*.csv\"",
        ""));
    WatchConfigException e = assertThrows(WatchConfigException.class, () -> WatchConfigFile.read(f, new WatchDraft()));
    String all = String.join("\n", e.lines());
    assertTrue(all.contains("bad.yaml:2:15: quiet-period: expected a duration"), all);
    assertTrue(all.contains("bad.yaml:3:1: colour: unknown key"), all);
    assertTrue(all.contains("bad.yaml:4:10: workers: expected a whole number of at least 1"), all);
    assertTrue(all.contains("bad.yaml:6:5: routes[0]: a route needs a method"), all);
  }

  @ParameterizedTest(name = "[{0}] is {1} ms")
  @CsvSource({"2s, 2000", "150ms, 150", "1min, 60000", "0.5s, 500", "3, 3000", "1h, 3600000"})
  void durationsAreRead(String text, long ms) {
    assertEquals(Duration.ofMillis(ms), WatchConfigFile.parseDuration(text).orElseThrow());
  }

  @Test
  @DisplayName("durations and sizes that are not ones are refused")
  void badDurationsAndSizes() {
    for (String t : List.of("", "soon", "-1s", "0s", "2 days")) {
      assertTrue(WatchConfigFile.parseDuration(t).isEmpty(), t);
    }
    assertEquals(Optional.of(10L * 1024 * 1024), WatchConfigFile.parseSize("10MB"));
    assertTrue(WatchConfigFile.parseSize("12").isEmpty(), "under 1 KB");
    assertTrue(WatchConfigFile.parseSize("lots").isEmpty());
  }

  @Test
  @DisplayName("watch without a method, or with a bad option value, is a usage error: one message, exit code 2")
  void usageErrors() throws Exception {
    CommandRun r = CommandRun.of("watch", root.resolve("in").toString(), "--out", root.resolve("out").toString());
    assertEquals(2, r.exitCode());
    assertTrue(r.err().contains("no method"), r.err());
    r = CommandRun.of("watch", root.resolve("in").toString(), "--method", WatchFixture.METHOD.toString(), "--out",
        root.resolve("out").toString(), "--quiet-period", "soon");
    assertEquals(2, r.exitCode());
    assertTrue(r.err().contains("'soon' is not a duration"), r.err());
    r = CommandRun.of("watch", root.resolve("in").toString(), "--method", root.resolve("missing.yaml").toString(),
        "--out", root.resolve("out").toString());
    assertEquals(2, r.exitCode());
    assertTrue(r.err().contains("missing.yaml: no such file"), r.err());
    assertTrue(!Files.exists(root.resolve("out")), "nothing is made for a refused command");
  }

  @Test
  @DisplayName("the command processes what is in the inbox and, with --until-idle, stops when nothing is left")
  void commandRunsUntilIdle() throws Exception {
    Path in = root.resolve("in");
    drop(in, "C1.csv", export("c1"));
    CommandRun r = CommandRun.of("watch", in.toString(), "--method", WatchFixture.METHOD.toString(), "--profile",
        WatchFixture.PROFILE.toString(), "--out", root.resolve("out").toString(), "--plugins", WatchFixture.PLUGINS.toString(),
        "--quiet-period", "100ms", "--until-idle");
    assertEquals(0, r.exitCode(), r.err());
    assertTrue(r.out().contains("C1.csv: run C1"), r.out());
    assertEquals(List.of("C1"), WatchFixture.folders(root.resolve("out")));
    assertTrue(Files.isRegularFile(root.resolve("out/.watch/logs/watch.log")));
  }
}
