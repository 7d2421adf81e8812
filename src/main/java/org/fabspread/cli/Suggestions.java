package org.fabspread.cli;

import java.util.ArrayList;
import java.util.List;

import picocli.CommandLine;

/**
 * Names close to a mistyped command or option, by the edit distance the study reader's suggestions use
 * ({@link org.fabspread.study.Suggestions#distance}: Levenshtein with adjacent transpositions).
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
                if (org.fabspread.study.Suggestions.distance(word, n) == d && !out.contains(n)) {
                    out.add(n);
                }
            }
        }
        return out;
    }
}
