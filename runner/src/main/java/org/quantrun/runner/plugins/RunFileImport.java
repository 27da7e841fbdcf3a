package org.quantrun.runner.plugins;

import java.io.IOException;
import java.io.InputStream;
import java.nio.file.Files;
import java.nio.file.NoSuchFileException;
import java.nio.file.Path;
import org.quantrun.core.importer.ImportException;
import org.quantrun.core.importer.ImportProfiles;
import org.quantrun.core.importer.ImportSettings;
import org.quantrun.core.importer.ImporterSelection;
import org.quantrun.core.importer.RawRun;
import org.quantrun.core.importer.RunImporter;
import org.quantrun.core.importer.SourcePosition;

/**
 * Reads an export file into a run: picks the importer named by the settings (an id, or
 * {@code auto} for the highest detection confidence) and reads the file with it. The file is
 * only read, never changed. Every failure is one {@link ImportException} naming the file; an
 * importer that throws anything else is contained and named with its plugin. The size limits of
 * the settings are checked before reading and on the run read.
 */
public final class RunFileImport {

  private final ImporterSelection selection;

  /**
   * A reader over the loaded importers.
   *
   * @param selection the importers to choose from
   */
  public RunFileImport(ImporterSelection selection) {
    this.selection = selection;
  }

  /**
   * Loads an import profile file.
   *
   * @param profile the YAML profile
   * @return the settings
   * @throws ImportException if it cannot be read or is not a valid profile
   */
  public static ImportSettings loadProfile(Path profile) throws ImportException {
    String name = profile.getFileName().toString();
    try {
      if (Files.size(profile) > 4L * ImportProfiles.MAX_CODE_POINTS) {
        throw new ImportException(name, SourcePosition.UNKNOWN,
            "the profile is larger than " + ImportProfiles.MAX_CODE_POINTS / 1024 + " KiB and is refused");
      }
      return ImportProfiles.parse(Files.readString(profile), name);
    } catch (NoSuchFileException e) {
      throw new ImportException(name, SourcePosition.UNKNOWN, "import profile not found");
    } catch (IOException e) {
      throw new ImportException(name, SourcePosition.UNKNOWN, "cannot be read: " + e.getMessage(), e);
    }
  }

  /**
   * Picks the importer for a file.
   *
   * @param file the export
   * @param settings the settings; {@link ImportSettings#importer()} is an id or {@code auto}
   * @return the importer
   * @throws ImportException if the file cannot be read or no single importer fits
   */
  public RunImporter importerFor(Path file, ImportSettings settings) throws ImportException {
    String name = file.getFileName().toString();
    byte[] head;
    try (InputStream in = Files.newInputStream(file)) {
      head = in.readNBytes(RunImporter.DETECT_HEAD_BYTES);
    } catch (NoSuchFileException e) {
      throw new ImportException(name, SourcePosition.UNKNOWN, "file not found");
    } catch (IOException e) {
      throw new ImportException(name, SourcePosition.UNKNOWN, "cannot be read: " + e.getMessage(), e);
    }
    return selection.select(settings.importer(), name, head);
  }

  /**
   * Reads a file with the importer the settings pick.
   *
   * @param file the export
   * @param settings the settings
   * @return the run
   * @throws ImportException for any problem, naming the file and, where known, line and column
   */
  public RawRun read(Path file, ImportSettings settings) throws ImportException {
    String name = file.getFileName().toString();
    try {
      if (Files.size(file) > settings.maxFileBytes()) {
        throw new ImportException(name, SourcePosition.UNKNOWN,
            "the file is larger than " + settings.maxFileBytes() + " bytes (max_file_bytes in the import profile)");
      }
    } catch (NoSuchFileException e) {
      throw new ImportException(name, SourcePosition.UNKNOWN, "file not found");
    } catch (IOException e) {
      throw new ImportException(name, SourcePosition.UNKNOWN, "cannot be read: " + e.getMessage(), e);
    }
    RunImporter importer = importerFor(file, settings);
    String id = importer.id();
    RawRun run;
    try (InputStream in = Files.newInputStream(file)) {
      run = importer.read(in, settings, name);
    } catch (IOException e) {
      throw new ImportException(name, SourcePosition.UNKNOWN, "cannot be read: " + e.getMessage(), e);
    } catch (ImportException e) {
      throw e;
    } catch (Throwable e) {
      // a plugin broke its contract, whatever it threw: this file's problem, never a stack trace
      throw new ImportException(name, SourcePosition.UNKNOWN, selection.describe(id) + " failed unexpectedly: " + e, e);
    }
    return withinLimits(run, settings, name, id);
  }

  /** The limits hold for third-party importers too, whether or not they count. */
  private RawRun withinLimits(RawRun run, ImportSettings settings, String name, String id) throws ImportException {
    if (run == null) {
      throw new ImportException(name, SourcePosition.UNKNOWN, selection.describe(id) + " gave no run");
    }
    if (run.injections().size() > settings.maxInjections()) {
      throw new ImportException(name, SourcePosition.UNKNOWN, "the export has more than " + settings.maxInjections()
          + " injections (max_injections in the import profile)");
    }
    if (run.analyteLines().size() > settings.maxAnalyteLines()) {
      throw new ImportException(name, SourcePosition.UNKNOWN, "the export has more than " + settings.maxAnalyteLines()
          + " analyte lines (max_analyte_lines in the import profile)");
    }
    return run;
  }
}
