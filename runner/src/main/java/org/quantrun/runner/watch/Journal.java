package org.quantrun.runner.watch;

import com.fasterxml.jackson.core.JsonProcessingException;
import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import com.fasterxml.jackson.databind.node.ObjectNode;
import java.io.IOException;
import java.nio.ByteBuffer;
import java.nio.channels.FileChannel;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.StandardCopyOption;
import java.nio.file.StandardOpenOption;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Optional;

/**
 * The service's memory across restarts: an append-only file of JSON lines, one per step of a
 * file's way through the service, each written and forced to disk before the step it announces
 * is taken. A restart reads it back: every file whose last line is not {@code done} is finished
 * (or its claim is dropped, so it is taken again) by {@link WatchService}.
 *
 * <p>Lines, all with {@code job} (a number) and {@code step}:
 *
 * <ul>
 *   <li>{@code claim}: {@code src} (path in the inbox), {@code sha256}, {@code route}; nothing has moved yet
 *   <li>{@code publish}: {@code work} (results folder in the work area), {@code target} (its name in OUT)
 *   <li>{@code archive}: {@code target} (path under the archive folder)
 *   <li>{@code fail}: {@code target} (path under the failed folder), {@code message}
 *   <li>{@code duplicate}: {@code of} (the earlier results folder), {@code target} (path under the archive folder)
 *   <li>{@code done}: {@code outcome} ({@code processed}, {@code failed}, {@code duplicate}, {@code dropped}),
 *       {@code sha256}, {@code output} (results folder name, when processed or duplicate), {@code input}
 *       (where the input ended up)
 * </ul>
 *
 * A line cut short by a crash (the last one) is ignored. On open the file is compacted: only the
 * {@code done} lines of processed content and the lines of unfinished files are kept.
 */
final class Journal implements AutoCloseable {
  private static final ObjectMapper JSON = new ObjectMapper();

  /** What a restart finds about one file that was not done. */
  static final class Pending {
    final long job;
    final Map<String, ObjectNode> steps = new LinkedHashMap<>();

    Pending(long job) {
      this.job = job;
    }

    ObjectNode claim() {
      return steps.get("claim");
    }

    Optional<ObjectNode> step(String name) {
      return Optional.ofNullable(steps.get(name));
    }
  }

  /**
   * Content processed earlier.
   *
   * @param sha256 the content's digest
   * @param output the results folder name under OUT
   * @param input where the input was archived
   * @param time when it was done (ISO-8601)
   */
  record Processed(String sha256, String output, String input, String time) {}

  private final Path file;
  private final FileChannel channel;
  private final Map<String, Processed> processed;
  private final List<Pending> pending;
  private long nextJob;

  private Journal(Path file, FileChannel channel, Map<String, Processed> processed, List<Pending> pending, long nextJob) {
    this.file = file;
    this.channel = channel;
    this.processed = processed;
    this.pending = pending;
    this.nextJob = nextJob;
  }

  /**
   * Opens (or creates) the journal, reads it back and compacts it.
   *
   * @param file the journal file
   * @return the journal
   * @throws IOException if it cannot be read or written
   */
  static Journal open(Path file) throws IOException {
    Files.createDirectories(file.getParent());
    Map<String, Processed> processed = new LinkedHashMap<>();
    Map<Long, Pending> pending = new LinkedHashMap<>();
    long maxJob = 0;
    if (Files.exists(file)) {
      for (String line : Files.readAllLines(file, StandardCharsets.UTF_8)) {
        JsonNode n;
        try {
          n = JSON.readTree(line);
        } catch (JsonProcessingException e) {
          continue; // cut short by a crash
        }
        if (n == null || !n.has("job") || !n.has("step")) {
          continue;
        }
        long job = n.get("job").asLong();
        maxJob = Math.max(maxJob, job);
        String step = n.get("step").asText();
        if (step.equals("done")) {
          pending.remove(job);
          if (n.path("outcome").asText().equals("processed")) {
            String sha = n.path("sha256").asText();
            processed.put(sha, new Processed(sha, n.path("output").asText(), n.path("input").asText(), n.path("time").asText()));
          }
        } else {
          pending.computeIfAbsent(job, Pending::new).steps.put(step, (ObjectNode) n);
        }
      }
    }
    pending.values().removeIf(p -> p.claim() == null);
    // compact: write what is still needed to a new file and rename it over the old one
    Path tmp = file.resolveSibling(file.getFileName() + ".new");
    try (FileChannel out = FileChannel.open(tmp, StandardOpenOption.CREATE, StandardOpenOption.WRITE,
        StandardOpenOption.TRUNCATE_EXISTING)) {
      StringBuilder sb = new StringBuilder();
      long job = 0;
      for (Processed p : processed.values()) {
        ObjectNode n = JSON.createObjectNode();
        n.put("job", --job).put("step", "done").put("outcome", "processed").put("sha256", p.sha256())
            .put("output", p.output()).put("input", p.input()).put("time", p.time());
        sb.append(JSON.writeValueAsString(n)).append('\n');
      }
      for (Pending p : pending.values()) {
        for (ObjectNode n : p.steps.values()) {
          sb.append(JSON.writeValueAsString(n)).append('\n');
        }
      }
      out.write(ByteBuffer.wrap(sb.toString().getBytes(StandardCharsets.UTF_8)));
      out.force(true);
    }
    Files.move(tmp, file, StandardCopyOption.ATOMIC_MOVE, StandardCopyOption.REPLACE_EXISTING);
    FileChannel channel = FileChannel.open(file, StandardOpenOption.WRITE, StandardOpenOption.APPEND);
    return new Journal(file, channel, processed, new ArrayList<>(pending.values()), maxJob + 1);
  }

  /** @return the files that were not done when the journal was last closed */
  List<Pending> pending() {
    return List.copyOf(pending);
  }

  /**
   * The earlier processing of some content, if any.
   *
   * @param sha256 the content's digest
   * @return what was made of it
   */
  synchronized Optional<Processed> processed(String sha256) {
    return Optional.ofNullable(processed.get(sha256));
  }

  /** @return how many distinct contents were processed, over the journal's whole life */
  synchronized int processedCount() {
    return processed.size();
  }

  /** @return a new job number */
  synchronized long newJob() {
    return nextJob++;
  }

  /**
   * A new line for a job.
   *
   * @param job the job
   * @param step the step
   * @return the line to fill in and {@link #write}
   */
  static ObjectNode line(long job, String step) {
    return JSON.createObjectNode().put("job", job).put("step", step);
  }

  /**
   * Appends a line and forces it to disk.
   *
   * @param line the line
   * @throws IOException if it cannot be written
   */
  synchronized void write(ObjectNode line) throws IOException {
    byte[] bytes = (JSON.writeValueAsString(line) + "\n").getBytes(StandardCharsets.UTF_8);
    ByteBuffer b = ByteBuffer.wrap(bytes);
    while (b.hasRemaining()) {
      channel.write(b);
    }
    channel.force(false);
    if (line.path("step").asText().equals("done") && line.path("outcome").asText().equals("processed")) {
      String sha = line.path("sha256").asText();
      processed.put(sha, new Processed(sha, line.path("output").asText(), line.path("input").asText(), line.path("time").asText()));
    }
  }

  /** @return the journal file */
  Path file() {
    return file;
  }

  @Override
  public synchronized void close() throws IOException {
    channel.close();
  }
}
