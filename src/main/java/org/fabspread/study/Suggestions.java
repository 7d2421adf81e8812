package org.fabspread.study;

import java.util.ArrayList;
import java.util.Collection;
import java.util.List;

/** "Did you mean" help for misspelt keys, ids and names (Levenshtein edit distance). */
public final class Suggestions {

    private Suggestions() {
    }

    /**
     * Optimal string alignment distance: Levenshtein's insertions, deletions and substitutions plus
     * transposition of two adjacent characters (Damerau 1964), each costing 1; three-row dynamic programme.
     */
    public static int distance(String a, String b) {
        int[] pp = new int[b.length() + 1];
        int[] prev = new int[b.length() + 1];
        int[] cur = new int[b.length() + 1];
        for (int j = 0; j <= b.length(); j++) {
            prev[j] = j;
        }
        for (int i = 1; i <= a.length(); i++) {
            cur[0] = i;
            for (int j = 1; j <= b.length(); j++) {
                int sub = prev[j - 1] + (a.charAt(i - 1) == b.charAt(j - 1) ? 0 : 1);
                int d = Math.min(sub, Math.min(prev[j] + 1, cur[j - 1] + 1));
                if (i > 1 && j > 1 && a.charAt(i - 1) == b.charAt(j - 2) && a.charAt(i - 2) == b.charAt(j - 1)) {
                    d = Math.min(d, pp[j - 2] + 1);
                }
                cur[j] = d;
            }
            int[] t = pp;
            pp = prev;
            prev = cur;
            cur = t;
        }
        return prev[b.length()];
    }

    /** The nearest candidate when it is close enough to be a plausible typo, else null. */
    static String nearest(String word, Collection<String> candidates) {
        String best = null;
        int bestD = Integer.MAX_VALUE;
        for (String c : candidates) {
            int d = distance(word.toLowerCase(), c.toLowerCase());
            if (d < bestD) {
                bestD = d;
                best = c;
            }
        }
        return best != null && bestD <= Math.max(1, Math.min(word.length(), best.length()) / 3) ? best : null;
    }

    /** "; did you mean 'x'?" or "". */
    static String didYouMean(String word, Collection<String> candidates) {
        String n = nearest(word, candidates);
        return n == null ? "" : "; did you mean '" + n + "'?";
    }

    /**
     * Candidates that look related: sharing the word's first dash-separated token, or within a
     * plausible edit distance of it; at most {@code max}, closest first.
     */
    static List<String> close(String word, Collection<String> candidates, int max) {
        String w = word.toLowerCase();
        String head = w.split("[-_ ]")[0];
        List<String> out = new ArrayList<>();
        candidates.stream()
                .filter(c -> c.toLowerCase().startsWith(head) || c.toLowerCase().contains(w)
                        || distance(w, c.toLowerCase()) <= Math.max(2, c.length() / 3))
                .sorted((x, y) -> Integer.compare(distance(w, x.toLowerCase()), distance(w, y.toLowerCase())))
                .limit(max)
                .forEach(out::add);
        return out;
    }
}
