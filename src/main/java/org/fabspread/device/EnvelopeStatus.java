package org.fabspread.device;

import java.util.ArrayList;
import java.util.List;

/**
 * One device's place with respect to the validity envelope: which {@link EnvelopeReason}s it violates.
 * Immutable. The per-sample counting path does not build these ({@link EnvelopeJudge#tally}); they serve the
 * nominal point ({@code check}) and the design map.
 *
 * @param sizeParameter   {@link EnvelopeReason#SIZE_PARAMETER}
 * @param volumeFraction  {@link EnvelopeReason#VOLUME_FRACTION}
 * @param largerThanFilm  {@link EnvelopeReason#LARGER_THAN_FILM}
 * @param beyondMonolayer {@link EnvelopeReason#BEYOND_MONOLAYER}
 */
public record EnvelopeStatus(boolean sizeParameter, boolean volumeFraction, boolean largerThanFilm,
                             boolean beyondMonolayer) {

    /** The status of a device inside the envelope (also a planar device). */
    public static final EnvelopeStatus INSIDE = new EnvelopeStatus(false, false, false, false);

    /** Whether no reason is violated. */
    public boolean inside() {
        return !sizeParameter && !volumeFraction && !largerThanFilm && !beyondMonolayer;
    }

    /** Whether reason {@code r} is violated. */
    public boolean violates(EnvelopeReason r) {
        return switch (r) {
            case SIZE_PARAMETER -> sizeParameter;
            case VOLUME_FRACTION -> volumeFraction;
            case LARGER_THAN_FILM -> largerThanFilm;
            case BEYOND_MONOLAYER -> beyondMonolayer;
        };
    }

    /** The violated reasons in declaration order (empty inside the envelope). */
    public List<EnvelopeReason> violated() {
        List<EnvelopeReason> out = new ArrayList<>();
        for (EnvelopeReason r : EnvelopeReason.values()) {
            if (violates(r)) {
                out.add(r);
            }
        }
        return List.copyOf(out);
    }
}
