package org.fabspread.cli;

import java.nio.file.Path;

import org.fabspread.study.Study;

/** The results folder a run uses when none is named: {@code fabspread-out/<study name>}. */
final class DefaultFolder {

    /** The parent of the default results folders. */
    static final String ROOT = "fabspread-out";

    private DefaultFolder() {
    }

    static Path of(Study study) {
        return Path.of(ROOT, name(study.name()));
    }

    /** The study name as a folder name: letters, digits, '.', '_' and '-' kept, anything else '-'. */
    static String name(String studyName) {
        StringBuilder b = new StringBuilder();
        String s = studyName == null ? "" : studyName.strip();
        for (int i = 0; i < s.length() && b.length() < 80; i++) {
            char c = s.charAt(i);
            boolean keep = c < 128 && (Character.isLetterOrDigit(c) || c == '.' || c == '_' || c == '-');
            b.append(keep ? c : '-');
        }
        String n = b.toString().replaceAll("-{2,}", "-").replaceAll("^[-.]+|-+$", "");
        return n.isEmpty() ? "study" : n;
    }
}
