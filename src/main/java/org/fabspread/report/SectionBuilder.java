package org.fabspread.report;

import org.fabspread.pipeline.StudyResults;

/**
 * One section of the study report, built from the results with the report's charts. Returns null when
 * the study has nothing for the section (no plan, no tolerance analysis, …), and the section is left
 * out. A new section is a new class with such a method and one line in {@link StudyReport#SECTIONS}.
 */
@FunctionalInterface
interface SectionBuilder {

    Section build(StudyResults r, ChartFactory charts);
}
