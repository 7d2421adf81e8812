package org.fabspread.report;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.file.Files;
import java.nio.file.Path;
import java.util.stream.Stream;
import org.junit.jupiter.api.Test;

/**
 * Renders the synthetic sample report into target/sample-report so that a person can look at it,
 * and checks that the folder holds what the writer promises. // common practice
 */
class SampleReportTest {

    @Test
    void sampleReportIsWrittenCompletely() throws Exception {
        ReportDocument doc = SampleDocument.build(new ChartFactory());
        Path out = Path.of("target", "sample-report");
        Path html = ReportWriter.write(doc, out);
        assertEquals(out.resolve("report.html"), html);
        assertTrue(Files.size(html) > 100_000);
        assertTrue(Files.isRegularFile(out.resolve("report.md")));
        for (Figure fig : doc.figures()) {
            assertTrue(Files.size(out.resolve("charts").resolve(fig.chart().name() + ".png")) > 5_000);
            assertTrue(Files.size(out.resolve("charts").resolve(fig.chart().name() + ".svg")) > 5_000);
        }
        assertEquals(11, doc.figures().size());
        try (Stream<Path> files = Files.walk(out)) {
            assertTrue(files.noneMatch(p -> p.getFileName().toString().endsWith(".part")));
        }
    }
}
