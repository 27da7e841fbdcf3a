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
 * error that names both importers, and so is a best confidence of 0.
 *
 * <p>Immutable; build it from whatever importers the runner loaded.
 */
public final class ImporterSelection {

  /**
   * One importer's detection result.
   *
   * @param importerId the importer's id
   * @param confidence its confidence, clamped to 0..1 (0 when its detector threw)
   */
  public record Candidate(String importerId, double confidence) {}

  private final Map<String, RunImporter> importers;

  /**
   * A selection over these importers.
   *
   * @param importers the importers available; ids must be unique
   * @throws IllegalArgumentException if two importers have the same id, or one is named auto
   */
  public ImporterSelection(List<RunImporter> importers) {
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
      try {
        c = i.detect(fileName, h.clone());
      } catch (RuntimeException e) {
        c = 0; // a detector that throws cannot read the file
      }
      out.add(new Candidate(i.id(), Double.isFinite(c) ? Math.max(0, Math.min(1, c)) : 0));
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
