package org.fabspread.study;

import java.nio.file.Path;

/**
 * The metal nanoparticle layer.
 *
 * <p>Shape: the volume-equivalent diameter D (lognormal within one device, median {@code diameter},
 * coefficient of variation {@code sizeCv}), the in-plane aspect ratio p = a/b &ge; 1 and the
 * out-of-plane aspect ratio q = c/a, with semi-axes a, b in the film plane and c normal to it:
 * a = (D/2)(p/q)^{1/3}, b = a/p, c = q a (so abc = (D/2)^3). A sphere has p = q = 1.
 *
 * <p>Placement: inside the host layer {@code host}; {@code offset} is the distance (nm) from the host
 * layer's front face (the side light enters) to the front face of the particle layer, whose thickness
 * is the height 2c of the median particle. {@code placement} FRONT means offset 0, BACK means flush
 * with the host's back face; OFFSET uses {@code offset}.
 *
 * @param metal            bundled metal material (ag-..., au-...)
 * @param coverage         areal coverage θ, fraction of the film area covered by particle projections
 * @param forwardFraction  share f_fwd of scattered light heading into the absorber; null when the study
 *                         leaves it out (the model then uses the particles' own forward-hemisphere share)
 * @param aligned          true: particles aligned in plane (one solve per polarisation); false: random in-plane orientation
 * @param mixingRule       effective-medium rule
 * @param enhancementTable optional user table of absorption enhancement (replaces built-in particle optics)
 * @param shape            a shape for the discrete-dipole path ({@code particles.shape}), or null: the
 *                         ellipsoid given by diameter and aspect ratios
 */
public record ParticleLayer(MaterialRef metal, String host, Placement placement, Parameter offset,
                            Parameter diameter, Parameter sizeCv, Parameter inPlaneAspect,
                            Parameter outOfPlaneAspect, Parameter coverage, Parameter forwardFraction,
                            boolean aligned, MixingRule mixingRule, MetalParameters metalParameters,
                            Path enhancementTable, ParticleShape shape) {

    /** A particle layer of ellipsoids (no {@code particles.shape}). */
    public ParticleLayer(MaterialRef metal, String host, Placement placement, Parameter offset,
                         Parameter diameter, Parameter sizeCv, Parameter inPlaneAspect,
                         Parameter outOfPlaneAspect, Parameter coverage, Parameter forwardFraction,
                         boolean aligned, MixingRule mixingRule, MetalParameters metalParameters,
                         Path enhancementTable) {
        this(metal, host, placement, offset, diameter, sizeCv, inPlaneAspect, outOfPlaneAspect, coverage,
                forwardFraction, aligned, mixingRule, metalParameters, enhancementTable, null);
    }

    public enum Placement { FRONT, BACK, OFFSET }

    public enum MixingRule { MAXWELL_GARNETT, BRUGGEMAN }
}
