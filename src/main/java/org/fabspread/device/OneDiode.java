package org.fabspread.device;

/**
 * The one-diode model of a solar cell,
 * <pre>  J = J_L − J_0 [exp((V + J R_s)/(n V_T)) − 1] − (V + J R_s)/R_sh,  V_T = kT/q,</pre>
 * solved exactly with the Lambert W function (A. Jain &amp; A. Kapoor, Sol. Energy Mater. Sol. Cells 81,
 * 269 (2004)): J(V) and V(J) are explicit in W, whose argument is handled in logs
 * ({@link LambertW#ofExp}) so that it never overflows. The Jain–Kapoor form divides by R_s; R_s = 0 is
 * the separate closed case J = J_L − J_0(e^{V/nV_T} − 1) − V/R_sh. R_sh = +∞ is allowed. The maximum
 * power point is found by Brent's minimiser (R. P. Brent, Algorithms for Minimization without
 * Derivatives (1973), ch. 5) on −V·J(V) over [0, V_oc]. The photocurrent does not depend on voltage.
 *
 * <p>Units: current densities in mA/cm², resistances in Ω·cm² (so J·R is in mV), voltages in V,
 * temperature in K. Efficiency is P_max over 100 mW/cm².
 *
 * @param photocurrent       J_L, mA/cm² (≥ 0)
 * @param saturationCurrent  J_0, mA/cm² (&gt; 0)
 * @param ideality           n (&gt; 0)
 * @param seriesResistance   R_s, Ω·cm² (≥ 0)
 * @param shuntResistance    R_sh, Ω·cm² (&gt; 0, +∞ allowed)
 * @param temperature        T, K (&gt; 0)
 */
record OneDiode(double photocurrent, double saturationCurrent, double ideality, double seriesResistance,
                       double shuntResistance, double temperature) {

    /** Boltzmann constant over elementary charge, V/K (exact in the 2019 SI). */
    public static final double K_OVER_Q = 1.380649e-23 / 1.602176634e-19;
    /** Irradiance of the reference spectrum, mW/cm². */
    public static final double REFERENCE_IRRADIANCE = 100.0;

    /** Indices of {@link #solve}'s output array. */
    public static final int VOC = 0, JSC = 1, FF = 2, VMP = 3, JMP = 4, PMAX = 5, EFFICIENCY = 6, RESULT_SIZE = 7;

    public OneDiode {
        String bad = check(photocurrent, saturationCurrent, ideality, seriesResistance, shuntResistance, temperature);
        if (bad != null) {
            throw new IllegalArgumentException(bad);
        }
    }

    /** The operating figures of the cell. */
    public record Performance(double openCircuitVoltage, double shortCircuitCurrent, double fillFactor,
                              double maxPowerVoltage, double maxPowerCurrent, double maxPower, double efficiency) {
    }

    /** n kT/q, V. */
    public double thermalVoltage() {
        return ideality * K_OVER_Q * temperature;
    }

    /** J(V), mA/cm². */
    public double current(double volts) {
        return current(photocurrent, saturationCurrent, thermalVoltage(), seriesResistance * 1e-3,
                shuntResistance * 1e-3, volts);
    }

    /** V(J), V, for J &lt; J_L + J_0. */
    public double voltage(double currentDensity) {
        return voltage(photocurrent, saturationCurrent, thermalVoltage(), seriesResistance * 1e-3,
                shuntResistance * 1e-3, currentDensity);
    }

    public double openCircuitVoltage() {
        return voltage(0);
    }

    /** J at V = 0 read off the curve (below J_L when R_s &gt; 0 or R_sh finite). */
    public double shortCircuitCurrent() {
        return current(0);
    }

    public Performance performance() {
        double[] r = new double[RESULT_SIZE];
        solve(photocurrent, saturationCurrent, ideality, seriesResistance, shuntResistance, temperature, r);
        return new Performance(r[VOC], r[JSC], r[FF], r[VMP], r[JMP], r[PMAX], r[EFFICIENCY]);
    }

    /** Null when the parameters are usable, else what is wrong (one line). */
    public static String check(double jl, double j0, double n, double rs, double rsh, double t) {
        if (!(jl >= 0) || Double.isInfinite(jl)) {
            return "photocurrent must be finite and >= 0 mA/cm^2, got " + jl;
        }
        if (!(j0 > 0) || Double.isInfinite(j0)) {
            return "saturation current must be > 0 mA/cm^2, got " + j0;
        }
        if (!(n > 0) || Double.isInfinite(n)) {
            return "ideality must be > 0, got " + n;
        }
        if (!(rs >= 0) || Double.isInfinite(rs)) {
            return "series resistance must be finite and >= 0 ohm cm^2, got " + rs;
        }
        if (!(rsh > 0)) {
            return "shunt resistance must be > 0 ohm cm^2, got " + rsh;
        }
        if (!(t > 0) || Double.isInfinite(t)) {
            return "temperature must be > 0 K, got " + t;
        }
        return null;
    }

    /**
     * Allocation-free solution for hot loops: fills {@code out} (size {@link #RESULT_SIZE}) at the
     * indices {@link #VOC} … {@link #EFFICIENCY}. Parameters in the record's units; not validated
     * (call {@link #check} first).
     */
    public static void solve(double jl, double j0, double n, double rsOhm, double rshOhm, double t, double[] out) {
        double a = n * K_OVER_Q * t;
        double rs = rsOhm * 1e-3;
        double rsh = rshOhm * 1e-3;
        double voc = voltage(jl, j0, a, rs, rsh, 0);
        double jsc = current(jl, j0, a, rs, rsh, 0);
        out[VOC] = voc;
        out[JSC] = jsc;
        if (!(voc > 0) || !(jsc > 0)) {
            out[FF] = 0;
            out[VMP] = 0;
            out[JMP] = 0;
            out[PMAX] = 0;
            out[EFFICIENCY] = 0;
            return;
        }
        double vmp = maximisePower(jl, j0, a, rs, rsh, voc);
        double jmp = current(jl, j0, a, rs, rsh, vmp);
        double pmax = vmp * jmp; // mW/cm² (V · mA/cm²)
        out[VMP] = vmp;
        out[JMP] = jmp;
        out[PMAX] = pmax;
        out[FF] = pmax / (voc * jsc);
        out[EFFICIENCY] = pmax / REFERENCE_IRRADIANCE;
    }

    /**
     * J(V) with a = n kT/q (V) and resistances in V per mA/cm².
     */
    static double current(double jl, double j0, double a, double rs, double rsh, double v) {
        boolean noShunt = Double.isInfinite(rsh);
        if (rs == 0) {
            return jl - j0 * Math.expm1(v / a) - (noShunt ? 0 : v / rsh);
        }
        if (noShunt) {
            // J = J_L + J_0 − (a/R_s) W( (R_s J_0/a) e^{(R_s(J_L+J_0) + V)/a} )
            double logArg = Math.log(rs * j0 / a) + (rs * (jl + j0) + v) / a;
            return jl + j0 - (a / rs) * LambertW.ofExp(logArg);
        }
        double sum = rs + rsh;
        double logArg = Math.log(rs * j0 * rsh / (a * sum)) + rsh * (rs * (jl + j0) + v) / (a * sum);
        return (rsh * (jl + j0) - v) / sum - (a / rs) * LambertW.ofExp(logArg);
    }

    /** V(J), same units as {@link #current(double, double, double, double, double, double)}. */
    static double voltage(double jl, double j0, double a, double rs, double rsh, double j) {
        if (Double.isInfinite(rsh)) {
            return a * Math.log1p((jl - j) / j0) - j * rs;
        }
        // V = (J_L + J_0 − J) R_sh − J R_s − a W( (J_0 R_sh/a) e^{R_sh (J_L + J_0 − J)/a} )
        double logArg = Math.log(j0 * rsh / a) + rsh * (jl + j0 - j) / a;
        return (jl + j0 - j) * rsh - j * rs - a * LambertW.ofExp(logArg);
    }

    /** Brent's minimisation of −V·J(V) on [0, V_oc]; returns V at the maximum power point. */
    private static double maximisePower(double jl, double j0, double a, double rs, double rsh, double voc) {
        final double golden = 0.5 * (3 - Math.sqrt(5));
        final double relTol = 1e-12;
        final double absTol = 1e-14 * voc;
        double lo = 0;
        double hi = voc;
        double x = lo + golden * (hi - lo);
        double w = x;
        double v = x;
        double fx = -x * current(jl, j0, a, rs, rsh, x);
        double fw = fx;
        double fv = fx;
        double d = 0;
        double e = 0;
        for (int iter = 0; iter < 200; iter++) {
            double m = 0.5 * (lo + hi);
            double tol = relTol * Math.abs(x) + absTol;
            double t2 = 2 * tol;
            if (Math.abs(x - m) <= t2 - 0.5 * (hi - lo)) {
                break;
            }
            double p = 0;
            double q = 0;
            double r = 0;
            if (Math.abs(e) > tol) {
                r = (x - w) * (fx - fv);
                q = (x - v) * (fx - fw);
                p = (x - v) * q - (x - w) * r;
                q = 2 * (q - r);
                if (q > 0) {
                    p = -p;
                } else {
                    q = -q;
                }
                r = e;
                e = d;
            }
            if (Math.abs(p) < Math.abs(0.5 * q * r) && p > q * (lo - x) && p < q * (hi - x)) {
                d = p / q;
                double u = x + d;
                if (u - lo < t2 || hi - u < t2) {
                    d = x < m ? tol : -tol;
                }
            } else {
                e = (x < m ? hi : lo) - x;
                d = golden * e;
            }
            double u = x + (Math.abs(d) >= tol ? d : (d > 0 ? tol : -tol));
            double fu = -u * current(jl, j0, a, rs, rsh, u);
            if (fu <= fx) {
                if (u < x) {
                    hi = x;
                } else {
                    lo = x;
                }
                v = w;
                fv = fw;
                w = x;
                fw = fx;
                x = u;
                fx = fu;
            } else {
                if (u < x) {
                    lo = u;
                } else {
                    hi = u;
                }
                if (fu <= fw || w == x) {
                    v = w;
                    fv = fw;
                    w = u;
                    fw = fu;
                } else if (fu <= fv || v == x || v == w) {
                    v = u;
                    fv = fu;
                }
            }
        }
        return x;
    }
}
