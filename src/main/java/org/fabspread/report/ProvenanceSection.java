package org.fabspread.report;

import static org.fabspread.report.ReportText.*;
import static org.fabspread.report.ResultLookup.*;

import java.util.ArrayList;
import java.util.List;
import org.fabspread.pipeline.StudyResults;
import org.fabspread.study.Study;

/** The report's "Provenance" section: version, build, seed, hashes, material sources, the study file as run. */
final class ProvenanceSection {

    private ProvenanceSection() {
    }

    static Section build(StudyResults r) {
        StudyResults.Provenance p = r.provenance();
        List<Block> b = new ArrayList<>();
        if (p == null) {
            b.add(new Paragraph("No provenance was recorded for this run."));
            return new Section(StudyReport.PROVENANCE, "Provenance", b);
        }
        b.add(new KeyValues(List.of(
                KeyValues.pair("fabspread version", p.version()),
                KeyValues.pair("Build commit", p.commit()),
                KeyValues.pair("Build date", p.buildDate()),
                KeyValues.pair("Run finished", p.runDate()),
                KeyValues.pair("Seed", Long.toString(p.seed())),
                KeyValues.pair("Study file SHA-256", p.studySha256()),
                KeyValues.pair("Command", p.command()))));
        if (p.materialSources() != null && !p.materialSources().isEmpty()) {
            List<List<String>> rows = new ArrayList<>();
            p.materialSources().forEach((k, v) -> rows.add(List.of(k, v)));
            b.add(Table.of("Optical constants and their published sources", List.of("material", "source"), rows));
        }
        if (p.studyText() != null && !p.studyText().isEmpty()) {
            b.add(new Paragraph("The study file as run:"));
            b.add(new Preformatted(p.studyText()));
        }
        return new Section(StudyReport.PROVENANCE, "Provenance", b);
    }
}
