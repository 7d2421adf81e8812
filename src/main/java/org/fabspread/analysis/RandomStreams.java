package org.fabspread.analysis;

import org.apache.commons.rng.UniformRandomProvider;
import org.apache.commons.rng.simple.RandomSource;
import org.fabspread.sampling.Streams;

/**
 * Independent random streams of the analyses, one per (seed, purpose, index), with the whole generator
 * state mixed by SplitMix64 ({@link Streams#derive}). A generator seeded with a short, nearly equal array
 * such as {seed, index} starts with correlated outputs across indices (with xoshiro256++ the second
 * draw of {@code nextInt(100)} was 0 for every index), which biased the first random orders of a
 * Shapley design and the first rows of each bootstrap resample.
 */
final class RandomStreams {

    private static final long GOLDEN = 0x9E3779B97F4A7C15L;

    private RandomStreams() {
    }

    static UniformRandomProvider of(long seed, long purpose, long index) {
        long a = Streams.derive(seed, purpose, index);
        return RandomSource.XO_RO_SHI_RO_128_PP.create(new long[] {a, Streams.mix(a ^ GOLDEN)});
    }
}
