package org.fabspread.dda;

/** The tabulated single-particle quantities, per in-plane polarisation and wavelength. */
public enum Quantity {
    /** C_ext (nm²) */
    EXTINCTION,
    /** C_abs (nm²) */
    ABSORPTION,
    /** C_sca (nm²) */
    SCATTERING,
    /** the forward-hemisphere part of C_sca (nm²) */
    FORWARD,
    /** mean |E|²/|E₀|² in the host shell */
    NEAR_FIELD,
    /** Re α along the field (nm³, p = ε₀ε_h α E₀) */
    ALPHA_RE,
    /** Im α along the field (nm³) */
    ALPHA_IM;

    static final int COUNT = values().length;
}
