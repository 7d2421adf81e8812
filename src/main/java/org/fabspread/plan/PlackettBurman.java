package org.fabspread.plan;

/**
 * Plackett–Burman two-level screening designs (Biometrika 33, 305 (1946)) of 12, 20 and 24 runs:
 * the first row is published; rows 2 … N − 1 are its cyclic shifts (each row the previous one moved
 * one place to the right) and the last row is all minus. The N − 1 columns are balanced and mutually
 * orthogonal; two-factor interactions are partially aliased with main effects (no defining relation).
 */
public final class PlackettBurman {

    /** Supported run sizes. */
    public static final int[] RUN_SIZES = {12, 20, 24};

    private static final String ROW12 = "++-+++---+-";
    private static final String ROW20 = "++--++++-+-+----++-";
    private static final String ROW24 = "+++++-+-++--++--+-+----";

    private PlackettBurman() {
    }

    /** The published first row of the N-run design. */
    public static String firstRow(int runs) {
        return switch (runs) {
            case 12 -> ROW12;
            case 20 -> ROW20;
            case 24 -> ROW24;
            default -> throw new IllegalArgumentException("Plackett-Burman designs here have 12, 20 or 24 runs, not " + runs);
        };
    }

    /** The full N × (N − 1) matrix of ±1. */
    public static int[][] matrix(int runs) {
        String first = firstRow(runs);
        int m = runs - 1;
        int[][] x = new int[runs][m];
        for (int r = 0; r < m; r++) {
            for (int c = 0; c < m; c++) {
                char s = first.charAt(Math.floorMod(c - r, m));
                x[r][c] = s == '+' ? 1 : -1;
            }
        }
        for (int c = 0; c < m; c++) {
            x[m][c] = -1;
        }
        return x;
    }

    /** The smallest supported run size with room for k factors, or -1. */
    public static int runsFor(int k) {
        for (int n : RUN_SIZES) {
            if (n - 1 >= k) {
                return n;
            }
        }
        return -1;
    }
}
