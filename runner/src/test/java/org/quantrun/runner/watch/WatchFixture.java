package org.quantrun.runner.watch;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.time.Clock;
import java.time.Duration;
import java.util.ArrayList;
import java.util.Collections;
import java.util.List;
import java.util.Optional;
import java.util.function.BooleanSupplier;
import java.util.stream.Stream;
import org.quantrun.runner.plugins.ImporterPlugins;

/** Shared set-up for the watch tests: demo exports that differ in content, settings, a running service. */
final class WatchFixture {
  static final Path DEMO_EXPORT = Path.of("../demo-data/run-R2611A-long.csv").toAbsolutePath().normalize();
  static final Path METHOD = Path.of("../config-examples/demo-R2611A.yaml").toAbsolutePath().normalize();
  static final Path PROFILE = Path.of("../config-examples/importers/long-csv.yaml").toAbsolutePath().normalize();
  static final Path PLUGINS = Path.of("target/plugins").toAbsolutePath().normalize();
  private static byte[] demo;

  private WatchFixture() {}

  /**
   * The demo export with a line after its footer (which the import profile reads as footer), so
   * every variant has its own SHA-256 but the same readings.
   */
  static byte[] export(String variant) throws IOException {
    if (demo == null) {
      demo = Files.readAllBytes(DEMO_EXPORT);
    }
    byte[] tail = ("copy " + variant + "\n").getBytes(StandardCharsets.UTF_8);
    byte[] b = new byte[demo.length + tail.length];
    System.arraycopy(demo, 0, b, 0, demo.length);
    System.arraycopy(tail, 0, b, demo.length, tail.length);
    return b;
  }

  /** Writes a file the way a careful instrument PC would: under a temporary name, then renamed. */
  static Path drop(Path dir, String name, byte[] content) throws IOException {
    Files.createDirectories(dir);
    Path tmp = dir.resolve(name + ".part");
    Files.write(tmp, content);
    return Files.move(tmp, dir.resolve(name));
  }

  static WatchDraft draft(Path root) {
    WatchDraft d = new WatchDraft();
    d.inbox = root.resolve("inbox");
    d.out = root.resolve("results");
    d.quiet = Duration.ofMillis(100);
    d.poll = Duration.ofMillis(50);
    d.statusInterval = Duration.ofMillis(100);
    d.workers = 2;
    d.routes = List.of(Route.everything(METHOD, Optional.of(PROFILE), Optional.empty()));
    return d;
  }

  static ExportHandler coreHandler(List<Route> routes) throws WatchConfigException {
    return new BatchExportHandler(routes, ImporterPlugins.load(PLUGINS), List.of("watch"), Clock.systemUTC());
  }

  /** A service running on its own thread, with the lines it reports. */
  static final class Running implements AutoCloseable {
    final WatchService service;
    final List<String> events = Collections.synchronizedList(new ArrayList<>());
    final Thread thread;
    volatile Throwable failure;

    Running(WatchSettings s, ExportHandler handler, Clock clock) {
      service = new WatchService(s, handler, clock, events::add);
      thread = new Thread(() -> {
        try {
          service.run();
        } catch (Throwable t) {
          failure = t;
        }
      }, "test-watch");
      thread.start();
    }

    @Override
    public void close() throws Exception {
      service.stop();
      thread.join(30_000);
      if (failure != null) {
        throw new AssertionError("the service failed", failure);
      }
    }
  }

  static void await(String what, Duration timeout, BooleanSupplier condition) throws InterruptedException {
    long end = System.nanoTime() + timeout.toNanos();
    while (!condition.getAsBoolean()) {
      if (System.nanoTime() > end) {
        throw new AssertionError("timed out waiting for: " + what);
      }
      Thread.sleep(10);
    }
  }

  /** The SHA-256 of the export a results folder was made from, read from its audit trail. */
  static String exportSha(Path folder) throws IOException {
    com.fasterxml.jackson.databind.JsonNode audit = new com.fasterxml.jackson.databind.ObjectMapper()
        .readTree(folder.resolve("audit.json").toFile());
    for (com.fasterxml.jackson.databind.JsonNode in : audit.get("inputs")) {
      if (in.get("role").asText().equals("export")) {
        return in.get("sha256").asText();
      }
    }
    throw new AssertionError("no export in the audit trail of " + folder);
  }

  /** The regular files under a folder (not following links, not hidden), as paths relative to it. */
  static List<String> files(Path dir) throws IOException {
    if (!Files.isDirectory(dir)) {
      return List.of();
    }
    try (Stream<Path> s = Files.walk(dir)) {
      return s.filter(p -> !Files.isDirectory(p)).map(p -> dir.relativize(p).toString().replace('\\', '/'))
          .filter(r -> Stream.of(r.split("/")).noneMatch(x -> x.startsWith(".")))
          .sorted().toList();
    }
  }

  /** The visible folders directly inside a folder. */
  static List<String> folders(Path dir) throws IOException {
    if (!Files.isDirectory(dir)) {
      return List.of();
    }
    try (Stream<Path> s = Files.list(dir)) {
      return s.filter(Files::isDirectory).map(p -> p.getFileName().toString()).filter(n -> !n.startsWith(".")).sorted().toList();
    }
  }
}
