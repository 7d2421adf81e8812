package org.fabspread.report;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.HashSet;
import java.util.List;
import java.util.Locale;
import java.util.Objects;
import java.util.Set;
import org.fabspread.io.AtomicFiles;

/**
 * Writes a report folder: {@code report.html} (self-contained), {@code report.md} and, for every
 * figure, {@code charts/<name>.png} and {@code charts/<name>.svg}. Every file goes through
 * {@link AtomicFiles}, so an interrupted run never leaves a half-written file under its final name.
 * Both reports close with links to every data file already in the folder and to every chart.
 */
public final class ReportWriter {

    public static final String HTML_FILE = "report.html";
    public static final String MARKDOWN_FILE = "report.md";
    public static final String CHART_DIR = "charts";

    private ReportWriter() {
    }

    /**
     * Writes the report into {@code outDir} (created if needed) and returns the path of
     * {@code report.html}. Chart names must be file-safe and unique ignoring case (checked before
     * anything is written).
     */
    public static Path write(ReportDocument doc, Path outDir) throws IOException {
        Objects.requireNonNull(doc, "doc");
        Objects.requireNonNull(outDir, "outDir");
        Set<String> names = new HashSet<>();
        for (Figure f : doc.figures()) {
            String name = f.chart().name();
            Chart.requireFileSafe(name);
            if (!names.add(name.toLowerCase(Locale.ROOT))) {
                throw new IllegalArgumentException("two figures would write the file charts/" + name + ".png");
            }
        }
        Path charts = outDir.resolve(CHART_DIR);
        for (Figure f : doc.figures()) {
            Chart c = f.chart();
            byte[] png = c.png();
            AtomicFiles.write(charts.resolve(c.name() + ".png"), out -> out.write(png));
            byte[] svg = c.svg().getBytes(StandardCharsets.UTF_8);
            AtomicFiles.write(charts.resolve(c.name() + ".svg"), out -> out.write(svg));
        }
        ReportDocument full = withDataFiles(doc, outDir);
        AtomicFiles.writeString(outDir.resolve(MARKDOWN_FILE), new MarkdownRenderer().render(full));
        Path html = outDir.resolve(HTML_FILE);
        AtomicFiles.writeString(html, new HtmlRenderer().render(full));
        return html;
    }

    /** The document with a closing section that links every file of the folder ({@link DataFilesSection}). */
    static ReportDocument withDataFiles(ReportDocument doc, Path outDir) throws IOException {
        Section files = DataFilesSection.build(doc, outDir);
        if (files == null || doc.sections().stream().anyMatch(s -> s.id().equals(DataFilesSection.ID))) {
            return doc;
        }
        List<Section> sections = new ArrayList<>(doc.sections());
        sections.add(files);
        return new ReportDocument(doc.title(), doc.subtitle(), sections);
    }
}
