package org.quantrun.runner.watch;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;
import static org.quantrun.runner.watch.WatchFixture.await;

import java.io.IOException;
import java.io.UncheckedIOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.Clock;
import java.time.Duration;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import java.util.Set;
import java.util.concurrent.ConcurrentHashMap;
import java.util.concurrent.atomic.AtomicInteger;
import java.util.stream.Stream;
import org.junit.jupiter.api.DisplayName;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.quantrun.runner.output.Digests;
import org.quantrun.runner.output.OutputFolder;

/**
 * Many files at once. The handler here writes a small results folder holding its input's
 * SHA-256, so the test measures the service (claiming, publishing, archiving), not the processor;
 * the benchmark script runs the real pipeline.
 */
class WatchLoadTest {
  @TempDir Path root;

  /** Records each call and writes a results folder named after the file, holding the input's digest. */
  static final class DigestHandler implements ExportHandler {
    final Map<String, AtomicInteger> calls = new ConcurrentHashMap<>();
    final Set<String> threads = ConcurrentHashMap.newKeySet();

    @Override
    public WatchOutcome handle(Path export, Route route, Path workFolder) {
      String name = export.getFileName().toString().replace(".csv", "");
      threads.add(Thread.currentThread().getName() + "@" + System.identityHashCode(Thread.currentThread()));
      try {
        String sha = Digests.sha256(export);
        calls.computeIfAbsent(sha, k -> new AtomicInteger()).incrementAndGet();
        try (OutputFolder out = OutputFolder.create(workFolder, name)) {
          Files.writeString(out.staging().resolve("digest.txt"), sha);
          return new WatchOutcome.Processed(out.publish(), "digest " + sha.substring(0, 8));
        }
      } catch (IOException e) {
        throw new UncheckedIOException(e);
      }
    }
  }

  @Test
  @DisplayName("500 files dropped at once are each processed exactly once, by a pool of as many workers as cores")
  void fiveHundredFilesAtOnce() throws Exception {
    WatchDraft d = WatchFixture.draft(root);
    d.workers = null; // the default: the number of cores
    Files.createDirectories(d.inbox);
    Map<String, Integer> expected = new HashMap<>();
    for (int i = 0; i < 500; i++) {
      byte[] b = ("file " + i + "\n").getBytes(StandardCharsets.UTF_8);
      Files.write(d.inbox.resolve("L" + i + ".csv"), b);
      expected.put(Digests.sha256(b), 1);
    }
    DigestHandler handler = new DigestHandler();
    WatchSettings s = d.build();
    assertEquals(Runtime.getRuntime().availableProcessors(), s.workers());
    try (WatchFixture.Running w = new WatchFixture.Running(s, handler, Clock.systemUTC())) {
      await("all archived", Duration.ofSeconds(60), () -> w.service.status().path("done").asInt() == 500);
    }
    Map<String, Integer> calls = new HashMap<>();
    handler.calls.forEach((k, v) -> calls.put(k, v.get()));
    assertEquals(expected, calls, "each content handled exactly once");
    List<String> folders = WatchFixture.folders(d.out);
    assertEquals(500, folders.size());
    Map<String, Integer> published = new HashMap<>();
    for (String f : folders) {
      published.merge(Files.readString(d.out.resolve(f).resolve("digest.txt")), 1, Integer::sum);
    }
    assertEquals(expected, published, "one results folder per content");
    try (Stream<Path> left = Files.list(d.inbox)) {
      assertEquals(List.of("archive"), left.map(p -> p.getFileName().toString()).toList());
    }
    assertEquals(500, WatchFixture.files(d.inbox.resolve("archive")).size());
    assertTrue(handler.threads.size() >= Math.min(2, s.workers()), "work was shared: " + handler.threads);
  }

  @Test
  @DisplayName("the watch log rolls over by size and keeps the configured number of old files")
  void logRollsBySize() throws Exception {
    Path log = root.resolve("logs/watch.log");
    try (AutoCloseable handle = WatchLog.start(log, 2048, 3)) {
      org.slf4j.Logger l = org.slf4j.LoggerFactory.getLogger(WatchService.class);
      for (int i = 0; i < 400; i++) {
        l.info("line {} of a long enough log message to fill the file quickly", i);
        if (i % 20 == 0) {
          Thread.sleep(110); // the size is looked at every 100 ms
        }
      }
    }
    try (Stream<Path> s = Files.list(log.getParent())) {
      List<String> names = s.map(p -> p.getFileName().toString()).sorted().toList();
      assertEquals(List.of("watch.1.log", "watch.2.log", "watch.3.log", "watch.log"), names);
    }
    // logback checks the size every so often, so a file may pass the limit a little
    assertTrue(Files.size(log.resolveSibling("watch.1.log")) < 64 * 1024);
    assertTrue(Files.readString(log).contains("line 399"));
  }
}
