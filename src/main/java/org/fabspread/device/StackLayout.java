package org.fabspread.device;

/**
 * The stack as the transfer matrix sees it. The study's layers (index j) become computational layers
 * (index c): an incoherent first layer (the glass) is left out of the coherent solve, and the particles'
 * host splits into a front part, the effective particle layer and a back part ({@link #KIND_HOST_FRONT},
 * {@link #KIND_EFFECTIVE}, {@link #KIND_HOST_BACK}); every other layer is one {@link #KIND_PLAIN} layer.
 * Without particles {@link #host}, {@link #effective}, {@link #diffuseAbsorber} and {@link #neighbour} are −1.
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
 */
record StackLayout(int layers, int[] bucket, boolean[] absorber, double[] minN, boolean incoherentGlass,
                   int firstCoherent, int compCount, int[] compLayer, int[] compKind, int[] compFirst,
                   int[] compLast, int host, int effective, int diffuseAbsorber, int neighbour,
                   boolean neighbourBehind) {
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

    /** Whether the stack holds a particle layer. */
    boolean hasParticles() {
        return host >= 0;
    }
}
