package org.fabspread.report;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.StringReader;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.stream.Stream;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;
import org.xml.sax.InputSource;

class ReportWriterTest {

    @TempDir
    Path dir;

    private static ReportDocument twoFigures() {
        return new ReportDocument("Report", "", List.of(new Section("a", "A",
                new Paragraph("text"),
                new Figure(TestCharts.small("first", "First"), "one"),
                new Figure(TestCharts.small("second", "Second"), "two"))));
    }

    @Test
    void writesHtmlMarkdownAndChartFiles() throws Exception {
        ReportDocument doc = twoFigures();
        Path out = dir.resolve("out");
        Path html = ReportWriter.write(doc, out);
        assertEquals(out.resolve("report.html"), html);
        assertTrue(Files.isRegularFile(out.resolve("report.md")));
        assertEquals(new HtmlRenderer().render(ReportWriter.withDataFiles(doc, out)),
                Files.readString(html, StandardCharsets.UTF_8));
        for (Figure f : doc.figures()) {
            Chart c = f.chart();
            assertArrayEquals(c.png(), Files.readAllBytes(out.resolve("charts/" + c.name() + ".png")));
            String svg = Files.readString(out.resolve("charts/" + c.name() + ".svg"), StandardCharsets.UTF_8);
            assertEquals(c.svg(), svg);
            ChartFactoryTest.xmlParser().parse(new InputSource(new StringReader(svg)));
        }
    }

    @Test
    void linksEveryDataFileAndChartThatIsThere() throws Exception {
        // common practice: a report names the files it rests on, and every link resolves
        ReportDocument doc = twoFigures();
        Path out = dir.resolve("linked");
        Files.createDirectories(out.resolve("plan"));
        Files.writeString(out.resolve("summary.json"), "{}");
        Files.writeString(out.resolve("samples.csv"), "a\n1\n");
        Files.writeString(out.resolve("plan/plan.csv"), "run\n1\n");
        String html = Files.readString(ReportWriter.write(doc, out), StandardCharsets.UTF_8);
        String md = Files.readString(out.resolve("report.md"), StandardCharsets.UTF_8);
        for (String f : List.of("summary.json", "samples.csv", "plan/plan.csv", "charts/first.svg", "charts/second.svg",
                "charts/first.png")) {
            assertTrue(html.contains("href=\"" + f + "\""), f);
            assertTrue(Files.isRegularFile(out.resolve(f)), f);
        }
        assertTrue(md.contains("[summary.json](summary.json)"), md);
        assertFalse(html.contains("href=\"report.md\""), "the report does not list itself");
    }

    @Test
    void leavesNoTemporaryFilesAndOverwrites() throws Exception {
        // common practice: atomic writes leave no .part files behind, also when writing over an old report
        ReportWriter.write(twoFigures(), dir);
        ReportWriter.write(twoFigures(), dir);
        try (Stream<Path> files = Files.walk(dir)) {
            List<String> names = files.filter(Files::isRegularFile).map(p -> dir.relativize(p).toString()).sorted().toList();
            assertEquals(List.of("charts/first.png", "charts/first.svg", "charts/second.png", "charts/second.svg",
                    "report.html", "report.md"), names);
            assertFalse(names.stream().anyMatch(n -> n.endsWith(".part")));
        }
    }

    @Test
    void chartNamesMustBeUniqueIgnoringCase() {
        Chart a = TestCharts.small("Spectra", "a");
        Chart b = TestCharts.small("spectra", "b");
        assertThrows(IllegalArgumentException.class, () -> new ReportDocument("r", "", List.of(
                new Section("x", "X", new Figure(a, "a")), new Section("y", "Y", new Figure(b, "b")))));
        assertThrows(IllegalArgumentException.class, () -> new ReportDocument("r", "", List.of(
                new Section("x", "X", new Figure(a, "a"), new Figure(a, "again")))));
    }
}
