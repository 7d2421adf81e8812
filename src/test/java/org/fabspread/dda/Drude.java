package org.fabspread.dda;

/**
 * Drude permittivity ε = ε∞ − ω_p²/(ω² + iγω) (common practice; Bohren &amp; Huffman 1983, §9.1), with a
 * damping larger than bulk silver's so that test solves converge in few iterations.
 */
final class Drude {
    static final double EPS_INF = 3.7;
    static final double PLASMA_EV = 8.9;
    static final double DAMPING_EV = 0.4;

    private Drude() {
    }

    /** {Re ε, Im ε} at a vacuum wavelength (nm). */
    static double[] eps(double lambdaNm) {
        double w = 1239.84198 / lambdaNm;
        double d = w * w + DAMPING_EV * DAMPING_EV;
        double p2 = PLASMA_EV * PLASMA_EV;
        return new double[] {EPS_INF - p2 / d, p2 * DAMPING_EV / (w * d)};
    }
}
