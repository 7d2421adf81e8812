package org.fabspread.device;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.SplittableRandom;

import org.junit.jupiter.api.Test;

class LambertianSlabFastTest {

    @Test
    void fixedCostE3AgreesWithTheSeriesAndContinuedFraction() {
        // source: Abramowitz & Stegun, Handbook of Mathematical Functions (1964), 5.1.11 and 5.1.14 (the
        // fixed-cost form) against 5.1.12 / 5.1.22 as summed by LambertianSlab.expIntegral
        SplittableRandom rnd = new SplittableRandom(3);
        double worst = 0;
        for (int i = 0; i < 20_000; i++) {
            double x = i < 10_000 ? Math.pow(10, -12 + 12 * rnd.nextDouble()) : rnd.nextDouble();
            if (x == 0) {
                continue;
            }
            double ref = LambertianSlab.expIntegral(3, x);
            worst = Math.max(worst, Math.abs(LambertianSlab.e3Small(x) / ref - 1));
        }
        assertTrue(worst < 1e-14, "worst relative difference " + worst);
        // common practice: the public transmission switches method at x = 1 without a visible step
        double below = LambertianSlab.diffuseTransmission(1.0);
        double above = LambertianSlab.diffuseTransmission(Math.nextUp(1.0));
        assertEquals(below, above, 1e-14);
        assertEquals(2 * LambertianSlab.expIntegral(3, 1.0), below, 1e-15);
    }
}
