package org.fabspread.report;

import java.util.ArrayList;
import java.util.List;

import org.fabspread.pipeline.StudyResults;

/**
 * The report's "Limits of the model" section: the model's validity ranges and cautions
 * ({@link ModelLimits}) with the notes of this run (re-runs, intervals, repaired correlations).
 */
final class LimitsSection {

    private LimitsSection() {
    }

    static Section build(StudyResults r) {
        return ModelLimits.section(StudyReport.LIMITS, r.study(), notes(r));
    }

    /** The run's notes worth a reader's attention, in the order the analyses ran. */
    static List<String> notes(StudyResults r) {
        List<String> notes = new ArrayList<>(r.notes());
        if (r.envelope() != null && r.envelope().samples() > 0) {
            notes.add(EnvelopeParagraph.text(r.envelope()));
        }
        if (r.yield() != null) {
            notes.add(r.yield().note());
        }
        if (r.sobol() != null) {
            notes.add(r.sobol().note());
        }
        if (r.allocation() != null) {
            notes.add(r.allocation().note());
        }
        if (r.summary().correlationRepaired()) {
            notes.add("The study's correlation targets were inconsistent; the normal correlation matrix was "
                    + "repaired to the nearest valid one before sampling.");
        }
        return notes;
    }
}
