package org.quantrun.runner.watch;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import com.fasterxml.jackson.databind.node.ObjectNode;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.Clock;
import java.time.Instant;
import java.time.ZoneId;
import java.util.List;
import org.junit.jupiter.api.DisplayName;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.quantrun.runner.output.Digests;

/**
 * A restart after a crash at each step of a file's way, set up by hand: the journal as the
 * service left it and the folders as they were. The handler counts its calls, so a file whose
 * results were published must not be processed again.
 */
class RecoveryTest {
  private static final Clock DAY = Clock.fixed(Instant.parse("2031-05-02T08:00:00Z"), ZoneId.of("UTC"));
  private static final byte[] CONTENT = "an export\n".getBytes(StandardCharsets.UTF_8);
  private static final String SHA = Digests.sha256(CONTENT);

  @TempDir Path root;

  private WatchSettings settings() throws WatchConfigException {
    WatchDraft d = WatchFixture.draft(root);
    d.untilIdle = true;
    return d.build();
  }

  private static void journal(WatchSettings s, ObjectNode... lines) throws Exception {
    Files.createDirectories(s.state());
    StringBuilder b = new StringBuilder();
    for (ObjectNode n : lines) {
      b.append(n).append('\n');
    }
    Files.writeString(s.journal(), b.toString());
  }

  private static ObjectNode claim() {
    return Journal.line(1, "claim").put("src", "R1.csv").put("sha256", SHA).put("size", CONTENT.length).put("route", "all files");
  }

  private static WatchLoadTest.DigestHandler restart(WatchSettings s) throws Exception {
    WatchLoadTest.DigestHandler h = new WatchLoadTest.DigestHandler();
    new WatchService(s, h, DAY, e -> { }).run();
    return h;
  }

  private static Path completeFolder(Path where) throws Exception {
    Files.createDirectories(where);
    Files.writeString(where.resolve("digest.txt"), SHA);
    return where;
  }

  @Test
  @DisplayName("killed after the claim: the half-made work folder is removed and the file is processed once")
  void afterClaim() throws Exception {
    WatchSettings s = settings();
    WatchFixture.drop(s.inbox(), "R1.csv", CONTENT);
    Files.createDirectories(s.work().resolve("job-1/.staging-R1-123"));
    Files.writeString(s.work().resolve("job-1/.staging-R1-123/results.csv"), "half");
    journal(s, claim());
    WatchLoadTest.DigestHandler h = restart(s);
    assertEquals(1, h.calls.get(SHA).get());
    assertEquals(List.of("R1"), WatchFixture.folders(s.out()));
    assertTrue(Files.exists(s.archive().resolve("2031-05-02/R1.csv")));
    assertEquals(List.of(), WatchFixture.files(s.work()));
  }

  @Test
  @DisplayName("killed after announcing the publish: the finished results are renamed into place, not made again")
  void afterPublishAnnounced() throws Exception {
    WatchSettings s = settings();
    WatchFixture.drop(s.inbox(), "R1.csv", CONTENT);
    completeFolder(s.work().resolve("job-1/R1"));
    journal(s, claim(), Journal.line(1, "publish").put("work", "job-1/R1").put("target", "R1"));
    WatchLoadTest.DigestHandler h = restart(s);
    assertTrue(h.calls.isEmpty(), "processed again");
    assertEquals(SHA, Files.readString(s.out().resolve("R1/digest.txt")));
    assertTrue(Files.exists(s.archive().resolve("2031-05-02/R1.csv")));
  }

  @Test
  @DisplayName("killed after the publish, before the archive: the input is archived and nothing else is made")
  void afterPublished() throws Exception {
    WatchSettings s = settings();
    WatchFixture.drop(s.inbox(), "R1.csv", CONTENT);
    completeFolder(s.out().resolve("R1"));
    journal(s, claim(), Journal.line(1, "publish").put("work", "job-1/R1").put("target", "R1"));
    WatchLoadTest.DigestHandler h = restart(s);
    assertTrue(h.calls.isEmpty(), "processed again");
    assertEquals(List.of("R1"), WatchFixture.folders(s.out()));
    assertTrue(Files.exists(s.archive().resolve("2031-05-02/R1.csv")));
    assertFalse(Files.exists(s.inbox().resolve("R1.csv")));
  }

  @Test
  @DisplayName("killed after the archive move: the file is done, and its content counts as processed")
  void afterArchived() throws Exception {
    WatchSettings s = settings();
    WatchFixture.drop(s.archive().resolve("2031-05-01"), "R1.csv", CONTENT);
    completeFolder(s.out().resolve("R1"));
    journal(s, claim(), Journal.line(1, "publish").put("work", "job-1/R1").put("target", "R1"),
        Journal.line(1, "archive").put("target", "2031-05-01/R1.csv"));
    restart(s);
    // the same content dropped again is now a duplicate of R1
    WatchFixture.drop(s.inbox(), "R1-again.csv", CONTENT);
    WatchLoadTest.DigestHandler h = restart(s);
    assertTrue(h.calls.isEmpty(), "processed again");
    assertTrue(Files.readString(s.archive().resolve("2031-05-02/R1-again.csv.duplicate.txt")).contains(s.out().resolve("R1").toString()));
    assertEquals(List.of("R1"), WatchFixture.folders(s.out()));
  }

  @Test
  @DisplayName("killed after announcing a failure: the note from the journal is written and the input moved to failed")
  void afterFailAnnounced() throws Exception {
    WatchSettings s = settings();
    WatchFixture.drop(s.inbox(), "R1.csv", CONTENT);
    journal(s, claim(), Journal.line(1, "fail").put("target", "R1.csv").put("note", "Problem: it is not an export\n"));
    WatchLoadTest.DigestHandler h = restart(s);
    assertTrue(h.calls.isEmpty(), "processed again");
    assertEquals("Problem: it is not an export\n", Files.readString(s.failed().resolve("R1.csv.error.txt")));
    assertTrue(Files.exists(s.failed().resolve("R1.csv")));
    assertEquals(List.of(), WatchFixture.folders(s.out()));
  }
}
