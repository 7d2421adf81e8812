package org.fabspread.report;

import java.util.List;

import org.fabspread.pipeline.StudyResults;

/**
 * The report's "Suggested experiments" section when no plan could be made: it says why (the model
 * refused a run of the plan, with that run's settings, or there is nothing to vary) and what to change
 * in the study, so the section never disappears silently.
 */
final class PlanMissingSection {

    private PlanMissingSection() {
    }

    /** The section, or null when the results say nothing about a missing plan. */
    static Section build(StudyResults r) {
        if (r.planMissing() == null || r.planMissing().isBlank()) {
            return null;
        }
        return new Section(StudyReport.EXPERIMENTS, "Suggested experiments", List.of(
                new Paragraph("No experiment plan could be proposed for this study: " + r.planMissing() + "."),
                new Paragraph("Until the study is changed, verify any change of a process specification with "
                        + "experiments planned by hand.")));
    }
}
