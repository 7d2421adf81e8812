package org.fabspread.device;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;

import java.util.ArrayList;
import java.util.List;

import org.fabspread.model.Evaluator;
import org.fabspread.particles.LossSplit;
import org.junit.jupiter.api.Test;

/**
 * The device model's side of the {@link ParticleOptics} contract, held with a stand-in particle physics
 * (a fixed effective index and a fixed split of the effective layer's absorptance): whatever physics plugs
 * in, the device puts its index into the transfer matrix, splits the absorptance by its shares, closes the
 * energy balance, averages its polarisation passes and asks for a new fill only when a particle input
 * changes.
 */
class ParticleOpticsContractTest {
    /** Metal, scattering, useful host, quenched host, near field: an arbitrary split that sums to 1. */
    private static final double[] SPLIT = {0.3, 0.25, 0.2, 0.15, 0.1};

    /** The stand-in physics: N = 2 + 0.3i at every wavelength, {@link #SPLIT}, a 16 nm layer; counts its fills. */
    private static final class FixedOptics implements ParticleOptics {
        private final int passes;
        int fills;

        FixedOptics(int passes) {
            this.passes = passes;
        }

        @Override
        public void shape(ParticleSample s) {
            // the stand-in's index and split do not depend on the shape
        }

        @Override
        public double layerHeight() {
            return 16;
        }

        @Override
        public void fill(ParticleSample s, ParticleSpectra out) {
            fills++;
            out.passes = passes;
            for (int pass = 0; pass < passes; pass++) {
                for (int i = 0; i < s.hostEpsRe.length; i++) {
                    out.effectiveN[pass][i] = 2.0;
                    out.effectiveK[pass][i] = 0.3;
                    for (int k = 0; k < LossSplit.PARTS; k++) {
                        out.share[pass][k][i] = SPLIT[k];
                    }
                }
            }
        }
    }

    private static DeviceModel with(DemoStudy d, List<FixedOptics> made, int passes) {
        CompiledDevice c = StudyCompiler.compile(d.build(), true);
        return DeviceModel.of(c.withParticles(c.particles().withOptics((setup, lambda) -> {
            FixedOptics o = new FixedOptics(passes);
            made.add(o);
            return o;
        })));
    }

    @Test
    void theDeviceClosesEnergyAndSplitsByThePhysicsShares() {
        // source: device-model.md section 4.5: the effective layer's absorptance is split in proportion to the
        // particle physics's rates, and R + T + every absorbed and lost share = 1 at every wavelength
        DeviceModel m = with(new DemoStudy(), new ArrayList<>(), 1);
        Spectra s = m.nominalSpectra();
        for (int i = 0; i < s.size(); i++) {
            assertEquals(0, s.closure(i), 1e-12, "energy closes at " + s.wavelengthNm()[i] + " nm");
            double total = s.particleMetal()[i] + s.particleScattering()[i] + s.particleHost()[i]
                    + s.particleQuenched()[i] + s.particleNearField()[i];
            assertEquals(SPLIT[LossSplit.METAL], s.particleMetal()[i] / total, 1e-12);
            assertEquals(SPLIT[LossSplit.SCATTERING], s.particleScattering()[i] / total, 1e-12);
            assertEquals(SPLIT[LossSplit.HOST_USEFUL], s.particleHost()[i] / total, 1e-12);
            assertEquals(SPLIT[LossSplit.HOST_QUENCHED], s.particleQuenched()[i] / total, 1e-12);
            assertEquals(SPLIT[LossSplit.NEIGHBOUR], s.particleNearField()[i] / total, 1e-12);
            // the scattered light is all accounted for as diffuse light absorbed or lost
            assertEquals(s.particleScattering()[i], s.diffuseAbsorbed()[i] + s.scatteringLost()[i], 1e-12);
        }
    }

    @Test
    void twoEqualPolarisationPassesAverageToOne() {
        // common practice: unpolarised light is the mean of the two polarisations; equal passes give the single one
        double[] one = with(new DemoStudy(), new ArrayList<>(), 1).evaluate(new double[0]);
        double[] two = with(new DemoStudy(), new ArrayList<>(), 2).evaluate(new double[0]);
        assertArrayEquals(one, two, 1e-12);
    }

    @Test
    void aFillIsReusedUntilAParticleInputChanges() {
        // common practice: a cache keyed by every input reuses results exactly and refills on any change
        DemoStudy d = new DemoStudy();
        d.normal("stack.absorber.thickness", 100, 5).normal("particles.coverage", 0.05, 0.01);
        List<FixedOptics> made = new ArrayList<>();
        DeviceModel m = with(d, made, 1);
        Evaluator e = m.newEvaluator();
        FixedOptics o = made.get(made.size() - 1);
        double[] x = m.nominalInputs();
        double[] y = new double[m.outputs().size()];
        e.evaluate(x, y);
        e.evaluate(x, y);
        assertEquals(1, o.fills, "the same sample twice: one fill");
        x[m.inputIds().indexOf("stack.absorber.thickness")] = 104;
        e.evaluate(x, y);
        assertEquals(1, o.fills, "the absorber's thickness is no input of the particle optics");
        x[m.inputIds().indexOf("particles.coverage")] = 0.06;
        e.evaluate(x, y);
        assertEquals(2, o.fills, "a new coverage: a new fill");
    }
}
