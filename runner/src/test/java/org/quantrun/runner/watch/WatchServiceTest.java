package org.quantrun.runner.watch;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;
import static org.quantrun.runner.watch.WatchFixture.await;
import static org.quantrun.runner.watch.WatchFixture.drop;
import static org.quantrun.runner.watch.WatchFixture.export;
import static org.quantrun.runner.watch.WatchFixture.files;
import static org.quantrun.runner.watch.WatchFixture.folders;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import java.io.IOException;
import java.io.OutputStream;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.StandardOpenOption;
import java.time.Clock;
import java.time.Duration;
import java.time.Instant;
import java.time.ZoneId;
import java.util.List;
import java.util.Optional;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.DisplayName;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.quantrun.runner.output.Digests;

/** The watch service in this JVM, with the real importers and core's run processor. */
class WatchServiceTest {
  private static final ObjectMapper JSON = new ObjectMapper();
  /** A day chosen so the archive's date folder cannot come from the machine's own clock by chance. */
  private static final Clock MARCH_14 = Clock.fixed(Instant.parse("2031-03-14T10:15:30Z"), ZoneId.of("UTC"));
  private static final Duration LONG = Duration.ofSeconds(20);
  static ExportHandler handler;

  @TempDir Path root;

  @BeforeAll
  static void handler() throws WatchConfigException {
    handler = WatchFixture.coreHandler(List.of(Route.everything(WatchFixture.METHOD, Optional.of(WatchFixture.PROFILE),
        Optional.empty())));
  }

  private WatchFixture.Running start(WatchDraft d) throws WatchConfigException {
    return new WatchFixture.Running(d.build(), handler, MARCH_14);
  }

  @Test
  @DisplayName("files present at start and files dropped later are processed: results under OUT/<run>/, inputs in archive/<date>/")
  void presentAndNewFilesAreProcessed() throws Exception {
    WatchDraft d = WatchFixture.draft(root);
    drop(d.inbox, "R1.csv", export("1"));
    try (WatchFixture.Running w = start(d)) {
      await("R1 archived", LONG, () -> Files.exists(d.inbox.resolve("archive/2031-03-14/R1.csv")));
      drop(d.inbox, "R2.csv", export("2"));
      await("R2 archived", LONG, () -> Files.exists(d.inbox.resolve("archive/2031-03-14/R2.csv")));
    }
    assertEquals(List.of("R1", "R2"), folders(d.out));
    assertEquals(Digests.sha256(export("1")), WatchFixture.exportSha(d.out.resolve("R1")));
    assertEquals(List.of("archive/2031-03-14/R1.csv", "archive/2031-03-14/R2.csv"), files(d.inbox));
  }

  @Test
  @DisplayName("temporary and hidden names are never taken, and a file still being written is taken only once it is quiet")
  void incompleteFilesWait() throws Exception {
    WatchDraft d = WatchFixture.draft(root);
    d.quiet = Duration.ofMillis(600);
    Files.createDirectories(d.inbox);
    for (String n : List.of("R1.csv.tmp", "R1.csv.part", "~$R1.csv", ".R1.csv")) {
      Files.write(d.inbox.resolve(n), export(n));
    }
    Path growing = d.inbox.resolve("R3.csv");
    byte[] all = export("3");
    try (WatchFixture.Running w = start(d); OutputStream o = Files.newOutputStream(growing)) {
      // write it in pieces, each well within the quiet period of the one before
      int step = all.length / 8;
      for (int i = 0; i < 8; i++) {
        o.write(all, i * step, i == 7 ? all.length - i * step : step);
        o.flush();
        Thread.sleep(200);
        assertTrue(Files.exists(growing), "taken while still being written (piece " + i + ")");
      }
      o.close();
      await("R3 archived", LONG, () -> Files.exists(d.inbox.resolve("archive/2031-03-14/R3.csv")));
      Thread.sleep(300);
    }
    assertEquals(Digests.sha256(all), Digests.sha256(d.inbox.resolve("archive/2031-03-14/R3.csv")));
    assertEquals(List.of("R3"), folders(d.out));
    for (String n : List.of("R1.csv.tmp", "R1.csv.part", "~$R1.csv", ".R1.csv")) {
      assertTrue(Files.exists(d.inbox.resolve(n)), n + " must stay where it is");
    }
  }

  @Test
  @DisplayName("a companion marker makes a file complete at once, long before its quiet period is over")
  void markerTakesAFileAtOnce() throws Exception {
    WatchDraft d = WatchFixture.draft(root);
    d.quiet = Duration.ofMinutes(10);
    d.marker = ".ready";
    drop(d.inbox, "R4.csv", export("4"));
    try (WatchFixture.Running w = start(d)) {
      Thread.sleep(500);
      assertTrue(Files.exists(d.inbox.resolve("R4.csv")), "no marker yet, and far from quiet for ten minutes");
      Files.writeString(d.inbox.resolve("R4.csv.ready"), "");
      await("R4 archived", LONG, () -> Files.exists(d.inbox.resolve("archive/2031-03-14/R4.csv")));
    }
    assertEquals(List.of("R4"), folders(d.out));
    assertTrue(Files.exists(d.inbox.resolve("archive/2031-03-14/R4.csv.ready")), "the marker travels with its file");
  }

  @Test
  @DisplayName("a file that cannot be processed goes to failed/ beside an error note saying what was wrong and what to do")
  void badFileGoesToFailedWithANote() throws Exception {
    WatchDraft d = WatchFixture.draft(root);
    byte[] broken = new String(export("5"), StandardCharsets.UTF_8).replace("\n1,CAL-BLK,BLANK,2026-11-26 09:14:05,As,188.980,2,199.8,",
        "\n1,CAL-BLK,BLANK,2026-11-26 09:14:05,As,188.980,2,19x9.8,").getBytes(StandardCharsets.UTF_8);
    drop(d.inbox, "R5.csv", broken);
    try (WatchFixture.Running w = start(d)) {
      await("R5 failed", LONG, () -> Files.exists(d.inbox.resolve("failed/R5.csv")));
    }
    String note = Files.readString(d.inbox.resolve("failed/R5.csv.error.txt"));
    // the broken reading is on line 3, column 8 (Intensity) of the export
    assertTrue(note.contains("R5.csv:3:8"), note);
    assertTrue(note.contains("19x9.8"), note);
    assertTrue(note.contains("What to do:"), note);
    assertTrue(note.contains("qualified analyst"), note);
    assertEquals(Digests.sha256(broken), Digests.sha256(d.inbox.resolve("failed/R5.csv")), "the input is unchanged");
    assertEquals(List.of(), folders(d.out), "nothing is published for a failed file");
  }

  @Test
  @DisplayName("name clashes in archive, failed and results get a suffix; nothing is overwritten")
  void clashesGetASuffix() throws Exception {
    WatchDraft d = WatchFixture.draft(root);
    Path earlier = d.inbox.resolve("archive/2031-03-14/R6.csv");
    Files.createDirectories(earlier.getParent());
    Files.writeString(earlier, "an earlier file of the same name");
    Files.createDirectories(d.out.resolve("R6"));
    Files.writeString(d.out.resolve("R6/mine.txt"), "someone's own folder");
    drop(d.inbox, "R6.csv", export("6"));
    try (WatchFixture.Running w = start(d)) {
      await("R6 archived", LONG, () -> Files.exists(d.inbox.resolve("archive/2031-03-14/R6-2.csv")));
      drop(d.inbox, "R6.csv", export("6b"));
      await("second R6 archived", LONG, () -> Files.exists(d.inbox.resolve("archive/2031-03-14/R6-3.csv")));
    }
    assertEquals("an earlier file of the same name", Files.readString(earlier));
    assertEquals("someone's own folder", Files.readString(d.out.resolve("R6/mine.txt")));
    assertEquals(List.of("R6", "R6-2", "R6-3"), folders(d.out));
  }

  @Test
  @DisplayName("content processed before is archived as a duplicate pointing to the earlier results, and not processed again")
  void duplicatesAreNotProcessedAgain() throws Exception {
    WatchDraft d = WatchFixture.draft(root);
    drop(d.inbox, "R7.csv", export("7"));
    try (WatchFixture.Running w = start(d)) {
      await("R7 archived", LONG, () -> Files.exists(d.inbox.resolve("archive/2031-03-14/R7.csv")));
      drop(d.inbox.resolve("again"), "R7-copy.csv", export("7"));
      await("copy archived", LONG, () -> Files.exists(d.inbox.resolve("archive/2031-03-14/again/R7-copy.csv")));
    }
    assertEquals(List.of("R7"), folders(d.out), "one results folder for one content");
    String note = Files.readString(d.inbox.resolve("archive/2031-03-14/again/R7-copy.csv.duplicate.txt"));
    assertTrue(note.contains(d.out.resolve("R7").toString()), note);
    assertTrue(note.contains(Digests.sha256(export("7"))), note);
    assertTrue(note.contains("--reprocess"), note);
  }

  @Test
  @DisplayName("with reprocess, content processed before is processed again into a new results folder")
  void reprocessProcessesAgain() throws Exception {
    WatchDraft d = WatchFixture.draft(root);
    drop(d.inbox, "R8.csv", export("8"));
    try (WatchFixture.Running w = start(d)) {
      await("R8 archived", LONG, () -> Files.exists(d.inbox.resolve("archive/2031-03-14/R8.csv")));
    }
    d.reprocess = true;
    drop(d.inbox, "R8.csv", export("8"));
    try (WatchFixture.Running w = start(d)) {
      await("R8 archived again", LONG, () -> Files.exists(d.inbox.resolve("archive/2031-03-14/R8-2.csv")));
    }
    assertEquals(List.of("R8", "R8-2"), folders(d.out));
  }

  @Test
  @DisplayName("a file no route takes goes to failed/ with a note naming the folder and what to add")
  void unroutedFileFails() throws Exception {
    WatchDraft d = WatchFixture.draft(root);
    Route oes = new Route("folder oes", Optional.of("oes"), "*.csv", WatchFixture.METHOD, Optional.of(WatchFixture.PROFILE),
        Optional.empty());
    d.routes = List.of(oes);
    drop(d.inbox.resolve("oes"), "R9.csv", export("9"));
    drop(d.inbox.resolve("ms"), "R10.csv", export("10"));
    try (WatchFixture.Running w = new WatchFixture.Running(d.build(), WatchFixture.coreHandler(d.routes), MARCH_14)) {
      await("both done", LONG, () -> Files.exists(d.inbox.resolve("archive/2031-03-14/oes/R9.csv"))
          && Files.exists(d.inbox.resolve("failed/ms/R10.csv")));
    }
    String note = Files.readString(d.inbox.resolve("failed/ms/R10.csv.error.txt"));
    assertTrue(note.contains("no route") && note.contains("'ms'"), note);
  }

  @Test
  @DisplayName("a link that points nowhere is moved to failed/ with the reason it cannot be read")
  void unreadableFileFails() throws Exception {
    WatchDraft d = WatchFixture.draft(root);
    Files.createDirectories(d.inbox);
    Files.createSymbolicLink(d.inbox.resolve("R11.csv"), root.resolve("nowhere.csv"));
    try (WatchFixture.Running w = start(d)) {
      await("R11 failed", LONG, () -> Files.isSymbolicLink(d.inbox.resolve("failed/R11.csv")));
    }
    String note = Files.readString(d.inbox.resolve("failed/R11.csv.error.txt"));
    assertTrue(note.contains("cannot be read"), note);
  }

  @Test
  @DisplayName("a file that cannot be moved to failed/ stays in the inbox, and the reason is in the status file")
  void unmovableFileStaysWithAReason() throws Exception {
    WatchDraft d = WatchFixture.draft(root);
    d.failed = root.resolve("blocked/failed");
    Files.writeString(root.resolve("blocked"), "a file where the failed folder's parent should be");
    drop(d.inbox, "R12.csv", "not an export at all\n".getBytes(StandardCharsets.UTF_8));
    try (WatchFixture.Running w = start(d)) {
      await("status names it", LONG, () -> w.service.status().path("last_error").path("file").asText().equals("R12.csv"));
      JsonNode status = JSON.readTree(d.build().statusFile().toFile());
      await("status file names it", LONG, () -> {
        try {
          return JSON.readTree(d.build().statusFile().toFile()).path("left_in_inbox").asInt() >= 1;
        } catch (Exception e) {
          return false;
        }
      });
      assertTrue(status != null);
    }
    assertTrue(Files.exists(d.inbox.resolve("R12.csv")), "left where it was");
    JsonNode status = JSON.readTree(d.build().statusFile().toFile());
    assertTrue(status.path("last_error").path("message").asText().contains("could not be moved"), status.toString());
  }

  @Test
  @DisplayName("a file left in the inbox that is then taken away by hand is forgotten, and the service goes on at its polling pace")
  void leftFileTakenAwayIsForgotten() throws Exception {
    WatchDraft d = WatchFixture.draft(root);
    d.changeEvents = false;
    d.poll = Duration.ofMillis(50); // a left file is looked at again after 30 polls: 1.5 s
    d.failed = root.resolve("blocked/failed");
    Files.writeString(root.resolve("blocked"), "a file where the failed folder's parent should be");
    drop(d.inbox, "R18.csv", "not an export at all\n".getBytes(StandardCharsets.UTF_8));
    try (WatchFixture.Running w = start(d)) {
      await("left", LONG, () -> w.service.status().path("left_in_inbox").asInt() == 1);
      Files.delete(d.inbox.resolve("R18.csv"));
      Thread.sleep(2000); // past the time it was to be looked at again
      long before = w.service.status().path("inbox_looks").asLong();
      Thread.sleep(1000);
      long looks = w.service.status().path("inbox_looks").asLong() - before;
      // polling every 50 ms and a status rewrite every 100 ms: about 20 looks a second, not one a millisecond
      assertTrue(looks <= 60, looks + " looks at the inbox in one second");
    }
  }

  @Test
  @DisplayName("the inbox may vanish and come back: the service says so, keeps looking, and goes on")
  void inboxVanishesAndReturns() throws Exception {
    WatchDraft d = WatchFixture.draft(root);
    d.changeEvents = false;
    Files.createDirectories(d.inbox);
    try (WatchFixture.Running w = start(d)) {
      await("watching", LONG, () -> w.service.status().path("state").asText().equals("running"));
      Files.delete(d.inbox);
      await("inbox missing", LONG, () -> !w.service.status().path("inbox_present").asBoolean());
      assertTrue(w.service.status().path("last_error").path("message").asText().contains("not there"));
      drop(d.inbox, "R13.csv", export("13"));
      await("R13 archived", LONG, () -> Files.exists(d.inbox.resolve("archive/2031-03-14/R13.csv")));
      assertTrue(w.events.stream().anyMatch(e -> e.contains("is back")), w.events.toString());
    }
    assertEquals(List.of("R13"), folders(d.out));
  }

  @Test
  @DisplayName("polling alone, without change events, finds new files")
  void pollingAloneWorks() throws Exception {
    WatchDraft d = WatchFixture.draft(root);
    d.changeEvents = false;
    d.poll = Duration.ofMillis(150);
    try (WatchFixture.Running w = start(d)) {
      drop(d.inbox, "R14.csv", export("14"));
      await("R14 archived", LONG, () -> Files.exists(d.inbox.resolve("archive/2031-03-14/R14.csv")));
    }
  }

  @Test
  @DisplayName("the status file is JSON with queue, done, failed, last error and uptime, and is never seen half-written")
  void statusFileIsWholeJson() throws Exception {
    WatchDraft d = WatchFixture.draft(root);
    d.statusInterval = Duration.ofMillis(20);
    drop(d.inbox, "R15.csv", export("15"));
    drop(d.inbox, "R16.csv", "no export\n".getBytes(StandardCharsets.UTF_8));
    Path status = d.build().statusFile();
    int reads = 0;
    try (WatchFixture.Running w = start(d)) {
      long end = System.nanoTime() + Duration.ofSeconds(20).toNanos();
      while (System.nanoTime() < end) {
        if (Files.exists(status)) {
          JsonNode n = JSON.readTree(Files.readAllBytes(status)); // throws if ever half-written
          reads++;
          if (n.path("done").asInt() == 1 && n.path("failed").asInt() == 1) {
            break;
          }
        }
      }
    }
    JsonNode n = JSON.readTree(status.toFile());
    assertEquals(1, n.get("done").asInt());
    assertEquals(1, n.get("failed").asInt());
    assertEquals(0, n.get("queue").asInt());
    assertEquals("R16.csv", n.get("last_error").get("file").asText());
    assertTrue(n.get("uptime_seconds").isNumber());
    assertEquals("stopped", n.get("state").asText());
    assertTrue(reads > 10, "read while it was being rewritten: " + reads);
  }

  @Test
  @DisplayName("the journal survives a torn last line, and a restart keeps knowing what was processed")
  void journalKeepsProcessedContentAcrossRestarts() throws Exception {
    WatchDraft d = WatchFixture.draft(root);
    drop(d.inbox, "R17.csv", export("17"));
    try (WatchFixture.Running w = start(d)) {
      await("R17 archived", LONG, () -> Files.exists(d.inbox.resolve("archive/2031-03-14/R17.csv")));
    }
    Files.writeString(d.build().journal(), "{\"job\":99,\"step\":\"cla", StandardOpenOption.APPEND);
    drop(d.inbox, "R17-again.csv", export("17"));
    try (WatchFixture.Running w = start(d)) {
      await("duplicate archived", LONG, () -> Files.exists(d.inbox.resolve("archive/2031-03-14/R17-again.csv")));
    }
    assertTrue(Files.exists(d.inbox.resolve("archive/2031-03-14/R17-again.csv.duplicate.txt")));
    assertEquals(List.of("R17"), folders(d.out));
  }

  @Test
  @DisplayName("a second service on the same folders is refused while the first runs")
  void secondServiceIsRefused() throws Exception {
    WatchDraft d = WatchFixture.draft(root);
    try (WatchFixture.Running w = start(d)) {
      await("watching", LONG, () -> w.service.status().path("state").asText().equals("running"));
      WatchService second = new WatchService(d.build(), handler, MARCH_14, e -> { });
      WatchConfigException e = org.junit.jupiter.api.Assertions.assertThrows(WatchConfigException.class, second::run);
      assertTrue(e.getMessage().contains("already using"), e.getMessage());
    }
    assertFalse(Files.exists(d.out.resolve("R1")));
  }
}
