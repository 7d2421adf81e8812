package org.fabspread.device;

import org.fabspread.dda.Quantity;
import org.fabspread.dda.ShapeTable;
import org.fabspread.particles.LossSplit;
import org.fabspread.study.ParticleLayer;

/**
 * Particle optics of a named shape read from its discrete-dipole table ({@link ShapeTables}): per sample the
 * table's interpolation weights at the sample's shape parameters (clamped into the tabulated range), then per
 * wavelength and in-plane polarisation the polarisability α, the cross-sections, the forward part of the
 * scattering and the mean near-field intensity in the host shell.
 *
 * <p>Effective medium: Maxwell Garnett with the particle's own dipole polarisability (Clausius–Mossotti,
 * (ε_eff − ε_h)/(ε_eff + 2ε_h) = n_V α/3 in the α convention of {@code particles.Polarizability}; Bohren &amp;
 * Huffman, Absorption and Scattering of Light by Small Particles, section 8.5), per polarisation. Aligned
 * particles give two passes (field along x, then y), whose R, T and absorptances the caller averages — the
 * unpolarised average of the two in-plane polarisations; randomly oriented ones one pass with the averaged
 * ε_eff and loss rates. Loss rates as in {@link LossSplit}: n_V C_abs, n_V C_sca, the host's absorption with
 * its shell's near-field excess n_V V_shell (⟨|E|²⟩ − 1) and, with a quenching distance, the shell within
 * it. Not modelled on this path: the size spread ({@code size_spread} is ignored), the size correction of
 * the metal (bulk permittivity) and the near field reaching a neighbouring absorber.
 *
 * <p>Allocation-free after construction.
 */
final class TabulatedOptics implements ParticleOptics {
    private final ParticleLayer layer;
    private final double[] lambda;
    private final ShapeTables.Built built;
    private final ShapeTable table;
    private final double[] at;
    private final double[] weights;
    private final double[] rates = new double[LossSplit.PARTS];
    private final double[] ratesY = new double[LossSplit.PARTS];
    private final double[] parts = new double[LossSplit.PARTS];
    private final double[] eps = new double[4];
    private final double shellNm;
    private int heightSlot;
    private double height;
    private double area;
    private double volume;
    private double coverage;

    /** The maker of a built table's optics. */
    static Maker maker(ShapeTables.Built built) {
        return (setup, lambda) -> new TabulatedOptics(setup, lambda, built);
    }

    private TabulatedOptics(ParticleSetup setup, double[] lambda, ShapeTables.Built built) {
        this.layer = setup.layer();
        this.lambda = lambda;
        this.built = built;
        this.table = built.table();
        this.at = new double[built.varying().length];
        this.weights = new double[table.scratchSize()];
        this.shellNm = org.fabspread.dda.DdaSettings.defaults().shellNm();
        java.util.List<String> names = new java.util.ArrayList<>(layer.shape().parameters().keySet());
        heightSlot = names.indexOf(ShapeTables.heightParameter(built.kind()));
    }

    @Override
    public void shape(ParticleSample s) {
        int[] var = built.varying();
        double[] lo = built.low();
        double[] hi = built.high();
        for (int d = 0; d < var.length; d++) {
            at[d] = Math.min(hi[d], Math.max(lo[d], s.shapeValues[var[d]]));
        }
        table.weights(at, weights);
        double a = 0;
        double v = 0;
        double[] na = built.area();
        double[] nv = built.volume();
        for (int node = 0; node < na.length; node++) {
            a += weights[node] * na[node];
            v += weights[node] * nv[node];
        }
        area = a;
        volume = v;
        height = s.shapeValues[heightSlot];
        if (!(area > 0 && volume > 0 && height > 0)) {
            throw new IllegalArgumentException("the shape parameters give no particle (area " + area + " nm²)");
        }
        coverage = s.coverage;
    }

    @Override
    public double layerHeight() {
        return height;
    }

    @Override
    public void fill(ParticleSample s, ParticleSpectra out) {
        double nA = coverage / area;
        double nV = nA / height;
        double f = Math.min(1, nV * volume);
        double r = Math.cbrt(3 * volume / (4 * Math.PI));
        double shell = 4 * Math.PI / 3 * (Math.pow(r + shellNm, 3) - r * r * r);
        double q = s.quenchDistance;
        double quenchShell = q > 0 ? 4 * Math.PI / 3 * (Math.pow(r + q, 3) - r * r * r) : 0;
        boolean two = layer.aligned();
        out.passes = two ? 2 : 1;
        out.tabulated = true;
        out.numberPerArea = nA;
        for (int i = 0; i < lambda.length; i++) {
            double hr = s.hostEpsRe[i];
            double hi = Math.max(0, s.hostEpsIm[i]);
            double nh = Math.sqrt(0.5 * (Math.sqrt(hr * hr + hi * hi) + hr));
            double kh = 2 * Math.PI / lambda[i] * hi / nh;
            effective(ShapeTable.POL_X, i, nV, hr, hi, 0);
            effective(ShapeTable.POL_Y, i, nV, hr, hi, 2);
            rates(ShapeTable.POL_X, i, nV, f, kh, shell, quenchShell, rates);
            rates(ShapeTable.POL_Y, i, nV, f, kh, shell, quenchShell, ratesY);
            if (two) {
                EnsembleOptics.toIndex(eps[0], eps[1], 0, i, out);
                EnsembleOptics.toIndex(eps[2], eps[3], 1, i, out);
                split(rates, 0, i, out);
                split(ratesY, 1, i, out);
            } else {
                EnsembleOptics.toIndex(0.5 * (eps[0] + eps[2]), 0.5 * (eps[1] + eps[3]), 0, i, out);
                for (int k = 0; k < LossSplit.PARTS; k++) {
                    rates[k] = 0.5 * (rates[k] + ratesY[k]);
                }
                split(rates, 0, i, out);
            }
            double ax = table.value(Quantity.ABSORPTION, ShapeTable.POL_X, i, weights);
            double ay = table.value(Quantity.ABSORPTION, ShapeTable.POL_Y, i, weights);
            double sx = table.value(Quantity.SCATTERING, ShapeTable.POL_X, i, weights);
            double sy = table.value(Quantity.SCATTERING, ShapeTable.POL_Y, i, weights);
            double fx = table.value(Quantity.FORWARD, ShapeTable.POL_X, i, weights);
            double fy = table.value(Quantity.FORWARD, ShapeTable.POL_Y, i, weights);
            out.absorptionCrossSection[i] = Math.max(0, 0.5 * (ax + ay));
            out.scatteringCrossSection[i] = Math.max(0, 0.5 * (sx + sy));
            double sum = sx + sy;
            out.forwardShare[i] = sum > 0 ? Math.min(1, Math.max(0, (fx + fy) / sum)) : 0.5;
        }
    }

    /** Maxwell Garnett ε_eff = ε_h (1 + 2x)/(1 − x), x = n_V α / 3, into eps[o], eps[o + 1]. */
    private void effective(int pol, int i, double nV, double hr, double hi, int o) {
        double xr = nV * table.value(Quantity.ALPHA_RE, pol, i, weights) / 3;
        double xi = nV * table.value(Quantity.ALPHA_IM, pol, i, weights) / 3;
        double ar = 1 + 2 * xr;
        double ai = 2 * xi;
        double br = 1 - xr;
        double bi = -xi;
        double den = br * br + bi * bi;
        double qr = (ar * br + ai * bi) / den;
        double qi = (ai * br - ar * bi) / den;
        eps[o] = hr * qr - hi * qi;
        eps[o + 1] = hr * qi + hi * qr;
    }

    private void rates(int pol, int i, double nV, double f, double kh, double shell, double quenchShell, double[] out) {
        double cabs = Math.max(0, table.value(Quantity.ABSORPTION, pol, i, weights));
        double csca = Math.max(0, table.value(Quantity.SCATTERING, pol, i, weights));
        double nf = Math.max(0, table.value(Quantity.NEAR_FIELD, pol, i, weights));
        out[LossSplit.METAL] = nV * cabs;
        out[LossSplit.SCATTERING] = nV * csca;
        double host = Math.max(0, kh * ((1 - f) + nV * shell * (nf - 1)));
        double quenched = quenchShell > 0 ? Math.min(host, kh * Math.min(nV * quenchShell, 1 - f) * nf) : 0;
        out[LossSplit.HOST_USEFUL] = Math.max(0, host - quenched);
        out[LossSplit.HOST_QUENCHED] = Math.max(0, quenched);
        out[LossSplit.NEIGHBOUR] = 0;
    }

    private void split(double[] r, int pass, int i, ParticleSpectra out) {
        LossSplit.split(1.0, r, parts);
        double[][] share = out.share[pass];
        for (int k = 0; k < LossSplit.PARTS; k++) {
            share[k][i] = parts[k];
        }
    }
}
