package org.fabspread.device;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertNotNull;
import static org.junit.jupiter.api.Assertions.assertNull;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.file.Path;
import java.util.SplittableRandom;

import org.fabspread.model.Evaluator;
import org.fabspread.sampling.StudyInputSpace;
import org.fabspread.study.Study;
import org.fabspread.study.StudyReader;
import org.junit.jupiter.api.Test;

/**
 * The tabulated particle optics ({@link SphereTable}) against the exact path ({@link DeviceModel#exact}) on
 * the demo study: the speed work may move results only within the stated tolerance.
 */
class TabulatedParticlesTest {
    static final Path DEMO = Path.of("demo-studies/pilot-line-inverted.yaml");
    /** Stated accuracy of the tabulated path: every current within 1e-4 relative of the exact one. */
    static final double TOLERANCE = 1e-4;

    @Test
    void demoStudyWithinToleranceOfTheExactPath() {
        // common practice: a speed-up is held to the reference implementation over many random inputs
        Study study = StudyReader.read(DEMO);
        DeviceModel fast = DeviceModel.of(study);
        DeviceModel exact = DeviceModel.exact(study);
        assertNotNull(fast.sphereTable(), "the demo's spheres qualify for the table");
        assertNull(exact.sphereTable());
        StudyInputSpace space = StudyInputSpace.of(study);
        DeviceEvaluator ef = fast.newDeviceEvaluator();
        DeviceEvaluator ee = exact.newDeviceEvaluator();
        SplittableRandom rnd = new SplittableRandom(20261201);
        int k = space.dimension();
        double[] u = new double[k];
        double[] x = new double[k];
        int nOut = fast.outputs().size();
        double[] of = new double[nOut];
        double[] oe = new double[nOut];
        double worstJsc = 0;
        double worstAny = 0;
        int tabulated = 0;
        int samples = 600;
        for (int s = 0; s < samples; s++) {
            for (int i = 0; i < k; i++) {
                // every tenth sample takes the particle inputs from their far tails (|z| ≈ 4.75)
                boolean tail = s % 10 == 0 && space.ids().get(i).startsWith("particles.");
                u[i] = tail ? (rnd.nextBoolean() ? 1e-6 : 1 - 1e-6) : rnd.nextDouble();
            }
            space.map(u, x);
            ef.evaluate(x, of);
            ee.evaluate(x, oe);
            tabulated += ef.particles().spectra().tabulated ? 1 : 0;
            assertFalse(ee.particles().spectra().tabulated);
            worstJsc = Math.max(worstJsc, Math.abs(of[fast.outputIndex("jsc")] / oe[fast.outputIndex("jsc")] - 1));
            for (int o = 0; o < nOut; o++) {
                // currents and fractions: relative to J_sc (losses are parts of the incident photon current)
                double scale = fast.outputs().get(o).unit().equals("mA/cm^2") ? oe[fast.outputIndex("jsc")] : Math.abs(oe[o]);
                worstAny = Math.max(worstAny, Math.abs(of[o] - oe[o]) / scale);
            }
        }
        System.out.printf("tabulated %d of %d samples; worst |dJsc/Jsc| %.2e, worst output %.2e%n", tabulated,
                samples, worstJsc, worstAny);
        assertEquals(samples, tabulated, "every sample of the demo lies inside the table");
        assertTrue(worstJsc < TOLERANCE, "J_sc within 1e-4 relative, worst " + worstJsc);
        assertTrue(worstAny < TOLERANCE, "every output within 1e-4, worst " + worstAny);
    }

    @Test
    void outsideTheTableTheExactPathGivesIdenticalResults() {
        // common practice: the fallback is the reference path itself, bit for bit
        Study study = StudyReader.read(DEMO);
        DeviceModel fast = DeviceModel.of(study);
        DeviceModel exact = DeviceModel.exact(study);
        DeviceEvaluator ef = fast.newDeviceEvaluator();
        DeviceEvaluator ee = exact.newDeviceEvaluator();
        double[] x = fast.nominalInputs();
        int d = fast.inputIds().indexOf("particles.diameter");
        x[d] = 0.5 * fast.sphereTable().minDiameter();
        double[] of = new double[fast.outputs().size()];
        double[] oe = new double[of.length];
        ef.evaluate(x, of);
        ee.evaluate(x, oe);
        assertFalse(ef.particles().spectra().tabulated);
        assertArrayEquals(oe, of, 0.0);
    }

    @Test
    void resultsDoNotDependOnWhatWasEvaluatedBefore() {
        // common practice: bit-identical results for the same inputs in any order and on any evaluator
        Study study = StudyReader.read(DEMO);
        DeviceModel m = DeviceModel.of(study);
        Evaluator a = m.newEvaluator();
        Evaluator b = m.newEvaluator();
        double[] x0 = m.nominalInputs();
        double[] x1 = x0.clone();
        for (int i = 0; i < x1.length; i++) {
            x1[i] *= 1.003;
        }
        double[] x2 = x0.clone();
        x2[m.inputIds().indexOf("particles.diameter")] = 0.4 * m.sphereTable().minDiameter();
        int n = m.outputs().size();
        double[] first = new double[n];
        double[] again = new double[n];
        double[] other = new double[n];
        double[] scratch = new double[n];
        a.evaluate(x1, first);
        a.evaluate(x0, scratch);
        a.evaluate(x2, scratch);
        a.evaluate(x1, again);
        b.evaluate(x1, other);
        assertArrayEquals(first, again, 0.0);
        assertArrayEquals(first, other, 0.0);
    }
}
