package org.fabspread.dda;

/**
 * Leave-one-out estimate of a {@link ShapeTable}'s interpolation error in C_ext: each interior node of a
 * parameter (then each interior wavelength) is dropped and predicted from the others by the table's own
 * interpolation (one node fewer, so the estimate errs on the high side), relative to the largest |C_ext|
 * of that polarisation. Leave-one-out cross-validation of interpolants: common practice (e.g. Rippa,
 * Adv. Comput. Math. 11, 193 (1999)).
 *
 * @param parameter  largest relative error per varying parameter (NaN when it has fewer than 3 nodes)
 * @param wavelength largest relative error of the wavelength interpolation (NaN with fewer than 5 wavelengths)
 */
public record InterpolationError(double[] parameter, double wavelength) {

    public InterpolationError {
        parameter = parameter.clone();
    }

    @Override
    public double[] parameter() {
        return parameter.clone();
    }

    /** The largest of all the estimates (NaN when none could be made). */
    public double worst() {
        double w = wavelength;
        for (double p : parameter) {
            if (!Double.isNaN(p) && (Double.isNaN(w) || p > w)) {
                w = p;
            }
        }
        return w;
    }

    public static InterpolationError estimate(ShapeTable t) {
        int dims = t.dimensions();
        int nodes = t.nodeCount();
        int nw = t.wavelengthCount();
        double[] scale = new double[2];
        for (int pol = 0; pol < 2; pol++) {
            for (int node = 0; node < nodes; node++) {
                for (int w = 0; w < nw; w++) {
                    scale[pol] = Math.max(scale[pol], Math.abs(t.at(Quantity.EXTINCTION, pol, node, w)));
                }
            }
        }
        double[] par = new double[dims];
        int stride = 1;
        for (int d = 0; d < dims; d++) {
            double[] x = t.nodes(d);
            int len = x.length;
            par[d] = len < 3 ? Double.NaN : 0;
            double[] basis = new double[len];
            for (int skip = 1; len >= 3 && skip < len - 1; skip++) {
                Nodes.basis(x, Nodes.weights(x, skip), skip, x[skip], basis);
                for (int node = 0; node < nodes; node++) {
                    if ((node / stride) % len != skip) {
                        continue;
                    }
                    int base = node - skip * stride;
                    for (int pol = 0; pol < 2; pol++) {
                        for (int w = 0; w < nw; w++) {
                            double est = 0;
                            for (int j = 0; j < len; j++) {
                                est += basis[j] * t.at(Quantity.EXTINCTION, pol, base + j * stride, w);
                            }
                            double err = Math.abs(est - t.at(Quantity.EXTINCTION, pol, node, w)) / scale[pol];
                            par[d] = Math.max(par[d], err);
                        }
                    }
                }
            }
            stride *= len;
        }
        return new InterpolationError(par, wavelengthError(t, scale));
    }

    private static double wavelengthError(ShapeTable t, double[] scale) {
        int nw = t.wavelengthCount();
        if (nw < 5) {
            return Double.NaN;
        }
        double[] wl = t.wavelengths();
        double[] coef = new double[4];
        double worst = 0;
        for (int skip = 1; skip < nw - 1; skip++) {
            int first = Math.max(0, Math.min(skip - 2, nw - 5));
            ShapeTable.lagrange(wl, first, 4, skip, wl[skip], coef);
            int[] idx = new int[4];
            int m = 0;
            for (int i = first; m < 4; i++) {
                if (i != skip) {
                    idx[m++] = i;
                }
            }
            for (int pol = 0; pol < 2; pol++) {
                for (int node = 0; node < t.nodeCount(); node++) {
                    double est = 0;
                    for (int k = 0; k < 4; k++) {
                        est += coef[k] * t.at(Quantity.EXTINCTION, pol, node, idx[k]);
                    }
                    double err = Math.abs(est - t.at(Quantity.EXTINCTION, pol, node, skip)) / scale[pol];
                    worst = Math.max(worst, err);
                }
            }
        }
        return worst;
    }
}
