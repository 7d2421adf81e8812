package org.fabspread.device;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import org.fabspread.model.ModelException;
import org.fabspread.study.ParticleLayer;
import org.junit.jupiter.api.Test;

/** Particles taller than their host stick out into the next layer (ParticleStage's class comment). */
class ProtrudingParticlesTest {

    /** The demo stack, ETL 30 nm host, D50 sampled; the placement and host as given. */
    private static DeviceModel model(String host, ParticleLayer.Placement placement) {
        DemoStudy d = new DemoStudy();
        d.host = host;
        d.placement = placement;
        d.normal("particles.diameter", 20, 3);
        return DeviceModel.of(d.build());
    }

    @Test
    void slicesHoldTheWholeParticleVolume() {
        // source: device-model.md section 4.3, n_A = θ/(π⟨ab⟩) with ⟨D²⟩ = D50² e^{2σ²}, σ² = ln(1 + CV²):
        // the slices together hold n_A⟨V⟩ per area, the volume of the spheres times their areal density
        DeviceModel m = model("etl", ParticleLayer.Placement.BACK);
        DeviceEvaluator e = m.newDeviceEvaluator();
        double d50 = 36;
        e.prepare(e.sampleVector(new double[] {d50}));
        ParticlePlacement p = e.placement();
        assertEquals(6, p.protrusion, 1e-12, "36 nm in 30 nm of ZnO sticks 6 nm into the ITO");
        assertEquals(36, p.height, 1e-12);
        double h = p.height;
        double nHost = e.particles().spectra().numberPerArea;
        double nSlice = e.particles().sliceSpectra().numberPerArea;
        double s2 = Math.log(1 + 0.2 * 0.2);
        double nA = 0.05 / (Math.PI * d50 * d50 / 4 * Math.exp(2 * s2));
        // the ensemble's n_A of each slice is the coverage it is given over π⟨ab⟩; its volume per area is
        // n_A,slice ⟨V⟩ t/h for a slice of height t
        assertEquals(nA, nHost * (h - p.protrusion) / h + nSlice * p.protrusion / h, 1e-9 * nA);
        // and the slice holds the cap's share of every particle (Bronshtein & Semendyayev, spherical segment)
        double r = h / 2;
        double cap = Math.PI * 6 * 6 * (3 * r - 6) / 3 / (4 * Math.PI * r * r * r / 3);
        assertEquals(nA * cap, nSlice * p.protrusion / h, 1e-9 * nA);
    }

    @Test
    void energyClosesAcrossTheInterface() {
        // source: device-model.md section 4.5: R + T + every absorbed and lost share = 1 at every wavelength,
        // here with the particles sticking out of the ZnO into the ITO (back) and into the absorber (front), and
        // out of the absorber into the ZnO in front of it (back)
        Object[][] cases = {{"etl", ParticleLayer.Placement.BACK, 37.0}, {"etl", ParticleLayer.Placement.FRONT, 41.0},
                {"absorber", ParticleLayer.Placement.BACK, 104.0}};
        for (Object[] c : cases) {
            DeviceModel m = model((String) c[0], (ParticleLayer.Placement) c[1]);
            Spectra s = m.spectra(new double[] {(double) c[2]});
            for (int i = 0; i < s.size(); i++) {
                assertEquals(0, s.closure(i), 1e-12, c[0] + " " + c[1] + " at " + s.wavelengthNm()[i] + " nm");
            }
        }
    }

    @Test
    void currentIsContinuousWhereTheParticlesStartToStickOut() {
        // common practice: a slice of vanishing height holding a vanishing share changes nothing, so the
        // outputs pass the host's thickness without a jump
        for (ParticleLayer.Placement pl : new ParticleLayer.Placement[] {ParticleLayer.Placement.BACK,
                ParticleLayer.Placement.FRONT}) {
            DeviceModel m = model("etl", pl);
            double[] in = new double[m.outputs().size()];
            double[] out = new double[m.outputs().size()];
            var ev = m.newEvaluator();
            ev.evaluate(new double[] {30 - 1e-7}, in);
            ev.evaluate(new double[] {30 + 1e-7}, out);
            for (int k = 0; k < in.length; k++) {
                assertEquals(in[k], out[k], 1e-6 * Math.max(1, Math.abs(in[k])), pl + " output " + k);
            }
        }
    }

    @Test
    void tallerThanHostAndNeighbourIsStillRefused() {
        // device-model.md section 4.3: a particle layer that does not fit is an input error; now only when it
        // would pass through the next layer too (ZnO 30 nm + absorber 100 nm behind it)
        DeviceModel m = model("etl", ParticleLayer.Placement.FRONT);
        var ev = m.newEvaluator();
        double[] o = new double[m.outputs().size()];
        ev.evaluate(new double[] {125}, o);
        assertTrue(o[0] > 0);
        ModelException ex = assertThrows(ModelException.class, () -> ev.evaluate(new double[] {131}, o));
        assertEquals("particle-layer-outside-host", ex.reason());
    }
}
