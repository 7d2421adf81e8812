package org.fabspread.cli;

import java.io.IOException;
import java.nio.file.Path;

import org.fabspread.pipeline.ResultsRenderer;
import org.fabspread.pipeline.StudyResults;
import org.fabspread.report.ReportWriter;
import org.fabspread.report.StudyReport;

/** The study report (HTML, Markdown, charts) as the pipeline's renderer. */
enum ReportRenderer implements ResultsRenderer {
    INSTANCE;

    @Override
    public Path render(StudyResults results, Path folder) throws IOException {
        return ReportWriter.write(StudyReport.build(results), folder);
    }
}
