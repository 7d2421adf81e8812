package org.fabspread.plan;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.Optional;

/**
 * Minimum-aberration 2^(k−p) fractions for k ≤ 11 factors in 8, 16, 32, 64 and 128 runs, with the
 * generators of the published tables (NIST/SEMATECH e-Handbook of Statistical Methods, section
 * 5.3.3.4.7; Montgomery, Design and Analysis of Experiments, table of 2^(k−p) designs; the
 * minimum-aberration catalogue of Chen, Sun &amp; Wu, Int. Stat. Rev. 61, 131 (1993)), and an
 * exhaustive search over all regular fractions of a given size (every choice of p interaction
 * columns of the base factorial as generators) that finds the minimum word-length pattern, or the
 * best design keeping named two-factor interactions clear (minimum aberration is not the same as the
 * most clear interactions: Wu &amp; Hamada, Experiments, 2nd ed., ch. 5).
 */
public final class MinimumAberrationCatalog {

    /** Run sizes covered by the table. */
    public static final int[] RUN_SIZES = {8, 16, 32, 64, 128};

    /** Largest k covered by the table. */
    public static final int MAX_FACTORS = 11;

    private static final String[][][] TABLE = new String[129][][];

    static {
        TABLE[8] = new String[][]{
                {"D=ABC"},
                {"D=AB", "E=AC"},
                {"D=AB", "E=AC", "F=BC"},
                {"D=AB", "E=AC", "F=BC", "G=ABC"},
        };
        TABLE[16] = new String[][]{
                {"E=ABCD"},
                {"E=ABC", "F=BCD"},
                {"E=ABC", "F=BCD", "G=ACD"},
                {"E=BCD", "F=ACD", "G=ABC", "H=ABD"},
                {"E=ABC", "F=BCD", "G=ACD", "H=ABD", "J=ABCD"},
                {"E=ABC", "F=BCD", "G=ACD", "H=ABD", "J=ABCD", "K=AB"},
                {"E=ABC", "F=BCD", "G=ACD", "H=ABD", "J=ABCD", "K=AB", "L=AC"},
        };
        TABLE[32] = new String[][]{
                {"F=ABCDE"},
                {"F=ABCD", "G=ABDE"},
                {"F=ABC", "G=ABD", "H=BCDE"},
                {"F=ABCD", "G=ABCE", "H=ABDE", "J=ACDE"},
                {"F=ABCD", "G=ABCE", "H=ABDE", "J=ACDE", "K=BCDE"},
                {"F=ABC", "G=BCD", "H=CDE", "J=ACD", "K=ADE", "L=BDE"},
        };
        TABLE[64] = new String[][]{
                {"G=ABCDEF"},
                {"G=ABCD", "H=ABEF"},
                {"G=ABCD", "H=ACEF", "J=CDEF"},
                {"G=BCDF", "H=ACDF", "J=ABDE", "K=ABCE"},
                {"G=CDE", "H=ABCD", "J=ABF", "K=BDEF", "L=ADEF"},
        };
        TABLE[128] = new String[][]{
                {"H=ABCDEFG"},
                {"H=ACEFG", "J=BCDEG"},
                {"H=ABCG", "J=BCDE", "K=ACDF"},
                {"H=ABCG", "J=BCDE", "K=ACDF", "L=ABCDEFG"},
        };
    }

    private MinimumAberrationCatalog() {
    }

    /** True when the table holds a fraction (or the full factorial) of k factors in this many runs. */
    public static boolean covers(int k, int runs) {
        int b = log2(runs);
        if (b < 0 || k < 1 || k > MAX_FACTORS) {
            return false;
        }
        if (k == b) {
            return true;
        }
        return runs >= 8 && runs <= 128 && k > b && k - b - 1 < TABLE[runs].length;
    }

    /** The generators from the table, letters (empty for a full factorial). */
    public static List<String> generators(int k, int runs) {
        if (!covers(k, runs)) {
            throw new IllegalArgumentException("no tabled 2-level design of " + k + " factors in " + runs + " runs");
        }
        int b = log2(runs);
        return k == b ? List.of() : List.of(TABLE[runs][k - b - 1]);
    }

    /** The tabled design of k factors in this many runs. */
    public static TwoLevelDesign design(int k, int runs) {
        int b = log2(runs);
        if (k == b) {
            return TwoLevelDesign.full(k);
        }
        return TwoLevelDesign.fromGenerators(k, generators(k, runs).toArray(String[]::new));
    }

    /** The smallest tabled run size holding k factors at the wanted resolution, if any. */
    public static Optional<TwoLevelDesign> smallest(int k, int minResolution) {
        for (int runs = 2; runs <= 2048; runs *= 2) {
            int b = log2(runs);
            if (b > k) {
                break;
            }
            if (k == b) {
                return Optional.of(TwoLevelDesign.full(k));
            }
            if (covers(k, runs)) {
                TwoLevelDesign d = design(k, runs);
                if (d.resolution() >= minResolution) {
                    return Optional.of(d);
                }
            }
        }
        return Optional.empty();
    }

    static int log2(int runs) {
        if (runs < 2 || Integer.bitCount(runs) != 1) {
            return -1;
        }
        return Integer.numberOfTrailingZeros(runs);
    }

    /** Lexicographic comparison of word-length patterns from length 1 up. */
    public static int compareAberration(int[] a, int[] b) {
        int n = Math.max(a.length, b.length);
        for (int i = 1; i < n; i++) {
            int x = i < a.length ? a[i] : 0;
            int y = i < b.length ? b[i] : 0;
            if (x != y) {
                return Integer.compare(x, y);
            }
        }
        return 0;
    }

    /**
     * Searches every regular 2^(k−p) fraction in {@code runs} runs (every set of p distinct
     * interaction columns of the base factorial as generators) for the minimum word-length pattern,
     * pruning a branch as soon as its partial pattern is already worse than the best. Exhaustive, so
     * the result has minimum aberration by definition.
     */
    public static TwoLevelDesign searchMinimumAberration(int k, int runs) {
        return search(k, runs, 0, List.of(), Integer.MAX_VALUE).orElseThrow();
    }

    /**
     * The minimum-aberration design among those of at least {@code minResolution} in which every
     * named two-factor interaction (factor index pairs) is clear, relabelling factors where needed.
     * Designs are visited up to {@code budget} generator sets (the search is exhaustive for up to 32
     * runs); empty when none qualifies.
     */
    public static Optional<TwoLevelDesign> searchWithClear(int k, int runs, int minResolution,
                                                           List<int[]> mustBeClear, long budget) {
        return search(k, runs, minResolution, mustBeClear, budget);
    }

    /** The design of this size with the most clear two-factor interactions among resolution ≥ minResolution. */
    public static TwoLevelDesign searchMostClearInteractions(int k, int runs, int minResolution) {
        int b = log2(runs);
        int p = k - b;
        int[] cols = interactionColumns(b);
        int[] choice = new int[p];
        TwoLevelDesign[] best = {null};
        int[] bestClear = {-1};
        combinations(cols.length, p, 0, 0, choice, c -> {
            int[] g = new int[p];
            for (int j = 0; j < p; j++) {
                g[j] = cols[c[j]];
            }
            TwoLevelDesign d = TwoLevelDesign.fromGenerators(k, g);
            if (d.resolution() >= minResolution) {
                int n = d.clearTwoFactorInteractions().size();
                if (n > bestClear[0] || (n == bestClear[0]
                        && compareAberration(d.wordLengthPattern(), best[0].wordLengthPattern()) < 0)) {
                    bestClear[0] = n;
                    best[0] = d;
                }
            }
        });
        if (best[0] == null) {
            throw new IllegalArgumentException("no design of resolution " + minResolution + " with " + k
                    + " factors in " + runs + " runs");
        }
        return best[0];
    }

    private static Optional<TwoLevelDesign> search(int k, int runs, int minResolution, List<int[]> mustBeClear,
                                                   long budget) {
        int b = log2(runs);
        if (b < 0 || b > k) {
            throw new IllegalArgumentException("bad run size " + runs + " for " + k + " factors");
        }
        if (b == k) {
            TwoLevelDesign full = TwoLevelDesign.full(k);
            return Optional.of(full);
        }
        int p = k - b;
        int[] cols = interactionColumns(b);
        if (cols.length < p) {
            return Optional.empty();
        }
        Search s = new Search(k, b, p, cols, minResolution, mustBeClear, budget);
        s.run(0, 0);
        return Optional.ofNullable(s.best);
    }

    /** Non-zero masks over b base variables of weight ≥ 2, ordered by weight then value. */
    static int[] interactionColumns(int b) {
        List<Integer> out = new ArrayList<>();
        for (int w = 2; w <= b; w++) {
            for (int m = 1; m < (1 << b); m++) {
                if (Integer.bitCount(m) == w) {
                    out.add(m);
                }
            }
        }
        return out.stream().mapToInt(Integer::intValue).toArray();
    }

    private interface ChoiceConsumer {
        void accept(int[] choice);
    }

    private static void combinations(int n, int r, int start, int depth, int[] choice, ChoiceConsumer c) {
        if (depth == r) {
            c.accept(choice);
            return;
        }
        for (int i = start; i <= n - (r - depth); i++) {
            choice[depth] = i;
            combinations(n, r, i + 1, depth + 1, choice, c);
        }
    }

    /** Depth-first search over generator sets with the words of each partial set kept incrementally. */
    private static final class Search {
        final int k;
        final int b;
        final int p;
        final int[] cols;
        final int minResolution;
        final List<int[]> mustBeClear;
        final long budget;
        final int[] words;
        final int[] gens;
        final int[] wlp;
        int[] bestWlp;
        TwoLevelDesign best;
        long visited;

        Search(int k, int b, int p, int[] cols, int minResolution, List<int[]> mustBeClear, long budget) {
            this.k = k;
            this.b = b;
            this.p = p;
            this.cols = cols;
            this.minResolution = minResolution;
            this.mustBeClear = mustBeClear;
            this.budget = budget;
            this.words = new int[1 << p];
            this.gens = new int[p];
            this.wlp = new int[k + 1];
        }

        void run(int depth, int start) {
            if (visited >= budget) {
                return;
            }
            if (depth == p) {
                visited++;
                accept();
                return;
            }
            int nWords = 1 << depth;
            for (int i = start; i <= cols.length - (p - depth); i++) {
                int g = cols[i] | (1 << (b + depth));
                // new words: g times every existing word (including the identity at index 0)
                boolean ok = true;
                for (int w = 0; w < nWords; w++) {
                    int nw = words[w] ^ g;
                    words[nWords + w] = nw;
                    int len = Integer.bitCount(nw);
                    wlp[len]++;
                    if (len < minResolution) {
                        ok = false;
                    }
                }
                if (ok && (bestWlp == null || compareAberration(wlp, bestWlp) <= 0)) {
                    gens[depth] = cols[i];
                    run(depth + 1, i + 1);
                }
                for (int w = 0; w < nWords; w++) {
                    wlp[Integer.bitCount(words[nWords + w])]--;
                }
            }
        }

        private void accept() {
            if (bestWlp != null && compareAberration(wlp, bestWlp) >= 0) {
                return;
            }
            TwoLevelDesign d = TwoLevelDesign.fromGenerators(k, gens.clone());
            if (!mustBeClear.isEmpty()) {
                d = relabelToClear(d, mustBeClear);
                if (d == null) {
                    return;
                }
            }
            best = d;
            bestWlp = wlp.clone();
        }
    }

    /**
     * Relabels the factors of {@code d} so that each named pair is a clear two-factor interaction,
     * by backtracking over assignments of named factors to design factors; null when impossible.
     */
    static TwoLevelDesign relabelToClear(TwoLevelDesign d, List<int[]> pairs) {
        int k = d.factors();
        boolean[][] clear = new boolean[k][k];
        for (int e : d.clearTwoFactorInteractions()) {
            int i = Integer.numberOfTrailingZeros(e);
            int j = 31 - Integer.numberOfLeadingZeros(e);
            clear[i][j] = true;
            clear[j][i] = true;
        }
        int[] assign = new int[k];
        Arrays.fill(assign, -1);
        boolean[] used = new boolean[k];
        if (!assign(0, k, pairs, clear, assign, used)) {
            return null;
        }
        // assign[named factor] = design factor; the relabelling maps design factor -> named factor
        int[] perm = new int[k];
        for (int f = 0; f < k; f++) {
            perm[assign[f]] = f;
        }
        return d.permute(perm);
    }

    private static boolean assign(int f, int k, List<int[]> pairs, boolean[][] clear, int[] assign, boolean[] used) {
        if (f == k) {
            return true;
        }
        for (int c = 0; c < k; c++) {
            if (used[c]) {
                continue;
            }
            boolean ok = true;
            for (int[] pr : pairs) {
                int other = pr[0] == f ? pr[1] : pr[1] == f ? pr[0] : -1;
                if (other >= 0 && other < f && !clear[c][assign[other]]) {
                    ok = false;
                    break;
                }
            }
            if (ok) {
                used[c] = true;
                assign[f] = c;
                if (assign(f + 1, k, pairs, clear, assign, used)) {
                    return true;
                }
                used[c] = false;
                assign[f] = -1;
            }
        }
        return false;
    }
}
