package org.fabspread.report;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.stream.Stream;

/**
 * The report's closing "Data files" section: a link to every result file in the report's folder
 * (the files the run wrote before the report: summary, samples, sensitivity, plan, …) and to each
 * chart as SVG and PNG. Built by {@link ReportWriter} from the folder as it is when the report is
 * written, so it lists exactly what is there.
 */
final class DataFilesSection {

    static final String ID = "data-files";

    private DataFilesSection() {
    }

    /** The section for {@code outDir}, or null when it holds no data file and the document no figure. */
    static Section build(ReportDocument doc, Path outDir) throws IOException {
        List<Links.Link> links = new ArrayList<>();
        if (Files.isDirectory(outDir)) {
            try (Stream<Path> files = Files.walk(outDir, 3)) {
                files.filter(Files::isRegularFile)
                        .map(p -> outDir.relativize(p).toString().replace('\\', '/'))
                        .filter(DataFilesSection::isData)
                        .sorted()
                        .forEach(p -> links.add(new Links.Link(p, describe(p))));
            }
        }
        for (Figure f : doc.figures()) {
            String base = ReportWriter.CHART_DIR + "/" + f.chart().name();
            links.add(new Links.Link(base + ".svg", "chart: " + f.chart().title() + " (SVG; PNG beside it)"));
        }
        if (links.isEmpty()) {
            return null;
        }
        return new Section(ID, "Data files", List.of(new Paragraph("Every file of this run, beside this report:"),
                new Links(links)));
    }

    private static boolean isData(String rel) {
        String name = rel.toLowerCase(Locale.ROOT);
        if (name.startsWith(ReportWriter.CHART_DIR + "/") || name.equals(ReportWriter.HTML_FILE)
                || name.equals(ReportWriter.MARKDOWN_FILE) || name.contains("/.") || name.startsWith(".")) {
            return false;
        }
        return name.endsWith(".json") || name.endsWith(".csv") || name.endsWith(".txt") || name.endsWith(".yaml")
                || name.endsWith(".md");
    }

    /** What a result file holds, by its name. */
    static String describe(String rel) {
        String name = rel.substring(rel.lastIndexOf('/') + 1);
        return switch (name) {
            case "summary.json" -> "the run's statistics, yields and analyses (machine-readable)";
            case "samples.csv" -> "every Monte Carlo sample: inputs and outputs";
            case "sensitivity.csv" -> "sensitivity indices per output and input";
            case "plan.csv" -> "the run sheet of the suggested experiments";
            default -> name.endsWith(".csv") ? "table (CSV)" : name.endsWith(".json") ? "data (JSON)" : "text";
        };
    }
}
