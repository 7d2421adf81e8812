package org.fabspread.dda;

import static org.junit.jupiter.api.Assertions.assertEquals;

import java.util.SplittableRandom;

import org.junit.jupiter.api.Test;

class ConvolutionTest {

    /**
     * source: the definition E_t = Σ_σ G(t − σ) P_σ with Draine's (ApJ 333, 848 (1988)) dipole field
     * G = e^{iκr}/r³[κ²r²(I − r̂r̂) + (1 − iκr)(3r̂r̂ − I)], summed directly; the FFT convolution must agree.
     */
    @Test
    void fftConvolutionEqualsTheDirectSum() {
        int nx = 5;
        int ny = 4;
        int nz = 3;
        double kappa = 0.37;
        Convolution c = new Convolution(nx, ny, nz, nx - 1, ny - 1, nz - 1);
        c.setWavenumber(kappa);
        int n = nx * ny * nz;
        double[][] pr = new double[n][3];
        double[][] pi = new double[n][3];
        SplittableRandom rnd = new SplittableRandom(11);
        c.clear();
        for (int z = 0; z < nz; z++) {
            for (int y = 0; y < ny; y++) {
                for (int x = 0; x < nx; x++) {
                    int j = (z * ny + y) * nx + x;
                    for (int a = 0; a < 3; a++) {
                        pr[j][a] = rnd.nextDouble() - 0.5;
                        pi[j][a] = rnd.nextDouble() - 0.5;
                        c.re(a)[c.index(x, y, z)] = pr[j][a];
                        c.im(a)[c.index(x, y, z)] = pi[j][a];
                    }
                }
            }
        }
        c.convolve(nx, ny, nz);
        for (int t = 0; t < n; t += 7) {
            int tx = t % nx;
            int ty = (t / nx) % ny;
            int tz = t / (nx * ny);
            double[] er = new double[3];
            double[] ei = new double[3];
            for (int s = 0; s < n; s++) {
                if (s == t) {
                    continue;
                }
                double[] r = {tx - s % nx, ty - (s / nx) % ny, tz - s / (nx * ny)};
                double d = Math.sqrt(r[0] * r[0] + r[1] * r[1] + r[2] * r[2]);
                double kr = kappa * d;
                double cr = Math.cos(kr) / (d * d * d);
                double ci = Math.sin(kr) / (d * d * d);
                for (int a = 0; a < 3; a++) {
                    for (int b = 0; b < 3; b++) {
                        double rr = r[a] * r[b] / (d * d);
                        double del = a == b ? 1 : 0;
                        // κ²r²(δ − r̂r̂) + (1 − iκr)(3r̂r̂ − δ)
                        double gRe = kr * kr * (del - rr) + (3 * rr - del);
                        double gIm = -kr * (3 * rr - del);
                        double fr = cr * gRe - ci * gIm;
                        double fi = cr * gIm + ci * gRe;
                        er[a] += fr * pr[s][b] - fi * pi[s][b];
                        ei[a] += fr * pi[s][b] + fi * pr[s][b];
                    }
                }
            }
            for (int a = 0; a < 3; a++) {
                assertEquals(er[a], c.re(a)[c.index(tx, ty, tz)], 1e-12);
                assertEquals(ei[a], c.im(a)[c.index(tx, ty, tz)], 1e-12);
            }
        }
    }
}
