package org.quantrun.core.importer;

import static org.junit.jupiter.api.Assertions.assertEquals;

import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.CsvSource;

/** Header names as compared: the spellings instrument exports use for one column (common practice). */
class ColumnNamesTest {

  @ParameterizedTest(name = "''{0}'' is ''{1}''")
  @CsvSource(delimiter = '|', value = {
      "Sample ID|sample id",
      "sample_id|sample id",
      "SAMPLE-ID|sample id",
      "SampleID|sample id",
      "sampleId|sample id",
      "SampleName|sample name",
      "DateTime|date time",
      "SeqNo|seq no",
      "IDNumber|id number",
      "SAMPLEID|sampleid",
      "Wavelength (nm)|wavelength nm",
      "  Intensity  |intensity",
      "m/z|m z",
      "\uFEFFSeq|seq",
  })
  void normalise(String header, String expected) {
    assertEquals(expected, ColumnNames.normalise(header));
  }
}
