package org.fabspread.plan;

import org.apache.commons.math3.special.Beta;
import org.apache.commons.math3.special.Erf;
import org.apache.commons.math3.special.Gamma;

/**
 * Cumulative distribution of the noncentral t distribution, Lenth's Algorithm AS 243 (Appl. Stat. 38,
 * 185 (1989)): P(T ≤ t) for T = (Z + δ)/sqrt(χ²_ν/ν), summed as the twin Poisson-weighted series of
 * incomplete beta functions of Guenther (J. Stat. Comput. Simul. 6, 199 (1978)), with the series
 * stopped by its error bound. The incomplete beta is Commons Math's regularised beta.
 */
public final class NoncentralT {

    private static final double R2PI = Math.sqrt(2 / Math.PI);
    private static final double ALNRPI = 0.5 * Math.log(Math.PI);
    private static final int ITRMAX = 2000;
    private static final double ERRMAX = 1e-12;

    private NoncentralT() {
    }

    /**
     * P(T ≤ t) for ν degrees of freedom (real, &gt; 0) and noncentrality δ. For δ² beyond about 1400
     * the Poisson weights underflow; there the limit Φ(t − δ) is not used silently but the
     * conditional form is integrated instead (see {@link #cdfByIntegration}).
     */
    public static double cdf(double t, double nu, double delta) {
        if (!(nu > 0)) {
            throw new IllegalArgumentException("degrees of freedom must be > 0, got " + nu);
        }
        double tt = t;
        double del = delta;
        boolean negdel = false;
        if (t < 0) {
            negdel = true;
            tt = -tt;
            del = -del;
        }
        if (del * del > 1400) {
            return cdfByIntegration(t, nu, delta);
        }
        double tnc = 0;
        double x = tt * tt / (tt * tt + nu);
        if (x > 0) {
            double lambda = del * del;
            double p = 0.5 * Math.exp(-0.5 * lambda);
            double q = R2PI * p * del;
            double s = 0.5 - p;
            double a = 0.5;
            double b = 0.5 * nu;
            double rxb = Math.pow(1 - x, b);
            double albeta = ALNRPI + Gamma.logGamma(b) - Gamma.logGamma(a + b);
            double xodd = Beta.regularizedBeta(x, a, b);
            double godd = 2 * rxb * Math.exp(a * Math.log(x) - albeta);
            double xeven = 1 - rxb;
            double geven = b * x * rxb;
            tnc = p * xodd + q * xeven;
            double en = 1;
            double errbd;
            do {
                a += 1;
                xodd -= godd;
                xeven -= geven;
                godd *= x * (a + b - 1) / a;
                geven *= x * (a + b - 0.5) / (a + 0.5);
                p *= lambda / (2 * en);
                q *= lambda / (2 * en + 1);
                s -= p;
                en += 1;
                tnc += p * xodd + q * xeven;
                errbd = 2 * s * (xodd - godd);
            } while (errbd > ERRMAX && en <= ITRMAX);
        }
        tnc += 0.5 * Erf.erfc(del / Math.sqrt(2));
        if (negdel) {
            tnc = 1 - tnc;
        }
        return Math.min(1, Math.max(0, tnc));
    }

    /**
     * P(T ≤ t) = E[Φ(t sqrt(V/ν) − δ)] with V ~ χ²_ν, integrated over w = sqrt(V) by composite
     * five-point Gauss–Legendre quadrature. An independent route to the same number, used where the
     * series' Poisson weights underflow (very large δ).
     */
    public static double cdfByIntegration(double t, double nu, double delta) {
        org.apache.commons.math3.distribution.ChiSquaredDistribution chi =
                new org.apache.commons.math3.distribution.ChiSquaredDistribution(null, nu);
        double[] gx = {-0.9061798459386640, -0.5384693101056831, 0, 0.5384693101056831, 0.9061798459386640};
        double[] gw = {0.2369268850561891, 0.4786286704993665, 0.5688888888888889, 0.4786286704993665,
                0.2369268850561891};
        double wMax = Math.sqrt(nu + 40 * Math.sqrt(2 * nu) + 40);
        int panels = 4000;
        double h = wMax / panels;
        double sum = 0;
        for (int i = 0; i < panels; i++) {
            double mid = (i + 0.5) * h;
            for (int j = 0; j < gx.length; j++) {
                double w = mid + 0.5 * h * gx[j];
                double z = t * w / Math.sqrt(nu) - delta;
                sum += 0.5 * h * gw[j] * 0.5 * Erf.erfc(-z / Math.sqrt(2)) * chi.density(w * w) * 2 * w;
            }
        }
        return Math.min(1, Math.max(0, sum));
    }
}
