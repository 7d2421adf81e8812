package org.fabspread.dda;

/**
 * Restarted GMRES(m) (Saad &amp; Schultz, SIAM J. Sci. Stat. Comput. 7, 856 (1986)) for a complex linear system
 * A x = b: Arnoldi with modified Gram–Schmidt, Givens rotations on the Hessenberg matrix, restart after m
 * steps. Stops when ‖b − A x‖ ≤ tol ‖b‖ (the residual norm the rotations give, checked against the true
 * residual at each restart). Separate real and imaginary arrays; allocation-free after construction.
 */
final class Gmres {
    private final int n;
    private final int m;
    private final double[][] vr;
    private final double[][] vi;
    private final double[] hr;
    private final double[] hi;
    private final double[] csr;
    private final double[] sr;
    private final double[] si;
    private final double[] gr;
    private final double[] gi;
    private final double[] yr;
    private final double[] yi;
    private final double[] wr;
    private final double[] wi;
    private int iterations;
    private double residual;

    Gmres(int n, int m) {
        this.n = n;
        this.m = m;
        vr = new double[m + 1][n];
        vi = new double[m + 1][n];
        hr = new double[(m + 1) * m];
        hi = new double[(m + 1) * m];
        csr = new double[m];
        sr = new double[m];
        si = new double[m];
        gr = new double[m + 1];
        gi = new double[m + 1];
        yr = new double[m];
        yi = new double[m];
        wr = new double[n];
        wi = new double[n];
    }

    int iterations() {
        return iterations;
    }

    double residual() {
        return residual;
    }

    /** Solves A x = b from the guess in x; true when the tolerance was reached within maxIterations steps. */
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
        while (true) {
            a.apply(xr, xi, wr, wi);
            for (int i = 0; i < n; i++) {
                wr[i] = br[i] - wr[i];
                wi[i] = bi[i] - wi[i];
            }
            double beta = norm(wr, wi);
            residual = beta / bnorm;
            if (residual <= tol || iterations >= maxIterations) {
                return residual <= tol;
            }
            for (int i = 0; i < n; i++) {
                vr[0][i] = wr[i] / beta;
                vi[0][i] = wi[i] / beta;
            }
            java.util.Arrays.fill(gr, 0);
            java.util.Arrays.fill(gi, 0);
            gr[0] = beta;
            int k = 0;
            while (k < m && iterations < maxIterations) {
                iterations++;
                a.apply(vr[k], vi[k], wr, wi);
                for (int j = 0; j <= k; j++) {
                    // h = <v_j, w>
                    double dr = 0;
                    double di = 0;
                    double[] pr = vr[j];
                    double[] pi = vi[j];
                    for (int i = 0; i < n; i++) {
                        dr += pr[i] * wr[i] + pi[i] * wi[i];
                        di += pr[i] * wi[i] - pi[i] * wr[i];
                    }
                    hr[j * m + k] = dr;
                    hi[j * m + k] = di;
                    for (int i = 0; i < n; i++) {
                        wr[i] -= dr * pr[i] - di * pi[i];
                        wi[i] -= dr * pi[i] + di * pr[i];
                    }
                }
                double h = norm(wr, wi);
                hr[(k + 1) * m + k] = h;
                hi[(k + 1) * m + k] = 0;
                if (h > 0) {
                    for (int i = 0; i < n; i++) {
                        vr[k + 1][i] = wr[i] / h;
                        vi[k + 1][i] = wi[i] / h;
                    }
                }
                rotate(k);
                k++;
                residual = Math.hypot(gr[k], gi[k]) / bnorm;
                if (residual <= tol || h == 0) {
                    break;
                }
            }
            update(k, xr, xi);
        }
    }

    /** Applies the previous rotations to column k of H, then a new rotation that zeroes H[k+1][k]. */
    private void rotate(int k) {
        for (int j = 0; j < k; j++) {
            // [c  s; -conj(s) c] applied to (h_j, h_{j+1})
            double ar = hr[j * m + k];
            double ai = hi[j * m + k];
            double cr = hr[(j + 1) * m + k];
            double ci = hi[(j + 1) * m + k];
            double c = csr[j];
            double tr = c * ar + sr[j] * cr - si[j] * ci;
            double ti = c * ai + sr[j] * ci + si[j] * cr;
            double ur = -(sr[j] * ar + si[j] * ai) + c * cr;
            double ui = -(sr[j] * ai - si[j] * ar) + c * ci;
            hr[j * m + k] = tr;
            hi[j * m + k] = ti;
            hr[(j + 1) * m + k] = ur;
            hi[(j + 1) * m + k] = ui;
        }
        double ar = hr[k * m + k];
        double ai = hi[k * m + k];
        double b = hr[(k + 1) * m + k];
        double na = Math.hypot(ar, ai);
        double r = Math.hypot(na, b);
        double c;
        double sRe;
        double sIm;
        if (na == 0) {
            c = 0;
            sRe = 1;
            sIm = 0;
            hr[k * m + k] = b;
            hi[k * m + k] = 0;
        } else {
            c = na / r;
            // s = (a/|a|) conj(b) / r, b real
            sRe = ar / na * b / r;
            sIm = ai / na * b / r;
            hr[k * m + k] = ar / na * r;
            hi[k * m + k] = ai / na * r;
        }
        hr[(k + 1) * m + k] = 0;
        csr[k] = c;
        sr[k] = sRe;
        si[k] = sIm;
        double g0r = gr[k];
        double g0i = gi[k];
        gr[k] = c * g0r;
        gi[k] = c * g0i;
        gr[k + 1] = -(sRe * g0r + sIm * g0i);
        gi[k + 1] = -(sRe * g0i - sIm * g0r);
    }

    /** x += V y with H y = g (back substitution on the rotated upper-triangular H). */
    private void update(int k, double[] xr, double[] xi) {
        for (int j = k - 1; j >= 0; j--) {
            double tr = gr[j];
            double ti = gi[j];
            for (int l = j + 1; l < k; l++) {
                double ar = hr[j * m + l];
                double ai = hi[j * m + l];
                tr -= ar * yr[l] - ai * yi[l];
                ti -= ar * yi[l] + ai * yr[l];
            }
            double dr = hr[j * m + j];
            double di = hi[j * m + j];
            double dd = dr * dr + di * di;
            yr[j] = (tr * dr + ti * di) / dd;
            yi[j] = (ti * dr - tr * di) / dd;
        }
        for (int j = 0; j < k; j++) {
            double[] pr = vr[j];
            double[] pi = vi[j];
            double cr = yr[j];
            double ci = yi[j];
            for (int i = 0; i < n; i++) {
                xr[i] += cr * pr[i] - ci * pi[i];
                xi[i] += cr * pi[i] + ci * pr[i];
            }
        }
    }

    private double norm(double[] ar, double[] ai) {
        double s = 0;
        for (int i = 0; i < n; i++) {
            s += ar[i] * ar[i] + ai[i] * ai[i];
        }
        return Math.sqrt(s);
    }
}
