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
    /** distance from the host's front face to the particle layer's front face, nm (≥ 0, inside the host). */
    double offset;
    /**
     * how far the layer sticks out of its host into the layer next to it ({@link StackLayout#sliceLayer}), nm;
     * 0 when it fits. The host then holds {@link #height} − protrusion of it.
     */
    double protrusion;
    /** share f_fwd of the scattered light heading into the absorber, when the study gives one. */
    double forward;
    /** whether the study gives f_fwd; otherwise the particle optics' own forward share is used. */
    boolean forwardGiven;

    /** whether the protrusion is into the layer in front of the host ({@code back} placement) rather than behind. */
    boolean protrudesFront;

    /** Depth of the particles' centres (the layer's mid-plane) from the host's front face, nm; &lt; 0 is possible in front. */
    double centre() {
        double c = offset + 0.5 * height;
        return protrudesFront ? c - protrusion : c;
    }

    void clear() {
        on = false;
        height = 0;
        offset = 0;
        protrusion = 0;
        protrudesFront = false;
        forward = 0;
        forwardGiven = false;
    }

    /**
     * Places a layer of height {@link #height} inside its host of thickness hostD (nm from the host's front
     * face), by the study's placement; a layer that does not fit is a model exception naming the offset or
     * the diameter. Inside the rounding tolerance it is snapped onto the host. With {@code room} ≥ 0 (the
     * thickness of the layer next to the host on the side the placement leaves open: behind it for
     * {@code front} and an offset, in front of it for {@code back}) a layer taller than what the host leaves
     * sticks out into that layer by {@link #protrusion}, which must stay below {@code room}; with a negative
     * {@code room} it does not fit.
     */
    void placeInHost(ParticleLayer p, ParticleSlots slots, double[] v, double hostD, String hostName, double room) {
        double at = switch (p.placement()) {
            case FRONT -> 0;
            case BACK -> hostD - height;
            case OFFSET -> ParameterVector.value(v, slots.offset(), 0);
        };
        double tol = 1e-9 * Math.max(1, hostD);
        boolean fits = at >= -tol && at + height <= hostD + tol;
        if (!fits && room >= 0 && (at >= -tol || p.placement() == ParticleLayer.Placement.BACK)) {
            double out = p.placement() == ParticleLayer.Placement.BACK ? -at : at + height - hostD;
            if (out < room && height - out > 0) {
                protrusion = out;
                protrudesFront = p.placement() == ParticleLayer.Placement.BACK;
                offset = p.placement() == ParticleLayer.Placement.BACK ? 0 : Math.max(0, at);
                return;
            }
        }
        if (!fits) {
            int slot = p.placement() == ParticleLayer.Placement.OFFSET && slots.offset() >= 0
                    ? slots.offset() : slots.diameter();
            throw new InputException("particle-layer-outside-host", slot, String.format(Locale.ROOT,
                    "particle layer (offset %.4g nm, height %.4g nm) does not fit inside host layer %s (%.4g nm)",
                    at, height, hostName, hostD));
        }
        offset = Math.max(0, Math.min(at, hostD - height));
    }
}
