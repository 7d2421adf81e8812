/**
 * Charts and the design-review report.
 *
 * <p>The report is built on a small immutable document model ({@link org.fabspread.report.ReportDocument},
 * {@link org.fabspread.report.Section} and the {@link org.fabspread.report.Block} kinds) that knows
 * nothing of the analyses; whoever assembles a report translates analysis results into paragraphs,
 * tables and figures. {@link org.fabspread.report.ChartFactory} draws the figures from plain arrays,
 * {@link org.fabspread.report.HtmlRenderer} and {@link org.fabspread.report.MarkdownRenderer} render a
 * document, and {@link org.fabspread.report.ReportWriter} writes everything to a folder through
 * {@link org.fabspread.io.AtomicFiles}. Every user string in the model is plain text; the renderers
 * escape it.
 */
package org.fabspread.report;
