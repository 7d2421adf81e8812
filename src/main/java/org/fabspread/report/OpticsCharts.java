package org.fabspread.report;

import static org.fabspread.report.ChartChecks.*;
import static org.fabspread.report.ChartParts.*;
import static org.fabspread.report.ChartText.*;

import java.awt.Color;
import java.util.ArrayList;
import java.util.List;
import org.knowm.xchart.XYSeries;
import org.knowm.xchart.XYSeries.XYSeriesRenderStyle;
import org.knowm.xchart.style.XYStyler;
import org.knowm.xchart.style.markers.SeriesMarkers;

/** Charts of the nominal device's optics: absorption by layer, generation profile, particle cross-sections. */
final class OpticsCharts {

    private final ChartCanvas canvas;

    OpticsCharts(ChartCanvas canvas) {
        this.canvas = canvas;
    }

    /**
     * Nominal absorption spectra stacked by layer: band k reaches from the sum of the layers before it
     * to the sum including it, so the top of the stack is the total absorptance. The absorber's EQE is
     * drawn as a line, and the reflectance as a line hanging from 1 (at 1 − R), so that the gap between
     * the stack and that line is the light transmitted or lost otherwise.
     *
     * @param absorptance absorptance[layer][wavelength], fractions, layers in stack order
     * @param eqe         the absorber's external quantum efficiency (fraction), or null to omit it
     * @param reflectance the reflectance (fraction), or null to omit it
     */
    Chart absorptionSpectra(String name, String title, double[] wavelengthNm, String[] layers,
                                   double[][] absorptance, double[] eqe, double[] reflectance) {
        int nl = requireLabels(name, layers);
        int nw = requireNonEmpty(name, "wavelengthNm", wavelengthNm);
        requireIncreasing(name, "wavelengthNm", wavelengthNm);
        if (absorptance == null || absorptance.length != nl) {
            throw new IllegalArgumentException(name + ": one absorptance row per layer is needed (" + nl + " layers)");
        }
        for (double[] row : absorptance) {
            requireLength(name, "absorptance row", row, nw);
        }
        requireSomeFinite(name, "absorptance", absorptance);
        double[][] cumulative = new double[nl][nw];
        for (int j = 0; j < nw; j++) {
            double sum = 0;
            for (int l = 0; l < nl; l++) {
                double a = absorptance[l][j];
                sum += Double.isFinite(a) ? a : 0;
                cumulative[l][j] = sum;
            }
        }
        PathChart c = canvas.newChart(name, title, Quantity.of("wavelength", "nm"), Quantity.dimensionless("fraction of incident photons"));
        List<String> names = new ArrayList<>();
        Color[] fills = ChartStyle.fillRamp(nl);
        int points = 0;
        double[] bx = new double[2 * nw + 1];
        for (int j = 0; j < nw; j++) {
            bx[j] = wavelengthNm[j];
            bx[2 * nw - 1 - j] = wavelengthNm[j];
        }
        bx[2 * nw] = wavelengthNm[0];
        for (int l = nl - 1; l >= 0; l--) {
            // band l: along its upper edge left to right, back along the edge below it, closed
            double[] by = new double[2 * nw + 1];
            for (int j = 0; j < nw; j++) {
                by[j] = cumulative[l][j];
                by[2 * nw - 1 - j] = l == 0 ? 0 : cumulative[l - 1][j];
            }
            by[2 * nw] = by[0];
            XYSeries s = c.addSeries(uniqueName(names, layers[l]), bx, by);
            s.setXYSeriesRenderStyle(XYSeriesRenderStyle.PolygonArea);
            s.setMarker(SeriesMarkers.NONE);
            s.setFillColor(fills[l]);
            s.setLineColor(ChartStyle.BAR_EDGE);
            s.setLineStyle(ChartStyle.solid(0.7f));
            points += countFinite(absorptance[l]);
        }
        if (eqe != null) {
            requireLength(name, "eqe", eqe, nw);
            curve(c, names, "EQE (absorber)", wavelengthNm, eqe, ChartStyle.PALETTE[0], ChartStyle.dashed(2.6f));
            points += countFinite(eqe);
        }
        if (reflectance != null) {
            requireLength(name, "reflectance", reflectance, nw);
            double[] top = new double[nw];
            for (int j = 0; j < nw; j++) {
                top[j] = 1 - reflectance[j];
            }
            curve(c, names, "1 − R", wavelengthNm, top, ChartStyle.PALETTE[0], ChartStyle.dotted(2.8f));
            points += countFinite(reflectance);
        }
        XYStyler st = c.getStyler();
        st.setYAxisMin(0.0);
        st.setYAxisMax(1.0);
        st.setXAxisMin(wavelengthNm[0]);
        st.setXAxisMax(wavelengthNm[nw - 1]);
        roundTicksX(c, wavelengthNm, 0);
        legendRight(c, names.size());
        return canvas.finish(c, name, points, names);
    }

    /**
     * Generation rate against depth in the absorber, one curve per case (for example with and
     * without particles).
     *
     * @param generation generation[case][depth] in {@code generationUnit}
     */
    Chart generationProfile(String name, String title, double[] depthNm, String[] cases,
                                   double[][] generation, String generationUnit) {
        int nc = requireLabels(name, cases);
        int nx = requireNonEmpty(name, "depthNm", depthNm);
        if (generation == null || generation.length != nc) {
            throw new IllegalArgumentException(name + ": one generation row per case is needed (" + nc + " cases)");
        }
        for (double[] row : generation) {
            requireLength(name, "generation row", row, nx);
        }
        requireSomeFinite(name, "generation", generation);
        double big = 0;
        for (double[] row : generation) {
            for (double v : row) {
                if (Double.isFinite(v)) {
                    big = Math.max(big, Math.abs(v));
                }
            }
        }
        int exponent = big > 0 ? (int) Math.floor(Math.log10(big)) : 0;
        // large rates are drawn in units of 10^e so that the ticks read 1, 2, 3 … instead of 1E21
        double scale = Math.abs(exponent) >= 4 ? Math.pow(10, -exponent) : 1;
        String unit = scale == 1 ? generationUnit : "10" + superscript(exponent) + " " + generationUnit;
        PathChart c = canvas.newChart(name, title, Quantity.of("depth from the front of the absorber", "nm"),
                Quantity.of("generation rate", unit));
        List<String> names = new ArrayList<>();
        int points = 0;
        for (int k = 0; k < nc; k++) {
            double[] row = new double[nx];
            for (int j = 0; j < nx; j++) {
                row[j] = generation[k][j] * scale;
            }
            curve(c, names, cases[k], depthNm, row, ChartStyle.lineColor(k), ChartStyle.stroke(k));
            points += countFinite(generation[k]);
        }
        c.getStyler().setYAxisMin(0.0);
        c.getStyler().setLegendVisible(nc > 1);
        roundTicksX(c, depthNm, 0);
        return canvas.finish(c, name, points, names);
    }

    /**
     * Cross-sections of one particle against wavelength: extinction (solid), scattering (dashed) and
     * absorption (dotted); extinction = scattering + absorption (Bohren &amp; Huffman, Absorption and
     * Scattering of Light by Small Particles (1983), §3.4).
     */
    Chart crossSections(String name, String title, double[] wavelengthNm, double[] extinction,
                               double[] scattering, double[] absorption, String areaUnit) {
        int nw = requireNonEmpty(name, "wavelengthNm", wavelengthNm);
        requireLength(name, "extinction", extinction, nw);
        requireLength(name, "scattering", scattering, nw);
        requireLength(name, "absorption", absorption, nw);
        requireSomeFinite(name, "cross-sections", extinction, scattering, absorption);
        return spectrumCurves(name, title, wavelengthNm, Quantity.of("cross-section", areaUnit),
                new String[] {"extinction", "scattering", "absorption"},
                new double[][] {extinction, scattering, absorption});
    }

    /** Curves against wavelength in the line colours and strokes of their order, from y = 0, x over the grid. */
    private Chart spectrumCurves(String name, String title, double[] wavelengthNm, Quantity y, String[] labels,
                                 double[][] data) {
        int nw = wavelengthNm.length;
        PathChart c = canvas.newChart(name, title, Quantity.of("wavelength", "nm"), y);
        List<String> names = new ArrayList<>();
        int points = 0;
        for (int k = 0; k < labels.length; k++) {
            curve(c, names, labels[k], wavelengthNm, data[k], ChartStyle.lineColor(k), ChartStyle.stroke(k));
            points += countFinite(data[k]);
        }
        c.getStyler().setYAxisMin(0.0);
        c.getStyler().setXAxisMin(wavelengthNm[0]);
        c.getStyler().setXAxisMax(wavelengthNm[nw - 1]);
        roundTicksX(c, wavelengthNm, 0);
        return canvas.finish(c, name, points, names);
    }

    /**
     * Extinction of one particle per in-plane polarisation against wavelength: field along x (solid), along y
     * (dashed) and their mean, what unpolarised light sees (dotted).
     */
    Chart polarisedExtinction(String name, String title, double[] wavelengthNm, double[] alongX, double[] alongY,
                              String areaUnit) {
        int nw = requireNonEmpty(name, "wavelengthNm", wavelengthNm);
        requireLength(name, "alongX", alongX, nw);
        requireLength(name, "alongY", alongY, nw);
        requireSomeFinite(name, "extinction", alongX, alongY);
        double[] mean = new double[nw];
        for (int i = 0; i < nw; i++) {
            mean[i] = 0.5 * (alongX[i] + alongY[i]);
        }
        return spectrumCurves(name, title, wavelengthNm, Quantity.of("extinction cross-section", areaUnit),
                new String[] {"field along x", "field along y", "unpolarised (mean)"},
                new double[][] {alongX, alongY, mean});
    }
}
