package org.fabspread.dda;

import org.apache.commons.math3.analysis.integration.gauss.GaussIntegrator;
import org.apache.commons.math3.analysis.integration.gauss.GaussIntegratorFactory;

/**
 * The scattered far field of a dipole array integrated over directions. For a unit incident amplitude the
 * differential cross-section is dC/dΩ = k⁴ |(I − n̂n̂) Σ_j e^{−ik n̂·r_j} P_j|² (Draine, ApJ 333, 848 (1988),
 * eq. 20; Gaussian units). The sphere of directions is split at the plane normal to the incident direction;
 * each hemisphere takes an L+1 point Gauss–Legendre rule in cos θ and 2L+2 equally spaced φ, with
 * L = x + 4x^{1/3} + 2 for the size parameter x of the lattice's circumscribed sphere (the Mie series'
 * number of terms, Bohren &amp; Huffman 1983 app. A): the scattered intensity is then a polynomial of degree
 * ≲ 2L in n̂, integrated exactly by these rules.
 *
 * <p>Phases e^{−iκ n̂·r_j} come from per-axis tables (one complex product per dipole, no trigonometry in the
 * loop over dipoles). Allocation-free except when a larger wavenumber needs a longer rule.
 */
final class FarField {
    private final int nx;
    private final int ny;
    private final int nz;
    private final double ox;
    private final double oy;
    private final double oz;
    private final int[] xs;
    private final int[] ys;
    private final int[] zs;
    private final double[] exr;
    private final double[] exi;
    private final double[] eyr;
    private final double[] eyi;
    private final double[] ezr;
    private final double[] ezi;
    private final double radius;
    private int rule = -1;
    private double[] mu = new double[0];
    private double[] wmu = new double[0];
    private int nphi;

    /** total, forward and ∫cos θ dC of the last {@link #integrate} call, in lattice units times κ⁴ */
    double total;
    double forward;
    double cosWeighted;

    FarField(int nx, int ny, int nz, double[] origin, int[] xs, int[] ys, int[] zs) {
        this.nx = nx;
        this.ny = ny;
        this.nz = nz;
        this.ox = origin[0];
        this.oy = origin[1];
        this.oz = origin[2];
        this.xs = xs;
        this.ys = ys;
        this.zs = zs;
        exr = new double[nx];
        exi = new double[nx];
        eyr = new double[ny];
        eyi = new double[ny];
        ezr = new double[nz];
        ezi = new double[nz];
        radius = 0.5 * Math.sqrt((double) nx * nx + (double) ny * ny + (double) nz * nz);
    }

    private void prepare(double kappa) {
        double x = kappa * radius;
        int l = (int) Math.ceil(x + 4 * Math.cbrt(x) + 2);
        if (l == rule) {
            return;
        }
        rule = l;
        GaussIntegrator g = new GaussIntegratorFactory().legendre(l + 1, 0, 1);
        mu = new double[l + 1];
        wmu = new double[l + 1];
        for (int i = 0; i <= l; i++) {
            mu[i] = g.getPoint(i);
            wmu[i] = g.getWeight(i);
        }
        nphi = 2 * l + 2;
    }

    /**
     * Integrates k⁴|F⊥|² (lattice units: κ⁴, P in d³) over the sphere; results in {@link #total},
     * {@link #forward}, {@link #cosWeighted}.
     */
    void integrate(double kappa, Incidence inc, double[] pr, double[] pi) {
        prepare(kappa);
        double ax = inc.dir(0);
        double ay = inc.dir(1);
        double az = inc.dir(2);
        // e1 = ê, e2 = â × ê
        double e1x = inc.pol(0);
        double e1y = inc.pol(1);
        double e1z = inc.pol(2);
        double e2x = ay * e1z - az * e1y;
        double e2y = az * e1x - ax * e1z;
        double e2z = ax * e1y - ay * e1x;
        double k4 = kappa * kappa * kappa * kappa;
        double dphi = 2 * Math.PI / nphi;
        total = 0;
        forward = 0;
        cosWeighted = 0;
        for (int hemi = 0; hemi < 2; hemi++) {
            for (int it = 0; it < mu.length; it++) {
                double c = hemi == 0 ? mu[it] : -mu[it];
                double s = Math.sqrt(Math.max(0, 1 - c * c));
                double ring = 0;
                for (int ip = 0; ip < nphi; ip++) {
                    double phi = (ip + 0.5) * dphi;
                    double cp = Math.cos(phi) * s;
                    double sp = Math.sin(phi) * s;
                    double dx = c * ax + cp * e1x + sp * e2x;
                    double dy = c * ay + cp * e1y + sp * e2y;
                    double dz = c * az + cp * e1z + sp * e2z;
                    ring += transverse(kappa, dx, dy, dz, pr, pi);
                }
                double w = wmu[it] * dphi * ring * k4;
                total += w;
                cosWeighted += c * w;
                if (hemi == 0) {
                    forward += w;
                }
            }
        }
    }

    /** |(I − n̂n̂) Σ_j e^{−iκ n̂·r_j} P_j|² for one direction. */
    private double transverse(double kappa, double dx, double dy, double dz, double[] pr, double[] pi) {
        table(kappa * dx, ox, exr, exi);
        table(kappa * dy, oy, eyr, eyi);
        table(kappa * dz, oz, ezr, ezi);
        double fxr = 0;
        double fxi = 0;
        double fyr = 0;
        double fyi = 0;
        double fzr = 0;
        double fzi = 0;
        for (int j = 0; j < xs.length; j++) {
            double ar = exr[xs[j]];
            double ai = exi[xs[j]];
            double br = eyr[ys[j]];
            double bi = eyi[ys[j]];
            double cr = ar * br - ai * bi;
            double ci = ar * bi + ai * br;
            double gr = ezr[zs[j]];
            double gi = ezi[zs[j]];
            double hr = cr * gr - ci * gi;
            double hi = cr * gi + ci * gr;
            int b = 3 * j;
            fxr += hr * pr[b] - hi * pi[b];
            fxi += hr * pi[b] + hi * pr[b];
            fyr += hr * pr[b + 1] - hi * pi[b + 1];
            fyi += hr * pi[b + 1] + hi * pr[b + 1];
            fzr += hr * pr[b + 2] - hi * pi[b + 2];
            fzi += hr * pi[b + 2] + hi * pr[b + 2];
        }
        double nr = dx * fxr + dy * fyr + dz * fzr;
        double ni = dx * fxi + dy * fyi + dz * fzi;
        return fxr * fxr + fxi * fxi + fyr * fyr + fyi * fyi + fzr * fzr + fzi * fzi - nr * nr - ni * ni;
    }

    /** e^{−i q (o + i)} for i along one axis. */
    private static void table(double q, double o, double[] re, double[] im) {
        for (int i = 0; i < re.length; i++) {
            double a = -q * (o + i);
            re[i] = Math.cos(a);
            im[i] = Math.sin(a);
        }
    }

    int directions() {
        return 2 * mu.length * nphi;
    }
}
