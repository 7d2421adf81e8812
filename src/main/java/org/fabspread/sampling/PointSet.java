package org.fabspread.sampling;

import org.apache.commons.rng.UniformRandomProvider;

/**
 * A sampler: the point of the unit hypercube for each sample index. Whole-sample structure (Latin
 * hypercube strata, Sobol points) is a deterministic function of the seed and the index; the only
 * randomness drawn at sampling time comes from the stream of the index's chunk, consumed in sample
 * order. So a point depends on (seed, index) alone, whatever thread computes it. Implementations are
 * immutable, thread-safe and allocate nothing per point. Coordinates lie in [2^-53, 1 − 2^-53].
 */
public interface PointSet {

    int dimension();

    /** Number of points of the whole sample. */
    long size();

    /** Short name written to summaries and checkpoints. */
    String name();

    /**
     * Fills {@code u} with point {@code index}.
     *
     * @param chunkStream the stream of the chunk holding {@code index}, positioned after the draws of
     *                    the earlier points of that chunk
     */
    void point(long index, UniformRandomProvider chunkStream, double[] u);
}
