package org.fabspread.particles;

/**
 * Depolarisation (geometrical) factors of an ellipsoid with semi-axes a, b, c (Bohren &amp; Huffman,
 * <i>Absorption and Scattering of Light by Small Particles</i>, 1983, eq. 5.33):
 * L_1 = (abc/2) ∫₀^∞ dq / [(a² + q) f(q)], f(q) = √((q + a²)(q + b²)(q + c²)).
 *
 * <p>Written with Carlson's R_D in its standard normalisation
 * R_D(x,y,z) = (3/2) ∫₀^∞ dt / [√((t+x)(t+y)) (t+z)^{3/2}] (Carlson 1995), the integral above is
 * (2/3) R_D(b², c², a²), so L_a = (abc/3) R_D(b², c², a²). (The prefactor abc/2 belongs to the bare
 * integral, abc/3 to R_D.) A sphere gives R_D(r², r², r²) = r⁻³ and L = 1/3; the three factors sum to 1.
 *
 * <p>The spheroid closed forms of Bohren &amp; Huffman (eqs. 5.34, 5.35) are kept for checks only: they
 * cancel catastrophically near a sphere (about 1e-6 relative error at aspect ratio 1 + 1e-7).
 */
public final class Depolarization {
    private Depolarization() {
    }

    /** Carlson's symmetric elliptic integral of the second kind R_D (see {@link Carlson#rd}). */
    public static double carlsonRD(double x, double y, double z) {
        return Carlson.rd(x, y, z);
    }

    /** L along the axis of semi-axis {@code a}, the other two semi-axes b and c (all &gt; 0, nm or any unit). */
    public static double factor(double a, double b, double c) {
        checkAxes(a, b, c);
        if (a == b && b == c) {
            return 1.0 / 3.0;
        }
        // scale to the largest axis first: R_D is homogeneous of degree -3/2, abc of degree 3
        double s = Math.max(a, Math.max(b, c));
        double ua = a / s;
        double ub = b / s;
        double uc = c / s;
        return ua * ub * uc / 3 * Carlson.rd(ub * ub, uc * uc, ua * ua);
    }

    /** {L_a, L_b, L_c} for semi-axes a, b, c. */
    public static double[] factors(double a, double b, double c) {
        double[] out = new double[3];
        factors(a, b, c, out);
        return out;
    }

    /** Fills {@code out[0..2]} with L_a, L_b, L_c (no allocation). */
    public static void factors(double a, double b, double c, double[] out) {
        out[0] = factor(a, b, c);
        out[1] = factor(b, c, a);
        out[2] = factor(c, a, b);
    }

    /**
     * Prolate spheroid a &gt; b = c, closed form (Bohren &amp; Huffman eq. 5.34): e² = 1 − b²/a²,
     * L_a = (1 − e²)/e² · [−1 + ln((1 + e)/(1 − e)) / (2e)]; the two short axes share (1 − L_a)/2.
     *
     * @param aspect a/b &gt; 1
     * @return {L_long, L_short, L_short}
     */
    public static double[] prolate(double aspect) {
        if (!(aspect > 1) || Double.isInfinite(aspect)) {
            throw new IllegalArgumentException("a prolate spheroid needs aspect ratio a/b > 1, got " + aspect);
        }
        double e2 = 1 - 1 / (aspect * aspect);
        double e = Math.sqrt(e2);
        double la = (1 - e2) / e2 * (-1 + Math.log((1 + e) / (1 - e)) / (2 * e));
        double ls = 0.5 * (1 - la);
        return new double[] {la, ls, ls};
    }

    /**
     * Oblate spheroid a = b &gt; c, closed form (Bohren &amp; Huffman eq. 5.35): e² = 1 − c²/a²,
     * g = √((1 − e²)/e²), L_a = L_b = g/(2e²) · (π/2 − arctan g) − g²/2, L_c = 1 − 2L_a.
     *
     * @param aspect a/c &gt; 1
     * @return {L_a, L_b, L_c}
     */
    public static double[] oblate(double aspect) {
        if (!(aspect > 1) || Double.isInfinite(aspect)) {
            throw new IllegalArgumentException("an oblate spheroid needs aspect ratio a/c > 1, got " + aspect);
        }
        double e2 = 1 - 1 / (aspect * aspect);
        double g = Math.sqrt((1 - e2) / e2);
        double la = g / (2 * e2) * (Math.PI / 2 - Math.atan(g)) - g * g / 2;
        return new double[] {la, la, 1 - 2 * la};
    }

    private static void checkAxes(double a, double b, double c) {
        if (!(a > 0 && b > 0 && c > 0) || Double.isInfinite(a) || Double.isInfinite(b) || Double.isInfinite(c)) {
            throw new IllegalArgumentException("semi-axes must be finite and > 0, got " + a + ", " + b + ", " + c);
        }
    }
}
