package org.fabspread.device;

/**
 * Why one sample lies outside the validity envelope of the device model's particle optics. Each reason
 * carries its key in {@code summary.json} and the sentence the report and {@code check} print.
 */
public enum EnvelopeReason {
    /**
     * The size parameter x = 2π n_h a_max / λ (a_max the largest semi-axis of the median particle, n_h the
     * host's index, λ the grid's shortest wavelength) exceeds {@link ValidityEnvelope#MAX_SIZE_PARAMETER}
     * for an approximation that holds only for small particles (quasi-static, dipole-only Mie, modified
     * long-wavelength). Full Mie theory for spheres has no size limit.
     */
    SIZE_PARAMETER("size_parameter", "size parameter beyond the small-particle approximation in use"),
    /**
     * The particle layer's volume fraction exceeds {@link ValidityEnvelope#MAX_VOLUME_FRACTION}, where
     * coupling between neighbours breaks the dilute effective-medium picture.
     */
    VOLUME_FRACTION("volume_fraction", "volume fraction beyond the effective-medium limit (neighbour coupling)"),
    /** The particle layer's height is larger than the film it sits in. */
    LARGER_THAN_FILM("larger_than_film", "particle larger than the film it sits in"),
    /** The projected-area coverage exceeds the densest monolayer, {@link ValidityEnvelope#MAX_MONOLAYER_COVERAGE}. */
    BEYOND_MONOLAYER("beyond_monolayer", "coverage beyond a monolayer");

    private final String key;
    private final String sentence;

    EnvelopeReason(String key, String sentence) {
        this.key = key;
        this.sentence = sentence;
    }

    /** The snake_case key of {@code summary.json}. */
    public String key() {
        return key;
    }

    /** The reason in words, lower case. */
    public String sentence() {
        return sentence;
    }
}
