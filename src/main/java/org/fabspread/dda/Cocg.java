package org.fabspread.dda;

/**
 * Conjugate orthogonal conjugate gradient (COCG; van der Vorst &amp; Melissen, IEEE Trans. Magn. 26, 706
 * (1990)) for a complex-symmetric system A x = b (Aᵀ = A, as the coupled-dipole matrix is): the conjugate
 * gradient recurrences with the unconjugated bilinear form xᵀy, one operator application per step and
 * short recurrences (no stored basis). Stops when ‖b − A x‖ ≤ tol ‖b‖ (the recursive residual, confirmed
 * by a true residual at the end); reports failure on breakdown (xᵀx or pᵀAp = 0) or when the limit is
 * reached. Separate real and imaginary arrays; allocation-free after construction.
 */
final class Cocg {
    private final int n;
    private final double[] rr;
    private final double[] ri;
    private final double[] qr;
    private final double[] qi;
    private final double[] sr;
    private final double[] si;
    private int iterations;
    private double residual;

    Cocg(int n) {
        this.n = n;
        rr = new double[n];
        ri = new double[n];
        qr = new double[n];
        qi = new double[n];
        sr = new double[n];
        si = new double[n];
    }

    int iterations() {
        return iterations;
    }

    double residual() {
        return residual;
    }

    /**
     * Solves A x = b from the guess in x; true when the
     * tolerance was reached within maxIterations applications.
     */
    boolean solve(LinearOperator a, double[] br, double[] bi, double[] xr, double[] xi, double tol,
                  int maxIterations) {
        double bnorm = norm(br, bi);
        iterations = 0;
        if (bnorm == 0) {
            java.util.Arrays.fill(xr, 0);
            java.util.Arrays.fill(xi, 0);
            residual = 0;
            return true;
        }
        a.apply(xr, xi, qr, qi);
        for (int i = 0; i < n; i++) {
            rr[i] = br[i] - qr[i];
            ri[i] = bi[i] - qi[i];
            sr[i] = rr[i];
            si[i] = ri[i];
        }
        residual = norm(rr, ri) / bnorm;
        // ρ = rᵀr (unconjugated)
        double rhoR = 0;
        double rhoI = 0;
        for (int i = 0; i < n; i++) {
            rhoR += rr[i] * rr[i] - ri[i] * ri[i];
            rhoI += 2 * rr[i] * ri[i];
        }
        while (residual > tol) {
            if (iterations >= maxIterations) {
                return false;
            }
            iterations++;
            a.apply(sr, si, qr, qi);
            double muR = 0;
            double muI = 0;
            for (int i = 0; i < n; i++) {
                muR += sr[i] * qr[i] - si[i] * qi[i];
                muI += sr[i] * qi[i] + si[i] * qr[i];
            }
            double mm = muR * muR + muI * muI;
            if (mm == 0 || (rhoR == 0 && rhoI == 0)) {
                return false;
            }
            double alR = (rhoR * muR + rhoI * muI) / mm;
            double alI = (rhoI * muR - rhoR * muI) / mm;
            double nr = 0;
            double nRhoR = 0;
            double nRhoI = 0;
            for (int i = 0; i < n; i++) {
                xr[i] += alR * sr[i] - alI * si[i];
                xi[i] += alR * si[i] + alI * sr[i];
                double a1 = rr[i] - (alR * qr[i] - alI * qi[i]);
                double a2 = ri[i] - (alR * qi[i] + alI * qr[i]);
                rr[i] = a1;
                ri[i] = a2;
                nr += a1 * a1 + a2 * a2;
                nRhoR += a1 * a1 - a2 * a2;
                nRhoI += 2 * a1 * a2;
            }
            residual = Math.sqrt(nr) / bnorm;
            double rd = rhoR * rhoR + rhoI * rhoI;
            double beR = (nRhoR * rhoR + nRhoI * rhoI) / rd;
            double beI = (nRhoI * rhoR - nRhoR * rhoI) / rd;
            rhoR = nRhoR;
            rhoI = nRhoI;
            for (int i = 0; i < n; i++) {
                double a1 = rr[i] + beR * sr[i] - beI * si[i];
                double a2 = ri[i] + beR * si[i] + beI * sr[i];
                sr[i] = a1;
                si[i] = a2;
            }
        }
        // confirm with the true residual
        a.apply(xr, xi, qr, qi);
        for (int i = 0; i < n; i++) {
            qr[i] = br[i] - qr[i];
            qi[i] = bi[i] - qi[i];
        }
        residual = norm(qr, qi) / bnorm;
        return residual <= tol;
    }

    private double norm(double[] ar, double[] ai) {
        double s = 0;
        for (int i = 0; i < n; i++) {
            s += ar[i] * ar[i] + ai[i] * ai[i];
        }
        return Math.sqrt(s);
    }
}
