package org.fabspread.device;

import java.util.LinkedHashMap;
import java.util.Map;

import org.fabspread.optics.CoherentStack;

/** Collects per-wavelength results of one evaluation into a {@link Spectra} (not on the hot path). */
final class SpectraRecorder {
    static final int DEPTH_POINTS = 100;
    /** photons m⁻² s⁻¹ nm⁻¹ → cm⁻³ s⁻¹ (1e9 nm/m · 1e-6 m³/cm³). */
    private static final double TO_PER_CM3 = 1e3;

    private final CompiledDevice d;
    private final StackLayout layout;
    private final int nw;
    private final double[] r;
    private final double[] t;
    private final double[] glass;
    private final double[][] layer;
    private final double[] metal;
    private final double[] sca;
    private final double[] host;
    private final double[] quench;
    private final double[] nf;
    private final double[] diff;
    private final double[] lost;
    private final double[] eqe;
    private final int absorber;
    private final double[] depth = new double[DEPTH_POINTS];
    private final double[] gen = new double[DEPTH_POINTS];
    private boolean depthSet;

    SpectraRecorder(CompiledDevice d) {
        this.d = d;
        layout = d.layout();
        nw = d.wavelengths();
        r = new double[nw];
        t = new double[nw];
        glass = new double[nw];
        layer = new double[layout.layers()][nw];
        metal = new double[nw];
        sca = new double[nw];
        host = new double[nw];
        quench = new double[nw];
        nf = new double[nw];
        diff = new double[nw];
        lost = new double[nw];
        eqe = new double[nw];
        int a = layout.diffuseAbsorber();
        if (a < 0) {
            for (int j = layout.layers() - 1; j >= 0; j--) {
                if (layout.absorber()[j]) {
                    a = j;
                }
            }
        }
        absorber = a;
    }

    /** Records wavelength i's tally and its collected fraction (the EQE). */
    void record(int i, WavelengthTally w, double collected) {
        r[i] = w.reflectance;
        t[i] = w.transmittance;
        glass[i] = w.substrate;
        for (int j = 0; j < layout.layers(); j++) {
            layer[j][i] = w.layer[j];
        }
        metal[i] = w.metal;
        sca[i] = w.scattered;
        host[i] = w.host;
        quench[i] = w.quenched;
        nf[i] = w.nearField;
        diff[i] = w.diffuse;
        lost[i] = w.scatteringLost;
        eqe[i] = collected;
    }

    /** Adds the coherent generation profile of the recorded absorber for one polarisation pass. */
    void profile(int i, double wgt, double entry, OpticsStage optics) {
        double dAbs = optics.thickness(absorber);
        if (!depthSet) {
            for (int k = 0; k < DEPTH_POINTS; k++) {
                depth[k] = (k + 0.5) * dAbs / DEPTH_POINTS;
            }
            depthSet = true;
        }
        CoherentStack stack = optics.stack();
        double phi = d.flux()[i];
        int c0 = layout.compFirst()[absorber];
        int c1 = layout.compLast()[absorber];
        for (int k = 0; k < DEPTH_POINTS; k++) {
            double x = depth[k];
            for (int c = c0; c <= c1; c++) {
                double lo = optics.compOffset(c);
                double dc = optics.compThickness(c);
                if (dc > 0 && x >= lo && x <= lo + dc && !layout.particleComp(c)) {
                    gen[k] += wgt * phi * entry * stack.absorptionRate(c, x - lo);
                    break;
                }
            }
        }
    }

    /**
     * Adds the host absorption inside the particle layer (useful and quenched), spread uniformly over
     * the layer's depth, when the recorded absorber is the particles' host.
     */
    void hostLayer(int i, WavelengthTally w, ParticlePlacement p) {
        if (absorber != layout.host() || !p.on || !(p.height > 0)) {
            return;
        }
        double rate = d.flux()[i] * (w.host + w.quenched) / p.height;
        for (int k = 0; k < DEPTH_POINTS; k++) {
            double x = depth[k];
            if (x >= p.offset && x < p.offset + p.height) {
                gen[k] += rate;
            }
        }
    }

    Spectra build() {
        Map<String, double[]> byName = new LinkedHashMap<>();
        for (int j = 0; j < layout.layers(); j++) {
            if (j == 0 && layout.incoherentGlass()) {
                continue;
            }
            byName.put(d.study().stack().get(j).name(), layer[j]);
        }
        double[] g = gen.clone();
        for (int k = 0; k < g.length; k++) {
            g[k] *= TO_PER_CM3;
        }
        return new Spectra(d.lambda().clone(), d.flux().clone(), r, t, glass, byName, metal, sca, host, quench, nf, diff,
                lost, eqe, depth.clone(), g, d.study().stack().get(absorber).name());
    }
}
