package org.fabspread.dda;

/**
 * Three-dimensional complex FFT on a box of mx × my × mz points stored x fastest
 * (index (z·my + y)·mx + x) in separate real and imaginary arrays, by one-dimensional
 * {@link FftPlan} transforms along each axis.
 *
 * <p>Pruned for zero-padded convolution (Goodman, Draine &amp; Flatau, Opt. Lett. 16, 1198 (1991)): the forward
 * transform of data confined to the corner box nx × ny × nz transforms only the x-rows with y &lt; ny,
 * z &lt; nz, then the y-columns of the slabs z &lt; nz, then every z-column; the inverse transform whose
 * result is wanted only in that corner box runs the same passes in reverse order. Rows that are all zero
 * stay zero, so the result is the full transform's. Allocation-free after construction (one scratch
 * pair of the box size).
 */
final class Fft3 {
    final int mx;
    final int my;
    final int mz;
    private final FftPlan px;
    private final FftPlan py;
    private final FftPlan pz;
    private final double[] wr;
    private final double[] wi;

    Fft3(int mx, int my, int mz) {
        this.mx = mx;
        this.my = my;
        this.mz = mz;
        px = new FftPlan(mx);
        py = new FftPlan(my);
        pz = new FftPlan(mz);
        wr = new double[mx * my * mz];
        wi = new double[mx * my * mz];
    }

    int size() {
        return mx * my * mz;
    }

    /** Forward transform of data nonzero only in the corner box nx × ny × nz. */
    void forward(double[] re, double[] im, int nx, int ny, int nz) {
        for (int z = 0; z < nz; z++) {
            for (int y = 0; y < ny; y++) {
                px.transform(re, im, (z * my + y) * mx, 1, wr, wi, false);
            }
        }
        for (int z = 0; z < nz; z++) {
            py.transform(re, im, z * my * mx, mx, wr, wi, false);
        }
        pz.transform(re, im, 0, mx * my, wr, wi, false);
    }

    /** Inverse (unnormalised) transform, correct in the corner box nx × ny × nz only. */
    void inverse(double[] re, double[] im, int nx, int ny, int nz) {
        pz.transform(re, im, 0, mx * my, wr, wi, true);
        for (int z = 0; z < nz; z++) {
            py.transform(re, im, z * my * mx, mx, wr, wi, true);
        }
        for (int z = 0; z < nz; z++) {
            for (int y = 0; y < ny; y++) {
                px.transform(re, im, (z * my + y) * mx, 1, wr, wi, true);
            }
        }
    }

    /** Full forward transform. */
    void forward(double[] re, double[] im) {
        forward(re, im, mx, my, mz);
    }
}
