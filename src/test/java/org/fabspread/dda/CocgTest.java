package org.fabspread.dda;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.SplittableRandom;

import org.junit.jupiter.api.Test;

class CocgTest {

    /**
     * source: the definition of the solution, A x = b, checked by multiplying back with a dense
     * complex-symmetric matrix (Aᵀ = A, as the coupled-dipole matrix; van der Vorst &amp; Melissen 1990);
     * the residual is the stated relative tolerance.
     */
    @Test
    void solvesAComplexSymmetricSystemToTheTolerance() {
        int n = 40;
        SplittableRandom rnd = new SplittableRandom(5);
        double[][] ar = new double[n][n];
        double[][] ai = new double[n][n];
        for (int i = 0; i < n; i++) {
            for (int j = 0; j <= i; j++) {
                double re = (rnd.nextDouble() - 0.5) * 0.3;
                double im = (rnd.nextDouble() - 0.5) * 0.3;
                if (i == j) {
                    re += 2;
                    im += 0.5;
                }
                ar[i][j] = re;
                ar[j][i] = re;
                ai[i][j] = im;
                ai[j][i] = im;
            }
        }
        LinearOperator op = (xr, xi, yr, yi) -> {
            for (int i = 0; i < n; i++) {
                double sr = 0;
                double si = 0;
                for (int j = 0; j < n; j++) {
                    sr += ar[i][j] * xr[j] - ai[i][j] * xi[j];
                    si += ar[i][j] * xi[j] + ai[i][j] * xr[j];
                }
                yr[i] = sr;
                yi[i] = si;
            }
        };
        double[] br = new double[n];
        double[] bi = new double[n];
        for (int i = 0; i < n; i++) {
            br[i] = rnd.nextDouble();
            bi[i] = rnd.nextDouble();
        }
        double[] xr = new double[n];
        double[] xi = new double[n];
        Cocg c = new Cocg(n);
        assertTrue(c.solve(op, br, bi, xr, xi, 1e-10, 200));
        double[] yr = new double[n];
        double[] yi = new double[n];
        op.apply(xr, xi, yr, yi);
        double err = 0;
        double b = 0;
        for (int i = 0; i < n; i++) {
            err += (yr[i] - br[i]) * (yr[i] - br[i]) + (yi[i] - bi[i]) * (yi[i] - bi[i]);
            b += br[i] * br[i] + bi[i] * bi[i];
        }
        assertEquals(0, Math.sqrt(err / b), 1e-10);
        assertEquals(Math.sqrt(err / b), c.residual(), 1e-12, "reported residual is the true one");
        assertTrue(c.iterations() < n, "converges in fewer steps than the dimension");
    }
}
