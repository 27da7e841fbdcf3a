package org.quantrun.importer.example;

import java.io.BufferedReader;
import java.io.IOException;
import java.io.InputStream;
import java.io.UncheckedIOException;
import java.util.ArrayList;
import java.util.HashSet;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;
import java.util.Optional;
import java.util.Set;
import org.pf4j.Extension;
import org.quantrun.core.importer.AnalyteLine;
import org.quantrun.core.importer.ImportException;
import org.quantrun.core.importer.ImportSettings;
import org.quantrun.core.importer.Injection;
import org.quantrun.core.importer.LineReadings;
import org.quantrun.core.importer.MetadataEntry;
import org.quantrun.core.importer.RawRun;
import org.quantrun.core.importer.Reading;
import org.quantrun.core.importer.RunImporter;
import org.quantrun.core.importer.SourcePosition;
import org.quantrun.core.importer.TextInput;
import org.quantrun.core.importer.ValueReader;

/**
 * The example importer of DEVELOPERS.md. It reads a small format of our own, a block per
 * injection:
 *
 * <pre>
 * # run: R2611A
 * [W2611-007]
 * Cd 228.802 = 1201.5; 1199.0; OVER
 * Pb 220.353 = 310.0; 312.5; 309.9
 * </pre>
 *
 * <p>{@code # key: value} lines are metadata; {@code [sample id]} opens an injection; every other
 * non-blank line is {@code analyte [line] = reading; reading; ...}. It shows the parts every
 * importer needs: {@link TextInput} for safe decoding, {@link ValueReader} for numbers and
 * invalid markers, positions on every item, the limits of the settings (file size through
 * {@link TextInput}; injections and analyte lines counted here), and {@link ImportException} for
 * everything else.
 */
@Extension
public final class BlockImporter implements RunImporter {

  @Override
  public String id() {
    return "example-blocks";
  }

  @Override
  public String description() {
    return "Example: a block per sample, \"analyte line = reading; reading\"";
  }

  @Override
  public double detect(String fileName, byte[] head) {
    String text = TextInput.headText(head);
    for (String line : text.split("\\R")) {
      String l = line.strip();
      if (l.isEmpty() || l.startsWith("#")) {
        continue;
      }
      return l.startsWith("[") && l.endsWith("]") && text.contains("=") ? 0.9 : 0;
    }
    return 0;
  }

  @Override
  public RawRun read(InputStream in, ImportSettings settings, String sourceName) throws ImportException {
    TextInput text = TextInput.open(in, settings, sourceName);
    ValueReader values = new ValueReader(sourceName, settings);
    List<MetadataEntry> metadata = new ArrayList<>();
    List<Injection> injections = new ArrayList<>();
    Set<AnalyteLine> seenLines = new HashSet<>();
    Block block = null;
    int lineNo = 0;
    try (BufferedReader reader = new BufferedReader(text)) {
      String line;
      while ((line = reader.readLine()) != null) {
        lineNo++;
        String l = line.strip();
        if (l.isEmpty()) {
          continue;
        }
        if (l.startsWith("#")) {
          int colon = l.indexOf(':');
          String key = colon > 1 ? l.substring(1, colon).strip() : "";
          if (!key.isEmpty()) {
            metadata.add(new MetadataEntry(key, l.substring(colon + 1).strip(), SourcePosition.ofLine(lineNo)));
          }
        } else if (l.startsWith("[") && l.endsWith("]") && l.length() > 2) {
          String sampleId = l.substring(1, l.length() - 1).strip();
          if (sampleId.isEmpty()) {
            throw new ImportException(sourceName, new SourcePosition(lineNo, 1), "the sample id between [ and ] is empty");
          }
          if (block != null) {
            injections.add(block.build(sourceName, injections.size() + 1));
          }
          if (injections.size() >= settings.maxInjections()) {
            throw new ImportException(sourceName, SourcePosition.ofLine(lineNo), "the export has more than "
                + settings.maxInjections() + " injections (max_injections in the import profile)");
          }
          block = new Block(sampleId, lineNo);
        } else {
          if (block == null) {
            throw new ImportException(sourceName, new SourcePosition(lineNo, 1), "expected a [sample id] line first");
          }
          AnalyteLine al = block.add(line, lineNo, values, sourceName);
          if (seenLines.add(al) && seenLines.size() > settings.maxAnalyteLines()) {
            throw new ImportException(sourceName, new SourcePosition(lineNo, 1), "the export has more than "
                + settings.maxAnalyteLines() + " analyte lines (max_analyte_lines in the import profile)");
          }
        }
      }
    } catch (IOException | UncheckedIOException e) {
      throw text.problem(e, lineNo + 1);
    }
    if (block == null) {
      throw new ImportException(sourceName, SourcePosition.UNKNOWN, lineNo == 0 ? "the file is empty" : "has no [sample id] block");
    }
    injections.add(block.build(sourceName, injections.size() + 1));
    return new RawRun(sourceName, id(), metadata, injections);
  }

  /** One injection being read. */
  private static final class Block {
    final String sampleId;
    final int line;
    final Map<AnalyteLine, LineReadings> lines = new LinkedHashMap<>();

    Block(String sampleId, int line) {
      this.sampleId = sampleId;
      this.line = line;
    }

    AnalyteLine add(String text, int lineNo, ValueReader values, String source) throws ImportException {
      int eq = text.indexOf('=');
      if (eq < 0) {
        throw new ImportException(source, new SourcePosition(lineNo, text.length() + 1),
            "expected 'analyte line = reading; reading; ...'");
      }
      String[] name = text.substring(0, eq).strip().split("\\s+", 2);
      if (name[0].isEmpty()) {
        throw new ImportException(source, new SourcePosition(lineNo, 1), "analyte is empty");
      }
      AnalyteLine al = AnalyteLine.of(name[0], name.length > 1 ? name[1] : "");
      if (lines.containsKey(al)) {
        throw new ImportException(source, new SourcePosition(lineNo, 1), al.label() + " appears twice in [" + sampleId + "]");
      }
      List<Reading> readings = new ArrayList<>();
      int column = eq + 2;
      for (String part : text.substring(eq + 1).split(";", -1)) {
        readings.add(values.read(part, al.label(), lineNo, column));
        column += part.length() + 1;
      }
      lines.put(al, new LineReadings(al, Optional.empty(), readings, Optional.empty(), Optional.empty(),
          Optional.empty(), new SourcePosition(lineNo, 1)));
      return al;
    }

    Injection build(String source, int sequence) throws ImportException {
      if (lines.isEmpty()) {
        throw new ImportException(source, SourcePosition.ofLine(line), "[" + sampleId + "] has no readings");
      }
      return new Injection(sequence, sampleId, Optional.empty(), Optional.empty(), List.copyOf(lines.values()),
          SourcePosition.ofLine(line));
    }
  }
}
