package org.fabspread.plan;

import java.util.ArrayList;
import java.util.List;

/**
 * Blocks for a regular two-level design: 2^q blocks are defined by q block generators, interaction
 * columns of the base factorial; every product of them is confounded with blocks. The generators are
 * chosen by exhaustive search so that, where possible, no block effect coincides with a main effect
 * and as few as possible with two-factor interactions, preferring higher-order columns among equals
 * (Montgomery, Design and Analysis of Experiments, blocking and confounding in 2^k designs;
 * Sun, Wu &amp; Chen, Technometrics 39, 298 (1997) for the criterion's ordering).
 *
 * @param generators      block generator columns (masks over the base variables)
 * @param confoundedMain  main effects confounded with blocks (letters); empty when avoided
 * @param confounded2fi   two-factor interactions confounded with blocks (letters)
 * @param confoundedWith  the lowest-order effect confounded with each block effect (letters)
 */
public record Blocking(int[] generators, List<String> confoundedMain, List<String> confounded2fi,
                       List<String> confoundedWith) {

    /** Chooses block generators for 2^q blocks of {@code d}. */
    public static Blocking choose(TwoLevelDesign d, int blocks) {
        if (blocks < 2 || Integer.bitCount(blocks) != 1 || blocks > d.runs() / 2) {
            throw new IllegalArgumentException("a two-level design of " + d.runs() + " runs takes 2, 4, ... up to "
                    + d.runs() / 2 + " blocks, not " + blocks);
        }
        int q = Integer.numberOfTrailingZeros(blocks);
        int n = d.runs();
        int[] cand = new int[n - 1];
        for (int c = 1; c < n; c++) {
            cand[c - 1] = c;
        }
        int[] choice = new int[q];
        long[] best = {Long.MAX_VALUE};
        int[][] bestGen = {null};
        search(d, cand, q, 0, 0, choice, best, bestGen);
        return describe(d, bestGen[0]);
    }

    private static void search(TwoLevelDesign d, int[] cand, int q, int start, int depth, int[] choice, long[] best,
                               int[][] bestGen) {
        if (depth == q) {
            long score = score(d, choice);
            if (score < best[0]) {
                best[0] = score;
                bestGen[0] = choice.clone();
            }
            return;
        }
        for (int i = start; i <= cand.length - (q - depth); i++) {
            choice[depth] = cand[i];
            search(d, cand, q, i + 1, depth + 1, choice, best, bestGen);
        }
    }

    /** Lower is better: main effects confounded, then 2fi confounded, then minus the total order. */
    private static long score(TwoLevelDesign d, int[] gens) {
        int nMain = 0;
        int n2 = 0;
        int order = 0;
        for (int s = 1; s < (1 << gens.length); s++) {
            int c = 0;
            for (int j = 0; j < gens.length; j++) {
                if ((s & (1 << j)) != 0) {
                    c ^= gens[j];
                }
            }
            if (c == 0) {
                return Long.MAX_VALUE;
            }
            int leader = d.chainLeader(c);
            int len = Integer.bitCount(leader);
            if (len == 1) {
                nMain++;
            }
            for (int e : d.chain(c)) {
                if (Integer.bitCount(e) == 2) {
                    n2++;
                }
            }
            order += len;
        }
        return ((long) nMain << 40) + ((long) n2 << 20) + (1000 - order);
    }

    private static Blocking describe(TwoLevelDesign d, int[] gens) {
        List<String> main = new ArrayList<>();
        List<String> two = new ArrayList<>();
        List<String> with = new ArrayList<>();
        for (int s = 1; s < (1 << gens.length); s++) {
            int c = 0;
            for (int j = 0; j < gens.length; j++) {
                if ((s & (1 << j)) != 0) {
                    c ^= gens[j];
                }
            }
            int leader = d.chainLeader(c);
            with.add(EffectNames.word(leader));
            for (int e : d.chain(c)) {
                if (Integer.bitCount(e) == 1) {
                    main.add(EffectNames.word(e));
                } else if (Integer.bitCount(e) == 2) {
                    two.add(EffectNames.word(e));
                }
            }
        }
        return new Blocking(gens, main, two, with);
    }

    /** Block (0-based) of run r of the standard order. */
    public int blockOf(int run) {
        int b = 0;
        for (int j = 0; j < generators.length; j++) {
            int lows = Integer.bitCount(generators[j] & ~run);
            if ((lows & 1) == 0) {
                b |= 1 << j;
            }
        }
        return b;
    }
}
