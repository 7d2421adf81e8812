package org.fabspread.device;

/**
 * The stack as the transfer matrix sees it. The study's layers (index j) become computational layers
 * (index c): an incoherent first layer (the glass) is left out of the coherent solve, and the particles'
 * host splits into a front part, the effective particle layer and a back part ({@link #KIND_HOST_FRONT},
 * {@link #KIND_EFFECTIVE}, {@link #KIND_HOST_BACK}); every other layer is one {@link #KIND_PLAIN} layer.
 * Without particles {@link #host}, {@link #effective}, {@link #diffuseAbsorber} and {@link #neighbour} are −1.
 *
 * <p>A particle taller than what is left of its host sticks out into the layer next to it on the side the
 * placement leaves open (behind the host for {@code front} and an offset, in front of it for {@code back}): that
 * layer is split into a slice holding the protruding caps ({@link #KIND_SLICE}, the second part of the effective
 * layer, with that layer as its host) and the rest of it ({@link #KIND_SLICE_REST}). The slice has zero
 * thickness for particles that fit, and the solver passes the field across it exactly then
 * ({@link org.fabspread.optics.CoherentStack#passWhenEmpty}), so those samples keep their numbers bit for bit.
 * Without such a layer (the host touches the incoherent substrate or the exit medium) {@link #slice} and
 * {@link #sliceLayer} are −1.
 *
 * @param layers           number of study layers
 * @param bucket           loss bucket of each layer ({@link #ABSORBER}, {@link #ELECTRODE}, ...)
 * @param absorber         whether each layer is an absorber
 * @param minN             smallest tabulated n of each layer over the grid (an n shift must keep n &gt; 0)
 * @param incoherentGlass  whether layer 0 is an incoherent substrate
 * @param firstCoherent    first layer in the coherent solve (1 with an incoherent substrate, else 0)
 * @param compCount        number of computational layers
 * @param compLayer        study layer of each computational layer
 * @param compKind         kind of each computational layer
 * @param compFirst        first computational layer of each study layer (−1 for the substrate)
 * @param compLast         last computational layer of each study layer (−1 for the substrate)
 * @param host             the particles' host layer
 * @param effective        the computational index of the effective particle layer
 * @param diffuseAbsorber  the absorber that receives the scattered light as diffuse light
 * @param neighbour        the absorber touching a non-absorbing host, which the near field reaches
 * @param neighbourBehind  whether that neighbour lies behind the host (a tie goes behind)
 * @param slice            the computational index of the slice of protruding caps (−1: none)
 * @param sliceLayer       the study layer holding that slice (−1: none)
 * @param sliceBehind      whether that layer lies behind the host
 */
record StackLayout(int layers, int[] bucket, boolean[] absorber, double[] minN, boolean incoherentGlass,
                   int firstCoherent, int compCount, int[] compLayer, int[] compKind, int[] compFirst,
                   int[] compLast, int host, int effective, int diffuseAbsorber, int neighbour,
                   boolean neighbourBehind, int slice, int sliceLayer, boolean sliceBehind) {
    /** Loss buckets of the layers. */
    static final int ABSORBER = 0;
    static final int ELECTRODE = 1;
    static final int TRANSPORT = 2;
    static final int SUBSTRATE = 3;
    /** Number of loss buckets. */
    static final int BUCKETS = 4;

    /** Kinds of computational layers. */
    static final int KIND_PLAIN = 0;
    static final int KIND_HOST_FRONT = 1;
    static final int KIND_EFFECTIVE = 2;
    static final int KIND_HOST_BACK = 3;
    static final int KIND_SLICE = 4;
    static final int KIND_SLICE_REST = 5;

    /** Whether computational layer c is part of the particle layer (the effective layer or the slice). */
    boolean particleComp(int c) {
        return compKind[c] == KIND_EFFECTIVE || compKind[c] == KIND_SLICE;
    }

    /** Whether the stack holds a particle layer. */
    boolean hasParticles() {
        return host >= 0;
    }
}
