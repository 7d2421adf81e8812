package org.fabspread.optics;

import java.util.Arrays;

/**
 * Tabulated complex refractive index N = n + i k against vacuum wavelength (nm), interpolated
 * linearly. Immutable. Asking for a wavelength outside the table is an error, never an extrapolation.
 */
public final class NkTable {
    private final String id;
    private final String description;
    private final String source;
    private final double[] wl;
    private final double[] n;
    private final double[] k;
    private final int negativeKRows;

    public NkTable(String id, String description, String source, double[] wavelengthNm, double[] n, double[] k) {
        this(id, description, source, wavelengthNm, n, k, 0);
    }

    /**
     * @param negativeKRows how many rows of the file had k &lt; 0 and were read as 0 (digitisation noise)
     */
    public NkTable(String id, String description, String source, double[] wavelengthNm, double[] n, double[] k,
                   int negativeKRows) {
        if (wavelengthNm.length < 2 || n.length != wavelengthNm.length || k.length != wavelengthNm.length) {
            throw new IllegalArgumentException(id + ": a table needs at least two rows of wavelength_nm,n,k");
        }
        for (int i = 1; i < wavelengthNm.length; i++) {
            if (!(wavelengthNm[i] > wavelengthNm[i - 1])) {
                throw new IllegalArgumentException(id + ": wavelengths must increase (row " + (i + 1) + ")");
            }
        }
        this.id = id;
        this.description = description;
        this.source = source;
        this.wl = wavelengthNm.clone();
        this.n = n.clone();
        this.k = k.clone();
        this.negativeKRows = negativeKRows;
    }

    /** Rows of the source file whose negative k was read as 0. */
    public int negativeKRows() { return negativeKRows; }

    public String id() { return id; }
    public String description() { return description; }
    public String source() { return source; }
    public double minWavelength() { return wl[0]; }
    public double maxWavelength() { return wl[wl.length - 1]; }
    public double[] wavelengths() { return wl.clone(); }
    public double[] nValues() { return n.clone(); }
    public double[] kValues() { return k.clone(); }

    public boolean covers(double lambdaNm) {
        return lambdaNm >= wl[0] && lambdaNm <= wl[wl.length - 1];
    }

    /** n at a wavelength (nm), linear interpolation. */
    public double n(double lambdaNm) {
        return interp(n, lambdaNm);
    }

    /** k at a wavelength (nm), linear interpolation. */
    public double k(double lambdaNm) {
        return interp(k, lambdaNm);
    }

    /**
     * Interpolates n and k on a whole grid at once (done once per study, not per layer pass).
     *
     * @throws IllegalArgumentException naming the material and the first wavelength outside the table
     */
    public void sample(double[] lambdaNm, double[] nOut, double[] kOut) {
        for (int i = 0; i < lambdaNm.length; i++) {
            nOut[i] = interp(n, lambdaNm[i]);
            kOut[i] = interp(k, lambdaNm[i]);
        }
    }

    private double interp(double[] y, double x) {
        if (!covers(x)) {
            throw new IllegalArgumentException("material " + id + " is tabulated from " + wl[0] + " to "
                    + wl[wl.length - 1] + " nm; " + x + " nm is outside its table");
        }
        int i = Arrays.binarySearch(wl, x);
        if (i >= 0) {
            return y[i];
        }
        int hi = -i - 1;
        int lo = hi - 1;
        double t = (x - wl[lo]) / (wl[hi] - wl[lo]);
        return y[lo] + t * (y[hi] - y[lo]);
    }
}
