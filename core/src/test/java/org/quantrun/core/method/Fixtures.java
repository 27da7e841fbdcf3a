package org.quantrun.core.method;

import java.io.IOException;
import java.io.UncheckedIOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.stream.Stream;

/** Finds the repository's config-examples folder and reads test texts. */
final class Fixtures {
  private Fixtures() {}

  static Path examples() {
    Path base = Path.of(System.getProperty("basedir", ".")).toAbsolutePath();
    for (Path p = base; p != null; p = p.getParent()) {
      if (Files.isDirectory(p.resolve("config-examples")) && Files.isRegularFile(p.resolve("config-examples/method.schema.json"))) {
        return p.resolve("config-examples");
      }
    }
    throw new IllegalStateException("config-examples not found above " + base);
  }

  static List<Path> exampleMethods() {
    try (Stream<Path> s = Files.list(examples())) {
      return s.filter(p -> p.getFileName().toString().endsWith(".yaml")).sorted().toList();
    } catch (IOException e) {
      throw new UncheckedIOException(e);
    }
  }

  static String read(Path p) {
    try {
      return Files.readString(p, StandardCharsets.UTF_8);
    } catch (IOException e) {
      throw new UncheckedIOException(e);
    }
  }

  static String resource(String name) {
    try (var in = Fixtures.class.getResourceAsStream(name)) {
      if (in == null) {
        throw new IllegalStateException("no test resource " + name);
      }
      return new String(in.readAllBytes(), StandardCharsets.UTF_8);
    } catch (IOException e) {
      throw new UncheckedIOException(e);
    }
  }
}
