package org.fabspread.device;

import org.fabspread.optics.CoherentStack;
import org.fabspread.optics.IncoherentSubstrate;
import org.fabspread.optics.LayerOptics;

/**
 * The optics stage of one evaluator: reads the layers' thicknesses, n shifts and k scales from their
 * {@link StackSlots}, splits the particles' host around the effective layer and solves the stack per
 * wavelength. A first layer marked incoherent (the glass) is treated by intensities
 * ({@link IncoherentSubstrate}: Pettersson, Roman &amp; Inganäs, J. Appl. Phys. 86, 487 (1999)); the other
 * layers by coherent transfer matrices ({@link CoherentStack}), with the glass as incident medium (real index
 * Re n_glass) and air as exit medium. Owns the solver and its per-layer arrays; allocation-free.
 */
final class OpticsStage {
    private final StackLayout layout;
    private final StackSlots slots;
    private final ParameterVector params;
    private final LayerOptics optics;
    private final double[] lambda;
    private final int nl;
    private final int nc;
    private final CoherentStack stack;
    private final double[] nRe;
    private final double[] nIm;
    /** per computational layer: thickness with the particles, without them, and depth of its front in its layer. */
    private final double[] dC;
    private final double[] dPlanar;
    private final double[] x0;
    /** per study layer: thickness, n shift, k scale of this sample. */
    private final double[] dL;
    private final double[] shift;
    private final double[] scale;

    OpticsStage(CompiledDevice d) {
        layout = d.layout();
        slots = d.stack();
        params = d.parameters();
        optics = d.optics();
        lambda = d.lambda();
        nl = layout.layers();
        nc = layout.compCount();
        stack = new CoherentStack(nc);
        boolean[] slices = new boolean[nc];
        for (int c = 0; c < nc; c++) {
            slices[c] = layout.compKind()[c] == StackLayout.KIND_SLICE;
        }
        // an empty slice of protruding caps must leave the solve exactly as without it
        stack.passWhenEmpty(slices);
        nRe = new double[nc];
        nIm = new double[nc];
        dC = new double[nc];
        dPlanar = new double[nc];
        x0 = new double[nc];
        dL = new double[nl];
        shift = new double[nl];
        scale = new double[nl];
    }

    /** Reads and checks every layer's thickness, n shift and k scale. */
    void prepare(double[] v) {
        for (int j = 0; j < nl; j++) {
            int ts = slots.thickness()[j];
            double d = v[ts];
            if (!(d >= 0) || Double.isInfinite(d)) {
                throw params.error("negative-thickness", ts, "thickness must be >= 0 nm, got " + d);
            }
            if (layout.absorber()[j] && d == 0) {
                throw params.error("out-of-range", ts, "an absorber needs a thickness > 0 nm");
            }
            dL[j] = d;
            shift[j] = ParameterVector.value(v, slots.nShift()[j], 0);
            scale[j] = ParameterVector.value(v, slots.kScale()[j], 1);
            if (!(scale[j] >= 0)) {
                throw params.error("out-of-range", slots.kScale()[j], "k scale must be >= 0, got " + scale[j]);
            }
            if (!(layout.minN()[j] + shift[j] > 0)) {
                throw params.error("out-of-range", slots.nShift()[j], "n shift " + shift[j] + " makes n <= 0");
            }
        }
    }

    /**
     * Splits the host into front part, effective layer and back part around the placed particle layer, and the
     * layer next to it into the slice of protruding caps and the rest.
     */
    void split(ParticlePlacement p) {
        boolean on = p.on;
        for (int c = 0; c < nc; c++) {
            int j = layout.compLayer()[c];
            switch (layout.compKind()[c]) {
                case StackLayout.KIND_HOST_FRONT -> {
                    dC[c] = on ? p.offset : dL[j];
                    x0[c] = 0;
                    dPlanar[c] = dL[j];
                }
                case StackLayout.KIND_EFFECTIVE -> {
                    dC[c] = on ? p.height - p.protrusion : 0;
                    x0[c] = p.offset;
                    dPlanar[c] = 0;
                }
                case StackLayout.KIND_HOST_BACK -> {
                    dC[c] = on ? Math.max(0, dL[j] - p.offset - p.height) : 0;
                    x0[c] = p.offset + p.height;
                    dPlanar[c] = 0;
                }
                case StackLayout.KIND_SLICE -> {
                    dC[c] = on ? p.protrusion : 0;
                    x0[c] = layout.sliceBehind() ? 0 : dL[j] - dC[c];
                    dPlanar[c] = 0;
                }
                case StackLayout.KIND_SLICE_REST -> {
                    double out = on ? p.protrusion : 0;
                    dC[c] = dL[j] - out;
                    x0[c] = layout.sliceBehind() ? out : 0;
                    dPlanar[c] = dL[j];
                }
                default -> {
                    dC[c] = dL[j];
                    x0[c] = 0;
                    dPlanar[c] = dL[j];
                }
            }
        }
    }

    /**
     * Solves the device at wavelength i, the effective layer with index effN + i effK and the slice of
     * protruding caps with sliceN + i sliceK when {@code particles} (else they keep their host's index at zero
     * thickness).
     */
    void solve(int i, boolean particles, double effN, double effK, double sliceN, double sliceK, StackSolve out) {
        for (int c = 0; c < nc; c++) {
            if (particles && layout.compKind()[c] == StackLayout.KIND_EFFECTIVE) {
                nRe[c] = effN;
                nIm[c] = effK;
            } else if (particles && layout.compKind()[c] == StackLayout.KIND_SLICE && dC[c] > 0) {
                nRe[c] = sliceN;
                nIm[c] = sliceK;
            } else {
                plain(c, i);
            }
        }
        solveMain(i, dC, out);
    }

    /** Solves the same stack without particles (the planar reference) at wavelength i. */
    void solvePlanar(int i, StackSolve out) {
        for (int c = 0; c < nc; c++) {
            plain(c, i);
        }
        solveMain(i, dPlanar, out);
    }

    private void plain(int c, int i) {
        int j = layout.compLayer()[c];
        nRe[c] = optics.n(j, i) + shift[j];
        nIm[c] = optics.k(j, i) * scale[j];
    }

    private void solveMain(int i, double[] thick, StackSolve out) {
        double lam = lambda[i];
        if (layout.incoherentGlass()) {
            double ng = n(0, i);
            double kg = k(0, i);
            stack.solve(lam, ng, nc, nRe, nIm, thick, 1.0, 0.0);
            double rc = stack.reflectance();
            double tc = stack.transmittance();
            double rAg = IncoherentSubstrate.fresnelNormal(1, 0, ng, kg);
            double tG = IncoherentSubstrate.singlePass(kg, dL[0], lam);
            out.reflectance = IncoherentSubstrate.totalReflectance(rAg, tG, rc);
            out.transmittance = IncoherentSubstrate.totalTransmittance(rAg, tG, rc, tc);
            out.substrate = IncoherentSubstrate.glassAbsorptance(rAg, tG, rc);
            out.entry = IncoherentSubstrate.entryFactor(rAg, tG, rc);
            return;
        }
        stack.solve(lam, 1.0, nc, nRe, nIm, thick, 1.0, 0.0);
        out.reflectance = stack.reflectance();
        out.transmittance = stack.transmittance();
        out.substrate = 0;
        out.entry = 1;
    }

    /** The solver after the last solve (absorptances, weighted absorption, the reflectance behind a layer). */
    CoherentStack stack() {
        return stack;
    }

    /** n of study layer j at wavelength i with the sample's shift. */
    double n(int j, int i) {
        return optics.n(j, i) + shift[j];
    }

    /** k of study layer j at wavelength i with the sample's scale. */
    double k(int j, int i) {
        return optics.k(j, i) * scale[j];
    }

    /** The sample's n shift of study layer j. */
    double shift(int j) {
        return shift[j];
    }

    /** The sample's k scale of study layer j. */
    double scale(int j) {
        return scale[j];
    }

    /** The sample's thickness of study layer j, nm. */
    double thickness(int j) {
        return dL[j];
    }

    /** Thickness of computational layer c in the solve with particles, nm. */
    double compThickness(int c) {
        return dC[c];
    }

    /** Thickness of computational layer c in the planar solve, nm. */
    double planarThickness(int c) {
        return dPlanar[c];
    }

    /** Depth of computational layer c's front face inside its study layer, nm. */
    double compOffset(int c) {
        return x0[c];
    }
}
