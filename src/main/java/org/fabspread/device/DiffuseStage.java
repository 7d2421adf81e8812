package org.fabspread.device;

import org.fabspread.optics.CoherentStack;

/**
 * The scattered light of the particle layer as diffuse light in the absorber ({@link LambertianSlab}): the
 * forward share f_fwd is injected into the absorber; the rest heads away from it — towards the front, where
 * 1 − R_f escapes and R_f returns into the absorber as forward light (particles in front of the absorber), or
 * towards the back electrode, where R_b returns and 1 − R_b is lost (particles behind it). With the particles
 * inside the absorber the light is born at the particle layer's mid-plane, the particles' centres, at depth z
 * from the absorber's front face (the placement's offset plus half the layer height): the forward share heads
 * to the back, the rest to the front, each first attenuated by 2E₃ of the optical distance to its face
 * ({@link LambertianSlab#absorbedInside}), so part of the backward share escapes through the front. R_f = 1 − 1/n² with n
 * the absorber's index; R_b is the normal-incidence reflectance of everything behind the absorber seen from
 * inside it, used for all angles. Owns the solver of an absorber with nothing behind it; allocation-free.
 */
final class DiffuseStage {
    private static final double FOUR_PI = 4 * Math.PI;
    /** no layers: the back solve of an absorber with nothing behind it (the exit medium alone). */
    private static final double[] NONE = new double[0];

    private final double[] lambda;
    private final int host;
    private final int absorber;
    private final int firstBehind;
    private final int behind;
    private final CoherentStack back = new CoherentStack(0);

    DiffuseStage(CompiledDevice d) {
        StackLayout l = d.layout();
        lambda = d.lambda();
        host = l.host();
        absorber = l.diffuseAbsorber();
        firstBehind = l.compLast()[absorber] + 1;
        behind = l.compCount() - firstBehind;
    }

    /**
     * Adds the diffuse light from scattered light {@code sca} at wavelength i (weight {@code wgt} of this
     * polarisation pass), after the main solve of this pass, to the tally: absorbed (optical and collected by
     * ⟨η⟩) and lost. {@code depth} is where the light is born inside the absorber, nm from its front face (read
     * only when the particles lie in the absorber).
     */
    void redistribute(int i, double sca, double wgt, double forward, double depth, OpticsStage optics,
                      CollectionStage collection, WavelengthTally w) {
        int t = absorber;
        double lam = lambda[i];
        double n = optics.n(t, i);
        double k = optics.k(t, i);
        double kappaD = FOUR_PI * k / lam * optics.thickness(t);
        double t1 = LambertianSlab.diffuseTransmission(kappaD);
        double rf = LambertianSlab.escapeConeReflectance(n, 1.0);
        // back reflectance: everything behind the absorber, seen from inside it
        double rb;
        if (behind > 0) {
            // the main solve's sweep has already reached the absorber's back face: bit for bit the same
            // reflectance as solving the layers behind it again
            rb = optics.stack().reflectanceBehind(firstBehind, n);
        } else {
            back.solve(lam, n, 0, NONE, NONE, NONE, 1.0, 0.0);
            rb = back.reflectance();
        }
        double fFwd = forward;
        double absorbed;
        double lost;
        if (host < t) {
            double in = fFwd + (1 - fFwd) * rf;
            absorbed = in * LambertianSlab.absorbedFront(t1, rb, rf);
            lost = in * (LambertianSlab.escapedFront(t1, rb, rf) + LambertianSlab.lostBackFront(t1, rb, rf))
                    + (1 - fFwd) * (1 - rf);
        } else if (host > t) {
            double in = fFwd + (1 - fFwd) * rb;
            absorbed = in * LambertianSlab.absorbedBack(t1, rb, rf);
            lost = in * (LambertianSlab.escapedBack(t1, rb, rf) + LambertianSlab.lostBackBack(t1, rb, rf))
                    + (1 - fFwd) * (1 - rb);
        } else {
            double d = optics.thickness(t);
            double z = Math.max(0, Math.min(depth, d));
            double kappa = FOUR_PI * k / lam;
            double tFront = LambertianSlab.diffuseTransmission(kappa * z);
            double tBack = LambertianSlab.diffuseTransmission(kappa * (d - z));
            absorbed = LambertianSlab.absorbedInside(t1, tFront, tBack, fFwd, rb, rf);
            lost = LambertianSlab.escapedInside(t1, tFront, tBack, fFwd, rb, rf)
                    + LambertianSlab.lostBackInside(t1, tFront, tBack, fFwd, rb, rf);
        }
        double diff = sca * absorbed;
        w.diffuse += wgt * diff;
        w.scatteringLost += wgt * sca * lost;
        w.optical += wgt * diff;
        w.collected += wgt * diff * collection.averageEta(t);
    }
}
