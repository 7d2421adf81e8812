package org.fabspread.device;

/**
 * One sample's particle inputs, as {@link ParticleStage} hands them to a {@link ParticleOptics}: the shape,
 * size spread, coverage and metal (range-checked, from {@link ParticleSlots}), the quenching distance, the
 * distance to a neighbouring absorber and the permittivities of the host and the neighbour on the grid
 * (with the sample's n shifts and k scales). A mutable holder, reused for every sample of one evaluator.
 */
final class ParticleSample {
    /** median volume-equivalent diameter D, nm (&gt; 0). */
    double diameter;
    /** coefficient of variation of the lognormal size spread (≥ 0). */
    double sizeCv;
    /** in-plane aspect ratio p = a/b (≥ 1). */
    double inPlaneAspect;
    /** out-of-plane aspect ratio q = c/a (&gt; 0). */
    double outOfPlaneAspect;
    /** areal coverage θ in [0, 1). */
    double coverage;
    /** free-electron plasma energy, eV. */
    double plasmaEnergy;
    /** bulk damping, eV. */
    double bulkDamping;
    /** Fermi velocity, m/s. */
    double fermiVelocity;
    /** surface-scattering constant A. */
    double surfaceScattering;
    /** distance from a metal surface within which host absorption is quenched, nm (0 outside an absorber). */
    double quenchDistance;
    /** distance from the particle centres to the neighbouring absorber, nm (used only with {@link #hasNeighbour}). */
    double neighbourDistance;
    /** whether a neighbouring absorber takes the far half-space. */
    boolean hasNeighbour;
    /** per wavelength: Re ε and Im ε of the host (Im as n, k give it: may be &lt; 0 only by rounding). */
    final double[] hostEpsRe;
    final double[] hostEpsIm;
    /** per wavelength: Im ε of the neighbouring absorber (0 without one). */
    final double[] neighbourEpsIm;

    /** the named shape's parameters (nm), in {@link ParticleSlots#shape} order (empty without a shape). */
    final double[] shapeValues;

    ParticleSample(int wavelengths) {
        this(wavelengths, 0);
    }

    ParticleSample(int wavelengths, int shapeParameters) {
        shapeValues = new double[shapeParameters];
        hostEpsRe = new double[wavelengths];
        hostEpsIm = new double[wavelengths];
        neighbourEpsIm = new double[wavelengths];
    }
}
