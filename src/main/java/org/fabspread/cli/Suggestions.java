package org.fabspread.cli;

import java.util.ArrayList;
import java.util.List;

import picocli.CommandLine;

/**
 * Names close to a mistyped command or option, by Levenshtein edit distance (source: V. I. Levenshtein,
 * Soviet Physics Doklady 10, 707 (1966); the dynamic programme of Wagner and Fischer, J. ACM 21, 168 (1974)).
 */
final class Suggestions {

    private Suggestions() {
    }

    /** The subcommands (or, for an option, the options) of {@code c} within two edits or a third of the word. */
    static List<String> near(String word, CommandLine c) {
        List<String> names = new ArrayList<>();
        if (word.startsWith("-")) {
            for (CommandLine.Model.OptionSpec o : c.getCommandSpec().options()) {
                names.addAll(List.of(o.names()));
            }
        } else {
            names.addAll(c.getSubcommands().keySet());
        }
        int limit = Math.max(2, word.length() / 3);
        List<String> out = new ArrayList<>();
        for (int d = 1; d <= limit; d++) {
            for (String n : names) {
                if (distance(word, n) == d && !out.contains(n)) {
                    out.add(n);
                }
            }
        }
        return out;
    }

    /** Levenshtein distance: insertions, deletions and substitutions, each of cost 1. */
    static int distance(String a, String b) {
        int[] prev = new int[b.length() + 1];
        int[] cur = new int[b.length() + 1];
        for (int j = 0; j <= b.length(); j++) {
            prev[j] = j;
        }
        for (int i = 1; i <= a.length(); i++) {
            cur[0] = i;
            for (int j = 1; j <= b.length(); j++) {
                int sub = prev[j - 1] + (a.charAt(i - 1) == b.charAt(j - 1) ? 0 : 1);
                cur[j] = Math.min(sub, Math.min(prev[j] + 1, cur[j - 1] + 1));
            }
            int[] t = prev;
            prev = cur;
            cur = t;
        }
        return prev[b.length()];
    }
}
