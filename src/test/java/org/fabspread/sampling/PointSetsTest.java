package org.fabspread.sampling;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertNotEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import org.apache.commons.math3.random.SobolSequenceGenerator;
import org.apache.commons.rng.UniformRandomProvider;
import org.fabspread.study.AnalysisSettings;
import org.junit.jupiter.api.Test;

class PointSetsTest {

    @Test
    void latinHypercubeHitsEveryStratumOnceInEveryDimension() {
        // source: McKay, Beckman & Conover, Technometrics 21, 239 (1979): one point per stratum per input
        for (long n : new long[] {1, 2, 7, 64, 1000, 4099}) {
            PointSet lhs = PointSets.of(AnalysisSettings.Sampler.LATIN_HYPERCUBE, 3, n, 17);
            int[][] hits = new int[3][(int) n];
            double[] u = new double[3];
            int chunk = 256;
            for (long j = 0; j < n; j++) {
                UniformRandomProvider rng = Streams.chunkStream(17, j / chunk);
                // position the chunk stream as the runner does: earlier points of the chunk drew first
                for (long k = j - j % chunk; k < j; k++) {
                    lhs.point(k, rng, u);
                }
                lhs.point(j, rng, u);
                for (int d = 0; d < 3; d++) {
                    assertTrue(u[d] > 0 && u[d] < 1);
                    hits[d][(int) Math.floor(u[d] * n)]++;
                }
            }
            for (int d = 0; d < 3; d++) {
                for (int s = 0; s < n; s++) {
                    assertEquals(1, hits[d][s], "n=" + n + " dim " + d + " stratum " + s);
                }
            }
        }
    }

    @Test
    void latinHypercubePermutationsDifferBetweenDimensionsAndSeeds() {
        PointSets.LatinHypercube a = new PointSets.LatinHypercube(2, 1000, 1);
        PointSets.LatinHypercube b = new PointSets.LatinHypercube(2, 1000, 2);
        int same01 = 0;
        int sameSeeds = 0;
        for (long j = 0; j < 1000; j++) {
            same01 += a.stratum(0, j) == a.stratum(1, j) ? 1 : 0;
            sameSeeds += a.stratum(0, j) == b.stratum(0, j) ? 1 : 0;
        }
        // common practice: two independent random permutations of 1000 share about one fixed point
        assertTrue(same01 < 10 && sameSeeds < 10, same01 + " " + sameSeeds);
        // a size of 10^7 needs no per-point storage
        PointSets.LatinHypercube big = new PointSets.LatinHypercube(30, 10_000_000L, 5);
        long s = big.stratum(29, 9_999_999L);
        assertTrue(s >= 0 && s < 10_000_000L);
    }

    @Test
    void sobolFirstPointsAreThePublishedSequence() {
        // from memory (Bratley & Fox, ACM TOMS 14, 88 (1988); Joe & Kuo, ACM TOMS 29, 49 (2003)):
        // points 1..5 in 2 dimensions
        double[][] expected = {{0.5, 0.5}, {0.75, 0.25}, {0.25, 0.75}, {0.375, 0.375}, {0.875, 0.875}};
        SobolSequenceGenerator g = new SobolSequenceGenerator(2);
        g.nextVector();
        PointSets.ShiftedSobol plain = new PointSets.ShiftedSobol(2, 64, 0, false);
        // cross-check from the definition: dimension 1 has m_k = 1 (v_k = 2^-k), dimension 2 the
        // polynomial x + 1 with m_1 = 1: m_k = 2 m_{k−1} XOR m_{k−1}; point j = XOR of v_b over the
        // bits b of its Gray code j XOR (j >> 1)
        long[] m2 = new long[8];
        m2[1] = 1;
        for (int k = 2; k < 8; k++) {
            m2[k] = (2 * m2[k - 1]) ^ m2[k - 1];
        }
        for (int j = 1; j <= 5; j++) {
            assertArrayEquals(expected[j - 1], g.nextVector(), 0.0);
            long gray = j ^ (j >> 1);
            long a1 = 0;
            long a2 = 0;
            for (int b = 1; b < 8; b++) {
                if (((gray >> (b - 1)) & 1) != 0) {
                    a1 ^= 1L << (8 - b);
                    a2 ^= m2[b] << (8 - b);
                }
            }
            double x1 = a1 / 256.0;
            double x2 = a2 / 256.0;
            assertEquals(expected[j - 1][0], x1, 0.0);
            assertEquals(expected[j - 1][1], x2, 0.0);
            assertEquals(expected[j - 1][0], plain.raw(0, j), 0.0);
            assertEquals(expected[j - 1][1], plain.raw(1, j), 0.0);
        }
    }

    @Test
    void sobolDirectEvaluationEqualsCommonsSequenceInManyDimensions() {
        SobolSequenceGenerator g = new SobolSequenceGenerator(12);
        PointSets.ShiftedSobol plain = new PointSets.ShiftedSobol(12, 4096, 0, false);
        for (int j = 0; j < 4096; j++) {
            double[] ref = g.nextVector();
            for (int d = 0; d < 12; d++) {
                assertEquals(ref[d], plain.raw(d, j), 0.0, "point " + j + " dim " + d);
            }
        }
        double[] big = new SobolSequenceGenerator(12).skipTo(1_234_567_890);
        for (int d = 0; d < 12; d++) {
            assertEquals(big[d], plain.raw(d, 1_234_567_890L), 0.0);
        }
    }

    @Test
    void shiftedSobolStaysBalancedAndInsideTheOpenCube() {
        int n = 1024;
        PointSet s = PointSets.of(AnalysisSettings.Sampler.SOBOL, 3, n, 99);
        double[] u = new double[3];
        int[][] halves = new int[3][16];
        for (int j = 0; j < n; j++) {
            s.point(j, null, u);
            for (int d = 0; d < 3; d++) {
                assertTrue(u[d] > 0 && u[d] < 1);
                halves[d][(int) (u[d] * 16)]++;
            }
        }
        // source: Cranley & Patterson, SIAM J. Numer. Anal. 13, 904 (1976): a shift modulo 1 keeps the
        // (0, m, s)-net balance of the first 2^m points in each one-dimensional projection
        for (int d = 0; d < 3; d++) {
            for (int b = 0; b < 16; b++) {
                assertEquals(n / 16, halves[d][b]);
            }
        }
        double[] v = new double[3];
        PointSets.of(AnalysisSettings.Sampler.SOBOL, 3, n, 100).point(0, null, v);
        s.point(0, null, u);
        assertNotEquals(u[0], v[0], "the shift depends on the seed");
    }

    @Test
    void monteCarloDrawsFromTheChunkStream() {
        PointSet mc = PointSets.of(AnalysisSettings.Sampler.RANDOM, 2, 10, 1);
        double[] a = new double[2];
        double[] b = new double[2];
        mc.point(0, Streams.chunkStream(5, 3), a);
        mc.point(0, Streams.chunkStream(5, 3), b);
        assertArrayEquals(a, b, 0.0);
        mc.point(0, Streams.chunkStream(5, 4), b);
        assertNotEquals(a[0], b[0]);
    }
}
