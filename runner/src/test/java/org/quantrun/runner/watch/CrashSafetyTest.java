package org.quantrun.runner.watch;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;
import static org.quantrun.runner.watch.WatchFixture.drop;
import static org.quantrun.runner.watch.WatchFixture.export;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.HashMap;
import java.util.HashSet;
import java.util.List;
import java.util.Map;
import java.util.Random;
import java.util.Set;
import java.util.TreeMap;
import java.util.concurrent.TimeUnit;
import java.util.stream.Stream;
import org.junit.jupiter.api.DisplayName;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.quantrun.runner.output.Digests;

/**
 * The watch service in a JVM of its own, killed without warning (SIGKILL) at random moments while
 * files keep arriving, and stopped with SIGTERM. After every kill and restart the folders are
 * checked from the outside: by content, never by the service's own journal.
 */
class CrashSafetyTest {
  private static final ObjectMapper JSON = new ObjectMapper();
  private static final int TRIALS = 60;
  private static final Set<String> EVERY_OUTPUT = Set.copyOf(java.util.Arrays.stream(
      org.quantrun.runner.write.OutputFormat.values()).flatMap(f -> f.files().stream()).toList());

  @TempDir Path root;

  /** Every input ever dropped, by content: how many copies, and whether it is a broken export. */
  private final Map<String, Integer> dropped = new TreeMap<>();
  private final Set<String> broken = new HashSet<>();

  private void dropCounted(Path dir, String name, byte[] content, boolean bad) throws IOException {
    drop(dir, name, content);
    String sha = Digests.sha256(content);
    dropped.merge(sha, 1, Integer::sum);
    if (bad) {
      broken.add(sha);
    }
  }

  @Test
  @DisplayName("killed with SIGKILL at 60 random moments, the service never loses, doubles or half-writes anything")
  void sigkillAtRandomMoments() throws Exception {
    long seed = System.nanoTime();
    Random rnd = new Random(seed);
    Path inbox = root.resolve("inbox");
    Path out = root.resolve("results");
    Path log = root.resolve("child.log");
    List<byte[]> good = new ArrayList<>();
    int variant = 0;
    int kills = 0;
    int interrupted = 0;
    for (int trial = 0; trial < TRIALS; trial++) {
      for (int i = 0; i < 2; i++) {
        byte[] b = export("crash-" + variant++);
        good.add(b);
        // few names, so names clash in the archive and the results folders
        String name = "R" + rnd.nextInt(6) + ".csv";
        if (Files.exists(inbox.resolve(name))) {
          name = "R-" + variant + ".csv";
        }
        dropCounted(inbox, name, b, false);
      }
      if (trial % 3 == 1) {
        dropCounted(inbox.resolve("sub"), "again-" + trial + ".csv", good.get(rnd.nextInt(good.size())), false);
      }
      if (trial % 5 == 2) {
        dropCounted(inbox, "bad-" + trial + ".csv", ("not an export " + trial + "\n").getBytes(StandardCharsets.UTF_8), true);
      }
      int started = starts(log);
      Process p = ChildService.start(inbox, out, log, "--quiet-period", "50ms", "--poll-interval", "50ms", "--workers", "2");
      // a random moment from the start of the JVM (a few trials) or of the watching (most), when files are on their way
      if (trial % 6 == 0) {
        Thread.sleep(rnd.nextInt(900));
      } else {
        long until = System.nanoTime() + TimeUnit.SECONDS.toNanos(10);
        while (starts(log) == started && p.isAlive() && System.nanoTime() < until) {
          Thread.sleep(2);
        }
        Thread.sleep(rnd.nextInt(400));
      }
      if (p.isAlive()) {
        kills++;
      }
      p.destroyForcibly(); // SIGKILL on Linux
      assertTrue(p.waitFor(30, TimeUnit.SECONDS), "the killed service did not end");
      check(inbox, out, false, "trial " + trial + " (seed " + seed + ")");
      interrupted += unfinishedSteps(out);
    }
    System.out.println("CrashSafetyTest: " + kills + " kills, " + interrupted + " files caught between claim and done");
    assertTrue(kills >= 50, "only " + kills + " kills hit a running service");
    // coverage, not correctness: the kills must catch files in the middle of their way, or the test proves little
    assertTrue(interrupted >= 15, "only " + interrupted + " kills caught a file in progress");
    Process last = ChildService.start(inbox, out, log, "--quiet-period", "50ms", "--poll-interval", "50ms", "--until-idle");
    assertTrue(last.waitFor(120, TimeUnit.SECONDS), "the last run did not finish");
    assertEquals(0, last.exitValue(), Files.readString(log));
    check(inbox, out, true, "after the last run (seed " + seed + ")");
  }

  @Test
  @DisplayName("SIGTERM lets the files in progress finish, takes nothing new, and leaves no unfinished step behind")
  void sigtermFinishesWhatIsInProgress() throws Exception {
    Path inbox = root.resolve("inbox");
    Path out = root.resolve("results");
    Path log = root.resolve("child.log");
    for (int i = 0; i < 40; i++) {
      dropCounted(inbox, "T" + i + ".csv", export("term-" + i), false);
    }
    Process p = ChildService.start(inbox, out, log, "--quiet-period", "50ms", "--workers", "2");
    long end = System.nanoTime() + TimeUnit.SECONDS.toNanos(60);
    while (WatchFixture.folders(out).size() < 3 && System.nanoTime() < end) {
      Thread.sleep(5);
    }
    p.destroy(); // SIGTERM on Linux
    assertTrue(p.waitFor(60, TimeUnit.SECONDS), "the service did not stop");
    assertEquals(143, p.exitValue(), "ends as a process stopped by SIGTERM (128 + 15)");
    String text = Files.readString(log);
    assertTrue(text.contains("stopped;"), text);
    // every claimed file was finished: each claim in the journal has its done line
    Map<Long, Integer> open = new HashMap<>();
    for (String line : Files.readAllLines(out.resolve(".watch/journal.jsonl"))) {
      JsonNode n = JSON.readTree(line);
      if (n.get("step").asText().equals("claim")) {
        open.merge(n.get("job").asLong(), 1, Integer::sum);
      } else if (n.get("step").asText().equals("done")) {
        open.remove(n.get("job").asLong());
      }
    }
    assertEquals(Map.of(), open, "claims without an end");
    try (Stream<Path> work = Files.list(out.resolve(".watch-work"))) {
      assertEquals(0, work.count(), "nothing left in the work area");
    }
    assertEquals("stopped", JSON.readTree(out.resolve(".watch/status.json").toFile()).get("state").asText());
    Map<String, Integer> left = check(inbox, out, false, "after SIGTERM");
    assertTrue(left.values().stream().mapToInt(Integer::intValue).sum() > 0, "it stopped before taking everything");
  }

  private static int starts(Path log) throws IOException {
    if (!Files.exists(log)) {
      return 0;
    }
    String text = Files.readString(log, StandardCharsets.UTF_8);
    int n = 0;
    for (int i = text.indexOf("quantrun watch: watching"); i >= 0; i = text.indexOf("quantrun watch: watching", i + 1)) {
      n++;
    }
    return n;
  }

  private static int unfinishedSteps(Path out) throws IOException {
    Path journal = out.resolve(".watch/journal.jsonl");
    if (!Files.exists(journal)) {
      return 0;
    }
    Set<Long> open = new HashSet<>();
    for (String line : Files.readAllLines(journal)) {
      JsonNode n;
      try {
        n = JSON.readTree(line);
      } catch (IOException e) {
        continue;
      }
      if (n.path("step").asText().equals("claim")) {
        open.add(n.get("job").asLong());
      } else if (n.path("step").asText().equals("done")) {
        open.remove(n.get("job").asLong());
      }
    }
    return open.size();
  }

  /**
   * Checks the folders; returns what is still in the inbox, by content.
   */
  private Map<String, Integer> check(Path inbox, Path out, boolean finished, String when) throws IOException {
    Map<String, Integer> inInbox = new HashMap<>();
    Map<String, Integer> archived = new HashMap<>();
    Map<String, Integer> failed = new HashMap<>();
    Map<String, Integer> all = new TreeMap<>();
    for (Path f : inputs(inbox)) {
      String rel = inbox.relativize(f).toString().replace('\\', '/');
      String sha = Digests.sha256(f);
      all.merge(sha, 1, Integer::sum);
      (rel.startsWith("archive/") ? archived : rel.startsWith("failed/") ? failed : inInbox).merge(sha, 1, Integer::sum);
      if (rel.startsWith("failed/")) {
        assertTrue(Files.exists(f.resolveSibling(f.getFileName() + ".error.txt")), when + ": " + rel + " has no note");
      }
    }
    assertEquals(dropped, all, when + ": every input is in exactly one of inbox, archive and failed");
    Map<String, Integer> outputs = new HashMap<>();
    for (String name : WatchFixture.folders(out)) {
      Path folder = out.resolve(name);
      // complete: the audit trail lists every output, each there with its recorded size and SHA-256
      assertTrue(Files.isRegularFile(folder.resolve("audit.json")), when + ": results folder " + name + " has no audit trail");
      JsonNode audit = JSON.readTree(folder.resolve("audit.json").toFile());
      Set<String> listed = new HashSet<>();
      audit.get("outputs").forEach(o -> listed.add(o.get("name").asText()));
      assertEquals(EVERY_OUTPUT, listed, when + ": " + name + " does not list every output");
      for (JsonNode o : audit.get("outputs")) {
        Path f = folder.resolve(o.get("name").asText());
        assertTrue(Files.isRegularFile(f), when + ": " + name + " lacks " + f.getFileName());
        assertEquals(o.get("sha256").asText(), Digests.sha256(f), when + ": " + name + "/" + f.getFileName() + " is not whole");
      }
      outputs.merge(WatchFixture.exportSha(folder), 1, Integer::sum);
    }
    for (String sha : archived.keySet()) {
      assertEquals(1, outputs.getOrDefault(sha, 0), when + ": an archived input has not exactly one results folder");
    }
    for (Map.Entry<String, Integer> e : outputs.entrySet()) {
      assertEquals(1, e.getValue(), when + ": one content, several results folders");
      assertTrue(archived.containsKey(e.getKey()) || inInbox.containsKey(e.getKey()),
          when + ": results for content that is neither archived nor waiting");
    }
    for (String sha : failed.keySet()) {
      assertTrue(broken.contains(sha), when + ": a good export was failed");
      assertTrue(!outputs.containsKey(sha), when + ": a failed export has results");
    }
    if (finished) {
      assertEquals(Map.of(), inInbox, when + ": inputs left in the inbox");
      for (String sha : dropped.keySet()) {
        if (!broken.contains(sha)) {
          assertEquals(1, outputs.getOrDefault(sha, 0), when + ": a good export was not processed exactly once");
        }
      }
    }
    return inInbox;
  }

  private static List<Path> inputs(Path inbox) throws IOException {
    try (Stream<Path> s = Files.walk(inbox)) {
      return s.filter(Files::isRegularFile).filter(p -> {
        String n = p.getFileName().toString();
        return !n.startsWith(".") && !n.endsWith(".error.txt") && !n.endsWith(".duplicate.txt");
      }).sorted().toList();
    }
  }
}
