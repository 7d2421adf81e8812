package org.fabspread.sampling;

import org.apache.commons.rng.UniformRandomProvider;
import org.apache.commons.rng.simple.RandomSource;

/**
 * Derived random streams: every stream is a function of the master seed and a (purpose, index)
 * pair, never of the thread that uses it. Seeds are mixed with the SplitMix64 finaliser (Steele, Lea
 * &amp; Flood, "Fast splittable pseudorandom number generators", OOPSLA 2014); the streams are
 * xoroshiro128++ (Blackman &amp; Vigna, ACM TOMS 47, 36 (2021)) from Commons RNG.
 */
public final class Streams {

    /** Purpose tags keep streams for different uses apart. */
    static final long CHUNK = 1;
    static final long LHS_PERMUTATION = 2;
    static final long SOBOL_SHIFT = 3;

    private static final long GOLDEN = 0x9E3779B97F4A7C15L;

    private Streams() {
    }

    /** The SplitMix64 output function: a bijective 64-bit mixer. */
    public static long mix(long z) {
        z = (z ^ (z >>> 30)) * 0xBF58476D1CE4E5B9L;
        z = (z ^ (z >>> 27)) * 0x94D049BB133111EBL;
        return z ^ (z >>> 31);
    }

    /** A 64-bit key derived from (seed, purpose, index). */
    public static long derive(long seed, long purpose, long index) {
        long s = mix(seed + GOLDEN * purpose);
        return mix(s + GOLDEN * (index + 1));
    }

    /** The random stream of chunk {@code chunk}. */
    public static UniformRandomProvider chunkStream(long seed, long chunk) {
        long a = derive(seed, CHUNK, chunk);
        long b = mix(a + GOLDEN);
        return RandomSource.XO_RO_SHI_RO_128_PP.create(new long[] {a, b});
    }

    /** A uniform in [2^-53, 1 − 2^-53] from a stream (never exactly 0 or 1). */
    public static double uniform(UniformRandomProvider rng) {
        return StandardNormal.clamp(rng.nextDouble());
    }
}
