package org.fabspread.dda;

/**
 * Discrete-dipole results tabulated on a tensor grid of the shape's varying parameters and a wavelength
 * grid, for the two in-plane polarisations (field along x, then y; light along +z). Between parameter nodes
 * the table interpolates by barycentric Lagrange interpolation in each parameter (Berrut &amp; Trefethen,
 * SIAM Review 46, 501 (2004)) — on Chebyshev nodes it converges fast for smooth responses — and
 * {@link #resample} moves it to another wavelength grid by local cubic Lagrange interpolation, once.
 *
 * <p>Immutable. Reading: {@link #weights} (per sample, into caller scratch) then {@link #value} (per
 * wavelength); both allocation-free.
 */
public final class ShapeTable {
    /** Polarisation slot: field along x. */
    public static final int POL_X = 0;
    /** Polarisation slot: field along y. */
    public static final int POL_Y = 1;

    private final double[][] nodes;
    private final double[][] bary;
    private final double[] wavelengths;
    private final int nodeCount;
    private final double[] data;

    ShapeTable(double[][] nodes, double[] wavelengths, double[] data) {
        this.nodes = new double[nodes.length][];
        this.bary = new double[nodes.length][];
        for (int d = 0; d < nodes.length; d++) {
            this.nodes[d] = nodes[d].clone();
            this.bary[d] = Nodes.weights(nodes[d], -1);
        }
        this.wavelengths = wavelengths.clone();
        int c = 1;
        for (double[] x : nodes) {
            c *= x.length;
        }
        nodeCount = c;
        if (data.length != Quantity.COUNT * 2 * nodeCount * wavelengths.length) {
            throw new IllegalArgumentException("table data has the wrong length");
        }
        this.data = data;
    }

    static int slot(Quantity q, int pol, int node, int w, int nodes, int nw) {
        return ((q.ordinal() * 2 + pol) * nodes + node) * nw + w;
    }

    public int dimensions() {
        return nodes.length;
    }

    public double[] nodes(int dim) {
        return nodes[dim].clone();
    }

    public int nodeCount() {
        return nodeCount;
    }

    public double[] wavelengths() {
        return wavelengths.clone();
    }

    public int wavelengthCount() {
        return wavelengths.length;
    }

    /** The stored value at a grid node. */
    public double at(Quantity q, int pol, int node, int w) {
        return data[slot(q, pol, node, w, nodeCount, wavelengths.length)];
    }

    /** Scratch size for {@link #weights}: nodeCount + Σ nodes per dimension. */
    public int scratchSize() {
        int s = nodeCount;
        for (double[] x : nodes) {
            s += x.length;
        }
        return s;
    }

    /**
     * Tensor-product interpolation weights of the grid nodes at the parameter values v, written to
     * {@code out[0 … nodeCount)}; {@code out} must hold {@link #scratchSize()} values.
     */
    public void weights(double[] v, double[] out) {
        int off = nodeCount;
        for (int d = 0; d < nodes.length; d++) {
            tmp(out, off, d, v[d]);
            off += nodes[d].length;
        }
        for (int node = 0; node < nodeCount; node++) {
            double w = 1;
            int rest = node;
            int o = nodeCount;
            for (int d = 0; d < nodes.length; d++) {
                int len = nodes[d].length;
                w *= out[o + rest % len];
                rest /= len;
                o += len;
            }
            out[node] = w;
        }
    }

    private void tmp(double[] out, int off, int d, double t) {
        double[] x = nodes[d];
        double[] w = bary[d];
        double sum = 0;
        for (int j = 0; j < x.length; j++) {
            double diff = t - x[j];
            if (diff == 0 || x.length == 1) {
                for (int k = 0; k < x.length; k++) {
                    out[off + k] = k == j ? 1 : 0;
                }
                return;
            }
            out[off + j] = w[j] / diff;
            sum += out[off + j];
        }
        for (int j = 0; j < x.length; j++) {
            out[off + j] /= sum;
        }
    }

    /** Interpolated value at wavelength index w for node weights from {@link #weights}. */
    public double value(Quantity q, int pol, int w, double[] weights) {
        int nw = wavelengths.length;
        int base = slot(q, pol, 0, w, nodeCount, nw);
        double s = 0;
        for (int node = 0; node < nodeCount; node++) {
            s += weights[node] * data[base + node * nw];
        }
        return s;
    }

    /**
     * The same table on another wavelength grid inside this one's range: each value by cubic Lagrange
     * interpolation through the four nearest tabulated wavelengths (linear with two).
     */
    public ShapeTable resample(double[] grid) {
        int nw = wavelengths.length;
        double[] out = new double[Quantity.COUNT * 2 * nodeCount * grid.length];
        double[] coef = new double[4];
        for (int g = 0; g < grid.length; g++) {
            double t = grid[g];
            if (t < wavelengths[0] - 1e-9 || t > wavelengths[nw - 1] + 1e-9) {
                throw new IllegalArgumentException("wavelength " + t + " nm lies outside the table's "
                        + wavelengths[0] + "-" + wavelengths[nw - 1] + " nm");
            }
            int first = stencil(wavelengths, t, -1);
            int count = Math.min(4, nw);
            lagrange(wavelengths, first, count, -1, t, coef);
            for (int q = 0; q < Quantity.COUNT; q++) {
                for (int pol = 0; pol < 2; pol++) {
                    for (int node = 0; node < nodeCount; node++) {
                        int base = ((q * 2 + pol) * nodeCount + node) * nw;
                        double s = 0;
                        for (int k = 0; k < count; k++) {
                            s += coef[k] * data[base + first + k];
                        }
                        out[((q * 2 + pol) * nodeCount + node) * grid.length + g] = s;
                    }
                }
            }
        }
        return new ShapeTable(nodes, grid, out);
    }

    /** First index of the (up to) four-point stencil around t, avoiding index {@code skip}. */
    static int stencil(double[] x, double t, int skip) {
        int n = x.length;
        int count = Math.min(4, n - (skip >= 0 ? 1 : 0));
        int i = java.util.Arrays.binarySearch(x, t);
        int hi = i >= 0 ? i : -i - 1;
        int first = Math.max(0, Math.min(hi - 2, n - count - (skip >= 0 ? 1 : 0)));
        return Math.max(0, first);
    }

    /**
     * Lagrange coefficients of {@code count} points starting at {@code first} (skipping index {@code skip},
     * which then adds one point to the span) for the value at t.
     */
    static void lagrange(double[] x, int first, int count, int skip, double t, double[] coef) {
        int[] idx = new int[4];
        int m = 0;
        for (int i = first; m < count && i < x.length; i++) {
            if (i != skip) {
                idx[m++] = i;
            }
        }
        for (int a = 0; a < m; a++) {
            double c = 1;
            for (int b = 0; b < m; b++) {
                if (b != a) {
                    c *= (t - x[idx[b]]) / (x[idx[a]] - x[idx[b]]);
                }
            }
            coef[a] = c;
        }
    }

    double[] data() {
        return data;
    }
}
