package org.fabspread.device;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.List;

import org.fabspread.particles.ParticleEnsemble;
import org.junit.jupiter.api.Test;

class ValidityEnvelopeTest {

    @Test
    void theMonolayerLimitIsHexagonalDiscPacking() {
        // source: Thue's theorem, L. Fejes Tóth, Lagerungen in der Ebene (1953): density π/√12 = 0.9068996821
        assertEquals(0.9068996821171089, ValidityEnvelope.MAX_MONOLAYER_COVERAGE, 1e-15);
        assertFalse(ValidityEnvelope.beyondMonolayer(0.90));
        assertTrue(ValidityEnvelope.beyondMonolayer(0.91));
    }

    @Test
    void theSizeParameterIsBohrenAndHuffmansDefinition() {
        // source: Bohren & Huffman (1983) §4.4, x = 2πNa/λ; 50 nm radius in N = 1.5 at 500 nm gives x = 0.3π
        assertEquals(0.3 * Math.PI, ValidityEnvelope.sizeParameter(50, 1.5, 500), 1e-15);
    }

    @Test
    void theLargestSemiAxisKeepsTheVolumeAndMatchesTheEnsembleHeight() {
        // derived: abc = (D/2)^3 with a = p b, c = q a; the ensemble's layer height is 2c (ParticleEnsemble javadoc)
        double d = 40;
        for (double[] pq : new double[][] {{1, 1}, {1, 2}, {1, 0.5}, {2, 1.5}}) {
            double p = pq[0];
            double q = pq[1];
            double a = 0.5 * d * Math.cbrt(p / q);
            double b = a / p;
            double c = q * a;
            assertEquals(Math.pow(d / 2, 3), a * b * c, 1e-9);
            assertEquals(Math.max(a, c), ValidityEnvelope.largestSemiAxis(d, p, q), 1e-12);
            double h = new ParticleEnsemble().setShape(d, 0, p, q, 0.05).thickness();
            assertEquals(2 * c, h, 1e-9, "p = " + p + ", q = " + q);
        }
    }

    private static DeviceModel model() {
        DemoStudy s = new DemoStudy();
        s.normal("particles.diameter", 20, 1).normal("particles.out_of_plane_aspect", 1, 0.01)
                .normal("particles.coverage", 0.05, 0.005);
        return DeviceModel.of(s.build());
    }

    private static EnvelopeStatus status(DeviceModel m, double d, double q, double coverage) {
        List<String> ids = m.inputIds();
        double[] x = m.nominalInputs();
        x[ids.indexOf("particles.diameter")] = d;
        x[ids.indexOf("particles.out_of_plane_aspect")] = q;
        x[ids.indexOf("particles.coverage")] = coverage;
        return m.envelopeJudge().status(x);
    }

    @Test
    void eachReasonIsFlaggedOnItsOwn() {
        DeviceModel m = model();
        assertTrue(m.nominalEnvelope().inside(), "20 nm Ag spheres at 5 % in 30 nm ZnO");
        // full Mie for spheres: no size limit; 28 nm fits the 30 nm film
        assertEquals(EnvelopeStatus.INSIDE, status(m, 28, 1, 0.05));
        // a 40 nm sphere in the 30 nm ZnO film
        assertEquals(List.of(EnvelopeReason.LARGER_THAN_FILM), status(m, 40, 1, 0.05).violated());
        // a prolate spheroid q = 0.5 (flat, c = a/2) of D = 28 nm: a = 14·2^(1/3) = 17.6 nm, x = 2π n a / 320 nm
        // exceeds 0.5 for any host index above 1.45 (ZnO near 320 nm has n about 2, from memory)
        assertEquals(List.of(EnvelopeReason.SIZE_PARAMETER), status(m, 28, 0.5, 0.05).violated());
        // monodisperse spheres: f = θ · (4/3 π r³) / (π r² · 2r) = 2θ/3 (derived); with CV 0.2 the ensemble's
        // moments raise it a little, so θ = 0.5 is beyond 0.3 and θ = 0.05 far inside
        assertEquals(List.of(EnvelopeReason.VOLUME_FRACTION), status(m, 20, 1, 0.5).violated());
        assertEquals(List.of(EnvelopeReason.VOLUME_FRACTION, EnvelopeReason.BEYOND_MONOLAYER),
                status(m, 20, 1, 0.95).violated());
        // coverage 0 is the planar device
        assertEquals(EnvelopeStatus.INSIDE, status(m, 40, 0.5, 0));
    }

    @Test
    void theTallyCountsEachSampleOnceAndEachReason() {
        DeviceModel m = model();
        EnvelopeJudge j = m.envelopeJudge();
        EnvelopeCounts.Tally t = new EnvelopeCounts.Tally();
        List<String> ids = m.inputIds();
        double[][] rows = {{20, 1, 0.05}, {40, 1, 0.05}, {20, 1, 0.95}, {28, 0.5, 0.05}};
        for (double[] r : rows) {
            double[] x = m.nominalInputs();
            x[ids.indexOf("particles.diameter")] = r[0];
            x[ids.indexOf("particles.out_of_plane_aspect")] = r[1];
            x[ids.indexOf("particles.coverage")] = r[2];
            j.tally(x, 0, t);
        }
        assertEquals(new EnvelopeCounts(4, 3, 1, 1, 1, 1), t.counts());
        assertEquals(new EnvelopeCounts(8, 6, 2, 2, 2, 2), t.counts().plus(t.counts()));
    }
}
