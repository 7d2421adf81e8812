package org.fabspread.optics;

/**
 * The backward sweep of the characteristic-matrix method (Born &amp; Wolf, <i>Principles of Optics</i>,
 * ch. 1.6) shared by {@link CoherentStack} and {@link ObliqueStack}: the tangential fields (E, H) are
 * carried from the exit medium back to the incident medium one layer at a time. In each layer of
 * admittance η they are split into a forward and a backward wave, E = F + B and H = η (F − B)
 * (Macleod, <i>Thin-Film Optical Filters</i>, ch. 2), and each wave is moved across the layer by its
 * phase factor. A running power-of-two rescaling keeps thick absorbing stacks from overflowing; the
 * number of rescaling steps taken is {@link #exp}.
 *
 * <p>A mutable scratch object owned by one solver: its fields are the sweep's state and the last
 * layer's amplitudes, read by the owner after each call. Allocates nothing.
 */
final class FieldSweep {
    /** Rescaling step of the backward sweep: 2^400. */
    static final int SCALE_EXP = 400;
    private static final double SCALE_LIMIT = Math.scalb(1.0, SCALE_EXP);
    private static final double SCALE_DOWN = Math.scalb(1.0, -SCALE_EXP);

    /** Tangential E and H at the current interface (rescaled by 2^(−400·exp)). */
    double eRe;
    double eIm;
    double hRe;
    double hIm;
    /** Rescaling steps taken so far. */
    int exp;
    /** Of the layer crossed last: forward amplitude at its front face, backward amplitude at its back face. */
    double fRe;
    double fIm;
    double bRe;
    double bIm;
    /** Forward and backward amplitudes in the incident medium, set by {@link #split}. */
    double f0Re;
    double f0Im;
    double b0Re;
    double b0Im;

    /** Starts at the exit interface with a unit forward wave: E = 1, H = η<sub>exit</sub>. */
    void start(double etaExitRe, double etaExitIm) {
        eRe = 1;
        eIm = 0;
        hRe = etaExitRe;
        hIm = etaExitIm;
        exp = 0;
    }

    /**
     * Carries (E, H) from the back face of a layer to its front face.
     *
     * @param yRe Re η of the layer
     * @param yIm Im η of the layer
     * @param c   cos θ of the phase thickness θ = Re(β) d
     * @param s   sin θ
     * @param em  e<sup>−g</sup>, g = Im(β) d
     */
    void cross(double yRe, double yIm, double c, double s, double em) {
        // H / η
        final double inv = 1.0 / (yRe * yRe + yIm * yIm);
        final double qRe = (hRe * yRe + hIm * yIm) * inv;
        final double qIm = (hIm * yRe - hRe * yIm) * inv;
        // forward and backward amplitudes at the back face
        final double fbRe = 0.5 * (eRe + qRe);
        final double fbIm = 0.5 * (eIm + qIm);
        final double bdRe = 0.5 * (eRe - qRe);
        final double bdIm = 0.5 * (eIm - qIm);
        final double ep = 1 / em;      // e^{+g}
        // forward at the front face: F = Fb e^{g} e^{-iθ}
        final double fr = ep * (fbRe * c + fbIm * s);
        final double fi = ep * (fbIm * c - fbRe * s);
        // backward at the front face: Bd e^{-g} e^{iθ}
        final double br = em * (bdRe * c - bdIm * s);
        final double bi = em * (bdIm * c + bdRe * s);
        fRe = fr;
        fIm = fi;
        bRe = bdRe;
        bIm = bdIm;
        eRe = fr + br;
        eIm = fi + bi;
        final double dRe = fr - br;
        final double dIm = fi - bi;
        hRe = yRe * dRe - yIm * dIm;
        hIm = yRe * dIm + yIm * dRe;
        if (Math.max(Math.max(Math.abs(eRe), Math.abs(eIm)), Math.max(Math.abs(hRe), Math.abs(hIm))) > SCALE_LIMIT) {
            eRe *= SCALE_DOWN;
            eIm *= SCALE_DOWN;
            hRe *= SCALE_DOWN;
            hIm *= SCALE_DOWN;
            exp++;
        }
    }

    /**
     * Sets the forward and backward amplitudes of a layer of zero thickness from (E, H) at the current
     * interface without carrying them anywhere: (E, H) stay exactly as they are, which is what crossing a
     * layer of zero thickness means (the characteristic matrix is the identity), without the rounding of
     * splitting and recombining the waves.
     */
    void passEmpty(double yRe, double yIm) {
        final double inv = 1.0 / (yRe * yRe + yIm * yIm);
        final double qRe = (hRe * yRe + hIm * yIm) * inv;
        final double qIm = (hIm * yRe - hRe * yIm) * inv;
        fRe = 0.5 * (eRe + qRe);
        fIm = 0.5 * (eIm + qIm);
        bRe = 0.5 * (eRe - qRe);
        bIm = 0.5 * (eIm - qIm);
    }

    /** Splits (E, H) in the incident medium of real admittance η<sub>0</sub>: F0, B0 = (E ± H/η<sub>0</sub>)/2. */
    void split(double eta0) {
        f0Re = 0.5 * (eRe + hRe / eta0);
        f0Im = 0.5 * (eIm + hIm / eta0);
        b0Re = 0.5 * (eRe - hRe / eta0);
        b0Im = 0.5 * (eIm - hIm / eta0);
    }

    /** 2<sup>−400·steps</sup>: undoes {@code steps} rescalings. */
    static double unscale(int steps) {
        return Math.scalb(1.0, -SCALE_EXP * steps);
    }
}
