package org.fabspread.device;

import java.util.LinkedHashMap;
import java.util.Map;

import org.fabspread.optics.CoherentStack;

/** Collects per-wavelength results of one evaluation into a {@link Spectra} (not on the hot path). */
final class SpectraRecorder {
    static final int DEPTH_POINTS = 100;
    /** photons m⁻² s⁻¹ nm⁻¹ → cm⁻³ s⁻¹ (1e9 nm/m · 1e-6 m³/cm³). */
    private static final double TO_PER_CM3 = 1e3;

    private final DeviceModel m;
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

    SpectraRecorder(DeviceModel m) {
        this.m = m;
        nw = m.lambda.length;
        r = new double[nw];
        t = new double[nw];
        glass = new double[nw];
        layer = new double[m.layerCount][nw];
        metal = new double[nw];
        sca = new double[nw];
        host = new double[nw];
        quench = new double[nw];
        nf = new double[nw];
        diff = new double[nw];
        lost = new double[nw];
        eqe = new double[nw];
        int a = m.diffuseAbsorber;
        if (a < 0) {
            for (int j = m.layerCount - 1; j >= 0; j--) {
                if (m.isAbsorber[j]) {
                    a = j;
                }
            }
        }
        absorber = a;
    }

    void record(int i, double wR, double wT, double wGlass, double[] wLayer, double wMetal, double wSca, double wHost,
                double wQuench, double wNf, double wDiff, double wLost, double collected) {
        r[i] = wR;
        t[i] = wT;
        glass[i] = wGlass;
        for (int j = 0; j < m.layerCount; j++) {
            layer[j][i] = wLayer[j];
        }
        metal[i] = wMetal;
        sca[i] = wSca;
        host[i] = wHost;
        quench[i] = wQuench;
        nf[i] = wNf;
        diff[i] = wDiff;
        lost[i] = wLost;
        eqe[i] = collected;
    }

    /** Adds the coherent generation profile of the recorded absorber for one polarisation pass. */
    void profile(int i, double wgt, double entry, CoherentStack stack, DeviceEvaluator e) {
        double d = e.layerThickness(absorber);
        if (!depthSet) {
            for (int k = 0; k < DEPTH_POINTS; k++) {
                depth[k] = (k + 0.5) * d / DEPTH_POINTS;
            }
            depthSet = true;
        }
        double phi = m.flux[i];
        int c0 = m.compOfLayerFirst[absorber];
        int c1 = m.compOfLayerLast[absorber];
        for (int k = 0; k < DEPTH_POINTS; k++) {
            double x = depth[k];
            for (int c = c0; c <= c1; c++) {
                double lo = e.compOffset(c);
                double dc = e.compThickness(c);
                if (dc > 0 && x >= lo && x <= lo + dc && m.compKind[c] != DeviceModel.K_EFFECTIVE) {
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
    void hostLayer(int i, double wHost, double wQuench, DeviceEvaluator e) {
        if (absorber != m.host || !e.particlesOn() || !(e.height() > 0)) {
            return;
        }
        double rate = m.flux[i] * (wHost + wQuench) / e.height();
        for (int k = 0; k < DEPTH_POINTS; k++) {
            double x = depth[k];
            if (x >= e.offset() && x < e.offset() + e.height()) {
                gen[k] += rate;
            }
        }
    }

    Spectra build() {
        Map<String, double[]> byName = new LinkedHashMap<>();
        for (int j = 0; j < m.layerCount; j++) {
            if (j == 0 && m.incoherentGlass) {
                continue;
            }
            byName.put(m.study.stack().get(j).name(), layer[j]);
        }
        double[] g = gen.clone();
        for (int k = 0; k < g.length; k++) {
            g[k] *= TO_PER_CM3;
        }
        return new Spectra(m.lambda.clone(), m.flux.clone(), r, t, glass, byName, metal, sca, host, quench, nf, diff,
                lost, eqe, depth.clone(), g, m.study.stack().get(absorber).name());
    }
}
