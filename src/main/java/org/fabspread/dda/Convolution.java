package org.fabspread.dda;

/**
 * The dipole–dipole interaction on a cubic lattice applied as a discrete convolution by FFT (Goodman, Draine
 * &amp; Flatau, Opt. Lett. 16, 1198 (1991)): the field at cell t from the dipoles P at cells σ,
 * E_t = Σ_σ G(t − σ) P_σ, with the free-space dyadic Green's function of the host (Gaussian units, lattice
 * units: lengths in d, wavenumber κ = kd)
 * <pre>  G(r) = e^{iκr}/r³ [ (κ²r² − 1 + iκr) I + (3 − 3iκr − κ²r²) r̂ r̂ ],  G(0) = 0</pre>
 * (Draine, ApJ 333, 848 (1988), eq. 3 with A_jk = −G). The kernel for offsets |δ_a| ≤ h_a is embedded
 * circulantly in a box of M_a ≥ 2h_a + 1 points (the smallest 5-smooth length), so one forward transform
 * of each of the three dipole components, a multiplication by the six distinct transformed tensor
 * components and three inverse transforms give the fields on the data box of t_a ≤ M_a cells.
 *
 * <p>Allocation-free after construction: the caller writes P into {@link #re(int)}/{@link #im(int)} and calls
 * {@link #convolve}.
 */
final class Convolution {
    /** tensor component slots */
    private static final int XX = 0;
    private static final int XY = 1;
    private static final int XZ = 2;
    private static final int YY = 3;
    private static final int YZ = 4;
    private static final int ZZ = 5;

    final int mx;
    final int my;
    final int mz;
    private final int tx;
    private final int ty;
    private final int tz;
    private final int hx;
    private final int hy;
    private final int hz;
    private final Fft3 fft;
    private final double[][] kRe = new double[6][];
    private final double[][] kIm = new double[6][];
    private final double[][] dRe = new double[3][];
    private final double[][] dIm = new double[3][];
    private double kappa = Double.NaN;

    /**
     * @param tx data box (cells whose field is wanted), per axis
     * @param hx largest |offset| between a source and a target, per axis
     */
    Convolution(int tx, int ty, int tz, int hx, int hy, int hz) {
        this.tx = tx;
        this.ty = ty;
        this.tz = tz;
        this.hx = hx;
        this.hy = hy;
        this.hz = hz;
        mx = Math.max(FftPlan.nextSmooth(2 * hx + 1), FftPlan.nextSmooth(tx));
        my = Math.max(FftPlan.nextSmooth(2 * hy + 1), FftPlan.nextSmooth(ty));
        mz = Math.max(FftPlan.nextSmooth(2 * hz + 1), FftPlan.nextSmooth(tz));
        fft = new Fft3(mx, my, mz);
        int n = fft.size();
        for (int c = 0; c < 6; c++) {
            kRe[c] = new double[n];
            kIm[c] = new double[n];
        }
        for (int c = 0; c < 3; c++) {
            dRe[c] = new double[n];
            dIm[c] = new double[n];
        }
    }

    /** Padded-box index of cell (x, y, z). */
    int index(int x, int y, int z) {
        return (z * my + y) * mx + x;
    }

    /** Real part of dipole component c (0 = x, 1 = y, 2 = z) on the padded box; the field after {@link #convolve}. */
    double[] re(int c) {
        return dRe[c];
    }

    double[] im(int c) {
        return dIm[c];
    }

    /** Sets every data value to zero. */
    void clear() {
        for (int c = 0; c < 3; c++) {
            java.util.Arrays.fill(dRe[c], 0);
            java.util.Arrays.fill(dIm[c], 0);
        }
    }

    /** Builds and transforms the kernel for the host wavenumber κ = kd (skipped when κ is unchanged). */
    void setWavenumber(double kd) {
        if (kd == kappa) {
            return;
        }
        kappa = kd;
        double scale = 1.0 / fft.size();
        for (int z = 0; z < mz; z++) {
            int dz = offset(z, mz, hz);
            for (int y = 0; y < my; y++) {
                int dy = offset(y, my, hy);
                for (int x = 0; x < mx; x++) {
                    int dx = offset(x, mx, hx);
                    int i = index(x, y, z);
                    if (dx == Integer.MIN_VALUE || dy == Integer.MIN_VALUE || dz == Integer.MIN_VALUE
                            || (dx == 0 && dy == 0 && dz == 0)) {
                        for (int c = 0; c < 6; c++) {
                            kRe[c][i] = 0;
                            kIm[c][i] = 0;
                        }
                        continue;
                    }
                    double r2 = (double) dx * dx + (double) dy * dy + (double) dz * dz;
                    double r = Math.sqrt(r2);
                    double kr = kd * r;
                    double cr = Math.cos(kr) * scale / (r2 * r);
                    double ci = Math.sin(kr) * scale / (r2 * r);
                    // diagonal factor a = κ²r² − 1 + iκr, dyad factor b = 3 − κ²r² − 3iκr, both times e^{iκr}/r³
                    double aRe = kr * kr - 1;
                    double aIm = kr;
                    double bRe = 3 - kr * kr;
                    double bIm = -3 * kr;
                    double ar = cr * aRe - ci * aIm;
                    double ai = cr * aIm + ci * aRe;
                    double br = (cr * bRe - ci * bIm) / r2;
                    double bi = (cr * bIm + ci * bRe) / r2;
                    set(XX, i, ar + br * dx * dx, ai + bi * dx * dx);
                    set(YY, i, ar + br * dy * dy, ai + bi * dy * dy);
                    set(ZZ, i, ar + br * dz * dz, ai + bi * dz * dz);
                    set(XY, i, br * dx * dy, bi * dx * dy);
                    set(XZ, i, br * dx * dz, bi * dx * dz);
                    set(YZ, i, br * dy * dz, bi * dy * dz);
                }
            }
        }
        for (int c = 0; c < 6; c++) {
            fft.forward(kRe[c], kIm[c]);
        }
    }

    private void set(int c, int i, double re, double im) {
        kRe[c][i] = re;
        kIm[c][i] = im;
    }

    /** Offset δ stored at padded index i, or MIN_VALUE in the gap between +h and −h. */
    private static int offset(int i, int m, int h) {
        if (i <= h) {
            return i;
        }
        if (i >= m - h) {
            return i - m;
        }
        return Integer.MIN_VALUE;
    }

    /**
     * Replaces the dipoles (nonzero only in the corner box sx × sy × sz) by their field, correct on the data box.
     * Hot loop: the pointwise 3 × 3 complex tensor product runs over the whole padded box, written out.
     */
    void convolve(int sx, int sy, int sz) {
        for (int c = 0; c < 3; c++) {
            fft.forward(dRe[c], dIm[c], sx, sy, sz);
        }
        double[] xr = dRe[0];
        double[] xi = dIm[0];
        double[] yr = dRe[1];
        double[] yi = dIm[1];
        double[] zr = dRe[2];
        double[] zi = dIm[2];
        double[] gxxr = kRe[XX];
        double[] gxxi = kIm[XX];
        double[] gxyr = kRe[XY];
        double[] gxyi = kIm[XY];
        double[] gxzr = kRe[XZ];
        double[] gxzi = kIm[XZ];
        double[] gyyr = kRe[YY];
        double[] gyyi = kIm[YY];
        double[] gyzr = kRe[YZ];
        double[] gyzi = kIm[YZ];
        double[] gzzr = kRe[ZZ];
        double[] gzzi = kIm[ZZ];
        int n = fft.size();
        for (int i = 0; i < n; i++) {
            double ax = xr[i];
            double bx = xi[i];
            double ay = yr[i];
            double by = yi[i];
            double az = zr[i];
            double bz = zi[i];
            double ex = gxxr[i] * ax - gxxi[i] * bx + gxyr[i] * ay - gxyi[i] * by + gxzr[i] * az - gxzi[i] * bz;
            double fx = gxxr[i] * bx + gxxi[i] * ax + gxyr[i] * by + gxyi[i] * ay + gxzr[i] * bz + gxzi[i] * az;
            double ey = gxyr[i] * ax - gxyi[i] * bx + gyyr[i] * ay - gyyi[i] * by + gyzr[i] * az - gyzi[i] * bz;
            double fy = gxyr[i] * bx + gxyi[i] * ax + gyyr[i] * by + gyyi[i] * ay + gyzr[i] * bz + gyzi[i] * az;
            double ez = gxzr[i] * ax - gxzi[i] * bx + gyzr[i] * ay - gyzi[i] * by + gzzr[i] * az - gzzi[i] * bz;
            double fz = gxzr[i] * bx + gxzi[i] * ax + gyzr[i] * by + gyzi[i] * ay + gzzr[i] * bz + gzzi[i] * az;
            xr[i] = ex;
            xi[i] = fx;
            yr[i] = ey;
            yi[i] = fy;
            zr[i] = ez;
            zi[i] = fz;
        }
        for (int c = 0; c < 3; c++) {
            fft.inverse(dRe[c], dIm[c], tx, ty, tz);
        }
    }
}
