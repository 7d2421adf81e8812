package org.fabspread.report;

import java.util.Base64;
import java.util.List;

/**
 * Renders a {@link ReportDocument} as one self-contained HTML file: inline style sheet, figures
 * embedded as {@code data:image/png;base64} images, no script; the only references are plain links to
 * the files beside it (each chart's SVG and PNG, the data files). The answer section, when the
 * document opens with one, comes before the contents. Tables scroll inside their own box on narrow
 * screens; the print style sheet numbers the pages and starts each section on a new page. The markup is XHTML-compatible (every element closed, attributes quoted, only the five
 * XML entities), so an XML parser reads it. Every user string is escaped ({@code & < > " '}) and
 * characters XML does not allow are replaced by U+FFFD.
 */
public final class HtmlRenderer {

    /** The style sheet: sober, printable, legible in greyscale; no colour carries meaning alone. */
    static final String CSS = String.join("\n",
            "*, *::before, *::after { box-sizing: border-box; }",
            "body { font-family: 'DejaVu Sans', 'Helvetica Neue', Arial, sans-serif; color: #1c1c1c; background: #fff;",
            "  max-width: 60rem; margin: 2rem auto; padding: 0 1.5rem; line-height: 1.45; font-size: 15px; }",
            "h1 { font-size: 1.75rem; margin: 0 0 0.25rem 0; overflow-wrap: break-word; }",
            "p.subtitle { font-size: 1.05rem; color: #3a3a3a; margin: 0 0 1.5rem 0; }",
            "h2 { font-size: 1.3rem; border-bottom: 2px solid #1c1c1c; padding-bottom: 0.2rem; margin-top: 2.2rem; }",
            "nav.toc { border: 1px solid #9a9a9a; padding: 0.6rem 1.2rem; margin: 1rem 0 2rem 0; background: #f6f6f6; }",
            "nav.toc h2 { border: none; font-size: 1.05rem; margin: 0.2rem 0; }",
            "nav.toc ol { margin: 0.3rem 0; padding-left: 1.4rem; columns: 2 16rem; }",
            "a { color: #1c1c1c; overflow-wrap: anywhere; }",
            "section#sec-verdict { border: 2px solid #1c1c1c; padding: 0 1rem 0.6rem 1rem; margin-top: 1rem; }",
            "section#sec-verdict h2 { margin-top: 0.8rem; }",
            "section#sec-verdict > p:first-of-type { font-size: 1.1rem; font-weight: bold; }",
            "section#sec-verdict table.kv th { width: 13rem; }",
            "div.scroll { max-width: 100%; overflow-x: auto; margin: 1rem 0; }",
            "div.scroll > table { margin: 0; }",
            "table { border-collapse: collapse; margin: 1rem 0; font-size: 0.92rem; }",
            "table.kv { width: 100%; }",
            "caption { caption-side: top; text-align: left; font-weight: bold; padding-bottom: 0.3rem; }",
            "th, td { border: 1px solid #9a9a9a; padding: 0.25rem 0.6rem; vertical-align: top; }",
            "table.kv td, table.kv th { overflow-wrap: anywhere; }",
            "thead th { background: #e8e8e8; border-bottom: 2px solid #1c1c1c; }",
            "td.r, th.r { text-align: right; font-variant-numeric: tabular-nums; }",
            "td.c, th.c { text-align: center; }",
            "td.l, th.l { text-align: left; }",
            "table.kv th { text-align: left; background: #f2f2f2; font-weight: normal; }",
            "figure { margin: 1.5rem 0; page-break-inside: avoid; break-inside: avoid; }",
            "figure img { max-width: 100%; height: auto; border: 1px solid #d0d0d0; }",
            "figcaption { font-size: 0.92rem; margin-top: 0.3rem; }",
            "ul.files li { margin: 0.15rem 0; }",
            "div.caution { border: 2px solid #1c1c1c; border-left: 10px solid #1c1c1c; background: #efefe6;",
            "  padding: 0.5rem 1rem; margin: 1rem 0; page-break-inside: avoid; break-inside: avoid; }",
            "div.caution p.label { font-weight: bold; text-transform: uppercase; letter-spacing: 0.06em; margin: 0 0 0.2rem 0; }",
            "div.caution p { margin: 0.2rem 0; }",
            "pre { background: #f4f4f4; border: 1px solid #c8c8c8; padding: 0.6rem; overflow-x: auto; font-size: 0.85rem;",
            "  font-family: 'DejaVu Sans Mono', Consolas, monospace; white-space: pre-wrap; overflow-wrap: anywhere; }",
            "footer { margin-top: 3rem; font-size: 0.8rem; color: #555; border-top: 1px solid #c8c8c8; padding-top: 0.4rem; }",
            "@media (max-width: 40rem) { body { padding: 0 0.7rem; margin: 1rem auto; font-size: 14px; }",
            "  th, td { padding: 0.2rem 0.35rem; } section#sec-verdict { padding: 0 0.5rem 0.4rem 0.5rem; }",
            "  section#sec-verdict table.kv th { width: 36%; } }",
            "@page { size: A4; margin: 15mm 14mm 18mm 14mm;",
            "  @bottom-right { content: \"page \" counter(page) \" of \" counter(pages); font-size: 9pt; color: #444; } }",
            "@media print { body { max-width: none; margin: 0; padding: 0; font-size: 10pt; } nav.toc { background: none; }",
            "  div.caution { background: none; } h2 { page-break-after: avoid; break-after: avoid; }",
            "  section { break-before: page; } section#sec-verdict { break-before: auto; }",
            "  div.scroll { overflow: visible; } tr, figure, pre { break-inside: avoid; } thead { display: table-header-group; }",
            "  figure img { max-height: 9.5cm; width: auto; } caption { break-after: avoid; }",
            "  a { text-decoration: none; } }");

    /** Renders the whole document. */
    public String render(ReportDocument doc) {
        StringBuilder sb = new StringBuilder(256 * 1024);
        sb.append("<!DOCTYPE html>\n<html lang=\"en\">\n<head>\n<meta charset=\"utf-8\"/>\n")
                .append("<meta name=\"viewport\" content=\"width=device-width, initial-scale=1\"/>\n")
                .append("<title>").append(escape(doc.title())).append("</title>\n")
                .append("<style>\n").append(CSS).append("\n</style>\n</head>\n<body>\n");
        sb.append("<header>\n<h1>").append(escape(doc.title())).append("</h1>\n");
        if (!doc.subtitle().isBlank()) {
            sb.append("<p class=\"subtitle\">").append(escape(doc.subtitle())).append("</p>\n");
        }
        sb.append("</header>\n");
        List<Section> sections = doc.sections();
        // the answer comes before the contents: it is the page a reader opens to
        boolean lead = !sections.isEmpty() && sections.get(0).id().equals(StudyReport.VERDICT);
        int[] counters = new int[2]; // figures, tables
        if (lead) {
            section(sb, sections.get(0), counters);
        }
        if (!sections.isEmpty()) {
            sb.append("<nav class=\"toc\">\n<h2>Contents</h2>\n<ol>\n");
            for (Section s : sections) {
                sb.append("<li><a href=\"#").append(anchor(s)).append("\">").append(escape(s.title())).append("</a></li>\n");
            }
            sb.append("</ol>\n</nav>\n");
        }
        for (int i = lead ? 1 : 0; i < sections.size(); i++) {
            section(sb, sections.get(i), counters);
        }
        sb.append("<footer><p>Produced by fabspread.</p></footer>\n</body>\n</html>\n");
        return sb.toString();
    }

    private static void section(StringBuilder sb, Section s, int[] counters) {
        sb.append("<section id=\"").append(anchor(s)).append("\">\n<h2>").append(escape(s.title())).append("</h2>\n");
        for (Block b : s.blocks()) {
            block(sb, b, counters);
        }
        sb.append("</section>\n");
    }

    /** The fragment id of a section (its id is already restricted to letters, digits, '_' and '-'). */
    static String anchor(Section s) {
        return "sec-" + s.id();
    }

    private static void block(StringBuilder sb, Block b, int[] counters) {
        if (b instanceof Paragraph p) {
            sb.append("<p>").append(escape(p.text())).append("</p>\n");
        } else if (b instanceof Caution c) {
            sb.append("<div class=\"caution\" role=\"note\">\n<p class=\"label\">Caution</p>\n");
            for (String para : c.text().split("\\n\\s*\\n")) {
                sb.append("<p>").append(escape(para.strip())).append("</p>\n");
            }
            sb.append("</div>\n");
        } else if (b instanceof KeyValues kv) {
            sb.append("<div class=\"scroll\">\n<table class=\"kv\">\n<tbody>\n");
            for (KeyValues.Pair pair : kv.pairs()) {
                sb.append("<tr><th scope=\"row\">").append(escape(pair.key())).append("</th><td>")
                        .append(escape(pair.value())).append("</td></tr>\n");
            }
            sb.append("</tbody>\n</table>\n</div>\n");
        } else if (b instanceof Table t) {
            table(sb, t, ++counters[1]);
        } else if (b instanceof Figure f) {
            figure(sb, f, ++counters[0]);
        } else if (b instanceof Preformatted pre) {
            sb.append("<pre>").append(escape(pre.text())).append("</pre>\n");
        } else if (b instanceof BulletList list) {
            sb.append("<ul>\n");
            for (String item : list.items()) {
                sb.append("<li>").append(escape(item)).append("</li>\n");
            }
            sb.append("</ul>\n");
        } else if (b instanceof Links links) {
            sb.append("<ul class=\"files\">\n");
            for (Links.Link l : links.links()) {
                sb.append("<li><a href=\"").append(escape(MarkdownRenderer.urlPath(l.path()))).append("\">")
                        .append(escape(l.path())).append("</a> — ").append(escape(l.description())).append("</li>\n");
            }
            sb.append("</ul>\n");
        } else {
            throw new IllegalStateException("unknown block " + b.getClass());
        }
    }

    private static void table(StringBuilder sb, Table t, int number) {
        List<Table.Align> align = t.alignment();
        sb.append("<div class=\"scroll\">\n<table>\n<caption>Table ").append(number);
        if (!t.caption().isBlank()) {
            sb.append(". ").append(escape(t.caption()));
        }
        sb.append("</caption>\n<thead>\n<tr>");
        for (int c = 0; c < t.header().size(); c++) {
            sb.append("<th scope=\"col\" class=\"").append(alignClass(align.get(c))).append("\">")
                    .append(escape(t.header().get(c))).append("</th>");
        }
        sb.append("</tr>\n</thead>\n<tbody>\n");
        for (List<String> row : t.rows()) {
            sb.append("<tr>");
            for (int c = 0; c < row.size(); c++) {
                sb.append("<td class=\"").append(alignClass(align.get(c))).append("\">").append(escape(row.get(c))).append("</td>");
            }
            sb.append("</tr>\n");
        }
        sb.append("</tbody>\n</table>\n</div>\n");
    }

    private static String alignClass(Table.Align a) {
        return switch (a) {
            case LEFT -> "l";
            case CENTER -> "c";
            case RIGHT -> "r";
        };
    }

    private static void figure(StringBuilder sb, Figure f, int number) {
        Chart c = f.chart();
        sb.append("<figure id=\"fig-").append(c.name()).append("\">\n<img src=\"data:image/png;base64,")
                .append(Base64.getEncoder().encodeToString(c.png())).append("\" width=\"").append(c.width())
                .append("\" height=\"").append(c.height()).append("\" alt=\"").append(escape(c.title()))
                .append("\"/>\n<figcaption>Figure ").append(number).append(". ").append(escape(f.caption()))
                .append(" <a href=\"").append(ReportWriter.CHART_DIR).append('/').append(c.name())
                .append(".svg\">SVG</a> · <a href=\"").append(ReportWriter.CHART_DIR).append('/').append(c.name())
                .append(".png\">PNG</a></figcaption>\n</figure>\n");
    }

    /**
     * Escapes text for HTML element content and quoted attribute values: {@code & < > " '} become
     * entities, characters outside XML 1.0 (controls other than tab, newline and return, lone
     * surrogates, U+FFFE, U+FFFF) become U+FFFD.
     */
    public static String escape(String text) {
        StringBuilder sb = new StringBuilder(text.length() + 16);
        int n = text.length();
        for (int i = 0; i < n; i++) {
            char ch = text.charAt(i);
            switch (ch) {
                case '&' -> sb.append("&amp;");
                case '<' -> sb.append("&lt;");
                case '>' -> sb.append("&gt;");
                case '"' -> sb.append("&quot;");
                case '\'' -> sb.append("&#39;");
                default -> {
                    if (Character.isHighSurrogate(ch) && i + 1 < n && Character.isLowSurrogate(text.charAt(i + 1))) {
                        sb.append(ch).append(text.charAt(++i));
                    } else if (Character.isSurrogate(ch) || ch == '\uFFFE' || ch == '\uFFFF'
                            || (ch < 0x20 && ch != '\t' && ch != '\n' && ch != '\r')) {
                        sb.append('\uFFFD');
                    } else {
                        sb.append(ch);
                    }
                }
            }
        }
        return sb.toString();
    }
}
