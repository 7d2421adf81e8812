package org.fabspread.sampling;

import org.apache.commons.math3.random.SobolSequenceGenerator;
import org.apache.commons.rng.UniformRandomProvider;
import org.fabspread.study.AnalysisSettings;

/** The samplers: plain Monte Carlo, Latin hypercube and randomly shifted Sobol points. */
public final class PointSets {

    private PointSets() {
    }

    public static PointSet of(AnalysisSettings.Sampler sampler, int dimension, long size, long seed) {
        return switch (sampler) {
            case RANDOM -> new MonteCarlo(dimension, size);
            case LATIN_HYPERCUBE -> new LatinHypercube(dimension, size, seed);
            case SOBOL -> new ShiftedSobol(dimension, size, seed);
        };
    }

    /** Independent uniforms from the chunk stream. */
    public record MonteCarlo(int dimension, long size) implements PointSet {
        @Override public String name() { return "random"; }

        @Override
        public void point(long index, UniformRandomProvider chunkStream, double[] u) {
            for (int d = 0; d < dimension; d++) {
                u[d] = Streams.uniform(chunkStream);
            }
        }
    }

    /**
     * Latin hypercube (McKay, Beckman &amp; Conover, Technometrics 21, 239 (1979)): coordinate d of
     * point j is (π_d(j) + U)/n with π_d a permutation of 0..n−1 and U uniform from the chunk stream,
     * so each of the n strata of each marginal holds exactly one point.
     *
     * <p>The permutations are whole-sample properties. Storing them would take 4nk bytes (1.2 GB for
     * n = 10^7, k = 30), so each π_d is instead a keyed bijection evaluated on demand: a six-round
     * balanced Feistel network on the smallest even-bit domain 2^(2h) ≥ n with round keys derived from
     * (seed, d) (Luby &amp; Rackoff, SIAM J. Comput. 17, 373 (1988)), restricted to 0..n−1 by cycle walking
     * (Black &amp; Rogaway, CT-RSA 2002, LNCS 2271, 114). Memory O(k), any n, random access, and the
     * same permutation for any thread count. The permutation is pseudorandom rather than uniformly
     * drawn from all n! orders; the stratification is exact.
     */
    public static final class LatinHypercube implements PointSet {
        private static final int ROUNDS = 6;
        private final int dimension;
        private final long size;
        private final int halfBits;
        private final long mask;
        private final long[] keys;

        public LatinHypercube(int dimension, long size, long seed) {
            if (size < 1) {
                throw new IllegalArgumentException("Latin hypercube needs at least one point");
            }
            this.dimension = dimension;
            this.size = size;
            int bits = 64 - Long.numberOfLeadingZeros(Math.max(1, size - 1));
            this.halfBits = Math.max(1, (bits + 1) / 2);
            this.mask = (1L << halfBits) - 1;
            this.keys = new long[dimension * ROUNDS];
            for (int d = 0; d < dimension; d++) {
                for (int r = 0; r < ROUNDS; r++) {
                    keys[d * ROUNDS + r] = Streams.derive(seed, Streams.LHS_PERMUTATION, (long) d * ROUNDS + r);
                }
            }
        }

        @Override public int dimension() { return dimension; }
        @Override public long size() { return size; }
        @Override public String name() { return "latin-hypercube"; }

        /** π_d(j): the stratum of point j in dimension d. */
        public long stratum(int d, long j) {
            long x = j;
            do {
                x = feistel(d, x);
            } while (x >= size);
            return x;
        }

        private long feistel(int d, long x) {
            long left = x >>> halfBits;
            long right = x & mask;
            int base = d * ROUNDS;
            for (int r = 0; r < ROUNDS; r++) {
                long f = Streams.mix(right ^ keys[base + r]) & mask;
                long next = left ^ f;
                left = right;
                right = next;
            }
            return (left << halfBits) | right;
        }

        @Override
        public void point(long index, UniformRandomProvider chunkStream, double[] u) {
            double n = size;
            for (int d = 0; d < dimension; d++) {
                u[d] = StandardNormal.clamp((stratum(d, index) + chunkStream.nextDouble()) / n);
            }
        }
    }

    /**
     * Sobol points (Sobol', USSR Comput. Math. Math. Phys. 7, 86 (1967)) with the Joe &amp; Kuo
     * direction numbers (SIAM J. Sci. Comput. 30, 2635 (2008)) of Commons Math's
     * {@link SobolSequenceGenerator}, randomised by one uniform shift modulo 1 per dimension
     * (Cranley &amp; Patterson, SIAM J. Numer. Anal. 13, 904 (1976)) derived from the seed. Point j is
     * the Gray-code point x_j = ⊕ v_b over the set bits b of j ⊕ (j &gt;&gt; 1), computed directly, so any
     * index is reachable without stepping through the sequence. Index 0 (the origin of the plain
     * sequence) becomes the shift itself. Balance properties hold for sample sizes that are powers
     * of two. Up to 2^31 − 1 points, up to 1000 dimensions.
     */
    public static final class ShiftedSobol implements PointSet {
        static final int BITS = 52;
        private static final int MAX_LOG2 = 31;
        private static final double SCALE = 0x1.0p-52;
        private final int dimension;
        private final long size;
        private final long[] direction;
        private final double[] shift;

        public ShiftedSobol(int dimension, long size, long seed) {
            this(dimension, size, seed, true);
        }

        ShiftedSobol(int dimension, long size, long seed, boolean shifted) {
            if (size > Integer.MAX_VALUE) {
                throw new IllegalArgumentException("Sobol points are limited to 2^31 - 1 samples");
            }
            if (dimension < 1 || dimension > 1000) {
                throw new IllegalArgumentException("Sobol points need 1 to 1000 dimensions, got " + dimension);
            }
            this.dimension = dimension;
            this.size = size;
            this.direction = directionNumbers(dimension);
            this.shift = new double[dimension];
            if (shifted) {
                UniformRandomProvider rng = Streams.chunkStream(Streams.derive(seed, Streams.SOBOL_SHIFT, 0), 0);
                for (int d = 0; d < dimension; d++) {
                    shift[d] = rng.nextDouble();
                }
            }
        }

        /** v_b of each dimension as 52-bit integers, read off Commons Math: point 2^(b+1) − 1 has Gray code 2^b. */
        static long[] directionNumbers(int dimension) {
            SobolSequenceGenerator g = new SobolSequenceGenerator(dimension);
            long[] v = new long[dimension * MAX_LOG2];
            for (int b = 0; b < MAX_LOG2; b++) {
                double[] p = g.skipTo((int) ((1L << (b + 1)) - 1));
                for (int d = 0; d < dimension; d++) {
                    v[d * MAX_LOG2 + b] = (long) (p[d] * 0x1.0p52);
                }
            }
            return v;
        }

        @Override public int dimension() { return dimension; }
        @Override public long size() { return size; }
        @Override public String name() { return "sobol"; }

        /** Coordinate d of the unshifted point j, as a fraction. */
        double raw(int d, long j) {
            long gray = j ^ (j >>> 1);
            long x = 0;
            int base = d * MAX_LOG2;
            for (int b = 0; gray != 0; b++, gray >>>= 1) {
                if ((gray & 1) != 0) {
                    x ^= direction[base + b];
                }
            }
            return x * SCALE;
        }

        @Override
        public void point(long index, UniformRandomProvider chunkStream, double[] u) {
            for (int d = 0; d < dimension; d++) {
                double v = raw(d, index) + shift[d];
                if (v >= 1) {
                    v -= 1;
                }
                u[d] = StandardNormal.clamp(v);
            }
        }
    }
}
