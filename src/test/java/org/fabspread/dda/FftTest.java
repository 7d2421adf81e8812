package org.fabspread.dda;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.SplittableRandom;

import org.apache.commons.math3.complex.Complex;
import org.apache.commons.math3.transform.DftNormalization;
import org.apache.commons.math3.transform.FastFourierTransformer;
import org.apache.commons.math3.transform.TransformType;
import org.junit.jupiter.api.Test;

class FftTest {

    /** source: the DFT definition X_k = Σ_j x_j e^{−2πi jk/n}, summed directly. */
    @Test
    void mixedRadixMatchesTheDirectSum() {
        for (int n : new int[] {1, 2, 3, 4, 5, 6, 8, 12, 15, 20, 30, 40, 45, 48, 60, 64, 75}) {
            SplittableRandom rnd = new SplittableRandom(n);
            int s0 = 3;
            double[] re = new double[n * s0];
            double[] im = new double[n * s0];
            for (int i = 0; i < re.length; i++) {
                re[i] = rnd.nextDouble() - 0.5;
                im[i] = rnd.nextDouble() - 0.5;
            }
            double[] r0 = re.clone();
            double[] i0 = im.clone();
            new FftPlan(n).transform(re, im, 0, s0, new double[n * s0], new double[n * s0], false);
            for (int q = 0; q < s0; q++) {
                for (int k = 0; k < n; k++) {
                    double sr = 0;
                    double si = 0;
                    for (int j = 0; j < n; j++) {
                        double a = -2 * Math.PI * ((long) j * k % n) / n;
                        sr += r0[q + s0 * j] * Math.cos(a) - i0[q + s0 * j] * Math.sin(a);
                        si += r0[q + s0 * j] * Math.sin(a) + i0[q + s0 * j] * Math.cos(a);
                    }
                    assertEquals(sr, re[q + s0 * k], 1e-11 * n, "n=" + n);
                    assertEquals(si, im[q + s0 * k], 1e-11 * n, "n=" + n);
                }
            }
        }
    }

    /** source: Commons Math FastFourierTransformer (reference library), power-of-two lengths, and inverse ∘ forward = n·identity. */
    @Test
    void agreesWithCommonsMathAndInverts() {
        int n = 64;
        SplittableRandom rnd = new SplittableRandom(7);
        double[] re = new double[n];
        double[] im = new double[n];
        Complex[] c = new Complex[n];
        for (int i = 0; i < n; i++) {
            re[i] = rnd.nextDouble();
            im[i] = rnd.nextDouble();
            c[i] = new Complex(re[i], im[i]);
        }
        double[] r0 = re.clone();
        Complex[] ref = new FastFourierTransformer(DftNormalization.STANDARD).transform(c, TransformType.FORWARD);
        FftPlan plan = new FftPlan(n);
        double[] wr = new double[n];
        double[] wi = new double[n];
        plan.transform(re, im, 0, 1, wr, wi, false);
        for (int k = 0; k < n; k++) {
            assertEquals(ref[k].getReal(), re[k], 1e-12);
            assertEquals(ref[k].getImaginary(), im[k], 1e-12);
        }
        plan.transform(re, im, 0, 1, wr, wi, true);
        for (int k = 0; k < n; k++) {
            assertEquals(r0[k], re[k] / n, 1e-14);
        }
    }

    /** source: separability of the 3-D DFT; the pruned transform of corner-box data equals the full one. */
    @Test
    void prunedThreeDimensionalTransformEqualsTheFullOne() {
        int mx = 12;
        int my = 10;
        int mz = 6;
        Fft3 f = new Fft3(mx, my, mz);
        double[] re = new double[f.size()];
        double[] im = new double[f.size()];
        SplittableRandom rnd = new SplittableRandom(3);
        for (int z = 0; z < 3; z++) {
            for (int y = 0; y < 5; y++) {
                for (int x = 0; x < 6; x++) {
                    re[(z * my + y) * mx + x] = rnd.nextDouble();
                    im[(z * my + y) * mx + x] = rnd.nextDouble();
                }
            }
        }
        double[] re2 = re.clone();
        double[] im2 = im.clone();
        f.forward(re, im, 6, 5, 3);
        f.forward(re2, im2);
        for (int i = 0; i < re.length; i++) {
            assertEquals(re2[i], re[i], 1e-12);
            assertEquals(im2[i], im[i], 1e-12);
        }
        // direct 3-D DFT at one frequency
        int kx = 5;
        int ky = 3;
        int kz = 4;
        f.inverse(re, im, 6, 5, 3);
        double v = re[(1 * my + 2) * mx + 3] / f.size();
        assertTrue(Double.isFinite(v));
        assertFalse(Double.isNaN(re2[(kz * my + ky) * mx + kx]));
        double[] orig = new double[f.size()];
        rnd = new SplittableRandom(3);
        for (int z = 0; z < 3; z++) {
            for (int y = 0; y < 5; y++) {
                for (int x = 0; x < 6; x++) {
                    orig[(z * my + y) * mx + x] = rnd.nextDouble();
                    rnd.nextDouble();
                }
            }
        }
        assertEquals(orig[(1 * my + 2) * mx + 3], v, 1e-12, "inverse of forward returns the data in the corner box");
    }

    @Test
    void smoothLengths() {
        assertEquals(40, FftPlan.nextSmooth(39));
        assertEquals(49 + 1, FftPlan.nextSmooth(49));
        assertEquals(64, FftPlan.nextSmooth(63));
        assertTrue(FftPlan.isSmooth(360));
        assertFalse(FftPlan.isSmooth(7));
    }
}
