package org.fabspread.device;

/**
 * Diffuse (Lambertian) light in an absorbing slab with partially reflecting walls, the model used for
 * the light scattered by the particle layer.
 *
 * <p>A slab of absorption coefficient κ and thickness d passes a fraction T₁ = 2E₃(κd) of isotropic
 * (Lambertian) light in one pass, E_n being the exponential integral E_n(x) = ∫₁^∞ e^{−xt} t^{−n} dt
 * (Abramowitz &amp; Stegun, Handbook of Mathematical Functions (1964), ch. 5; the slab transmission of
 * diffuse light: Goetzberger, Proc. 15th IEEE PVSC (1981) 867; Yablonovitch &amp; Cody, IEEE Trans.
 * Electron Dev. 29, 300 (1982)). With a back reflectance R_b and a front internal reflectance
 * R_f = 1 − (n_out/n)² (light outside the escape cone returns; Yablonovitch 1982), summing the passes
 * gives, with ρ = R_b R_f T₁²:
 * <ul>
 *   <li>injected at the front, heading to the back: A = (1 − T₁)(1 + R_b T₁)/(1 − ρ), escaping through
 *       the front (1 − R_f) R_b T₁²/(1 − ρ), lost at the back (1 − R_b) T₁/(1 − ρ);</li>
 *   <li>injected at the back, heading to the front: A = (1 − T₁)(1 + R_f T₁)/(1 − ρ), escaping
 *       (1 − R_f) T₁/(1 − ρ), lost at the back (1 − R_b) R_f T₁²/(1 − ρ).</li>
 * </ul>
 * The three shares add up to 1 exactly.
 *
 * <p><b>A source inside the slab.</b> Light scattered by a particle layer at depth z (0 ≤ z ≤ d, from the
 * front face) inside the slab starts there, not at a face: its forward share heads to the back over the
 * distance d − z, its backward share to the front over z. Each share is taken as a Lambertian source: its
 * radiance is the same in every direction of its hemisphere, so the power crossing a plane parallel to the
 * faces per unit of μ = cos θ is proportional to μ, i.e. a share 2μ dμ travels at μ (∫₀¹ 2μ dμ = 1). Such a
 * ray reaches a face at distance s along the path s/μ and arrives with e^{−κs/μ}, so the first pass transmits
 * <pre>
 *   T(s) = 2 ∫₀¹ μ e^{−κs/μ} dμ = 2 ∫₁^∞ t^{−3} e^{−κs t} dt = 2E₃(κs)      (t = 1/μ, dμ = −dt/t²),
 * </pre>
 * the same Lambertian angular average as T₁ = T(d) of light crossing the whole slab (A&amp;S 5.1.4 for E_n;
 * the slab transmission of diffuse light as cited above). After this first pass the light is at a face and
 * follows the face-injection bookkeeping above: with T_b = T(d − z), T_f = T(z),
 * <ul>
 *   <li>heading to the back: absorbed (1 − T_b) + T_b R_b A_back, escaped through the front
 *       T_b R_b E_back, lost at the back T_b (1 − R_b) + T_b R_b L_back;</li>
 *   <li>heading to the front: absorbed (1 − T_f) + T_f R_f A_front, escaped through the front
 *       T_f (1 − R_f) + T_f R_f E_front, lost at the back T_f R_f L_front,</li>
 * </ul>
 * where A, E, L are the absorbed, escaped and lost shares of light injected at that face. Each line adds up
 * to (1 − T) + T [R (A + E + L) + (1 − R)] = 1, so energy closes for any z. At z = 0 the backward share is at
 * the front at once (1 − R_f escapes, R_f returns as front-injected light) and the forward share is
 * front-injected light: the case of particles in front of the slab; z = d is the mirror case of particles
 * behind it. κ → 0 gives T = 1 everywhere and nothing absorbed.
 *
 * <p>Assumptions: every reflection re-randomises the direction
 * (specular walls give different numbers); R_b does not depend on angle; no Fresnel loss inside the
 * escape cone; ray optics, which a ~100 nm film strains.
 *
 * <p>All methods are static and allocation-free, for the per-wavelength loop.
 */
final class LambertianSlab {

    /** Euler–Mascheroni constant. */
    private static final double EULER_GAMMA = 0.57721566490153286061;
    private static final double EPS = 1e-16;

    /** c_k = (−1)^{k+1}/(k·k!), k = 1 … 18, of E₁(x) = −γ − ln x + Σ c_k x^k (A&amp;S 5.1.11). */
    private static final double[] E1_SERIES = new double[18];

    static {
        double f = 1;
        for (int k = 1; k <= E1_SERIES.length; k++) {
            f *= k;
            E1_SERIES[k - 1] = (k % 2 == 1 ? 1 : -1) / (k * f);
        }
    }

    private LambertianSlab() {
    }

    /**
     * E₃(x) for 0 &lt; x ≤ 1 at a fixed cost: E₃ = [e^{−x}(1 − x) + x² E₁(x)]/2 (the recurrence
     * E_{n+1} = (e^{−x} − x E_n)/n, A&amp;S 5.1.14, twice), E₁ from its power series A&amp;S 5.1.11 summed to
     * k = 18 by Horner's rule (truncation below 5e-19 at x = 1). Both terms are ≥ 0 on (0, 1], so nothing
     * cancels; it agrees with {@link #expIntegral}(3, x) to a few units in the last place.
     */
    static double e3Small(double x) {
        double p = E1_SERIES[E1_SERIES.length - 1];
        for (int k = E1_SERIES.length - 2; k >= 0; k--) {
            p = p * x + E1_SERIES[k];
        }
        double e1 = -EULER_GAMMA - Math.log(x) + x * p;
        return 0.5 * (Math.exp(-x) * (1 - x) + x * x * e1);
    }

    /**
     * The exponential integral E_n(x) for n ≥ 0, x ≥ 0 (x &gt; 0 when n ≤ 1): power series for x ≤ 1,
     * modified Lentz continued fraction for x &gt; 1 (Abramowitz &amp; Stegun 5.1.12 and 5.1.22; the
     * algorithm of Press et al., Numerical Recipes, 3rd ed. (2007), §6.3). Relative accuracy ~1e-15.
     */
    public static double expIntegral(int n, double x) {
        if (n < 0 || !(x >= 0) || (x == 0 && n <= 1)) {
            throw new IllegalArgumentException("E_" + n + "(" + x + ") is not defined");
        }
        if (n == 0) {
            return Math.exp(-x) / x;
        }
        if (x == 0) {
            return 1.0 / (n - 1);
        }
        if (x > 1) {
            if (x > 740) {
                return 0;
            }
            // continued fraction E_n(x) = e^{-x} (1/(x+n− 1·n/(x+n+2− 2(n+1)/(x+n+4− …))))
            double b = x + n;
            double c = 1.0 / 1e-300;
            double d = 1.0 / b;
            double h = d;
            for (int i = 1; i < 10_000; i++) {
                double an = -(double) i * (n - 1 + i);
                b += 2;
                d = 1.0 / (an * d + b);
                c = b + an / c;
                double del = c * d;
                h *= del;
                if (Math.abs(del - 1) < EPS) {
                    return h * Math.exp(-x);
                }
            }
            throw new ArithmeticException("continued fraction for E_" + n + "(" + x + ") did not converge");
        }
        // series: E_n(x) = (−x)^{n−1}/(n−1)! [−ln x + ψ(n)] − Σ_{m≠n−1} (−x)^m / ((m − n + 1) m!)
        int nm1 = n - 1;
        double ans = nm1 != 0 ? 1.0 / nm1 : -Math.log(x) - EULER_GAMMA;
        double fact = 1;
        for (int i = 1; i < 10_000; i++) {
            fact *= -x / i;
            double del;
            if (i != nm1) {
                del = -fact / (i - nm1);
            } else {
                double psi = -EULER_GAMMA;
                for (int ii = 1; ii <= nm1; ii++) {
                    psi += 1.0 / ii;
                }
                del = fact * (-Math.log(x) + psi);
            }
            ans += del;
            if (Math.abs(del) < Math.abs(ans) * EPS) {
                return ans;
            }
        }
        throw new ArithmeticException("series for E_" + n + "(" + x + ") did not converge");
    }

    /** Single-pass transmission of diffuse light, T₁ = 2E₃(κd); 1 at κd = 0. */
    public static double diffuseTransmission(double kappaD) {
        if (!(kappaD >= 0)) {
            throw new IllegalArgumentException("optical thickness must be >= 0, got " + kappaD);
        }
        if (kappaD == 0) {
            return 1.0;
        }
        return 2 * (kappaD <= 1 ? e3Small(kappaD) : expIntegral(3, kappaD));
    }

    /** Front internal reflectance for diffuse light, R_f = 1 − (n_out/n)² (0 when n ≤ n_out). */
    public static double escapeConeReflectance(double nInside, double nOutside) {
        if (nInside <= nOutside) {
            return 0;
        }
        double r = nOutside / nInside;
        return 1 - r * r;
    }

    /** Absorbed share of diffuse light injected at the front, heading to the back. */
    public static double absorbedFront(double t1, double rBack, double rFront) {
        return (1 - t1) * (1 + rBack * t1) / (1 - rBack * rFront * t1 * t1);
    }

    /** Absorbed share of diffuse light injected at the back, heading to the front. */
    public static double absorbedBack(double t1, double rBack, double rFront) {
        return (1 - t1) * (1 + rFront * t1) / (1 - rBack * rFront * t1 * t1);
    }

    /** Share escaping through the front (inside the escape cone), front injection. */
    public static double escapedFront(double t1, double rBack, double rFront) {
        return (1 - rFront) * rBack * t1 * t1 / (1 - rBack * rFront * t1 * t1);
    }

    /** Share lost at the back wall (back electrode), front injection. */
    public static double lostBackFront(double t1, double rBack, double rFront) {
        return (1 - rBack) * t1 / (1 - rBack * rFront * t1 * t1);
    }

    /** Share escaping through the front, back injection. */
    public static double escapedBack(double t1, double rBack, double rFront) {
        return (1 - rFront) * t1 / (1 - rBack * rFront * t1 * t1);
    }

    /**
     * Absorbed share of diffuse light born inside the slab: a share {@code forward} heading to the back with
     * first-pass transmission {@code tBack} = 2E₃(κ(d − z)), the rest heading to the front with
     * {@code tFront} = 2E₃(κz); {@code t1} = 2E₃(κd) (see the class comment for the derivation).
     */
    public static double absorbedInside(double t1, double tFront, double tBack, double forward,
                                        double rBack, double rFront) {
        double headingBack = (1 - tBack) + tBack * rBack * absorbedBack(t1, rBack, rFront);
        double headingFront = (1 - tFront) + tFront * rFront * absorbedFront(t1, rBack, rFront);
        return forward * headingBack + (1 - forward) * headingFront;
    }

    /** Share of diffuse light born inside the slab that escapes through the front; arguments as {@link #absorbedInside}. */
    public static double escapedInside(double t1, double tFront, double tBack, double forward,
                                       double rBack, double rFront) {
        double headingBack = tBack * rBack * escapedBack(t1, rBack, rFront);
        double headingFront = tFront * (1 - rFront) + tFront * rFront * escapedFront(t1, rBack, rFront);
        return forward * headingBack + (1 - forward) * headingFront;
    }

    /** Share of diffuse light born inside the slab that is lost at the back wall; arguments as {@link #absorbedInside}. */
    public static double lostBackInside(double t1, double tFront, double tBack, double forward,
                                        double rBack, double rFront) {
        double headingBack = tBack * (1 - rBack) + tBack * rBack * lostBackBack(t1, rBack, rFront);
        double headingFront = tFront * rFront * lostBackFront(t1, rBack, rFront);
        return forward * headingBack + (1 - forward) * headingFront;
    }

    /** Share lost at the back wall, back injection. */
    public static double lostBackBack(double t1, double rBack, double rFront) {
        return (1 - rBack) * rFront * t1 * t1 / (1 - rBack * rFront * t1 * t1);
    }
}
