package org.quantrun.runner.write;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.EnumSet;
import java.util.List;
import org.apache.commons.csv.CSVRecord;
import org.jsoup.Jsoup;
import org.jsoup.nodes.Document;
import org.jsoup.nodes.Element;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.DisplayName;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.quantrun.core.method.ResultFlag;
import org.quantrun.core.model.RunResult;

public class HtmlReportTest {
  @TempDir static Path dir;
  static Path folder;
  static Document doc;
  static String html;
  static RunResult run;

  @BeforeAll
  static void write() throws IOException {
    run = InventedRun.run();
    Path input = dir.resolve("run-R2701B.csv");
    Files.writeString(input, "abc");
    folder = ResultsFolder.write(dir.resolve("out"), run, InventedRun.method(), EnumSet.allOf(OutputFormat.class),
        ResultsFolderTest.audit(input), ResultsFolderTest.CLOCK, "test");
    html = Files.readString(folder.resolve("report.html"));
    doc = Jsoup.parse(html);
  }

  /** Compares an HTML table with a CSV file, column by column, through the data-column names. */
  public static void assertTableMatchesCsv(Element table, List<CSVRecord> csv) {
    List<String> columns = new ArrayList<>();
    for (Element th : table.select("thead th")) {
      columns.add(th.attr("data-column"));
    }
    List<Element> rows = table.select("tbody tr");
    assertEquals(csv.size(), rows.size(), "one HTML row per CSV row");
    for (int i = 0; i < rows.size(); i++) {
      List<Element> cells = rows.get(i).select("td");
      assertEquals(columns.size(), cells.size());
      for (int j = 0; j < columns.size(); j++) {
        String expected = csv.get(i).get(columns.get(j));
        if (expected.startsWith("'")) {
          expected = expected.substring(1); // the CSV's spreadsheet guard; the page shows the text itself
        }
        String shown = cells.get(j).text();
        if (columns.get(j).equals("verdict")) {
          assertTrue(shown.endsWith(expected), shown + " shows " + expected);
        } else if (isNumber(expected) && !expected.equals(shown)) {
          double e = Double.parseDouble(expected);
          assertEquals(e, Double.parseDouble(shown), Math.abs(e) * 5e-5 + 1e-300,
              "row " + i + " column " + columns.get(j) + ": five significant figures of the CSV value");
        } else {
          assertEquals(expected, shown, "row " + i + " column " + columns.get(j));
        }
      }
    }
  }

  static boolean isNumber(String s) {
    try {
      Double.parseDouble(s);
      return true;
    } catch (NumberFormatException e) {
      return false;
    }
  }

  @Test
  @DisplayName("the report's results, QC and rerun tables match results.csv, qc.csv and reruns.csv")
  void tablesMatchCsv() throws IOException {
    assertTableMatchesCsv(doc.selectFirst("table[data-table=results]"), ResultsFolderTest.csv(folder.resolve("results.csv")));
    assertTableMatchesCsv(doc.selectFirst("table[data-table=qc]"), ResultsFolderTest.csv(folder.resolve("qc.csv")));
    assertTableMatchesCsv(doc.selectFirst("table[data-table=reruns]"), ResultsFolderTest.csv(folder.resolve("reruns.csv")));
  }

  @Test
  @DisplayName("the report is self-contained: no script, no stylesheet link, no image or font fetched from anywhere")
  void selfContained() {
    assertTrue(doc.select("script, link, iframe, object, embed, img, base").isEmpty());
    for (Element e : doc.getAllElements()) {
      for (String attr : List.of("src", "href", "xlink:href", "srcset", "action", "data")) {
        String v = e.attr(attr);
        assertTrue(v.isEmpty() || v.startsWith("#"), e.tagName() + " " + attr + "=" + v);
      }
    }
    String style = doc.select("style").html();
    assertFalse(style.contains("url("), "no resource in the style sheet");
    assertFalse(style.contains("@import"));
    assertFalse(style.contains("@font-face"));
    assertFalse(html.matches("(?s).*\\son[a-z]+=.*"), "no event-handler attributes");
  }

  @Test
  @DisplayName("text from the export is escaped: a sample named <script> and a metadata value with tags show as text")
  void exportTextEscaped() {
    assertTrue(doc.select("script, b").isEmpty());
    assertTrue(doc.selectFirst("table[data-table=results]").text().contains(InventedRun.SCRIPT_ID));
    assertTrue(doc.selectFirst("#metadata").text().contains("<b>J. Doe</b>"));
    assertFalse(html.contains(InventedRun.SCRIPT_ID), "never written raw");
  }

  @Test
  @DisplayName("summary and verdict, a plot with statistics and levels per analyte line, flags legend, caution twice")
  void sections() {
    assertEquals("Run verdict: \u26a0 reruns needed", doc.getElementById("verdict").text());
    List<Element> cals = doc.select("section.calibration");
    assertEquals(2, cals.size());
    for (int i = 0; i < 2; i++) {
      Element c = cals.get(i);
      Element svg = c.selectFirst("svg");
      assertTrue(svg != null, "a plot per analyte line");
      assertEquals("cal-" + (i + 1) + "-plot", svg.id());
      assertTrue(svg.select("path, circle, ellipse").size() > 8, "the plot draws points and a curve");
      double c1 = run.calibrations().get(i).fit().get().coefficient(1);
      assertEquals(c1, Double.parseDouble(c.selectFirst("td[data-column=c1]").text()), Math.abs(c1) * 5e-5);
      assertEquals(4, c.select("table[data-table=calibration-levels] tbody tr").size());
    }
    assertTrue(cals.get(1).text().contains("\u2717 rejected"), "a rejected calibration says so in words");
    assertTrue(cals.get(1).text().contains("STD-4 back-calculates 10.9 % off"));
    Element legend = doc.selectFirst("table.legend");
    assertEquals(ResultFlag.values().length, legend.select("tbody tr").size());
    assertTrue(legend.text().contains("ND below-lod"), "the lab's code beside quantrun's flag name");
    assertEquals(2, doc.select("p.caution").size());
    // FIPS 180-2, appendix B.1: SHA-256("abc"), the invented export's content
    assertTrue(doc.selectFirst("table[data-table=inputs]").text()
        .contains("export run-R2701B.csv ba7816bf8f01cfea414140de5dae2223b00361a396177a9cb410ff61f20015ad"));
    assertTrue(doc.selectFirst("p.caution").text().contains("qualified analyst"));
    assertTrue(doc.selectFirst("p.caution").text().contains("accredited method"));
  }

  @Test
  @DisplayName("pass and fail are written as words with symbols, never by colour alone")
  void verdictsInWords() {
    for (Element td : doc.select("table[data-table=qc] tbody td.v-failed, table[data-table=qc] tbody td.v-passed, "
        + "table[data-table=qc] tbody td.v-not-evaluated")) {
      assertTrue(td.text().matches("[\u2713\u2717\u2013] (passed|failed|not evaluated)"), td.text());
    }
    assertEquals(4, doc.select("table[data-table=qc] tbody td[class^=v-]").size());
  }

  @Test
  @DisplayName("the page carries print rules for A4 and Letter: page margins without a fixed size, blocks kept whole")
  void printRules() {
    String style = doc.select("style").html();
    assertTrue(style.contains("@page"));
    assertFalse(style.matches("(?s).*@page[^}]*size.*"), "no fixed paper size, so A4 and Letter both fit");
    assertTrue(style.contains("@media print"));
    assertTrue(style.contains("break-inside: avoid"));
  }

  @Test
  @DisplayName("the escaper turns markup characters and control characters into safe text")
  void escaper() {
    assertEquals("&lt;a href=&quot;x&quot;&gt;&amp;&#39;\uFFFD", Html.escape("<a href=\"x\">&'\u0007"));
    assertEquals("12.346", Html.number(12.34567));
    assertEquals("1.2346E+8", Html.number(123456789));
    assertEquals("-0.00012346", Html.number(-0.000123456));
  }
}
