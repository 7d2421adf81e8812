package org.fabspread.study;

/**
 * The study's wavelength grid: {@code count} equally spaced vacuum wavelengths from {@code startNm}
 * to {@code stopNm} inclusive. Each point stands for the bin [λ − step/2, λ + step/2], clipped to
 * [start, stop] at the two ends, over which the solar photon flux is integrated exactly.
 */
public record WavelengthGrid(double startNm, double stopNm, double stepNm) {

    public WavelengthGrid {
        if (!(stepNm > 0) || !(stopNm >= startNm) || !(startNm > 0)) {
            throw new IllegalArgumentException("bad grid " + startNm + ".." + stopNm + " step " + stepNm);
        }
    }

    public int count() {
        return (int) Math.round((stopNm - startNm) / stepNm) + 1;
    }

    public double[] wavelengths() {
        int n = count();
        double[] w = new double[n];
        for (int i = 0; i < n; i++) {
            w[i] = startNm + i * stepNm;
        }
        w[n - 1] = Math.min(w[n - 1], stopNm);
        return w;
    }
}
