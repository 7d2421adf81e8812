package org.fabspread.particles;

/**
 * Carlson's symmetric elliptic integrals by the duplication algorithm (B. C. Carlson, "Numerical
 * computation of real or complex elliptic integrals", Numer. Algorithms 10, 13–26 (1995)), real and
 * non-negative arguments:
 * <ul>
 *   <li>R_F(x,y,z) = ½ ∫₀^∞ dt / √((t+x)(t+y)(t+z));</li>
 *   <li>R_D(x,y,z) = (3/2) ∫₀^∞ dt / [√((t+x)(t+y)) (t+z)^{3/2}];</li>
 *   <li>R_G(x,y,z), from R_F and R_D (NIST DLMF 19.21.10).</li>
 * </ul>
 * The truncation tolerance is set for full double precision (relative error of the series below 1e-16).
 */
public final class Carlson {
    private static final double TOL = 1e-16;
    private static final double QF = Math.pow(3 * TOL, -1.0 / 6.0);
    private static final double QD = Math.pow(TOL / 4, -1.0 / 6.0);

    private Carlson() {
    }

    /** R_F(x, y, z); at most one argument may be zero. */
    public static double rf(double x, double y, double z) {
        check(x, y, z);
        if (zeros(x, y, z) > 1) {
            throw new IllegalArgumentException("R_F needs at most one zero argument");
        }
        double a0 = (x + y + z) / 3;
        double q = QF * Math.max(Math.abs(a0 - x), Math.max(Math.abs(a0 - y), Math.abs(a0 - z)));
        double a = a0;
        double pow4 = 1;
        double xm = x;
        double ym = y;
        double zm = z;
        while (pow4 * q >= Math.abs(a)) {
            double sx = Math.sqrt(xm);
            double sy = Math.sqrt(ym);
            double sz = Math.sqrt(zm);
            double lam = sx * sy + sx * sz + sy * sz;
            xm = 0.25 * (xm + lam);
            ym = 0.25 * (ym + lam);
            zm = 0.25 * (zm + lam);
            a = 0.25 * (a + lam);
            pow4 *= 0.25;
        }
        double bx = pow4 * (a0 - x) / a;
        double by = pow4 * (a0 - y) / a;
        double bz = -(bx + by);
        double e2 = bx * by - bz * bz;
        double e3 = bx * by * bz;
        return (1 - e2 / 10 + e3 / 14 + e2 * e2 / 24 - 3 * e2 * e3 / 44) / Math.sqrt(a);
    }

    /** R_D(x, y, z); z &gt; 0 and at most one of x, y zero. */
    public static double rd(double x, double y, double z) {
        check(x, y, z);
        if (!(z > 0) || (x == 0 && y == 0)) {
            throw new IllegalArgumentException("R_D needs z > 0 and at most one of x, y zero");
        }
        double a0 = (x + y + 3 * z) / 5;
        double q = QD * Math.max(Math.abs(a0 - x), Math.max(Math.abs(a0 - y), Math.abs(a0 - z)));
        double a = a0;
        double pow4 = 1;
        double xm = x;
        double ym = y;
        double zm = z;
        double sum = 0;
        while (pow4 * q >= Math.abs(a)) {
            double sx = Math.sqrt(xm);
            double sy = Math.sqrt(ym);
            double sz = Math.sqrt(zm);
            double lam = sx * sy + sx * sz + sy * sz;
            sum += pow4 / (sz * (zm + lam));
            xm = 0.25 * (xm + lam);
            ym = 0.25 * (ym + lam);
            zm = 0.25 * (zm + lam);
            a = 0.25 * (a + lam);
            pow4 *= 0.25;
        }
        double bx = pow4 * (a0 - x) / a;
        double by = pow4 * (a0 - y) / a;
        double bz = -(bx + by) / 3;
        double xy = bx * by;
        double z2 = bz * bz;
        double e2 = xy - 6 * z2;
        double e3 = (3 * xy - 8 * z2) * bz;
        double e4 = 3 * (xy - z2) * z2;
        double e5 = xy * z2 * bz;
        double series = 1 - 3 * e2 / 14 + e3 / 6 + 9 * e2 * e2 / 88 - 3 * e4 / 22 - 9 * e2 * e3 / 52 + 3 * e5 / 26;
        return pow4 * series / (a * Math.sqrt(a)) + 3 * sum;
    }

    /**
     * R_G(x, y, z) = (1/4π) ∫∫ √(x sin²θ cos²φ + y sin²θ sin²φ + z cos²θ) dΩ, from
     * 2R_G = z R_F − (x − z)(y − z) R_D / 3 + √(xy/z) with z the middle argument (DLMF 19.21.10; the
     * middle one keeps every term non-negative). All arguments &gt; 0.
     */
    public static double rg(double x, double y, double z) {
        check(x, y, z);
        if (!(x > 0 && y > 0 && z > 0)) {
            throw new IllegalArgumentException("R_G is implemented for positive arguments only");
        }
        double lo = x;
        double mid = y;
        double hi = z;
        if (lo > mid) {
            double t = lo;
            lo = mid;
            mid = t;
        }
        if (mid > hi) {
            double t = mid;
            mid = hi;
            hi = t;
        }
        if (lo > mid) {
            double t = lo;
            lo = mid;
            mid = t;
        }
        return 0.5 * (mid * rf(lo, hi, mid) - (lo - mid) * (hi - mid) * rd(lo, hi, mid) / 3
                + Math.sqrt(lo * hi / mid));
    }

    private static void check(double x, double y, double z) {
        if (!(x >= 0 && y >= 0 && z >= 0) || Double.isInfinite(x) || Double.isInfinite(y) || Double.isInfinite(z)) {
            throw new IllegalArgumentException("Carlson integrals need finite non-negative arguments, got "
                    + x + ", " + y + ", " + z);
        }
    }

    private static int zeros(double x, double y, double z) {
        return (x == 0 ? 1 : 0) + (y == 0 ? 1 : 0) + (z == 0 ? 1 : 0);
    }
}
