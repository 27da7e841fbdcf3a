package org.quantrun.runner.write;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import org.apache.commons.csv.CSVFormat;
import org.apache.commons.csv.CSVParser;
import org.apache.commons.csv.CSVRecord;

/** Reads the CSV files quantrun writes back, with Commons CSV's RFC 4180 parser, for the tests. */
public final class CsvFiles {
  private CsvFiles() {}

  /** The records of a CSV file with a header row, by column name. */
  public static List<CSVRecord> records(Path file) throws IOException {
    try (CSVParser p = CSVParser.parse(Files.readString(file, StandardCharsets.UTF_8),
        CSVFormat.RFC4180.builder().setHeader().setSkipHeaderRecord(true).get())) {
      return p.getRecords();
    }
  }

  /** The header row of a CSV file. */
  public static List<String> header(Path file) throws IOException {
    try (CSVParser p = CSVParser.parse(Files.readString(file, StandardCharsets.UTF_8), CSVFormat.RFC4180)) {
      return p.getRecords().get(0).toList();
    }
  }
}
