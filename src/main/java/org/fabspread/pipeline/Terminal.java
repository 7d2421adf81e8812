package org.fabspread.pipeline;

/** User text made safe for a terminal line: control characters shown escaped, never sent raw. */
public final class Terminal {

    private Terminal() {
    }

    /** {@code s} with every control character (C0, DEL, C1) written as {@code \\u} and four hex digits. */
    public static String printable(String s) {
        if (s == null) {
            return "";
        }
        StringBuilder b = new StringBuilder(s.length());
        for (int i = 0; i < s.length(); i++) {
            char c = s.charAt(i);
            if (Character.isISOControl(c)) {
                b.append(String.format("\\u%04x", (int) c));
            } else {
                b.append(c);
            }
        }
        return b.toString();
    }
}
