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
        assertEquals(new HtmlRenderer().render(doc), Files.readString(html, StandardCharsets.UTF_8));
        for (Figure f : doc.figures()) {
            Chart c = f.chart();
            assertArrayEquals(c.png(), Files.readAllBytes(out.resolve("charts/" + c.name() + ".png")));
            String svg = Files.readString(out.resolve("charts/" + c.name() + ".svg"), StandardCharsets.UTF_8);
            assertEquals(c.svg(), svg);
            ChartFactoryTest.xmlParser().parse(new InputSource(new StringReader(svg)));
        }
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
