package org.quantrun.runner.watch;

import java.io.IOException;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;

/** {@code quantrun watch} in a JVM of its own, started with this test's class path. */
final class ChildService {
  private ChildService() {}

  static Process start(Path inbox, Path out, Path log, String... more) throws IOException {
    List<String> cmd = new ArrayList<>(List.of(
        Path.of(System.getProperty("java.home"), "bin", "java").toString(),
        "-Xshare:auto", "-XX:TieredStopAtLevel=1", "-Xmx256m", "-Djava.awt.headless=true",
        "-Dquantrun.log.dir=" + out.resolveSibling("logs"),
        "-cp", System.getProperty("java.class.path"),
        "org.quantrun.runner.Main", "watch", inbox.toString(),
        "--method", WatchFixture.METHOD.toString(), "--profile", WatchFixture.PROFILE.toString(),
        "--out", out.toString(), "--plugins", WatchFixture.PLUGINS.toString()));
    cmd.addAll(List.of(more));
    return new ProcessBuilder(cmd).redirectErrorStream(true).redirectOutput(ProcessBuilder.Redirect.appendTo(log.toFile()))
        .start();
  }
}
