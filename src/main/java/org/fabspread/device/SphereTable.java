package org.fabspread.device;

import org.fabspread.optics.LayerOptics;
import org.fabspread.particles.DipoleTable;
import org.fabspread.particles.GaussHermite;
import org.fabspread.particles.ParticleEnsemble;
import org.fabspread.study.DistributionSpec;
import org.fabspread.study.Study;

/**
 * Decides whether a model's built-in particle optics can read their single-sphere quantities from a
 * {@link DipoleTable} and builds it: spheres (in-plane and out-of-plane aspect fixed at 1), the metal's
 * free-electron parameters and the host's n shift and k scale fixed, so that per wavelength only the
 * diameter varies. The table covers every Gauss–Hermite node diameter the study's distributions reach
 * in practice: the median diameter's range ({@link #range}) widened by the outermost node of the
 * largest size spread. A sample whose nodes fall outside it takes the exact path (never a "close
 * enough" value), so the range decides speed, not results.
 */
final class SphereTable {
    /** Half-width of a normal or lognormal input's practical range, in standard deviations. */
    static final double SIGMAS = 8;
    /** Largest ratio of the largest to the smallest tabulated diameter. */
    static final double MAX_RATIO = Math.exp(8);

    private SphereTable() {
    }

    /**
     * The table of a study's built-in particle optics, or null when they do not qualify.
     *
     * @param hostShiftSlot slot of the host's n shift ({@link ParameterVector#NONE}: 0)
     * @param hostScaleSlot slot of the host's k scale ({@link ParameterVector#NONE}: 1)
     */
    static DipoleTable build(Study study, ParameterVector params, ParticleSlots slots, int hostShiftSlot,
                             int hostScaleSlot, int host, LayerOptics optics, double[] lambda, double[] metalEpsRe,
                             double[] metalEpsIm) {
        if (!fixedAt(params, slots.inPlaneAspect(), 1) || !fixedAt(params, slots.outOfPlaneAspect(), 1)) {
            return null;
        }
        int[] mustBeFixed = {slots.plasmaEnergy(), slots.bulkDamping(), slots.fermiVelocity(), slots.surfaceScattering(),
            hostShiftSlot, hostScaleSlot};
        for (int s : mustBeFixed) {
            if (s >= 0 && params.uncertain(s)) {
                return null;
            }
        }
        double[] d = range(spec(study, params, slots.diameter()));
        double[] cv = slots.sizeCv() < 0 ? new double[] {0, 0} : range(spec(study, params, slots.sizeCv()));
        if (d == null || cv == null) {
            return null;
        }
        double cvMax = cv[1];
        if (!(d[1] > 0) || !(cvMax >= 0) || Double.isInfinite(d[1]) || Double.isInfinite(cvMax)) {
            return null;
        }
        double lo = Math.max(d[0], d[1] / MAX_RATIO);
        double spread = 0;
        if (cvMax > 0) {
            GaussHermite rule = GaussHermite.of(ParticleEnsemble.DEFAULT_NODES);
            double xMax = 0;
            for (int i = 0; i < rule.size(); i++) {
                xMax = Math.max(xMax, Math.abs(rule.node(i)));
            }
            spread = Math.sqrt(2) * Math.sqrt(Math.log1p(cvMax * cvMax)) * xMax;
        }
        double minD = lo * Math.exp(-spread);
        double maxD = d[1] * Math.exp(spread);
        if (maxD / minD > MAX_RATIO) {
            minD = maxD / MAX_RATIO;
        }
        if (!(maxD > minD)) {
            // a fixed diameter and no spread: a small interval around it
            minD = 0.99 * maxD;
            maxD = 1.01 * maxD;
        }
        int nw = lambda.length;
        double[] v = params.nominal();
        double shift = ParameterVector.value(v, hostShiftSlot, 0);
        double scale = ParameterVector.value(v, hostScaleSlot, 1);
        double[] hRe = new double[nw];
        double[] hIm = new double[nw];
        for (int i = 0; i < nw; i++) {
            // exactly as ParticleStage and EnsembleOptics form the host permittivity
            double hn = optics.n(host, i) + shift;
            double hk = optics.k(host, i) * scale;
            hRe[i] = hn * hn - hk * hk;
            hIm[i] = Math.max(0, 2 * hn * hk);
        }
        try {
            return DipoleTable.of(lambda, metalEpsRe, metalEpsIm, hRe, hIm, v[slots.plasmaEnergy()],
                    v[slots.bulkDamping()], v[slots.fermiVelocity()], v[slots.surfaceScattering()], minD, maxD);
        } catch (IllegalArgumentException | ArithmeticException ex) {
            // values the exact path refuses too: it reports them, sample by sample
            return null;
        }
    }

    private static boolean fixedAt(ParameterVector params, int slot, double v) {
        return slot < 0 ? v == 1 : !params.uncertain(slot) && params.nominal()[slot] == v;
    }

    private static DistributionSpec spec(Study study, ParameterVector params, int slot) {
        return study.parameters().get(params.ids()[slot]).distribution();
    }

    /**
     * The practical range [lower, upper] of a distribution: its bounds where it has them, else
     * ±{@value #SIGMAS} standard deviations (of ln x for the lognormal); measured values widened by a
     * quarter of their range on each side (room for a smoothing kernel); null for a kind it does not know.
     */
    static double[] range(DistributionSpec s) {
        if (s instanceof DistributionSpec.Fixed f) {
            return new double[] {f.value(), f.value()};
        }
        if (s instanceof DistributionSpec.Normal n) {
            return new double[] {n.mean() - SIGMAS * n.sigma(), n.mean() + SIGMAS * n.sigma()};
        }
        if (s instanceof DistributionSpec.TruncatedNormal t) {
            return new double[] {Math.max(t.lower(), t.mean() - SIGMAS * t.sigma()),
                Math.min(t.upper(), t.mean() + SIGMAS * t.sigma())};
        }
        if (s instanceof DistributionSpec.LogNormal l) {
            double sl = Math.sqrt(Math.log1p(l.cv() * l.cv()));
            return new double[] {l.median() * Math.exp(-SIGMAS * sl), l.median() * Math.exp(SIGMAS * sl)};
        }
        if (s instanceof DistributionSpec.Uniform u) {
            return new double[] {u.lower(), u.upper()};
        }
        if (s instanceof DistributionSpec.Triangular t) {
            return new double[] {t.lower(), t.upper()};
        }
        if (s instanceof DistributionSpec.Empirical e) {
            double lo = Double.POSITIVE_INFINITY;
            double hi = Double.NEGATIVE_INFINITY;
            for (double x : e.values()) {
                lo = Math.min(lo, x);
                hi = Math.max(hi, x);
            }
            double pad = 0.25 * (hi - lo);
            return new double[] {lo - pad, hi + pad};
        }
        return null;
    }
}
