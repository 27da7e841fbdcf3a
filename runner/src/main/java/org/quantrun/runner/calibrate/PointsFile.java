package org.quantrun.runner.calibrate;

import java.io.IOException;
import java.io.Reader;
import java.nio.charset.CharacterCodingException;
import java.nio.charset.CodingErrorAction;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.NoSuchFileException;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.HashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import org.apache.commons.csv.CSVFormat;
import org.apache.commons.csv.CSVParser;
import org.apache.commons.csv.CSVRecord;
import org.quantrun.core.calibration.CalibrationPoint;
import org.quantrun.runner.InputException;

/**
 * Reads calibration points from a CSV file with a header naming the columns {@code x} and {@code
 * y} and, optionally, {@code sd} (in any order, any letter case; other columns are ignored). Blank
 * lines and lines starting with {@code #} are skipped.
 */
public final class PointsFile {
  private PointsFile() {}

  /**
   * Reads the points of a file.
   *
   * @throws InputException naming the file, line and column of the first problem
   */
  public static List<CalibrationPoint> read(Path file) {
    String name = file.getFileName() == null ? file.toString() : file.getFileName().toString();
    try (Reader reader = new java.io.InputStreamReader(Files.newInputStream(file),
        StandardCharsets.UTF_8.newDecoder()
            .onMalformedInput(CodingErrorAction.REPORT)
            .onUnmappableCharacter(CodingErrorAction.REPORT))) {
      return read(reader, name);
    } catch (NoSuchFileException e) {
      throw new InputException(name + ": no such file");
    } catch (CharacterCodingException e) {
      throw new InputException(name + ": not UTF-8 text (save the file as UTF-8 CSV)");
    } catch (IOException e) {
      throw new InputException(name + ": cannot be read (" + e.getMessage() + ")");
    }
  }

  /**
   * Reads the points from a reader; {@code name} is used in messages.
   *
   * @throws InputException naming the source, line and column of the first problem
   */
  public static List<CalibrationPoint> read(Reader reader, String name) throws IOException {
    CSVFormat format = CSVFormat.RFC4180.builder()
        .setCommentMarker('#')
        .setIgnoreEmptyLines(true)
        .setIgnoreSurroundingSpaces(true)
        .get();
    try (CSVParser parser = CSVParser.parse(reader, format)) {
      List<CalibrationPoint> points = new ArrayList<>();
      Map<String, Integer> columns = null;
      for (CSVRecord record : parser) {
        long line = parser.getCurrentLineNumber();
        if (columns == null) {
          columns = header(record, name, line);
          continue;
        }
        if (record.size() == 1 && record.get(0).isEmpty()) {
          continue;
        }
        double x = number(record, columns.get("x"), "x", name, line);
        double y = number(record, columns.get("y"), "y", name, line);
        Integer sdColumn = columns.get("sd");
        if (sdColumn != null && sdColumn < record.size() && !record.get(sdColumn).isEmpty()) {
          points.add(CalibrationPoint.of(x, y, number(record, sdColumn, "sd", name, line)));
        } else {
          points.add(CalibrationPoint.of(x, y));
        }
      }
      if (columns == null) {
        throw new InputException(name + ": the file is empty (expected a header 'x,y' or 'x,y,sd' and one row per standard)");
      }
      if (points.isEmpty()) {
        throw new InputException(name + ": the file has a header but no calibration points");
      }
      return points;
    } catch (java.io.UncheckedIOException | IllegalStateException e) {
      throw new InputException(name + ": not a readable CSV file (" + e.getMessage() + ")");
    }
  }

  private static Map<String, Integer> header(CSVRecord record, String name, long line) {
    Map<String, Integer> columns = new HashMap<>();
    for (int i = 0; i < record.size(); i++) {
      String key = stripBom(record.get(i)).trim().toLowerCase(Locale.ROOT);
      if (columns.containsKey(key) && (key.equals("x") || key.equals("y") || key.equals("sd"))) {
        throw new InputException(name + ":" + line + ":" + (i + 1) + ": column '" + key + "' appears twice in the header");
      }
      columns.putIfAbsent(key, i);
    }
    for (String required : new String[] {"x", "y"}) {
      if (!columns.containsKey(required)) {
        throw new InputException(name + ":" + line + ": the header has no column '" + required
            + "' (expected a header 'x,y' or 'x,y,sd', found '" + String.join(",", record) + "')");
      }
    }
    return columns;
  }

  private static double number(CSVRecord record, int column, String what, String name, long line) {
    String where = name + ":" + line + ":" + (column + 1) + ": ";
    if (column >= record.size()) {
      throw new InputException(where + "the row has no value for " + what
          + " (expected " + (column + 1) + " columns, found " + record.size() + ")");
    }
    String text = record.get(column);
    if (text.isEmpty()) {
      throw new InputException(where + what + " is empty (expected a number)");
    }
    try {
      double v = Double.parseDouble(text);
      if (!Double.isFinite(v) || text.chars().anyMatch(Character::isLetter) && !text.matches("[-+0-9.]+[eE][-+]?[0-9]+")) {
        throw new NumberFormatException();
      }
      return v;
    } catch (NumberFormatException e) {
      throw new InputException(where + what + " \"" + text + "\" is not a number (expected e.g. 12.5 or 1.25e3, with a decimal point)");
    }
  }

  private static String stripBom(String s) {
    return s.startsWith("\uFEFF") ? s.substring(1) : s;
  }
}
