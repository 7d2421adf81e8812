package org.fabspread.study;

/**
 * Text from users and their files made safe to show on a terminal: control characters (terminal
 * escape sequences, line breaks inside a one-line error) written as escapes such as {@code \e},
 * {@code \n} or {@code \u0007}, and excerpts of data files cut to {@link #EXCERPT} characters.
 */
public final class Printable {

    /** Longest excerpt of a data file an error message shows. */
    public static final int EXCERPT = 40;

    private Printable() {
    }

    /** {@code s} with every control character (C0, DEL, C1, line and paragraph separators) escaped. */
    public static String escape(String s) {
        if (s == null) {
            return null;
        }
        StringBuilder b = null;
        for (int i = 0; i < s.length(); i++) {
            char c = s.charAt(i);
            String e = escapeOf(c);
            if (e != null && b == null) {
                b = new StringBuilder(s.length() + 8).append(s, 0, i);
            }
            if (b != null) {
                if (e != null) {
                    b.append(e);
                } else {
                    b.append(c);
                }
            }
        }
        return b == null ? s : b.toString();
    }

    /** A short printable excerpt of text read from a file: escaped, at most {@link #EXCERPT} characters. */
    public static String excerpt(String s) {
        String e = escape(s == null ? "" : s.strip());
        return e.length() <= EXCERPT ? e : e.substring(0, EXCERPT - 1) + "…";
    }

    private static String escapeOf(char c) {
        switch (c) {
            case '\n': return "\\n";
            case '\r': return "\\r";
            case '\t': return "\\t";
            case 0x1b: return "\\e";
            default:
                if (c < 0x20 || c == 0x7f || (c >= 0x80 && c < 0xa0) || c == '\u2028' || c == '\u2029'
                        || c == '\u202e' || c == '\u202d') {
                    return String.format("\\u%04x", (int) c);
                }
                return null;
        }
    }
}
