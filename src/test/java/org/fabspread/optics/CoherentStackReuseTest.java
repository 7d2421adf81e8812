package org.fabspread.optics;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;

import java.util.SplittableRandom;

import org.junit.jupiter.api.Test;

class CoherentStackReuseTest {

    @Test
    void weightedAbsorptionDoesNotDependOnEarlierCalls() {
        // common practice: a cache keyed by exact inputs returns exactly what a fresh evaluation gives
        double[] nr = {2.0, 1.9, 0.1};
        double[] ni = {0.01, 0.4, 3.5};
        double[] d = {120, 100, 100};
        double[] rates = {1e-3, -2e-3, 0.0, -0.0, 5e-4, -7e-4, 3e-3, 1e-2, -1e-2, 2e-2};
        CoherentStack used = new CoherentStack(3);
        SplittableRandom rnd = new SplittableRandom(9);
        for (int trial = 0; trial < 300; trial++) {
            double lam = 350 + 400 * rnd.nextDouble();
            used.solve(lam, 1.5, 3, nr, ni, d, 1.0, 0.0);
            double s = rates[rnd.nextInt(rates.length)];
            double w = used.absorbedWeighted(1, s);
            CoherentStack fresh = new CoherentStack(3);
            fresh.solve(lam, 1.5, 3, nr, ni, d, 1.0, 0.0);
            assertEquals(Double.doubleToRawLongBits(fresh.absorbedWeighted(1, s)), Double.doubleToRawLongBits(w),
                    "trial " + trial + ", s = " + s);
        }
    }


    @Test
    void reflectanceBehindALayerEqualsASeparateSolveBitForBit() {
        // common practice: a value reused from one solve must equal the value a second solve would give
        SplittableRandom rnd = new SplittableRandom(5);
        int n = 6;
        double[] nr = new double[n];
        double[] ni = new double[n];
        double[] d = new double[n];
        CoherentStack whole = new CoherentStack(n);
        CoherentStack part = new CoherentStack(n);
        for (int trial = 0; trial < 200; trial++) {
            for (int j = 0; j < n; j++) {
                nr[j] = 0.05 + 3 * rnd.nextDouble();
                ni[j] = trial % 7 == 0 ? 0 : 4 * rnd.nextDouble();
                d[j] = trial % 5 == 0 && j == 2 ? 0 : 200 * rnd.nextDouble();
            }
            double lam = 300 + 600 * rnd.nextDouble();
            // two thick metal films (e^{2πkd/λ} ≈ 2^340 each) make the sweep rescale on some trials
            if (trial % 3 == 0) {
                lam = 300;
                for (int j = n - 2; j < n; j++) {
                    nr[j] = 0.05;
                    ni[j] = 4;
                    d[j] = 2800;
                }
            }
            whole.solve(lam, 1.5, n, nr, ni, d, 1.0, 0.0);
            for (int j = 0; j < n; j++) {
                double nIn = 1 + 2 * rnd.nextDouble();
                int cnt = n - j;
                part.solve(lam, nIn, cnt, slice(nr, j), slice(ni, j), slice(d, j), 1.0, 0.0);
                assertEquals(part.reflectance(), whole.reflectanceBehind(j, nIn), 0.0, "trial " + trial + " layer " + j);
            }
        }
        // from layer 0 with the stack's own incident index: the stack's reflectance
        whole.solve(550, 1.5, n, nr, ni, d, 1.0, 0.0);
        assertEquals(whole.reflectance(), whole.reflectanceBehind(0, 1.5), 0.0);
        assertThrows(IndexOutOfBoundsException.class, () -> whole.reflectanceBehind(n, 1.5));
        assertThrows(IllegalArgumentException.class, () -> whole.reflectanceBehind(0, 0));
    }

    private static double[] slice(double[] a, int from) {
        double[] s = new double[a.length - from];
        System.arraycopy(a, from, s, 0, s.length);
        return s;
    }
}
