package org.fabspread.device;

import org.fabspread.particles.LossSplit;

/**
 * What a {@link ParticleOptics} gives the rest of the device model for one sample, per wavelength i and
 * polarisation pass: the effective particle layer's complex index N = n + ik, and the shares of its
 * absorptance (metal, scattering, useful and quenched host absorption, near field in the neighbour; indices
 * of {@link LossSplit}, summing to 1); and the unpolarised ensemble cross-sections per particle. A mutable
 * holder owned by {@link ParticleStage}; allocated once per evaluator.
 */
final class ParticleSpectra {
    /** Most polarisation passes (two in-plane axes). */
    static final int MAX_PASSES = 2;

    /** Polarisation passes of this sample: 1, or 2 for aligned particles with p ≠ 1 (R, T, A averaged). */
    int passes;
    /** [pass][i]: real part n of the effective layer's index. */
    final double[][] effectiveN;
    /** [pass][i]: imaginary part k ≥ 0 of the effective layer's index. */
    final double[][] effectiveK;
    /** [pass][part][i]: share of the effective layer's absorptance, part by {@link LossSplit} index. */
    final double[][][] share;
    /** [i]: unpolarised ⟨σ_abs,metal⟩ per particle, nm². */
    final double[] absorptionCrossSection;
    /** [i]: unpolarised ⟨σ_sca⟩ per particle, nm². */
    final double[] scatteringCrossSection;
    /** [i]: the particles' own share of scattered light in the forward hemisphere (full Mie series for spheres). */
    final double[] forwardShare;
    /** whether the fill read precomputed single-particle quantities (a table) rather than solving them. */
    boolean tabulated;
    /** particles per nm² of film. */
    double numberPerArea;

    ParticleSpectra(int wavelengths) {
        effectiveN = new double[MAX_PASSES][wavelengths];
        effectiveK = new double[MAX_PASSES][wavelengths];
        share = new double[MAX_PASSES][LossSplit.PARTS][wavelengths];
        absorptionCrossSection = new double[wavelengths];
        scatteringCrossSection = new double[wavelengths];
        forwardShare = new double[wavelengths];
    }
}
