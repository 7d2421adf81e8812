package org.fabspread.device;

import java.util.Locale;

import org.fabspread.study.ParticleLayer;

/**
 * Where one sample's particle layer sits: filled by {@link ParticleStage} or {@link EnhancementStage}, read
 * by {@link OpticsStage} (the host split) and {@link CollectionStage} (η over the layer). A mutable holder,
 * one per evaluator.
 */
final class ParticlePlacement {
    /** whether the effective layer is in the transfer matrix (built-in optics at coverage &gt; 0). */
    boolean on;
    /** height h of the particle layer, nm (0 without particles). */
    double height;
    /** distance from the host's front face to the particle layer's front face, nm. */
    double offset;
    /** share f_fwd of the scattered light heading into the absorber, when the study gives one. */
    double forward;
    /** whether the study gives f_fwd; otherwise the particle optics' own forward share is used. */
    boolean forwardGiven;

    void clear() {
        on = false;
        height = 0;
        offset = 0;
        forward = 0;
        forwardGiven = false;
    }

    /**
     * Places a layer of height {@link #height} inside its host of thickness hostD (nm from the host's front
     * face), by the study's placement; a layer that does not fit is a model exception naming the offset or
     * the diameter. Inside the rounding tolerance it is snapped onto the host.
     */
    void placeInHost(ParticleLayer p, ParticleSlots slots, double[] v, double hostD, String hostName) {
        double at = switch (p.placement()) {
            case FRONT -> 0;
            case BACK -> hostD - height;
            case OFFSET -> ParameterVector.value(v, slots.offset(), 0);
        };
        double tol = 1e-9 * Math.max(1, hostD);
        if (!(at >= -tol) || at + height > hostD + tol) {
            int slot = p.placement() == ParticleLayer.Placement.OFFSET && slots.offset() >= 0
                    ? slots.offset() : slots.diameter();
            throw new InputException("particle-layer-outside-host", slot, String.format(Locale.ROOT,
                    "particle layer (offset %.4g nm, height %.4g nm) does not fit inside host layer %s (%.4g nm)",
                    at, height, hostName, hostD));
        }
        offset = Math.max(0, Math.min(at, hostD - height));
    }
}
