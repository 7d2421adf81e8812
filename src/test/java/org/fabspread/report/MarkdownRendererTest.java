package org.fabspread.report;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.List;
import org.junit.jupiter.api.Test;

class MarkdownRendererTest {

    @Test
    void pipesInCellsAreEscapedSoColumnsStay() {
        // source: GitHub Flavored Markdown spec 0.29, §4.10 tables: "\|" puts a pipe in a cell
        Table t = Table.of("a|b", List.of("input", "note"), List.of(List.of("x|y", "1|2"), List.of("plain", "")));
        String md = new MarkdownRenderer().render(new ReportDocument("T", "", List.of(new Section("s", "S", t))));
        assertTrue(md.contains("| x\\|y | 1\\|2 |"), md);
        for (String line : md.split("\n")) {
            if (line.startsWith("|")) {
                // three unescaped pipes: two columns
                assertEquals(3, line.replace("\\|", "").chars().filter(c -> c == '|').count(), line);
            }
        }
        assertTrue(md.contains("|:---|:---|"));
    }

    @Test
    void numericColumnsAlignRight() {
        Table t = Table.of("", List.of("input", "S_i"), List.of(List.of("a", "0.52"), List.of("b", "−0.004")));
        String md = new MarkdownRenderer().render(new ReportDocument("T", "", List.of(new Section("s", "S", t))));
        assertTrue(md.contains("|:---|---:|"), md);
    }

    @Test
    void figuresReferenceTheChartFiles() {
        Chart c = TestCharts.small("spectra", "Spectra");
        String md = new MarkdownRenderer().render(new ReportDocument("T", "", List.of(new Section("s", "S",
                new Figure(c, "Caption [1]")))));
        assertTrue(md.contains("![Spectra](charts/spectra.png)"), md);
        assertTrue(md.contains("*Figure 1. Caption \\[1\\]*"), md);
    }

    @Test
    void userTextIsLiteral() {
        // common practice: markup characters in user text are shown, not interpreted
        assertEquals("\\<script\\>alert(1)\\</script\\>", MarkdownRenderer.text("<script>alert(1)</script>"));
        assertEquals("\\# not a heading", MarkdownRenderer.text("# not a heading"));
        assertEquals("\\- not a list", MarkdownRenderer.text("- not a list"));
        assertEquals("12\\. not numbered", MarkdownRenderer.text("12. not numbered"));
        assertEquals("\\> not a quote", MarkdownRenderer.text("> not a quote"));
        assertEquals("a \\*b\\* \\_c\\_ \\`d\\` \\[e\\](f) \\& \\!", MarkdownRenderer.text("a *b* _c_ `d` [e](f) & !"));
        assertEquals("x - y", MarkdownRenderer.text("x - y"));
        assertEquals("a b", MarkdownRenderer.cell("a\nb"));
        String md = new MarkdownRenderer().render(new ReportDocument("<script>x</script>", "", List.of(
                new Section("s", "S", new Paragraph("<script>"), new Caution("two\nlines")))));
        // every '<' carries its backslash, so no raw tag reaches a Markdown-to-HTML converter
        assertFalse(java.util.regex.Pattern.compile("(?<!\\\\)<").matcher(md).find(), md);
        assertTrue(md.contains("> **Caution:** two\n> lines"), md);
    }

    @Test
    void preformattedUsesAFenceLongerThanItsBackticks() {
        String md = new MarkdownRenderer().render(new ReportDocument("T", "", List.of(new Section("s", "S",
                new Preformatted("a ```` b")))));
        assertTrue(md.contains("`````text\na ```` b\n`````"), md);
    }
}
