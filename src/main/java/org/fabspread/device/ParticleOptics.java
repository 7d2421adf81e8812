package org.fabspread.device;

/**
 * The particle physics the device model plugs in: for one sample's particle inputs, the height of the
 * effective particle layer and, per wavelength, its index and the split of what it absorbs. The device
 * model owns everything else (the range checks naming the parameter, the placement in the host, the
 * transfer matrix, diffuse light, collection); an implementation owns only its physics and its scratch.
 * {@link EnsembleOptics} is the built-in one (quasi-static ensemble of ellipsoids, Maxwell Garnett or
 * Bruggeman). Implementations allocate nothing per call: the hot path calls both methods once per sample.
 *
 * <p>Calls come in this order for each sample: {@link #shape}, {@link #layerHeight}, then {@link #fill}
 * unless the caller still holds a fill for equal inputs (it caches by value; a fill must depend only on
 * the sample's fields).
 */
interface ParticleOptics {
    /**
     * Sets the sample's shape, size spread, coverage and metal (range-checked already).
     *
     * @throws IllegalArgumentException for values the physics refuses (reported as an out-of-range sample)
     */
    void shape(ParticleSample s);

    /** Height h of the effective particle layer for the last {@link #shape}, nm. */
    double layerHeight();

    /**
     * Fills {@code out} at every wavelength of the grid for sample {@code s}, whose neighbour distance and
     * media are now set: {@link ParticleSpectra#passes}, the effective index and the absorptance shares of
     * every pass, the unpolarised cross-sections, whether a table was read.
     */
    void fill(ParticleSample s, ParticleSpectra out);

    /**
     * Makes one evaluator's instance of a particle physics (instances hold scratch and are not shared
     * between threads). The study compiler picks the maker of a study ({@link ParticleSetup#optics}).
     */
    @FunctionalInterface
    interface Maker {
        ParticleOptics make(ParticleSetup setup, double[] lambda);
    }
}
