package org.fabspread.particles;

/**
 * The single-sphere quantities of {@link ParticleEnsemble} by the full Mie series (the electric-dipole
 * polarisability α the effective medium uses, the metal's absorption, the scattering cross-section and its
 * forward-hemisphere part, and the near-field host cap) tabulated once per model on a uniform grid in u = ln D for a fixed
 * wavelength grid, bulk metal permittivity, free-electron parameters and host permittivity, so that a
 * sample's ensemble average costs interpolations instead of one or two Mie series per node and
 * wavelength.
 *
 * <p>Every grid value is computed by the exact path itself (a one-node {@link ParticleEnsemble} of that
 * diameter), divided by D³ (the volume scaling), and read back by four-point Lagrange interpolation in u
 * (a cubic through the grid points j−1 … j+2 around the node; error O(h⁴), Abramowitz &amp; Stegun,
 * <i>Handbook of Mathematical Functions</i> (1964), 25.2.13). With the default step
 * {@value #DEFAULT_STEP} the interpolated quantities of size-corrected silver spheres of 3–150 nm
 * in air and in ZnO over 320–800 nm stay within 1e-6 of the exact value relative to the largest value
 * of that quantity and wavelength over the table's range (held by {@code DipoleTableTest}); on the demo
 * study J_sc moves by about 2e-9 relative (held below 1e-4 by {@code TabulatedParticlesTest}).
 *
 * <p>A diameter outside [{@link #minDiameter()}, {@link #maxDiameter()}] is not covered: the ensemble
 * then uses its exact path for the whole sample. Immutable and thread-safe (shared by every evaluator of a
 * model).
 */
public final class DipoleTable {
    /** Default grid step in ln D. */
    public static final double DEFAULT_STEP = 0.002;
    /**
     * Values per grid point and wavelength: Re α/D³, Im α/D³, σ_abs,metal/D³, σ_sca/D³, σ_sca,fwd/D³ and the
     * near-field host cap B/(κ_h D³) ({@link NodeOptics#hostBudget}; 0 in a loss-free host).
     */
    static final int QUANTITIES = 6;

    private final double[] lambda;
    private final double[] metalRe;
    private final double[] metalIm;
    private final double[] hostRe;
    private final double[] hostIm;
    private final double plasmaEv;
    private final double dampingEv;
    private final double fermiVelocity;
    private final double surfaceA;
    private final double u0;
    private final double step;
    private final double invStep;
    private final int points;
    private final double minD;
    private final double maxD;
    /**
     * [(point · wavelengths + wavelength) · QUANTITIES + quantity]: one row per grid point, so that a node
     * (fixed stencil) reads four rows front to back over the wavelengths.
     */
    final double[] values;
    /** Whether wavelength i has an absorbing host (the near-field cap applies). */
    final boolean[] capped;
    /** Distance between consecutive grid points' rows in {@link #values}. */
    final int rowStride;

    private DipoleTable(double[] lambda, double[] metalRe, double[] metalIm, double[] hostRe, double[] hostIm,
                        double plasmaEv, double dampingEv, double fermiVelocity, double surfaceA, double minD,
                        double maxD, double step) {
        int nw = lambda.length;
        if (metalRe.length != nw || metalIm.length != nw || hostRe.length != nw || hostIm.length != nw) {
            throw new IllegalArgumentException("wavelength, metal and host arrays must have one length");
        }
        if (!(minD > 0) || !(maxD > minD) || Double.isInfinite(maxD)) {
            throw new IllegalArgumentException("need 0 < minD < maxD < inf, got " + minD + ", " + maxD);
        }
        if (!(step > 0 && step <= 0.5)) {
            throw new IllegalArgumentException("grid step must be in (0, 0.5], got " + step);
        }
        this.lambda = lambda.clone();
        this.metalRe = metalRe.clone();
        this.metalIm = metalIm.clone();
        this.hostRe = hostRe.clone();
        this.hostIm = hostIm.clone();
        for (double h : this.hostIm) {
            if (!(h >= 0)) {
                throw new IllegalArgumentException("Im eps_host must be >= 0, got " + h);
            }
        }
        this.plasmaEv = plasmaEv;
        this.dampingEv = dampingEv;
        this.fermiVelocity = fermiVelocity;
        this.surfaceA = surfaceA;
        this.step = step;
        this.invStep = 1 / step;
        // one grid point beyond each end, so that every covered u has its four-point stencil
        double lo = Math.log(minD);
        double hi = Math.log(maxD);
        int inner = (int) Math.ceil((hi - lo) / step);
        this.u0 = lo - step;
        this.points = inner + 3;
        this.minD = minD;
        this.maxD = Math.exp(lo + inner * step) > maxD ? maxD : Math.exp(lo + inner * step);
        this.values = new double[nw * points * QUANTITIES];
        this.rowStride = nw * QUANTITIES;
        this.capped = new boolean[nw];
        for (int i = 0; i < nw; i++) {
            capped[i] = this.hostIm[i] > 0;
        }
        ParticleEnsemble one = new ParticleEnsemble(1);
        one.setMetal(plasmaEv, dampingEv, fermiVelocity, surfaceA);
        for (int g = 0; g < points; g++) {
            double d = Math.exp(u0 + g * step);
            double inv3 = 1 / (d * d * d);
            one.setShape(d, 0, 1, 1, 0);
            for (int i = 0; i < nw; i++) {
                one.compute(lambda[i], metalRe[i], metalIm[i], hostRe[i], hostIm[i], Double.POSITIVE_INFINITY, 0);
                int o = (g * nw + i) * QUANTITIES;
                values[o] = one.alphaRe(ParticleEnsemble.AXIS_A) * inv3;
                values[o + 1] = one.alphaIm(ParticleEnsemble.AXIS_A) * inv3;
                values[o + 2] = one.metalAbsorption(ParticleEnsemble.AXIS_A) * inv3;
                values[o + 3] = one.scattering(ParticleEnsemble.AXIS_A) * inv3;
                values[o + 4] = one.forwardScattering(ParticleEnsemble.AXIS_A) * inv3;
                values[o + 5] = hostIm[i] > 0 ? one.nearFieldHostCap() * inv3 : 0;
                for (int q = 0; q < QUANTITIES; q++) {
                    if (!Double.isFinite(values[o + q])) {
                        throw new IllegalArgumentException("a sphere of " + d + " nm at " + lambda[i]
                                + " nm has no finite polarisability");
                    }
                }
            }
        }
    }

    /**
     * Tabulates spheres of diameter minD … maxD (nm) with the default step.
     *
     * @param lambda  vacuum wavelengths (nm)
     * @param metalRe bulk Re ε of the metal per wavelength
     * @param metalIm bulk Im ε of the metal
     * @param hostRe  Re ε_h per wavelength
     * @param hostIm  Im ε_h (≥ 0)
     */
    public static DipoleTable of(double[] lambda, double[] metalRe, double[] metalIm, double[] hostRe,
                                 double[] hostIm, double plasmaEnergyEv, double bulkDampingEv,
                                 double fermiVelocityMs, double surfaceScatteringA, double minD, double maxD) {
        return of(lambda, metalRe, metalIm, hostRe, hostIm, plasmaEnergyEv, bulkDampingEv, fermiVelocityMs,
                surfaceScatteringA, minD, maxD, DEFAULT_STEP);
    }

    /** As {@link #of(double[], double[], double[], double[], double[], double, double, double, double, double, double)} with a chosen step in ln D. */
    public static DipoleTable of(double[] lambda, double[] metalRe, double[] metalIm, double[] hostRe,
                                 double[] hostIm, double plasmaEnergyEv, double bulkDampingEv,
                                 double fermiVelocityMs, double surfaceScatteringA, double minD, double maxD,
                                 double step) {
        return new DipoleTable(lambda, metalRe, metalIm, hostRe, hostIm, plasmaEnergyEv, bulkDampingEv,
                fermiVelocityMs, surfaceScatteringA, minD, maxD, step);
    }

    /** Number of wavelengths. */
    public int wavelengths() {
        return lambda.length;
    }

    /** Wavelength i (nm). */
    public double wavelength(int i) {
        return lambda[i];
    }

    /** Bulk Re ε of the metal at wavelength i. */
    public double metalRe(int i) {
        return metalRe[i];
    }

    /** Bulk Im ε of the metal at wavelength i. */
    public double metalIm(int i) {
        return metalIm[i];
    }

    /** Re ε_h at wavelength i. */
    public double hostRe(int i) {
        return hostRe[i];
    }

    /** Im ε_h at wavelength i. */
    public double hostIm(int i) {
        return hostIm[i];
    }

    /** Smallest covered diameter (nm). */
    public double minDiameter() {
        return minD;
    }

    /** Largest covered diameter (nm). */
    public double maxDiameter() {
        return maxD;
    }

    /** Grid step in ln D. */
    public double step() {
        return step;
    }

    /** Whether the table was built for these free-electron parameters (exact comparison). */
    public boolean matchesMetal(double plasmaEnergyEv, double bulkDampingEv, double fermiVelocityMs,
                                double surfaceScatteringA) {
        return plasmaEnergyEv == plasmaEv && bulkDampingEv == dampingEv && fermiVelocityMs == fermiVelocity
                && surfaceScatteringA == surfaceA;
    }

    /** Whether diameter d (nm) lies in the covered range. */
    public boolean covers(double d) {
        return d >= minD && d <= maxD;
    }

    /**
     * The stencil of diameter d: writes into {@code weights[o … o+3]} the four Lagrange weights times D³
     * and returns the offset of the stencil's first row in {@link #values} (the others follow at
     * {@link #rowStride}). d must be {@linkplain #covers covered}.
     */
    int stencil(double d, double[] weights, int o) {
        double pos = (Math.log(d) - u0) * invStep;
        int j = (int) pos;
        // j ≥ 1 for a covered d; clamp so rounding at the ends keeps the stencil inside the grid
        j = Math.max(1, Math.min(points - 3, j));
        double t = pos - j;
        double d3 = d * d * d;
        double tm1 = t - 1;
        double tm2 = t - 2;
        double tp1 = t + 1;
        weights[o] = -t * tm1 * tm2 / 6 * d3;
        weights[o + 1] = tp1 * tm1 * tm2 / 2 * d3;
        weights[o + 2] = -tp1 * t * tm2 / 2 * d3;
        weights[o + 3] = tp1 * t * tm1 / 6 * d3;
        return (j - 1) * rowStride;
    }

    /**
     * Interpolated Re α, Im α (nm³) and σ_abs,metal (nm²) of a sphere of diameter d at wavelength i into
     * {@code out[0..2]} (allocates its stencil: for inspection, not the hot path).
     */
    public void at(int i, double d, double[] out) {
        if (!covers(d)) {
            throw new IllegalArgumentException("diameter " + d + " nm outside the table's " + minD + " .. " + maxD);
        }
        double[] w = new double[4];
        int s = stencil(d, w, 0) + i * QUANTITIES;
        for (int q = 0; q < QUANTITIES; q++) {
            double v = 0;
            for (int k = 0; k < 4; k++) {
                v += w[k] * values[s + k * rowStride + q];
            }
            out[q] = v;
        }
    }
}
