package org.fabspread.plan;

import java.util.ArrayList;
import java.util.List;

/**
 * One term of a polynomial model in coded factors: a main effect x_i, an interaction x_i x_j, or a
 * square x_i². Its "effect" is the change of the response when the term's column goes from −1 to +1
 * (twice the regression coefficient) for main effects and interactions, and the coefficient itself for
 * a square (the rise from the centre to ±1 beyond the linear part).
 *
 * @param label   letters, e.g. {@code A}, {@code AB}, {@code A^2}
 * @param factors the factor indices (one or two)
 * @param square  true for x_i²
 */
public record Term(String label, int[] factors, boolean square) {

    public double value(double[] x) {
        if (square) {
            return x[factors[0]] * x[factors[0]];
        }
        double v = 1;
        for (int f : factors) {
            v *= x[f];
        }
        return v;
    }

    /** The name with factor ids, e.g. {@code stack.etl.thickness x particles.coverage}. */
    public String named(List<String> ids) {
        if (square) {
            return ids.get(factors[0]) + "^2";
        }
        StringBuilder b = new StringBuilder();
        for (int f : factors) {
            if (b.length() > 0) {
                b.append(" x ");
            }
            b.append(ids.get(f));
        }
        return b.toString();
    }

    public boolean isMain() {
        return !square && factors.length == 1;
    }

    public boolean isInteraction() {
        return !square && factors.length == 2;
    }

    public static Term main(int i) {
        return new Term(String.valueOf(EffectNames.letter(i)), new int[]{i}, false);
    }

    public static Term interaction(int i, int j) {
        return new Term("" + EffectNames.letter(i) + EffectNames.letter(j), new int[]{i, j}, false);
    }

    public static Term square(int i) {
        return new Term(EffectNames.letter(i) + "^2", new int[]{i}, true);
    }

    /**
     * The terms a design can estimate: main effects; for a full factorial or resolution ≥ V fraction
     * all two-factor interactions, for resolution IV the clear ones; for central composite and
     * Box–Behnken designs all interactions and squares; for Plackett–Burman main effects only.
     */
    public static List<Term> estimable(CodedDesign d) {
        int k = d.factors();
        List<Term> t = new ArrayList<>();
        for (int i = 0; i < k; i++) {
            t.add(main(i));
        }
        switch (d.kind()) {
            case FULL_FACTORIAL, FRACTIONAL -> {
                TwoLevelDesign r = d.regular();
                if (r.resolution() >= 5) {
                    addAllInteractions(t, k);
                } else {
                    for (int e : r.clearTwoFactorInteractions()) {
                        int i = Integer.numberOfTrailingZeros(e);
                        int j = 31 - Integer.numberOfLeadingZeros(e);
                        t.add(interaction(i, j));
                    }
                }
            }
            case CENTRAL_COMPOSITE, BOX_BEHNKEN -> {
                addAllInteractions(t, k);
                for (int i = 0; i < k; i++) {
                    t.add(square(i));
                }
            }
            default -> {
            }
        }
        return t;
    }

    private static void addAllInteractions(List<Term> t, int k) {
        for (int i = 0; i < k; i++) {
            for (int j = i + 1; j < k; j++) {
                t.add(interaction(i, j));
            }
        }
    }
}
