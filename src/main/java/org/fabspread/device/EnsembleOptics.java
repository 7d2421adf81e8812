package org.fabspread.device;

import org.fabspread.particles.DipoleTable;
import org.fabspread.particles.LossSplit;
import org.fabspread.particles.ParticleEnsemble;
import org.fabspread.study.ParticleLayer;

/**
 * The built-in particle optics: the ensemble averages over the lognormal size spread
 * ({@link ParticleEnsemble}), the effective permittivity per in-plane polarisation (aligned-ellipsoid
 * Maxwell Garnett or Bruggeman) and the shares of the effective layer's absorptance ({@link LossSplit}).
 * Owns its scratch; allocation-free after construction.
 *
 * <p>Polarisation passes: aligned particles with in-plane aspect p ≠ 1 give two passes (field along a,
 * then along b), each with its own ε_eff and loss rates; the caller averages R, T and every absorptance.
 * Otherwise one pass: spheres and p = 1 use the a axis (equal to b); particles randomly oriented in the
 * plane use ε_eff averaged over the two in-plane axes and the unpolarised loss rates — an approximation
 * (averaging permittivities is not averaging the two polarisations' optical responses).
 *
 * <p>When the model has a {@link DipoleTable} ({@link SphereTable}) and the sample's spheres lie inside it,
 * the ensemble reads its single-sphere quantities from the table ({@link ParticleEnsemble#attach});
 * otherwise, and always for other shapes, it computes them exactly. The table is built only when the
 * host's n shift and k scale are fixed, so every sample's host is the host it was built for.
 */
final class EnsembleOptics implements ParticleOptics {
    /** Makes the built-in optics of a particle setup. */
    static final Maker MAKER = (setup, lambda) -> new EnsembleOptics(setup.layer(), lambda, setup.metalEpsRe(),
            setup.metalEpsIm(), setup.sphereTable());

    private final ParticleLayer layer;
    private final double[] lambda;
    private final double[] metalEpsRe;
    private final double[] metalEpsIm;
    private final DipoleTable table;
    private final ParticleEnsemble ensemble = new ParticleEnsemble();
    private final double[] tmp = new double[2];
    private final double[] rates = new double[LossSplit.PARTS];
    private final double[] parts = new double[LossSplit.PARTS];
    private boolean twoPasses;

    /**
     * @param lambda     the grid, nm
     * @param metalEpsRe Re ε of the bulk metal on the grid
     * @param metalEpsIm Im ε of the bulk metal on the grid
     * @param table      single-sphere quantities tabulated in the diameter (null: always the exact path)
     */
    EnsembleOptics(ParticleLayer layer, double[] lambda, double[] metalEpsRe, double[] metalEpsIm, DipoleTable table) {
        this.layer = layer;
        this.lambda = lambda;
        this.metalEpsRe = metalEpsRe;
        this.metalEpsIm = metalEpsIm;
        this.table = table;
    }

    @Override
    public void shape(ParticleSample s) {
        ensemble.setShape(s.diameter, s.sizeCv, s.inPlaneAspect, s.outOfPlaneAspect, s.coverage);
        ensemble.setMetal(s.plasmaEnergy, s.bulkDamping, s.fermiVelocity, s.surfaceScattering);
        twoPasses = layer.aligned() && s.inPlaneAspect != 1;
    }

    /** Height h of the particle layer (2c of the median particle), nm. */
    @Override
    public double layerHeight() {
        return ensemble.thickness();
    }

    @Override
    public void fill(ParticleSample s, ParticleSpectra out) {
        boolean tabulated = table != null && ensemble.attach(table);
        double zn = s.hasNeighbour ? s.neighbourDistance : Double.POSITIVE_INFINITY;
        out.passes = twoPasses ? 2 : 1;
        out.tabulated = tabulated;
        for (int i = 0; i < lambda.length; i++) {
            if (tabulated) {
                ensemble.compute(i, zn, s.quenchDistance);
            } else {
                ensemble.compute(lambda[i], metalEpsRe[i], metalEpsIm[i], s.hostEpsRe[i], Math.max(0, s.hostEpsIm[i]),
                        zn, s.quenchDistance);
            }
            atWavelength(i, s.neighbourEpsIm[i], out);
            out.absorptionCrossSection[i] = ensemble.metalAbsorption(ParticleEnsemble.UNPOLARIZED);
            out.scatteringCrossSection[i] = ensemble.scattering(ParticleEnsemble.UNPOLARIZED);
            out.forwardShare[i] = ensemble.forwardShare(ParticleEnsemble.UNPOLARIZED);
        }
        out.numberPerArea = ensemble.numberPerArea();
    }

    /** ε_eff → N and the loss shares of each pass at wavelength i, from the ensemble just computed there. */
    private void atWavelength(int i, double neighbourIm, ParticleSpectra out) {
        if (twoPasses) {
            for (int pass = 0; pass < 2; pass++) {
                int axis = pass == 0 ? ParticleEnsemble.AXIS_A : ParticleEnsemble.AXIS_B;
                effective(axis);
                toIndex(tmp[0], tmp[1], pass, i, out);
                split(axis, neighbourIm, pass, i, out);
            }
            return;
        }
        if (layer.aligned() || ensemble.depolarization(ParticleEnsemble.AXIS_A)
                == ensemble.depolarization(ParticleEnsemble.AXIS_B)) {
            effective(ParticleEnsemble.AXIS_A);
            toIndex(tmp[0], tmp[1], 0, i, out);
        } else {
            effective(ParticleEnsemble.AXIS_A);
            double re = tmp[0];
            double im = tmp[1];
            effective(ParticleEnsemble.AXIS_B);
            toIndex(0.5 * (re + tmp[0]), 0.5 * (im + tmp[1]), 0, i, out);
        }
        split(ParticleEnsemble.UNPOLARIZED, neighbourIm, 0, i, out);
    }

    private void effective(int axis) {
        if (layer.mixingRule() == ParticleLayer.MixingRule.BRUGGEMAN) {
            ensemble.bruggeman(axis, tmp);
        } else {
            ensemble.maxwellGarnett(axis, tmp);
        }
    }

    /** Shares that sum to 1 (the split of a unit absorptance) for polarisation {@code pol}. */
    private void split(int pol, double neighbourIm, int pass, int i, ParticleSpectra out) {
        LossSplit.rates(ensemble, pol, neighbourIm, rates);
        LossSplit.split(1.0, rates, parts);
        double[][] share = out.share[pass];
        for (int k = 0; k < LossSplit.PARTS; k++) {
            share[k][i] = parts[k];
        }
    }

    /** N = √ε on the branch with k ≥ 0, computed without cancellation (|ε| from its square: no hypot). */
    static void toIndex(double re, double im, int pass, int i, ParticleSpectra out) {
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
        out.effectiveN[pass][i] = n;
        out.effectiveK[pass][i] = k;
    }
}
