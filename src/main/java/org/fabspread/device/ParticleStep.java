package org.fabspread.device;

import org.fabspread.particles.DipoleTable;
import org.fabspread.particles.LossSplit;
import org.fabspread.particles.ParticleEnsemble;
import org.fabspread.study.ParticleLayer;

/**
 * The particle layer of one evaluator at one wavelength: the ensemble averages
 * ({@link ParticleEnsemble}), the effective permittivity per in-plane polarisation (aligned-ellipsoid
 * Maxwell Garnett or Bruggeman) and the shares of the effective layer's absorptance
 * ({@link LossSplit}). Owns its scratch; allocation-free after construction.
 *
 * <p>Polarisation passes: aligned particles with in-plane aspect p ≠ 1 give two passes (field along a,
 * then along b), each with its own ε_eff and loss rates; the caller averages R, T and every absorptance.
 * Otherwise one pass: spheres and p = 1 use the a axis (equal to b); particles randomly oriented in the
 * plane use ε_eff averaged over the two in-plane axes and the unpolarised loss rates — an approximation
 * (averaging permittivities is not averaging the two polarisations' optical responses).
 *
 * <p>When the model has a {@link DipoleTable} built for this host and the sample's spheres lie inside it,
 * the ensemble reads its single-sphere quantities from the table ({@link ParticleEnsemble#attach});
 * otherwise, and always for other shapes, it computes them exactly.
 */
final class ParticleStep {
    private final ParticleLayer layer;
    private final ParticleEnsemble ensemble = new ParticleEnsemble();
    private final double[] tmp = new double[2];
    private final double[] rates = new double[LossSplit.PARTS];
    private final double[][] shares = new double[2][LossSplit.PARTS];
    private final double[] effN = new double[2];
    private final double[] effK = new double[2];
    private boolean active;
    private boolean twoPasses;
    private double quench;
    private double z0;

    // per-wavelength cache of the last sample whose particle inputs were the same (exact reuse)
    static final int KEY_SIZE = 15;
    private final double[] key = new double[KEY_SIZE];
    private final double[] cachedKey = new double[KEY_SIZE];
    private final boolean[] cached;
    private final double[][] cacheN;
    private final double[][] cacheK;
    private final double[][][] cacheShares;

    /** the model's sphere table (null: none) and the host n shift and k scale it was built with. */
    private final DipoleTable table;
    private final double tableShift;
    private final double tableScale;
    private boolean tabulated;

    /**
     * @param table      single-sphere quantities tabulated in the diameter (null: always the exact path)
     * @param tableShift host n shift the table was built with
     * @param tableScale host k scale the table was built with
     */
    ParticleStep(ParticleLayer layer, int wavelengths, DipoleTable table, double tableShift, double tableScale) {
        this.layer = layer;
        this.table = table;
        this.tableShift = tableShift;
        this.tableScale = tableScale;
        cached = new boolean[wavelengths];
        cacheN = new double[wavelengths][2];
        cacheK = new double[wavelengths][2];
        cacheShares = new double[wavelengths][2][LossSplit.PARTS];
        java.util.Arrays.fill(cachedKey, Double.NaN);
    }

    /**
     * Reads and checks the sample's particle parameters and sets the ensemble's shape and metal.
     *
     * @throws DeviceModel.InputException for a value outside its range
     */
    void setSample(double[] v, DeviceModel m, double quenchNm) {
        double d50 = v[m.pDiameter];
        double cv = m.pCv < 0 ? 0 : v[m.pCv];
        double p = m.pInPlane < 0 ? 1 : v[m.pInPlane];
        double q = m.pOutOfPlane < 0 ? 1 : v[m.pOutOfPlane];
        double cov = v[m.pCoverage];
        if (!(d50 > 0 && !Double.isInfinite(d50))) {
            throw fail(m, m.pDiameter, "median diameter must be > 0 nm, got " + d50);
        }
        if (!(cv >= 0 && !Double.isInfinite(cv))) {
            throw fail(m, m.pCv, "size CV must be >= 0, got " + cv);
        }
        if (!(p >= 1 && !Double.isInfinite(p))) {
            throw fail(m, m.pInPlane, "in-plane aspect ratio must be >= 1, got " + p);
        }
        if (!(q > 0 && !Double.isInfinite(q))) {
            throw fail(m, m.pOutOfPlane, "out-of-plane aspect ratio must be > 0, got " + q);
        }
        if (!(cov >= 0 && cov < 1)) {
            throw fail(m, m.pCoverage, "coverage must be in [0, 1), got " + cov);
        }
        double wp = v[m.pPlasma];
        double g0 = v[m.pDamping];
        double vf = v[m.pFermi];
        double as = v[m.pSurface];
        if (!(wp > 0 && !Double.isInfinite(wp))) {
            throw fail(m, m.pPlasma, "plasma energy must be > 0 eV, got " + wp);
        }
        if (!(g0 >= 0 && !Double.isInfinite(g0))) {
            throw fail(m, m.pDamping, "bulk damping must be >= 0 eV, got " + g0);
        }
        if (!(vf >= 0 && !Double.isInfinite(vf))) {
            throw fail(m, m.pFermi, "Fermi velocity must be >= 0 m/s, got " + vf);
        }
        if (!(as >= 0 && !Double.isInfinite(as))) {
            throw fail(m, m.pSurface, "surface scattering must be >= 0, got " + as);
        }
        ensemble.setShape(d50, cv, p, q, cov);
        ensemble.setMetal(wp, g0, vf, as);
        active = cov > 0;
        twoPasses = layer.aligned() && p != 1;
        quench = quenchNm;
        key[0] = d50;
        key[1] = cv;
        key[2] = p;
        key[3] = q;
        key[4] = cov;
        key[5] = wp;
        key[6] = g0;
        key[7] = vf;
        key[8] = as;
        key[9] = quenchNm;
    }

    /**
     * Completes the cache key with everything else the particle optics depend on; when the key equals
     * the previous sample's, the per-wavelength results are reused exactly.
     */
    void completeKey(double hostShift, double hostScale, double neighbourShift, double neighbourScale) {
        // the table applies when it was built for this host exactly (the ensemble checks shape, metal and range)
        tabulated = table != null && hostShift == tableShift && hostScale == tableScale && ensemble.attach(table);
        key[10] = z0;
        key[11] = hostShift;
        key[12] = hostScale;
        key[13] = neighbourShift;
        key[14] = neighbourScale;
        if (!java.util.Arrays.equals(key, cachedKey)) {
            System.arraycopy(key, 0, cachedKey, 0, KEY_SIZE);
            java.util.Arrays.fill(cached, false);
        }
    }

    private static DeviceModel.InputException fail(DeviceModel m, int slot, String what) {
        String id = slot >= 0 ? m.paramIds[slot] : "particles";
        return new DeviceModel.InputException("out-of-range", slot, id + ": " + what);
    }

    /** Sets the distance from the particle centres to the neighbouring absorber (+∞ for none). */
    void setNeighbourDistance(double z0Nm) {
        this.z0 = z0Nm;
    }

    /** Whether the current sample reads the sphere table (else the exact path). */
    boolean tabulated() {
        return tabulated;
    }

    /** Height h of the particle layer (2c of the median particle), nm. */
    double layerHeight() {
        return ensemble.thickness();
    }

    /** False at zero coverage: the stack is then exactly planar. */
    boolean active() {
        return active;
    }

    /** Number of polarisation passes (1 or 2). */
    int passes() {
        return twoPasses ? 2 : 1;
    }

    /**
     * Computes ε_eff and the loss shares at one wavelength.
     *
     * @param neighbourPresent whether a neighbouring absorber takes the far half-space
     */
    void atWavelength(int i, boolean useCache, double lambdaNm, double metalRe, double metalIm, double hostRe,
                      double hostIm, double nbRe, double nbIm, boolean neighbourPresent) {
        int np = passes();
        if (useCache && cached[i]) {
            for (int pass = 0; pass < np; pass++) {
                effN[pass] = cacheN[i][pass];
                effK[pass] = cacheK[i][pass];
                System.arraycopy(cacheShares[i][pass], 0, shares[pass], 0, LossSplit.PARTS);
            }
            return;
        }
        compute(i, lambdaNm, metalRe, metalIm, hostRe, hostIm, nbIm, neighbourPresent);
        for (int pass = 0; pass < np; pass++) {
            cacheN[i][pass] = effN[pass];
            cacheK[i][pass] = effK[pass];
            System.arraycopy(shares[pass], 0, cacheShares[i][pass], 0, LossSplit.PARTS);
        }
        cached[i] = true;
    }

    private void compute(int i, double lambdaNm, double metalRe, double metalIm, double hostRe, double hostIm,
                         double nbIm, boolean neighbourPresent) {
        double zn = neighbourPresent ? z0 : Double.POSITIVE_INFINITY;
        if (tabulated) {
            ensemble.compute(i, zn, quench);
        } else {
            ensemble.compute(lambdaNm, metalRe, metalIm, hostRe, Math.max(0, hostIm), zn, quench);
        }
        if (twoPasses) {
            for (int pass = 0; pass < 2; pass++) {
                int axis = pass == 0 ? ParticleEnsemble.AXIS_A : ParticleEnsemble.AXIS_B;
                effective(axis);
                toIndex(tmp[0], tmp[1], pass);
                LossSplit.rates(ensemble, axis, nbIm, rates);
                normalise(rates, shares[pass]);
            }
            return;
        }
        if (layer.aligned() || ensemble.depolarization(ParticleEnsemble.AXIS_A)
                == ensemble.depolarization(ParticleEnsemble.AXIS_B)) {
            effective(ParticleEnsemble.AXIS_A);
            toIndex(tmp[0], tmp[1], 0);
        } else {
            effective(ParticleEnsemble.AXIS_A);
            double re = tmp[0];
            double im = tmp[1];
            effective(ParticleEnsemble.AXIS_B);
            toIndex(0.5 * (re + tmp[0]), 0.5 * (im + tmp[1]), 0);
        }
        LossSplit.rates(ensemble, ParticleEnsemble.UNPOLARIZED, nbIm, rates);
        normalise(rates, shares[0]);
    }

    private void effective(int axis) {
        if (layer.mixingRule() == ParticleLayer.MixingRule.BRUGGEMAN) {
            ensemble.bruggeman(axis, tmp);
        } else {
            ensemble.maxwellGarnett(axis, tmp);
        }
    }

    /** N = √ε on the branch with k ≥ 0, computed without cancellation (|ε| from its square: no hypot). */
    private void toIndex(double re, double im, int pass) {
        double mod = Math.sqrt(re * re + im * im);
        double n;
        double k;
        if (re >= 0) {
            n = Math.sqrt(0.5 * (mod + re));
            k = n == 0 ? 0 : Math.abs(im) / (2 * n);
        } else {
            k = Math.sqrt(0.5 * (mod - re));
            n = Math.abs(im) / (2 * k);
        }
        effN[pass] = n;
        effK[pass] = k;
    }

    /** Shares that sum to 1 (the split of a unit absorptance). */
    private static void normalise(double[] r, double[] out) {
        LossSplit.split(1.0, r, out);
    }

    double effectiveN(int pass) {
        return effN[pass];
    }

    double effectiveK(int pass) {
        return effK[pass];
    }

    double metalShare(int pass) {
        return shares[pass][LossSplit.METAL];
    }

    double scatteringShare(int pass) {
        return shares[pass][LossSplit.SCATTERING];
    }

    double hostShare(int pass) {
        return shares[pass][LossSplit.HOST_USEFUL];
    }

    double quenchedShare(int pass) {
        return shares[pass][LossSplit.HOST_QUENCHED];
    }

    double nearFieldShare(int pass) {
        return shares[pass][LossSplit.NEIGHBOUR];
    }

    /** n_A (nm⁻²). */
    double numberPerArea() {
        return ensemble.numberPerArea();
    }

    /** Unpolarised ⟨σ_abs,metal⟩ + ⟨σ_sca⟩ (nm²): extinction as absorption plus scattering. */
    double extinctionCrossSection() {
        return absorptionCrossSection() + scatteringCrossSection();
    }

    /** Unpolarised ⟨σ_sca⟩ (nm²). */
    double scatteringCrossSection() {
        return ensemble.scattering(ParticleEnsemble.UNPOLARIZED);
    }

    /** Unpolarised ⟨σ_abs,metal⟩ (nm²). */
    double absorptionCrossSection() {
        return ensemble.metalAbsorption(ParticleEnsemble.UNPOLARIZED);
    }
}
