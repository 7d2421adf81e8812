package org.fabspread.plan;

import java.util.Arrays;

import org.apache.commons.math3.distribution.TDistribution;

/**
 * Lenth's pseudo standard error for unreplicated two-level plans (Technometrics 31, 469 (1989)):
 * s0 = 1.5 median|c_j|, PSE = 1.5 median{|c_j| : |c_j| &lt; 2.5 s0}; margin of error
 * ME = t_{0.975,d}·PSE and simultaneous margin SME = t_{γ,d}·PSE with d = m/3 and
 * γ = (1 + 0.95^{1/m})/2, m the number of contrasts. The t quantiles are taken at the non-integer d.
 *
 * @param m     number of contrasts
 * @param s0    initial scale
 * @param pse   pseudo standard error
 * @param dof   d = m/3
 * @param me    margin of error (individual 95 %)
 * @param sme   simultaneous margin of error (95 % for all m together)
 */
public record Lenth(int m, double s0, double pse, double dof, double me, double sme) {

    /** ME and SME multipliers {t_{0.975,m/3}, t_{γ,m/3}} for m contrasts. */
    public static double[] multipliers(int m) {
        double d = m / 3.0;
        TDistribution t = new TDistribution(null, d);
        double gamma = (1 + Math.pow(0.95, 1.0 / m)) / 2;
        return new double[]{t.inverseCumulativeProbability(0.975), t.inverseCumulativeProbability(gamma)};
    }

    public static Lenth of(double[] contrasts) {
        int m = contrasts.length;
        if (m < 2) {
            throw new IllegalArgumentException("Lenth's method needs at least 2 contrasts");
        }
        double[] a = new double[m];
        for (int i = 0; i < m; i++) {
            a[i] = Math.abs(contrasts[i]);
        }
        double s0 = 1.5 * median(a);
        double[] kept = Arrays.stream(a).filter(v -> v < 2.5 * s0).toArray();
        double pse = kept.length == 0 ? s0 : 1.5 * median(kept);
        double[] mult = multipliers(m);
        return new Lenth(m, s0, pse, m / 3.0, mult[0] * pse, mult[1] * pse);
    }

    static double median(double[] v) {
        double[] s = v.clone();
        Arrays.sort(s);
        int n = s.length;
        return n % 2 == 1 ? s[n / 2] : 0.5 * (s[n / 2 - 1] + s[n / 2]);
    }
}
