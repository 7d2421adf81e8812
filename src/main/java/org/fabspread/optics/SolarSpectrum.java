package org.fabspread.optics;

import java.io.BufferedReader;
import java.io.IOException;
import java.io.InputStream;
import java.io.InputStreamReader;
import java.io.UncheckedIOException;
import java.nio.charset.StandardCharsets;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;

import org.fabspread.study.StudyException;
import org.fabspread.study.WavelengthGrid;

/**
 * A tabulated solar spectral irradiance E(λ) (W m<sup>−2</sup> nm<sup>−1</sup>), read as linear between
 * its tabulated points, and the photon flux it carries. The bundled table is the ASTM G173-03 reference
 * set (derived from SMARTS v2.9.2): extraterrestrial, global tilt (AM1.5G, 37° tilt) and
 * direct + circumsolar, 280–4000 nm.
 *
 * <p>Photon flux density φ(λ) = E(λ) λ / (hc). With E linear between points, φ is a quadratic on each
 * segment, so {@link #photonFluxPerBin} integrates it exactly (Simpson's rule is exact for quadratics).
 * Immutable and thread-safe.
 */
public final class SolarSpectrum {
    /** Elementary charge, C (exact, SI 2019). */
    public static final double Q = 1.602176634e-19;
    /** Planck constant, J s (exact, SI 2019). */
    public static final double H = 6.62607015e-34;
    /** Speed of light in vacuum, m/s (exact). */
    public static final double C = 299792458.0;
    /** hc in J nm: φ [photons m^-2 s^-1 nm^-1] = E [W m^-2 nm^-1] · λ[nm] / HC_NM. */
    private static final double HC_NM = H * C * 1e9;

    private static final String RESOURCE = MaterialLibrary.SHARED + "data/spectra/astm-g173-03.csv";

    /** Columns of the ASTM G173-03 table. */
    public enum Column {
        EXTRATERRESTRIAL(1), GLOBAL_TILT(2), DIRECT_CIRCUMSOLAR(3);

        private final int index;

        Column(int index) {
            this.index = index;
        }
    }

    private final String name;
    private final double[] wl;
    private final double[] e;

    /**
     * @param name          what the spectrum is (shown in messages)
     * @param wavelengthNm  increasing wavelengths, nm
     * @param irradiance    spectral irradiance, W m^-2 nm^-1
     */
    public SolarSpectrum(String name, double[] wavelengthNm, double[] irradiance) {
        if (wavelengthNm.length < 2 || irradiance.length != wavelengthNm.length) {
            throw new IllegalArgumentException(name + ": need at least two points of equal-length arrays");
        }
        for (int i = 1; i < wavelengthNm.length; i++) {
            if (!(wavelengthNm[i] > wavelengthNm[i - 1])) {
                throw new IllegalArgumentException(name + ": wavelengths must increase (point " + i + ")");
            }
        }
        this.name = name;
        this.wl = wavelengthNm.clone();
        this.e = irradiance.clone();
    }

    /** ASTM G173-03 global tilt (AM1.5G), the usual reference for solar-cell current. */
    public static SolarSpectrum astmG173Global() {
        return Table.GLOBAL;
    }

    /** One column of the bundled ASTM G173-03 table. */
    public static SolarSpectrum astmG173(Column column) {
        return switch (column) {
            case GLOBAL_TILT -> Table.GLOBAL;
            case DIRECT_CIRCUMSOLAR -> Table.DIRECT;
            case EXTRATERRESTRIAL -> Table.EXTRA;
        };
    }

    public String name() {
        return name;
    }

    public double minWavelength() {
        return wl[0];
    }

    public double maxWavelength() {
        return wl[wl.length - 1];
    }

    /** Tabulated wavelengths, nm (a copy). */
    public double[] wavelengths() {
        return wl.clone();
    }

    /** Tabulated irradiance, W m^-2 nm^-1 (a copy). */
    public double[] irradiance() {
        return e.clone();
    }

    /** E(λ), linear between tabulated points. */
    public double irradianceAt(double lambdaNm) {
        checkRange(lambdaNm, lambdaNm);
        int i = segment(lambdaNm);
        return lerp(i, lambdaNm);
    }

    /**
     * Photons m^-2 s^-1 falling in each bin of the grid: the exact integral of E(λ)λ/(hc) with E linear
     * between tabulated points. Bin i runs between the midpoints to its neighbours, which for the
     * grid's equal steps is [λ_i − step/2, λ_i + step/2], clipped to [start, stop] at the two ends, so
     * the bins tile [start, stop] exactly.
     *
     * @throws StudyException when the grid leaves the tabulated range
     */
    public double[] photonFluxPerBin(WavelengthGrid grid) {
        double[] w = grid.wavelengths();
        double lo = grid.startNm();
        double hi = Math.max(grid.stopNm(), w[w.length - 1]);
        if (lo < wl[0] || hi > wl[wl.length - 1]) {
            throw new StudyException("grid: the wavelength grid " + fmt(lo) + "–" + fmt(hi) + " nm leaves the solar spectrum "
                    + name + ", tabulated from " + fmt(wl[0]) + " to " + fmt(wl[wl.length - 1]) + " nm");
        }
        double[] out = new double[w.length];
        for (int i = 0; i < w.length; i++) {
            double a = i == 0 ? lo : 0.5 * (w[i - 1] + w[i]);
            double b = i == w.length - 1 ? hi : 0.5 * (w[i] + w[i + 1]);
            out[i] = photonFlux(a, b);
        }
        return out;
    }

    /** Exact ∫ E(λ)λ/(hc) dλ over [a, b] (photons m^-2 s^-1), E linear between tabulated points. */
    public double photonFlux(double fromNm, double toNm) {
        checkRange(fromNm, toNm);
        if (toNm <= fromNm) {
            return 0;
        }
        int i = segment(fromNm);
        double sum = 0;
        double a = fromNm;
        while (a < toNm) {
            double b = Math.min(toNm, wl[i + 1]);
            if (b > a) {
                // Simpson on one linear segment: E(λ)λ is quadratic, so this is exact
                double m = 0.5 * (a + b);
                double fa = lerp(i, a) * a;
                double fm = lerp(i, m) * m;
                double fb = lerp(i, b) * b;
                sum += (b - a) / 6 * (fa + 4 * fm + fb);
            }
            a = b;
            i++;
            if (i >= wl.length - 1) {
                break;
            }
        }
        return sum / HC_NM;
    }

    /** ∫ E dλ over [from, to] in W/m² by the trapezoid rule on the tabulated points (ends interpolated). */
    public double integratePower(double fromNm, double toNm) {
        return trapezoid(fromNm, toNm, false);
    }

    /**
     * The photon-flux limit of the short-circuit current density, mA/cm²: every photon between the two
     * wavelengths gives one electron; trapezoid rule on the tabulated photon flux E(λ)λ/(hc).
     */
    public double photonCurrentLimit(double fromNm, double toNm) {
        return toMilliampPerCm2(trapezoid(fromNm, toNm, true) / HC_NM);
    }

    /** q Φ in A/m² expressed in mA/cm² (1 A/m² = 0.1 mA/cm²). */
    public static double toMilliampPerCm2(double photonsPerM2s) {
        return Q * photonsPerM2s / 10.0;
    }

    private double trapezoid(double fromNm, double toNm, boolean photons) {
        checkRange(fromNm, toNm);
        if (toNm <= fromNm) {
            return 0;
        }
        int i = segment(fromNm);
        double sum = 0;
        double a = fromNm;
        double fa = lerp(i, a) * (photons ? a : 1);
        while (a < toNm && i < wl.length - 1) {
            double b = Math.min(toNm, wl[i + 1]);
            double fb = (b == wl[i + 1] ? e[i + 1] : lerp(i, b)) * (photons ? b : 1);
            sum += 0.5 * (b - a) * (fa + fb);
            a = b;
            fa = fb;
            i++;
        }
        return sum;
    }

    /** Index i of the segment [wl[i], wl[i+1]] holding x (the last segment for x = max). */
    private int segment(double x) {
        int i = Arrays.binarySearch(wl, x);
        if (i < 0) {
            i = -i - 2;
        }
        return Math.min(Math.max(i, 0), wl.length - 2);
    }

    private double lerp(int i, double x) {
        double t = (x - wl[i]) / (wl[i + 1] - wl[i]);
        return e[i] + t * (e[i + 1] - e[i]);
    }

    private void checkRange(double from, double to) {
        if (!(from >= wl[0]) || !(to <= wl[wl.length - 1])) {
            throw new StudyException("wavelengths " + fmt(from) + "–" + fmt(to) + " nm leave the solar spectrum "
                    + name + ", tabulated from " + fmt(wl[0]) + " to " + fmt(wl[wl.length - 1]) + " nm");
        }
    }

    static String fmt(double x) {
        return java.math.BigDecimal.valueOf(x).stripTrailingZeros().toPlainString();
    }

    /** Lazy holder of the bundled table. */
    private static final class Table {
        static final SolarSpectrum EXTRA;
        static final SolarSpectrum GLOBAL;
        static final SolarSpectrum DIRECT;

        static {
            double[][] cols = read();
            EXTRA = new SolarSpectrum("ASTM G173-03 extraterrestrial", cols[0], cols[Column.EXTRATERRESTRIAL.index]);
            GLOBAL = new SolarSpectrum("ASTM G173-03 global tilt", cols[0], cols[Column.GLOBAL_TILT.index]);
            DIRECT = new SolarSpectrum("ASTM G173-03 direct+circumsolar", cols[0], cols[Column.DIRECT_CIRCUMSOLAR.index]);
        }

        private static double[][] read() {
            List<double[]> rows = new ArrayList<>();
            try (InputStream in = SolarSpectrum.class.getResourceAsStream(RESOURCE)) {
                if (in == null) {
                    throw new IllegalStateException("the solar spectrum is missing from the jar: " + RESOURCE);
                }
                BufferedReader r = new BufferedReader(new InputStreamReader(in, StandardCharsets.UTF_8));
                String line;
                int lineNo = 0;
                while ((line = r.readLine()) != null) {
                    lineNo++;
                    if (lineNo <= 2 || line.isBlank()) {
                        continue;
                    }
                    String[] f = line.split(",");
                    if (f.length < 4) {
                        throw new IllegalStateException(RESOURCE + ":" + lineNo + ": expected 4 columns");
                    }
                    double[] row = new double[4];
                    for (int c = 0; c < 4; c++) {
                        row[c] = Double.parseDouble(f[c].strip());
                    }
                    rows.add(row);
                }
            } catch (IOException ex) {
                throw new UncheckedIOException(ex);
            }
            double[][] cols = new double[4][rows.size()];
            for (int i = 0; i < rows.size(); i++) {
                for (int c = 0; c < 4; c++) {
                    cols[c][i] = rows.get(i)[c];
                }
            }
            return cols;
        }
    }
}
