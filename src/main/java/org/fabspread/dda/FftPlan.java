package org.fabspread.dda;

/**
 * One-dimensional complex discrete Fourier transform of a 5-smooth length (factors 2, 3, 4, 5), by the
 * self-sorting Stockham algorithm (decimation in frequency; Van Loan, <i>Computational Frameworks for the
 * Fast Fourier Transform</i>, SIAM 1992, §1.7): a stage of radix r on a sequence of length L = r·m maps
 * x[q + s(p + t m)] to y[q + s(r p + u)] = w_L^{p u} Σ_t x[q + s(p + t m)] ω_r^{t u} and hands the r·s
 * interleaved sequences of length m to the next stage. No bit reversal is needed.
 *
 * <p>The transform works in place on {@code s0} interleaved sequences (element t of sequence q at
 * {@code base + q + s0·t}), ping-ponging through caller-owned scratch of at least {@code n·s0}
 * entries, and allocates nothing. Forward uses e^{−2πi jk/n}; inverse e^{+2πi jk/n}, unnormalised.
 */
final class FftPlan {
    private final int n;
    private final int[] radix;
    /** per stage: twiddle w_L^{p u} at index p·r + u (forward sign). */
    private final double[][] twRe;
    private final double[][] twIm;
    /** roots of unity of the odd radices, forward sign: index (t·u) mod r. */
    private static final double[] W3_RE = roots(3, true);
    private static final double[] W3_IM = roots(3, false);
    private static final double[] W5_RE = roots(5, true);
    private static final double[] W5_IM = roots(5, false);

    FftPlan(int n) {
        if (n < 1 || !isSmooth(n)) {
            throw new IllegalArgumentException("FFT length must be a positive 5-smooth number, got " + n);
        }
        this.n = n;
        int[] tmp = new int[32];
        int count = 0;
        int rest = n;
        while (rest % 4 == 0) {
            tmp[count++] = 4;
            rest /= 4;
        }
        for (int f : new int[] {2, 3, 5}) {
            while (rest % f == 0) {
                tmp[count++] = f;
                rest /= f;
            }
        }
        radix = java.util.Arrays.copyOf(tmp, count);
        twRe = new double[count][];
        twIm = new double[count][];
        int len = n;
        for (int st = 0; st < count; st++) {
            int r = radix[st];
            int m = len / r;
            twRe[st] = new double[m * r];
            twIm[st] = new double[m * r];
            for (int p = 0; p < m; p++) {
                for (int u = 0; u < r; u++) {
                    double a = -2 * Math.PI * ((long) p * u % len) / len;
                    twRe[st][p * r + u] = Math.cos(a);
                    twIm[st][p * r + u] = Math.sin(a);
                }
            }
            len = m;
        }
    }

    int length() {
        return n;
    }

    /** True when n has no prime factor above 5. */
    static boolean isSmooth(int n) {
        for (int f : new int[] {2, 3, 5}) {
            while (n > 1 && n % f == 0) {
                n /= f;
            }
        }
        return n == 1;
    }

    /** The smallest 5-smooth number ≥ n. */
    static int nextSmooth(int n) {
        int m = Math.max(1, n);
        while (!isSmooth(m)) {
            m++;
        }
        return m;
    }

    private static double[] roots(int r, boolean real) {
        double[] w = new double[r];
        for (int j = 0; j < r; j++) {
            double a = -2 * Math.PI * j / r;
            w[j] = real ? Math.cos(a) : Math.sin(a);
        }
        return w;
    }

    /**
     * Transforms {@code s0} interleaved sequences in place.
     *
     * @param base    index of element 0 of sequence 0
     * @param s0      number of interleaved sequences (their stride)
     * @param wr      scratch, length ≥ n·s0
     * @param wi      scratch, length ≥ n·s0
     * @param inverse true for the e^{+2πi jk/n} transform (unnormalised)
     */
    void transform(double[] re, double[] im, int base, int s0, double[] wr, double[] wi, boolean inverse) {
        double sign = inverse ? -1 : 1;
        int len = n;
        int s = s0;
        boolean inData = true;
        for (int st = 0; st < radix.length; st++) {
            int r = radix[st];
            int m = len / r;
            if (inData) {
                stage(r, m, s, re, im, base, wr, wi, 0, twRe[st], twIm[st], sign);
            } else {
                stage(r, m, s, wr, wi, 0, re, im, base, twRe[st], twIm[st], sign);
            }
            inData = !inData;
            len = m;
            s *= r;
        }
        if (!inData) {
            System.arraycopy(wr, 0, re, base, n * s0);
            System.arraycopy(wi, 0, im, base, n * s0);
        }
    }

    private static void stage(int r, int m, int s, double[] xr, double[] xi, int xo, double[] yr, double[] yi,
                              int yo, double[] tr, double[] ti, double sign) {
        switch (r) {
            case 4 -> radix4(m, s, xr, xi, xo, yr, yi, yo, tr, ti, sign);
            case 2 -> radix2(m, s, xr, xi, xo, yr, yi, yo, tr, ti, sign);
            default -> radixOdd(r, m, s, xr, xi, xo, yr, yi, yo, tr, ti, sign);
        }
    }

    private static void radix2(int m, int s, double[] xr, double[] xi, int xo, double[] yr, double[] yi, int yo,
                               double[] tr, double[] ti, double sign) {
        for (int p = 0; p < m; p++) {
            double w1r = tr[p * 2 + 1];
            double w1i = sign * ti[p * 2 + 1];
            int i0 = xo + s * p;
            int i1 = xo + s * (p + m);
            int o0 = yo + s * (2 * p);
            int o1 = o0 + s;
            for (int q = 0; q < s; q++) {
                double ar = xr[i0 + q];
                double ai = xi[i0 + q];
                double br = xr[i1 + q];
                double bi = xi[i1 + q];
                yr[o0 + q] = ar + br;
                yi[o0 + q] = ai + bi;
                double dr = ar - br;
                double di = ai - bi;
                yr[o1 + q] = dr * w1r - di * w1i;
                yi[o1 + q] = dr * w1i + di * w1r;
            }
        }
    }

    private static void radix4(int m, int s, double[] xr, double[] xi, int xo, double[] yr, double[] yi, int yo,
                               double[] tr, double[] ti, double sign) {
        for (int p = 0; p < m; p++) {
            double w1r = tr[p * 4 + 1];
            double w1i = sign * ti[p * 4 + 1];
            double w2r = tr[p * 4 + 2];
            double w2i = sign * ti[p * 4 + 2];
            double w3r = tr[p * 4 + 3];
            double w3i = sign * ti[p * 4 + 3];
            int i0 = xo + s * p;
            int i1 = i0 + s * m;
            int i2 = i1 + s * m;
            int i3 = i2 + s * m;
            int o0 = yo + s * (4 * p);
            int o1 = o0 + s;
            int o2 = o1 + s;
            int o3 = o2 + s;
            for (int q = 0; q < s; q++) {
                double a0r = xr[i0 + q];
                double a0i = xi[i0 + q];
                double a1r = xr[i1 + q];
                double a1i = xi[i1 + q];
                double a2r = xr[i2 + q];
                double a2i = xi[i2 + q];
                double a3r = xr[i3 + q];
                double a3i = xi[i3 + q];
                double s02r = a0r + a2r;
                double s02i = a0i + a2i;
                double d02r = a0r - a2r;
                double d02i = a0i - a2i;
                double s13r = a1r + a3r;
                double s13i = a1i + a3i;
                // forward: −i (a1 − a3); inverse: +i (a1 − a3)
                double jr = sign * (a1i - a3i);
                double ji = -sign * (a1r - a3r);
                yr[o0 + q] = s02r + s13r;
                yi[o0 + q] = s02i + s13i;
                double b1r = d02r + jr;
                double b1i = d02i + ji;
                double b2r = s02r - s13r;
                double b2i = s02i - s13i;
                double b3r = d02r - jr;
                double b3i = d02i - ji;
                yr[o1 + q] = b1r * w1r - b1i * w1i;
                yi[o1 + q] = b1r * w1i + b1i * w1r;
                yr[o2 + q] = b2r * w2r - b2i * w2i;
                yi[o2 + q] = b2r * w2i + b2i * w2r;
                yr[o3 + q] = b3r * w3r - b3i * w3i;
                yi[o3 + q] = b3r * w3i + b3i * w3r;
            }
        }
    }

    /** Radix 3 and 5 by the direct r-point sum (r² multiplications per butterfly; only a few stages use it). */
    private static void radixOdd(int r, int m, int s, double[] xr, double[] xi, int xo, double[] yr, double[] yi,
                                 int yo, double[] tr, double[] ti, double sign) {
        double[] wRe = r == 3 ? W3_RE : W5_RE;
        double[] wIm = r == 3 ? W3_IM : W5_IM;
        for (int p = 0; p < m; p++) {
            for (int u = 0; u < r; u++) {
                double twr = tr[p * r + u];
                double twi = sign * ti[p * r + u];
                int o = yo + s * (r * p + u);
                for (int q = 0; q < s; q++) {
                    double sr = 0;
                    double si = 0;
                    for (int t = 0; t < r; t++) {
                        int idx = xo + q + s * (p + t * m);
                        int e = (t * u) % r;
                        double cr = wRe[e];
                        double ci = sign * wIm[e];
                        double ar = xr[idx];
                        double ai = xi[idx];
                        sr += ar * cr - ai * ci;
                        si += ar * ci + ai * cr;
                    }
                    yr[o + q] = sr * twr - si * twi;
                    yi[o + q] = sr * twi + si * twr;
                }
            }
        }
    }
}
