package org.quantrun.runner.watch;

import com.fasterxml.jackson.databind.ObjectMapper;
import com.fasterxml.jackson.databind.node.ObjectNode;
import java.io.IOException;
import java.nio.channels.FileChannel;
import java.nio.channels.FileLock;
import java.nio.charset.StandardCharsets;
import java.nio.file.ClosedWatchServiceException;
import java.nio.file.FileSystems;
import java.nio.file.Files;
import java.nio.file.LinkOption;
import java.nio.file.NoSuchFileException;
import java.nio.file.Path;
import java.nio.file.StandardOpenOption;
import java.nio.file.StandardWatchEventKinds;
import java.nio.file.WatchKey;
import java.nio.file.attribute.BasicFileAttributes;
import java.time.Clock;
import java.time.Duration;
import java.time.Instant;
import java.time.LocalDate;
import java.util.HashMap;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.Set;
import java.util.concurrent.ConcurrentHashMap;
import java.util.concurrent.CountDownLatch;
import java.util.concurrent.ExecutorService;
import java.util.concurrent.Executors;
import java.util.concurrent.LinkedBlockingQueue;
import java.util.concurrent.TimeUnit;
import java.util.concurrent.atomic.AtomicInteger;
import java.util.concurrent.atomic.AtomicReference;
import java.util.function.Consumer;
import org.quantrun.runner.output.Digests;
import org.slf4j.Logger;
import org.slf4j.LoggerFactory;

/**
 * The watch service: takes complete files from the inbox, processes each with its route's method
 * on a pool of workers, publishes its results folder under OUT and moves the input to the archive
 * (or, with a note saying what was wrong, to the failed folder). Every step is announced in the
 * {@link Journal} before it is taken, so a restart after a crash finishes or redoes each file
 * exactly once. Content (SHA-256) processed before is archived as a duplicate with a note pointing
 * to the earlier results, unless reprocessing is asked for.
 *
 * <p>{@link #run()} blocks until {@link #stop()} (or, with {@code untilIdle}, until nothing is
 * left to take); files being processed when stop is asked are finished first, files not yet
 * started stay in the inbox.
 */
public final class WatchService {
  private static final Logger LOG = LoggerFactory.getLogger(WatchService.class);
  private static final ObjectMapper JSON = new ObjectMapper();
  private static final String NOTE_CAUTION =
      "Caution: results need review by a qualified analyst; the lab's accredited method and local regulations govern.";

  /** The shortest time between two looks at the inbox when change events wake the service. */
  private static final long MIN_LOOK_GAP_NANOS = TimeUnit.MILLISECONDS.toNanos(25);

  private final WatchSettings s;
  private final ExportHandler handler;
  private final Clock clock;
  private final Consumer<String> events;
  private final InboxScanner scanner;
  private final Set<Path> busy = ConcurrentHashMap.newKeySet();
  private final Set<String> shasInFlight = ConcurrentHashMap.newKeySet();
  private final Map<Path, Long> retryAfter = new ConcurrentHashMap<>();
  private final LinkedBlockingQueue<Boolean> wake = new LinkedBlockingQueue<>();
  private final AtomicInteger queued = new AtomicInteger();
  private final AtomicInteger inFlight = new AtomicInteger();
  private final AtomicInteger processed = new AtomicInteger();
  private final AtomicInteger failed = new AtomicInteger();
  private final AtomicInteger duplicates = new AtomicInteger();
  private final AtomicInteger left = new AtomicInteger();
  private final java.util.concurrent.atomic.AtomicLong looks = new java.util.concurrent.atomic.AtomicLong();
  private final AtomicReference<ObjectNode> lastError = new AtomicReference<>();
  private final CountDownLatch finished = new CountDownLatch(1);
  private final Object claimLock = new Object();
  private volatile boolean stopping;
  private volatile boolean inboxPresent = true;
  private volatile int waiting;
  private volatile String state = "starting";
  private Instant started;
  private Journal journal;

  /**
   * A service.
   *
   * @param settings what to watch and how
   * @param handler processes one export
   * @param clock the clock for the archive's date folders, notes and the status file
   * @param events receives one line per file outcome and per notable event, for the console
   */
  public WatchService(WatchSettings settings, ExportHandler handler, Clock clock, Consumer<String> events) {
    this.s = settings;
    this.handler = handler;
    this.clock = clock;
    this.events = events;
    this.scanner = new InboxScanner(settings);
  }

  /**
   * Runs the service until stopped.
   *
   * @throws WatchConfigException if the folders cannot be used or another service holds them
   * @throws IOException if the journal cannot be read or written
   */
  public void run() throws WatchConfigException, IOException {
    started = clock.instant();
    try {
      Files.createDirectories(s.state());
      Files.createDirectories(s.out());
      Files.createDirectories(s.work());
    } catch (IOException e) {
      finished.countDown();
      throw new WatchConfigException("cannot create the service's folders (" + e.getMessage() + ")");
    }
    try (FileChannel lockChannel = FileChannel.open(s.lockFile(), StandardOpenOption.CREATE, StandardOpenOption.WRITE);
        FileLock lock = tryLock(lockChannel)) {
      if (lock == null) {
        throw new WatchConfigException("another quantrun watch is already using " + s.state()
            + " (stop it first, or give this one other folders)");
      }
      journal = Journal.open(s.journal());
      try {
        recover();
        loop();
      } finally {
        journal.close();
      }
    } finally {
      finished.countDown();
    }
  }

  private static FileLock tryLock(FileChannel channel) throws IOException {
    try {
      return channel.tryLock();
    } catch (java.nio.channels.OverlappingFileLockException e) {
      return null; // held by another service in this JVM
    }
  }

  /** Asks the service to stop: files in progress are finished, nothing new is taken. */
  public void stop() {
    stopping = true;
    wake.offer(Boolean.TRUE);
  }

  /**
   * Waits until {@link #run()} has returned.
   *
   * @param timeout how long to wait at most
   * @return true when it returned in time
   * @throws InterruptedException if interrupted
   */
  public boolean awaitStopped(Duration timeout) throws InterruptedException {
    return finished.await(timeout.toMillis(), TimeUnit.MILLISECONDS);
  }

  // ---- the loop ----

  private void loop() throws IOException {
    ExecutorService workers = Executors.newFixedThreadPool(s.workers(), r -> {
      Thread t = new Thread(r, "watch-worker");
      t.setDaemon(true);
      return t;
    });
    ChangeEvents changes = s.useChangeEvents() ? ChangeEvents.start(s.inbox(), wake, Set.of(s.archive(), s.failed(), s.out(),
        s.state())) : ChangeEvents.NONE;
    state = "running";
    LOG.info("watching {} ({} workers, quiet period {} ms, polling every {} ms{}); results go to {}", s.inbox(), s.workers(),
        s.quietPeriod().toMillis(), s.pollInterval().toMillis(), changes.active() ? ", with change events" : "", s.out());
    long lastStatus = 0;
    boolean sawInbox = true;
    try {
      while (!stopping) {
        long nowNanos = System.nanoTime();
        // modification times are judged against the real time of the file system, not the injected clock
        InboxScanner.Scan scan = scanner.scan(nowNanos, System.currentTimeMillis(), busy);
        looks.incrementAndGet();
        if (scan.inboxPresent() != sawInbox) {
          sawInbox = scan.inboxPresent();
          if (sawInbox) {
            LOG.info("the inbox {} is back", s.inbox());
            events.accept("the inbox " + s.inbox() + " is back");
            changes.reRegister();
          } else {
            String msg = "the inbox " + s.inbox() + " is not there; looking again every " + s.pollInterval().toMillis() + " ms";
            LOG.warn(msg);
            events.accept(msg);
            error("", msg);
          }
        }
        inboxPresent = scan.inboxPresent();
        changes.registerNewFolders(s.inbox());
        int deferred = 0;
        for (InboxScanner.Ready r : scan.ready()) {
          Long after = retryAfter.get(r.file());
          if (after != null && after - nowNanos > 0) {
            deferred++;
            continue;
          }
          retryAfter.remove(r.file());
          busy.add(r.file());
          queued.incrementAndGet();
          workers.execute(() -> work(r));
        }
        waiting = scan.waiting();
        if (System.nanoTime() - lastStatus >= s.statusInterval().toNanos() / 4) {
          writeStatus();
          lastStatus = System.nanoTime();
        }
        if (s.untilIdle() && scan.inboxPresent() && scan.waiting() == 0 && busy.isEmpty()
            && scan.ready().size() == deferred) {
          break;
        }
        long waitNanos = s.pollInterval().toNanos();
        waitNanos = Math.min(waitNanos, scan.nextLook().map(Duration::toNanos).orElse(Long.MAX_VALUE));
        waitNanos = Math.min(waitNanos, s.statusInterval().toNanos());
        long now = System.nanoTime();
        // a file left in the inbox is looked at again when its time comes; one that went meanwhile is forgotten
        retryAfter.entrySet().removeIf(e -> e.getValue() - now <= 0 && !Files.exists(e.getKey(), LinkOption.NOFOLLOW_LINKS));
        for (long after : retryAfter.values()) {
          if (after - now > 0) {
            waitNanos = Math.min(waitNanos, after - now);
          }
        }
        try {
          if (wake.poll(Math.max(waitNanos, 1_000_000L), TimeUnit.NANOSECONDS) != null) {
            // a burst of change events (a copy in progress, files moving to the archive) is one look, not hundreds
            long since = System.nanoTime() - nowNanos;
            if (since < MIN_LOOK_GAP_NANOS && !stopping) {
              TimeUnit.NANOSECONDS.sleep(Math.min(MIN_LOOK_GAP_NANOS - since, waitNanos));
            }
            wake.clear();
          }
        } catch (InterruptedException e) {
          Thread.currentThread().interrupt();
          stopping = true;
        }
      }
    } finally {
      state = "stopping";
      int inProgress = inFlight.get();
      workers.shutdown();
      writeStatus();
      try {
        while (!workers.awaitTermination(1, TimeUnit.SECONDS)) {
          writeStatus();
        }
      } catch (InterruptedException e) {
        Thread.currentThread().interrupt();
      }
      changes.close();
      state = "stopped";
      writeStatus();
      String msg = "stopped; " + processed.get() + " processed, " + failed.get() + " failed, " + duplicates.get()
          + " duplicates" + (inProgress > 0 ? "; finished the " + inProgress + " in progress" : "");
      LOG.info(msg);
      events.accept(msg);
    }
  }

  private void work(InboxScanner.Ready r) {
    queued.decrementAndGet();
    if (stopping) {
      busy.remove(r.file());
      return; // not claimed: it stays in the inbox for the next start
    }
    inFlight.incrementAndGet();
    try {
      take(r);
    } catch (IOException | RuntimeException e) {
      String msg = r.relative() + ": left in the inbox: " + e.getMessage();
      LOG.error(msg, e);
      error(r.relative(), msg);
      retryAfter.put(r.file(), System.nanoTime() + retryDelay().toNanos());
    } finally {
      inFlight.decrementAndGet();
      busy.remove(r.file());
      wake.offer(Boolean.TRUE);
    }
  }

  private Duration retryDelay() {
    Duration d = s.pollInterval().multipliedBy(30);
    return d.compareTo(Duration.ofSeconds(30)) > 0 ? Duration.ofSeconds(30) : d;
  }

  // ---- one file ----

  private void take(InboxScanner.Ready r) throws IOException {
    Path file = r.file();
    BasicFileAttributes a;
    try {
      a = Files.readAttributes(file, BasicFileAttributes.class, LinkOption.NOFOLLOW_LINKS);
    } catch (NoSuchFileException e) {
      return; // gone before it was taken
    }
    if (a.size() != r.size() || a.lastModifiedTime().toMillis() != r.modified()) {
      return; // changed again: the scanner judges it anew
    }
    String folder = folderOf(r.relative());
    String name = file.getFileName().toString();
    Optional<Route> route = s.routes().stream().filter(x -> x.takes(folder, name)).findFirst();
    String sha;
    try {
      sha = Digests.sha256(file);
    } catch (NoSuchFileException e) {
      if (!Files.exists(file, LinkOption.NOFOLLOW_LINKS)) {
        return;
      }
      sha = "";
      long job = claim(r, sha, "");
      fail(job, file, r.relative(), name + ": the file cannot be read (" + reason(e) + ")",
          "check that it is a complete file that the service's user may read (a link that points nowhere cannot be read),"
              + " then drop it into the inbox again");
      return;
    } catch (IOException e) {
      long job = claim(r, "", "");
      fail(job, file, r.relative(), name + ": the file cannot be read (" + reason(e) + ")",
          "check the file's permissions and that it is a complete file, then drop it into the inbox again");
      return;
    }
    if (route.isEmpty()) {
      long job = claim(r, sha, "");
      fail(job, file, r.relative(), name + ": no route of the watch configuration takes this file (folder '"
          + (folder.isEmpty() ? "." : folder) + "')", "drop it into a folder a route watches, or add a route for it"
          + " (folder or file-name pattern) to the watch configuration");
      return;
    }
    Optional<Journal.Processed> earlier;
    synchronized (claimLock) {
      // the same content being processed right now: wait for it, then this one is its duplicate (or is retried)
      while (shasInFlight.contains(sha)) {
        try {
          claimLock.wait();
        } catch (InterruptedException e) {
          Thread.currentThread().interrupt();
          return;
        }
      }
      earlier = s.reprocess() ? Optional.empty() : journal.processed(sha);
      if (earlier.isEmpty()) {
        shasInFlight.add(sha);
      }
    }
    if (earlier.isPresent()) {
      long job = claim(r, sha, route.get().name());
      duplicate(job, file, r.relative(), sha, earlier.get());
      return;
    }
    try {
      long job = claim(r, sha, route.get().name());
      process(job, file, r.relative(), sha, route.get());
    } finally {
      synchronized (claimLock) {
        shasInFlight.remove(sha);
        claimLock.notifyAll();
      }
    }
  }

  private long claim(InboxScanner.Ready r, String sha, String route) throws IOException {
    long job = journal.newJob();
    ObjectNode n = Journal.line(job, "claim").put("src", r.relative()).put("sha256", sha).put("size", r.size())
        .put("route", route).put("time", clock.instant().toString());
    journal.write(n);
    return job;
  }

  /** Ends a job whose input could not be moved: it stays in the inbox and is tried again later. */
  private void leave(long job, Path file, String rel, String what, IOException e) throws IOException {
    journal.write(Journal.line(job, "done").put("outcome", "left").put("input", rel).put("time", clock.instant().toString()));
    left.incrementAndGet();
    String msg = rel + ": " + what + " (" + reason(e) + "); left in the inbox, tried again later";
    LOG.error(msg);
    events.accept(msg);
    error(rel, msg);
    retryAfter.put(file, System.nanoTime() + retryDelay().toNanos());
  }

  private void process(long job, Path file, String rel, String sha, Route route) throws IOException {
    Path workFolder = s.work().resolve("job-" + job);
    Moves.deleteTree(workFolder);
    Files.createDirectories(workFolder);
    WatchOutcome outcome;
    try {
      outcome = handler.handle(file, route, workFolder);
    } catch (RuntimeException | LinkageError e) {
      LOG.error("{}: internal error while processing", rel, e);
      Moves.deleteTree(workFolder);
      fail(job, file, rel, file.getFileName() + ": quantrun failed while processing it (" + e + "); nothing was written for it",
          "this is a fault of quantrun, not of the file: report it with the watch log (" + s.logFile().getFileName()
              + "); to try again, move the file back into the inbox");
      return;
    }
    if (outcome instanceof WatchOutcome.Refused refused) {
      Moves.deleteTree(workFolder);
      fail(job, file, rel, refused.problem(), refused.advice());
      return;
    }
    WatchOutcome.Processed done = (WatchOutcome.Processed) outcome;
    Path folder = done.folder().toAbsolutePath().normalize();
    if (!folder.getParent().equals(workFolder.toAbsolutePath().normalize()) || !Files.isDirectory(folder)) {
      throw new IllegalStateException("the handler published its results outside its work folder: " + folder);
    }
    Path target;
    try {
      synchronized (Moves.lock()) {
        target = Moves.freeName(s.out(), folder.getFileName().toString(), false);
        journal.write(Journal.line(job, "publish").put("work", s.work().relativize(folder).toString())
            .put("target", target.getFileName().toString()));
        Moves.rename(folder, target);
      }
    } catch (IOException e) {
      Moves.deleteTree(workFolder);
      leave(job, file, rel, "processed, but its results could not be put into " + s.out(), e);
      return;
    }
    Moves.deleteTree(workFolder);
    String archived;
    try {
      archived = archive(job, file, rel);
    } catch (IOException e) {
      // the results are in place: the content counts as processed, and the input is archived as a duplicate later
      finishProcessed(job, sha, target.getFileName().toString(), "");
      leave(job, file, rel, "processed (results in " + target + "), but it could not be moved to the archive", e);
      return;
    }
    finishProcessed(job, sha, target.getFileName().toString(), archived);
    String line = rel + ": " + done.summary() + " -> " + target;
    LOG.info(line);
    events.accept(line);
  }

  private String archive(long job, Path file, String rel) throws IOException {
    Path target;
    synchronized (Moves.lock()) {
      target = Moves.freeName(archiveFolder(rel), file.getFileName().toString(), true);
      journal.write(Journal.line(job, "archive").put("target", s.archive().relativize(target).toString()));
      Moves.rename(file, target);
    }
    moveMarker(file, target);
    return s.archive().relativize(target).toString();
  }

  private void finishProcessed(long job, String sha, String output, String archived) throws IOException {
    journal.write(Journal.line(job, "done").put("outcome", "processed").put("sha256", sha).put("output", output)
        .put("input", "archive/" + archived).put("time", clock.instant().toString()));
    processed.incrementAndGet();
  }

  private Path archiveFolder(String rel) {
    LocalDate day = LocalDate.ofInstant(clock.instant(), clock.getZone());
    String folder = folderOf(rel);
    Path dir = s.archive().resolve(day.toString());
    return folder.isEmpty() ? dir : dir.resolve(folder);
  }

  private void duplicate(long job, Path file, String rel, String sha, Journal.Processed earlier) throws IOException {
    Path target;
    String note = note("This file was not processed: its content is the same as a file processed before.",
        rel, List.of(
            "Content:     SHA-256 " + sha,
            "Earlier:     " + earlier.input() + (earlier.time().isEmpty() ? "" : ", processed " + earlier.time()),
            "Its results: " + s.out().resolve(earlier.output())),
        "nothing, if the file was dropped twice by mistake. To process the same content again, start the service with"
            + " --reprocess and drop the file into the inbox again.");
    Path noteFile = null;
    try {
      synchronized (Moves.lock()) {
        target = Moves.freeName(archiveFolder(rel), file.getFileName().toString(), true);
        journal.write(Journal.line(job, "duplicate").put("of", earlier.output())
            .put("target", s.archive().relativize(target).toString()).put("note", note));
        Files.createDirectories(target.getParent());
        noteFile = noteOf(target, ".duplicate.txt");
        Moves.writeWhole(noteFile, note.getBytes(StandardCharsets.UTF_8));
        Moves.rename(file, target);
      }
    } catch (IOException e) {
      deleteQuietly(noteFile);
      leave(job, file, rel, "a duplicate that could not be moved to the archive", e);
      return;
    }
    moveMarker(file, target);
    journal.write(Journal.line(job, "done").put("outcome", "duplicate").put("sha256", sha).put("output", earlier.output())
        .put("input", "archive/" + s.archive().relativize(target)).put("time", clock.instant().toString()));
    duplicates.incrementAndGet();
    String line = rel + ": duplicate of " + earlier.input() + "; its results: " + s.out().resolve(earlier.output());
    LOG.info(line);
    events.accept(line);
  }

  private void fail(long job, Path file, String rel, String problem, String advice) throws IOException {
    String note = note("This file could not be processed.", rel, List.of("Problem:     " + problem), advice);
    Path target;
    Path noteFile = null;
    try {
      synchronized (Moves.lock()) {
        target = Moves.freeName(failedFolder(rel), file.getFileName().toString(), true);
        journal.write(Journal.line(job, "fail").put("target", s.failed().relativize(target).toString()).put("note", note));
        Files.createDirectories(target.getParent());
        noteFile = noteOf(target, ".error.txt");
        Moves.writeWhole(noteFile, note.getBytes(StandardCharsets.UTF_8));
        Moves.rename(file, target);
      }
    } catch (IOException e) {
      deleteQuietly(noteFile);
      leave(job, file, rel, "could not be processed (" + problem + ") and could not be moved to " + s.failed(), e);
      return;
    }
    moveMarker(file, target);
    journal.write(Journal.line(job, "done").put("outcome", "failed").put("input", "failed/" + s.failed().relativize(target))
        .put("time", clock.instant().toString()));
    failed.incrementAndGet();
    String msg = rel + ": failed: " + problem + " -> " + target;
    LOG.warn(msg);
    events.accept(msg);
    error(rel, problem);
  }

  private static void deleteQuietly(Path p) {
    if (p != null) {
      try {
        Files.deleteIfExists(p);
      } catch (IOException e) {
        // a note of our own that stays behind; harmless
      }
    }
  }

  private Path failedFolder(String rel) {
    String folder = folderOf(rel);
    return folder.isEmpty() ? s.failed() : s.failed().resolve(folder);
  }

  private static Path noteOf(Path input, String suffix) {
    return input.resolveSibling(input.getFileName() + suffix);
  }

  private String note(String headline, String rel, List<String> facts, String advice) {
    StringBuilder b = new StringBuilder();
    b.append(headline).append("\n\n");
    b.append("File:        ").append(rel).append(" (in the inbox ").append(s.inbox()).append(")\n");
    b.append("When:        ").append(clock.instant()).append('\n');
    facts.forEach(f -> b.append(f).append('\n'));
    b.append("What to do:  ").append(advice).append("\n\n");
    b.append("The file itself is unchanged.\n");
    b.append(NOTE_CAUTION).append('\n');
    return b.toString();
  }

  private void moveMarker(Path input, Path movedTo) {
    Optional<Path> marker = scanner.markerOf(input);
    if (marker.isEmpty() || !Files.exists(marker.get(), LinkOption.NOFOLLOW_LINKS)) {
      return;
    }
    try {
      synchronized (Moves.lock()) {
        Path t = noteOf(movedTo, s.marker().get());
        if (!Files.exists(t, LinkOption.NOFOLLOW_LINKS)) {
          Moves.rename(marker.get(), t);
        }
      }
    } catch (IOException e) {
      LOG.warn("{}: its marker could not be moved beside it ({})", input.getFileName(), reason(e));
    }
  }

  // ---- restart ----

  private void recover() throws IOException {
    for (Journal.Pending p : journal.pending()) {
      ObjectNode claim = p.claim();
      String rel = claim.path("src").asText();
      Path src = s.inbox().resolve(rel);
      boolean srcThere = Files.exists(src, LinkOption.NOFOLLOW_LINKS);
      String sha = claim.path("sha256").asText();
      if (p.step("fail").isPresent() || p.step("duplicate").isPresent()) {
        boolean failStep = p.step("fail").isPresent();
        ObjectNode step = p.step(failStep ? "fail" : "duplicate").get();
        Path root = failStep ? s.failed() : s.archive();
        Path target = root.resolve(step.path("target").asText());
        String where = (failStep ? "failed/" : "archive/") + step.path("target").asText();
        if (srcThere) {
          synchronized (Moves.lock()) {
            if (Files.exists(target, LinkOption.NOFOLLOW_LINKS)) {
              target = Moves.freeName(target.getParent(), target.getFileName().toString(), true);
              where = (failStep ? "failed/" : "archive/") + root.relativize(target);
            }
            Moves.writeWhole(noteOf(target, failStep ? ".error.txt" : ".duplicate.txt"),
                step.path("note").asText().getBytes(StandardCharsets.UTF_8));
            Moves.rename(src, target);
          }
          moveMarker(src, target);
        }
        ObjectNode done = Journal.line(p.job, "done").put("outcome", failStep ? "failed" : "duplicate").put("sha256", sha)
            .put("input", where).put("time", clock.instant().toString());
        if (!failStep) {
          done.put("output", step.path("of").asText());
        }
        journal.write(done);
        LOG.info("restart: {} finished ({})", rel, where);
        continue;
      }
      Optional<ObjectNode> publish = p.step("publish");
      Optional<ObjectNode> archive = p.step("archive");
      if (publish.isEmpty()) {
        // claimed, nothing published: drop the claim, the file is taken again from the inbox
        Moves.deleteTree(s.work().resolve("job-" + p.job));
        journal.write(Journal.line(p.job, "done").put("outcome", "dropped").put("input", rel).put("time", clock.instant().toString()));
        LOG.info("restart: {} was not finished; it is taken again", rel);
        continue;
      }
      Path work = s.work().resolve(publish.get().path("work").asText());
      String output = publish.get().path("target").asText();
      if (Files.isDirectory(work)) {
        synchronized (Moves.lock()) {
          Path target = s.out().resolve(output);
          if (Files.exists(target, LinkOption.NOFOLLOW_LINKS)) {
            target = Moves.freeName(s.out(), output, false);
            output = target.getFileName().toString();
            journal.write(Journal.line(p.job, "publish").put("work", publish.get().path("work").asText()).put("target", output));
          }
          Moves.rename(work, target);
        }
      } else if (!Files.isDirectory(s.out().resolve(output))) {
        // the results are gone (removed by hand): process the file again if it is still there
        journal.write(Journal.line(p.job, "done").put("outcome", "dropped").put("input", rel).put("time", clock.instant().toString()));
        LOG.warn("restart: the results of {} are missing; it is taken again", rel);
        continue;
      }
      String archived;
      if (archive.isPresent() && !srcThere) {
        archived = archive.get().path("target").asText();
      } else if (srcThere) {
        archived = archive(p.job, src, rel);
      } else {
        archived = "";
        LOG.warn("restart: {} is no longer in the inbox; its results are {}", rel, output);
      }
      finishProcessed(p.job, sha, output, archived);
      Moves.deleteTree(s.work().resolve("job-" + p.job));
      LOG.info("restart: {} finished -> {}", rel, s.out().resolve(output));
    }
    // whatever is left in the work area belongs to no file any more
    try (var entries = Files.newDirectoryStream(s.work())) {
      for (Path p : entries) {
        Moves.deleteTree(p);
      }
    }
  }

  // ---- health ----

  private void error(String file, String message) {
    ObjectNode n = JSON.createObjectNode().put("time", clock.instant().toString()).put("file", file).put("message", message);
    lastError.set(n);
  }

  /**
   * The service's health now, as written to the status file.
   *
   * @return the status
   */
  public ObjectNode status() {
    Instant now = clock.instant();
    ObjectNode n = JSON.createObjectNode();
    n.put("state", state);
    n.put("pid", ProcessHandle.current().pid());
    n.put("inbox", s.inbox().toString());
    n.put("inbox_present", inboxPresent);
    n.put("out", s.out().toString());
    n.put("started", started == null ? "" : started.toString());
    n.put("updated", now.toString());
    n.put("uptime_seconds", started == null ? 0 : Duration.between(started, now).toMillis() / 1000.0);
    n.put("workers", s.workers());
    n.put("queue", waiting + queued.get());
    n.put("waiting_to_settle", waiting);
    n.put("queued", queued.get());
    n.put("in_progress", inFlight.get());
    n.put("done", processed.get());
    n.put("failed", failed.get());
    n.put("duplicates", duplicates.get());
    n.put("left_in_inbox", left.get());
    n.put("processed_ever", journal == null ? 0 : journal.processedCount());
    n.put("inbox_looks", looks.get());
    ObjectNode e = lastError.get();
    if (e == null) {
      n.putNull("last_error");
    } else {
      n.set("last_error", e);
    }
    return n;
  }

  private void writeStatus() {
    try {
      Moves.writeWhole(s.statusFile(), JSON.writerWithDefaultPrettyPrinter().writeValueAsBytes(status()));
    } catch (IOException e) {
      LOG.warn("the status file {} cannot be written ({})", s.statusFile(), reason(e));
    }
  }

  // ---- helpers ----

  static String folderOf(String rel) {
    int slash = rel.lastIndexOf('/');
    return slash < 0 ? "" : rel.substring(0, slash);
  }

  private static String reason(Exception e) {
    String m = e.getMessage();
    if (e instanceof NoSuchFileException) {
      return "no such file" + (m == null ? "" : ": " + m);
    }
    if (e instanceof java.nio.file.AccessDeniedException) {
      return "permission denied";
    }
    return m == null ? e.getClass().getSimpleName() : m;
  }

  /** File-system change events, where the file system gives them; polling covers the rest. */
  static class ChangeEvents implements AutoCloseable {
    static final ChangeEvents NONE = new ChangeEvents(null, null, Set.of());
    private final java.nio.file.WatchService watcher;
    private final LinkedBlockingQueue<Boolean> wake;
    private final Set<Path> skip;
    private final Map<Path, WatchKey> keys = new HashMap<>();

    private ChangeEvents(java.nio.file.WatchService watcher, LinkedBlockingQueue<Boolean> wake, Set<Path> skip) {
      this.watcher = watcher;
      this.wake = wake;
      this.skip = skip;
    }

    static ChangeEvents start(Path inbox, LinkedBlockingQueue<Boolean> wake, Set<Path> skip) {
      java.nio.file.WatchService w;
      try {
        w = FileSystems.getDefault().newWatchService();
      } catch (IOException | UnsupportedOperationException e) {
        LOG.info("no change events on this file system; polling only ({})", e.getMessage());
        return NONE;
      }
      ChangeEvents c = new ChangeEvents(w, wake, skip);
      Thread t = new Thread(c::pump, "watch-events");
      t.setDaemon(true);
      t.start();
      c.registerNewFolders(inbox);
      return c;
    }

    boolean active() {
      return watcher != null;
    }

    private void pump() {
      try {
        while (true) {
          WatchKey k = watcher.take();
          k.pollEvents();
          k.reset();
          wake.offer(Boolean.TRUE);
        }
      } catch (InterruptedException | ClosedWatchServiceException e) {
        // closed
      }
    }

    synchronized void registerNewFolders(Path inbox) {
      if (watcher == null || !Files.isDirectory(inbox)) {
        return;
      }
      keys.values().removeIf(k -> !k.isValid());
      register(inbox, 0);
    }

    private void register(Path dir, int depth) {
      if (!keys.containsKey(dir)) {
        try {
          keys.put(dir, dir.register(watcher, StandardWatchEventKinds.ENTRY_CREATE, StandardWatchEventKinds.ENTRY_MODIFY,
              StandardWatchEventKinds.ENTRY_DELETE));
        } catch (IOException | RuntimeException e) {
          return;
        }
      }
      if (depth >= 2) {
        return;
      }
      try (var entries = Files.newDirectoryStream(dir, Files::isDirectory)) {
        for (Path p : entries) {
          if (!p.getFileName().toString().startsWith(".") && !skip.contains(p.toAbsolutePath().normalize())) {
            register(p, depth + 1);
          }
        }
      } catch (IOException | RuntimeException e) {
        // a folder that went away
      }
    }

    synchronized void reRegister() {
      keys.values().forEach(WatchKey::cancel);
      keys.clear();
    }

    @Override
    public synchronized void close() {
      if (watcher != null) {
        try {
          watcher.close();
        } catch (IOException e) {
          // closing anyway
        }
      }
    }
  }
}
