package org.fabspread.report;

import java.util.List;

/**
 * Renders a {@link ReportDocument} as a GitHub-flavoured Markdown summary: tables as pipe tables,
 * figures as images referenced by relative file name ({@code charts/<name>.png}, as
 * {@link ReportWriter} writes them), cautions as block quotes, preformatted text in fences. User
 * strings are escaped so that they show literally: Markdown punctuation and {@code |}, {@code <},
 * {@code &} take a backslash, and line-start markers (headings, lists, quotes) are neutralised.
 */
public final class MarkdownRenderer {

    /** Characters that take a backslash anywhere in a line (all are ASCII punctuation, which GFM lets escape). */
    private static final String ALWAYS = "\\`*_[]<>|#~!&$";

    /** Renders the whole document. */
    public String render(ReportDocument doc) {
        StringBuilder sb = new StringBuilder(16 * 1024);
        sb.append("# ").append(inline(doc.title())).append("\n\n");
        if (!doc.subtitle().isBlank()) {
            sb.append('*').append(inline(doc.subtitle())).append("*\n\n");
        }
        if (!doc.sections().isEmpty()) {
            sb.append("Contents:\n\n");
            int k = 1;
            for (Section s : doc.sections()) {
                sb.append(k++).append(". ").append(inline(s.title())).append('\n');
            }
            sb.append('\n');
        }
        int figures = 0;
        int tables = 0;
        for (Section s : doc.sections()) {
            sb.append("## ").append(inline(s.title())).append("\n\n");
            for (Block b : s.blocks()) {
                if (b instanceof Paragraph p) {
                    sb.append(text(p.text())).append("\n\n");
                } else if (b instanceof Caution c) {
                    String body = text(c.text());
                    sb.append("> **Caution:** ").append(body.replace("\n", "\n> ")).append("\n\n");
                } else if (b instanceof KeyValues kv) {
                    sb.append("| Item | Value |\n|:---|:---|\n");
                    for (KeyValues.Pair pair : kv.pairs()) {
                        sb.append("| ").append(cell(pair.key())).append(" | ").append(cell(pair.value())).append(" |\n");
                    }
                    sb.append('\n');
                } else if (b instanceof Table t) {
                    table(sb, t, ++tables);
                } else if (b instanceof Figure f) {
                    figures++;
                    sb.append("![").append(inline(f.chart().title())).append("](").append(imagePath(f.chart()))
                            .append(")\n\n*Figure ").append(figures).append(". ").append(inline(f.caption())).append("*\n\n");
                } else if (b instanceof Preformatted pre) {
                    String fence = fence(pre.text());
                    sb.append(fence).append("text\n").append(pre.text());
                    if (!pre.text().endsWith("\n")) {
                        sb.append('\n');
                    }
                    sb.append(fence).append("\n\n");
                } else if (b instanceof BulletList list) {
                    for (String item : list.items()) {
                        sb.append("- ").append(inline(item)).append('\n');
                    }
                    sb.append('\n');
                } else if (b instanceof Links links) {
                    for (Links.Link l : links.links()) {
                        sb.append("- [").append(inline(l.path())).append("](").append(urlPath(l.path())).append(") — ")
                                .append(inline(l.description())).append('\n');
                    }
                    sb.append('\n');
                } else {
                    throw new IllegalStateException("unknown block " + b.getClass());
                }
            }
        }
        return sb.toString();
    }

    /** A relative path as a link target: characters other than letters, digits and {@code / . _ -} percent-encoded. */
    static String urlPath(String path) {
        StringBuilder sb = new StringBuilder();
        for (byte x : path.getBytes(java.nio.charset.StandardCharsets.UTF_8)) {
            char ch = (char) (x & 0xff);
            if ((ch >= 'a' && ch <= 'z') || (ch >= 'A' && ch <= 'Z') || (ch >= '0' && ch <= '9') || "/._-".indexOf(ch) >= 0) {
                sb.append(ch);
            } else {
                sb.append('%').append(String.format(java.util.Locale.ROOT, "%02X", x & 0xff));
            }
        }
        return sb.toString();
    }

    /** The relative path of a chart's PNG as {@link ReportWriter} writes it. */
    public static String imagePath(Chart chart) {
        return ReportWriter.CHART_DIR + "/" + chart.name() + ".png";
    }

    private static void table(StringBuilder sb, Table t, int number) {
        sb.append("**Table ").append(number);
        if (!t.caption().isBlank()) {
            sb.append(". ").append(inline(t.caption()));
        }
        sb.append("**\n\n|");
        for (String h : t.header()) {
            sb.append(' ').append(cell(h)).append(" |");
        }
        sb.append("\n|");
        for (Table.Align a : t.alignment()) {
            sb.append(switch (a) {
                case LEFT -> ":---";
                case CENTER -> ":---:";
                case RIGHT -> "---:";
            }).append('|');
        }
        sb.append('\n');
        for (List<String> row : t.rows()) {
            sb.append('|');
            for (String c : row) {
                sb.append(' ').append(cell(c)).append(" |");
            }
            sb.append('\n');
        }
        sb.append('\n');
    }

    /** A table cell: one line, every special character escaped, {@code |} included. */
    static String cell(String s) {
        String one = s.replace("\r\n", " ").replace('\n', ' ').replace('\r', ' ');
        String esc = inline(one);
        return esc.isBlank() ? " " : esc;
    }

    /** Text that stays on one line (headings, list items, captions): escaped, line breaks to spaces. */
    static String inline(String s) {
        return text(s.replace("\r\n", " ").replace('\n', ' ').replace('\r', ' '));
    }

    /**
     * Escapes plain text for Markdown: a backslash before Markdown punctuation anywhere, and before a
     * line-start marker (heading, list item, numbered item, quote, rule) at the start of each line.
     */
    public static String text(String s) {
        StringBuilder sb = new StringBuilder(s.length() + 16);
        boolean lineStart = true;
        for (int i = 0; i < s.length(); i++) {
            char ch = s.charAt(i);
            if (ch == '\r') {
                continue;
            }
            if (ch == '\n') {
                sb.append('\n');
                lineStart = true;
                continue;
            }
            if (lineStart) {
                if (ch == ' ' || ch == '\t') {
                    continue; // leading blanks would start a code block
                }
                if (ch == '-' || ch == '+' || ch == '=') {
                    sb.append('\\');
                } else if (Character.isDigit(ch)) {
                    int j = i;
                    while (j < s.length() && Character.isDigit(s.charAt(j))) {
                        j++;
                    }
                    if (j < s.length() && (s.charAt(j) == '.' || s.charAt(j) == ')')) {
                        sb.append(s, i, j).append('\\').append(s.charAt(j));
                        i = j;
                        lineStart = false;
                        continue;
                    }
                }
                lineStart = false;
            }
            if (ALWAYS.indexOf(ch) >= 0) {
                sb.append('\\');
            }
            sb.append(ch);
        }
        return sb.toString();
    }

    /** A backtick fence longer than any run of backticks in the text. */
    private static String fence(String text) {
        int longest = 0;
        int run = 0;
        for (int i = 0; i < text.length(); i++) {
            run = text.charAt(i) == '`' ? run + 1 : 0;
            longest = Math.max(longest, run);
        }
        return "`".repeat(Math.max(3, longest + 1));
    }
}
