package org.quantrun.core.importer;

import java.util.ArrayList;
import java.util.Comparator;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Optional;

/**
 * Picks the importer for a file: by id, or {@value ImportSettings#AUTO}, the importer with the
 * highest {@link RunImporter#detect detection} confidence. A tie for the highest confidence is an
 * error that names both importers, and so is a best confidence of 0, and so is a detector that
 * throws anything at all (it is contained and named with its plugin: the importer that failed may
 * have been the right one).
 *
 * <p>Immutable; build it from whatever importers the runner loaded.
 */
public final class ImporterSelection {

  /**
   * One importer's detection result.
   *
   * @param importerId the importer's id
   * @param confidence its confidence, clamped to 0..1 (0 when its detector threw)
   * @param failure what its detector threw, if it threw
   */
  public record Candidate(String importerId, double confidence, Optional<String> failure) {
    /**
     * A result of a detector that did not throw.
     *
     * @param importerId the importer's id
     * @param confidence its confidence
     */
    public Candidate(String importerId, double confidence) {
      this(importerId, confidence, Optional.empty());
    }
  }

  private final Map<String, RunImporter> importers;
  private final Map<String, String> origins;

  /**
   * A selection over these importers.
   *
   * @param importers the importers available; ids must be unique
   * @throws IllegalArgumentException if two importers have the same id, or one is named auto
   */
  public ImporterSelection(List<RunImporter> importers) {
    this(importers, Map.of());
  }

  /**
   * A selection over these importers, knowing where each came from, so that a failing importer
   * is named with its plugin in messages.
   *
   * @param importers the importers available; ids must be unique
   * @param origins per importer id, where it came from, e.g. {@code plugin 'acme' (acme-1.2.jar)}
   * @throws IllegalArgumentException if two importers have the same id, or one is named auto
   */
  public ImporterSelection(List<RunImporter> importers, Map<String, String> origins) {
    this.origins = Map.copyOf(origins);
    Map<String, RunImporter> m = new LinkedHashMap<>();
    for (RunImporter i : importers) {
      if (i.id().equals(ImportSettings.AUTO)) {
        throw new IllegalArgumentException("an importer cannot be called '" + ImportSettings.AUTO + "'");
      }
      if (m.putIfAbsent(i.id(), i) != null) {
        throw new IllegalArgumentException("two importers have the id '" + i.id() + "'");
      }
    }
    this.importers = java.util.Collections.unmodifiableMap(m);
  }

  /**
   * The importers, in the order given.
   *
   * @return the importers
   */
  public List<RunImporter> importers() {
    return List.copyOf(importers.values());
  }

  /**
   * Names an importer for messages: {@code importer 'x'}, followed by where it came from when
   * known, e.g. {@code importer 'x' of plugin 'acme' (acme-1.2.jar)}.
   *
   * @param id the importer id
   * @return the description
   */
  public String describe(String id) {
    String o = origins.get(id);
    return "importer '" + id + "'" + (o == null ? "" : " of " + o);
  }

  /**
   * The importer with this id.
   *
   * @param id the id
   * @return the importer, or empty
   */
  public Optional<RunImporter> byId(String id) {
    return Optional.ofNullable(importers.get(id));
  }

  /**
   * Every importer's confidence for a file, highest first (ties in the order given).
   *
   * @param fileName the file name
   * @param head the first bytes of the file
   * @return the candidates
   */
  public List<Candidate> detect(String fileName, byte[] head) {
    byte[] h = head.length > RunImporter.DETECT_HEAD_BYTES
        ? java.util.Arrays.copyOf(head, RunImporter.DETECT_HEAD_BYTES) : head;
    List<Candidate> out = new ArrayList<>();
    for (RunImporter i : importers.values()) {
      double c;
      Optional<String> failure = Optional.empty();
      try {
        c = i.detect(fileName, h.clone());
      } catch (Throwable e) { // a plugin's detector is contained, whatever it throws
        c = 0;
        failure = Optional.of(String.valueOf(e));
      }
      out.add(new Candidate(i.id(), Double.isFinite(c) ? Math.max(0, Math.min(1, c)) : 0, failure));
    }
    out.sort(Comparator.comparingDouble(Candidate::confidence).reversed());
    return out;
  }

  /**
   * Picks the importer.
   *
   * @param idOrAuto an importer id or {@value ImportSettings#AUTO}
   * @param fileName the file name (for detection and messages)
   * @param head the first bytes of the file (for detection)
   * @return the importer
   * @throws ImportException naming the file when the id is unknown, nothing detects the file, or
   *     two importers tie for the highest confidence
   */
  public RunImporter select(String idOrAuto, String fileName, byte[] head) throws ImportException {
    if (!idOrAuto.equals(ImportSettings.AUTO)) {
      RunImporter i = importers.get(idOrAuto);
      if (i == null) {
        throw new ImportException(fileName, SourcePosition.UNKNOWN, "importer '" + idOrAuto
            + "' is not installed (installed: " + (importers.isEmpty() ? "none" : String.join(", ", importers.keySet())) + ")");
      }
      return i;
    }
    List<Candidate> c = detect(fileName, head);
    for (Candidate k : c) {
      if (k.failure().isPresent()) {
        // the failing importer may have been the right one: auto cannot choose safely
        throw new ImportException(fileName, SourcePosition.UNKNOWN, describe(k.importerId())
            + " failed while detecting this file (" + k.failure().get() + "); remove or update the plugin, or name the importer in the method");
      }
    }
    if (c.isEmpty() || c.get(0).confidence() <= 0) {
      throw new ImportException(fileName, SourcePosition.UNKNOWN, "no installed importer recognises this file (installed: "
          + (importers.isEmpty() ? "none" : String.join(", ", importers.keySet())) + "); name one in the method");
    }
    if (c.size() > 1 && c.get(1).confidence() == c.get(0).confidence()) {
      throw new ImportException(fileName, SourcePosition.UNKNOWN, String.format(java.util.Locale.ROOT,
          "importers '%s' and '%s' both recognise this file with confidence %.2f; name one in the method",
          c.get(0).importerId(), c.get(1).importerId(), c.get(0).confidence()));
    }
    return importers.get(c.get(0).importerId());
  }
}
