package org.fabspread.particles;

import java.util.Arrays;

/**
 * An attached {@link DipoleTable} and the node sums read from it: each node's four-point stencil in the
 * table and, for every wavelength at once, the weighted sums over the nodes of the interpolated
 * single-sphere quantities, valid for one (z₀, δ_q). Per wavelength the nodes are added in the same order
 * as in the exact path of {@link ParticleEnsemble}. Mutable scratch of one ensemble.
 */
final class TabulatedSums {
    DipoleTable table;
    private final int[] stencilOffset;
    private final double[] stencilWeight;
    double[] sAr = new double[0];
    double[] sAi = new double[0];
    double[] abs = new double[0];
    double[] sca = new double[0];
    double[] fwd = new double[0];
    double[] r3 = new double[0];
    double[] z3 = new double[0];
    double[] host = new double[0];
    double[] quenched = new double[0];
    private boolean valid;
    private double z0;
    private double quench;

    TabulatedSums(int nodes) {
        stencilOffset = new int[nodes];
        stencilWeight = new double[4 * nodes];
    }

    /** Detaches the table. */
    void clear() {
        table = null;
    }

    /**
     * Attaches the table when every node's diameter lies inside it (the caller has checked shape, method and
     * metal). Allocation-free after the first attachment.
     */
    boolean attach(DipoleTable t, EnsembleNodes nodes) {
        table = null;
        for (int i = 0; i < nodes.active; i++) {
            if (!t.covers(nodes.diameter[i])) {
                return false;
            }
        }
        for (int i = 0; i < nodes.active; i++) {
            stencilOffset[i] = t.stencil(nodes.diameter[i], stencilWeight, 4 * i);
        }
        int nw = t.wavelengths();
        if (sAr.length < nw) {
            // once per evaluator (the table's wavelength count does not change between samples)
            sAr = new double[nw];
            sAi = new double[nw];
            abs = new double[nw];
            sca = new double[nw];
            fwd = new double[nw];
            r3 = new double[nw];
            z3 = new double[nw];
            host = new double[nw];
            quenched = new double[nw];
        }
        table = t;
        valid = false;
        return true;
    }

    /** Makes the sums those of (z₀, δ_q); the near-field integrals must be those of the same pair. */
    void prepare(EnsembleNodes nodes, NearFieldIntegrals near, double z0Nm, double quenchNm) {
        if (valid && z0Nm == z0 && quenchNm == quench) {
            return;
        }
        sumNodes(nodes, near);
        z0 = z0Nm;
        quench = quenchNm;
        valid = true;
    }

    /**
     * The node sums at every wavelength at once (node by node, each node's four table rows read front to
     * back, which keeps the reads sequential).
     */
    private void sumNodes(EnsembleNodes nodes, NearFieldIntegrals near) {
        final DipoleTable t = table;
        final int nw = t.wavelengths();
        final double[] vals = t.values;
        final int stride = t.rowStride;
        final int q = DipoleTable.QUANTITIES;
        final boolean[] capped = t.capped;
        final double[] sr = sAr;
        final double[] si = sAi;
        final double[] ab = abs;
        final double[] sc = sca;
        final double[] fw = fwd;
        final double[] rr = r3;
        final double[] zz = z3;
        final double[] ho = host;
        final double[] qu = quenched;
        Arrays.fill(sr, 0, nw, 0.0);
        Arrays.fill(si, 0, nw, 0.0);
        Arrays.fill(ab, 0, nw, 0.0);
        Arrays.fill(sc, 0, nw, 0.0);
        Arrays.fill(fw, 0, nw, 0.0);
        Arrays.fill(rr, 0, nw, 0.0);
        Arrays.fill(zz, 0, nw, 0.0);
        Arrays.fill(ho, 0, nw, 0.0);
        Arrays.fill(qu, 0, nw, 0.0);
        for (int n = 0; n < nodes.active; n++) {
            final int o0 = stencilOffset[n];
            final int o1 = o0 + stride;
            final int o2 = o1 + stride;
            final int o3 = o2 + stride;
            final int wo = 4 * n;
            final double w0 = stencilWeight[wo];
            final double w1 = stencilWeight[wo + 1];
            final double w2 = stencilWeight[wo + 2];
            final double w3 = stencilWeight[wo + 3];
            final double w = nodes.weight[n];
            final double ir3 = nodes.invR3[n];
            final double iz3 = near.invZ3[n];
            final double hn = near.hostNear16[n];
            final double qn = near.quenchNear16[n];
            for (int i = 0, o = 0; i < nw; i++, o += q) {
                double aAr = w0 * vals[o0 + o] + w1 * vals[o1 + o] + w2 * vals[o2 + o] + w3 * vals[o3 + o];
                double aAi = w0 * vals[o0 + o + 1] + w1 * vals[o1 + o + 1] + w2 * vals[o2 + o + 1] + w3 * vals[o3 + o + 1];
                double mA = w0 * vals[o0 + o + 2] + w1 * vals[o1 + o + 2] + w2 * vals[o2 + o + 2] + w3 * vals[o3 + o + 2];
                double sA = w0 * vals[o0 + o + 3] + w1 * vals[o1 + o + 3] + w2 * vals[o2 + o + 3] + w3 * vals[o3 + o + 3];
                double fA = w0 * vals[o0 + o + 4] + w1 * vals[o1 + o + 4] + w2 * vals[o2 + o + 4] + w3 * vals[o3 + o + 4];
                double cap = w0 * vals[o0 + o + 5] + w1 * vals[o1 + o + 5] + w2 * vals[o2 + o + 5] + w3 * vals[o3 + o + 5];
                sr[i] += w * aAr;
                si[i] += w * aAi;
                ab[i] += w * Math.max(0, mA);
                sc[i] += w * Math.max(0, sA);
                fw[i] += w * Math.max(0, fA);
                double wa = w * (aAr * aAr + aAi * aAi);
                rr[i] += wa * ir3;
                zz[i] += wa * iz3;
                double h = wa * hn;
                double f = 1;
                if (capped[i]) {
                    // the near-field budget of ExactSums, interpolated
                    double c = w * Math.max(0, cap);
                    f = h > c ? c / h : 1;
                }
                ho[i] += f * h;
                qu[i] += f * wa * qn;
            }
        }
    }
}
