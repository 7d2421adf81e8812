package org.fabspread.dda;

/**
 * Interpolation nodes and weights: Chebyshev points of the first kind and barycentric Lagrange
 * interpolation (Berrut &amp; Trefethen, SIAM Review 46, 501 (2004)), w_j = 1/Π_{k≠j}(x_j − x_k).
 */
public final class Nodes {
    private Nodes() {
    }

    /** n Chebyshev points of the first kind on [lo, hi], increasing: x_i = c − h cos((2i+1)π/(2n)). */
    public static double[] chebyshev(double lo, double hi, int n) {
        if (n < 1 || !(hi >= lo)) {
            throw new IllegalArgumentException("need n >= 1 nodes on a range lo <= hi");
        }
        double[] x = new double[n];
        if (n == 1) {
            x[0] = 0.5 * (lo + hi);
            return x;
        }
        if (hi == lo) {
            throw new IllegalArgumentException("a range of zero width holds only one node");
        }
        for (int i = 0; i < n; i++) {
            x[i] = 0.5 * (lo + hi) - 0.5 * (hi - lo) * Math.cos((2 * i + 1) * Math.PI / (2 * n));
        }
        return x;
    }

    /** Barycentric weights of the nodes, skipping node {@code skip} (−1: none). */
    static double[] weights(double[] x, int skip) {
        double[] w = new double[x.length];
        for (int j = 0; j < x.length; j++) {
            if (j == skip) {
                continue;
            }
            double p = 1;
            for (int k = 0; k < x.length; k++) {
                if (k != j && k != skip) {
                    p *= x[j] - x[k];
                }
            }
            w[j] = 1 / p;
        }
        return w;
    }

    /**
     * Lagrange basis values ℓ_j(t) from barycentric weights w (entries of skipped nodes 0), into out.
     * Exact at a node.
     */
    static void basis(double[] x, double[] w, int skip, double t, double[] out) {
        double sum = 0;
        for (int j = 0; j < x.length; j++) {
            if (j == skip) {
                out[j] = 0;
                continue;
            }
            double d = t - x[j];
            if (d == 0) {
                java.util.Arrays.fill(out, 0, x.length, 0);
                out[j] = 1;
                return;
            }
            out[j] = w[j] / d;
            sum += out[j];
        }
        for (int j = 0; j < x.length; j++) {
            out[j] /= sum;
        }
    }
}
