package org.fabspread.optics;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import org.fabspread.study.StudyException;
import org.fabspread.study.WavelengthGrid;
import org.junit.jupiter.api.Test;

class SolarSpectrumTest {

    private final SolarSpectrum global = SolarSpectrum.astmG173Global();

    @Test
    void integratedIrradiance() {
        // source: ASTM G173-03 via /work/shared/data/PROVENANCE.md (trapezoid over the whole file: 1000.37 W/m²;
        // the standard quotes 1000.4 W/m²)
        assertEquals(1000.37, global.integratePower(280, 4000), 0.005);
        // source: ASTM G173-03 via /work/shared/data/PROVENANCE.md (direct + circumsolar: 900.1 W/m²)
        assertEquals(900.1,
                SolarSpectrum.astmG173(SolarSpectrum.Column.DIRECT_CIRCUMSOLAR).integratePower(280, 4000), 0.05);
        assertEquals(2002, global.wavelengths().length);
    }

    @Test
    void photonCurrentLimits() {
        double[] edges = {700, 800, 900, 1000, 1100};
        // source: ASTM G173-03 via /work/shared/data/PROVENANCE.md (photon-flux limits from 280 nm)
        double[] limits = {20.44, 27.27, 33.74, 38.06, 43.52};
        for (int i = 0; i < edges.length; i++) {
            assertEquals(limits[i], global.photonCurrentLimit(280, edges[i]), 0.005, "edge " + edges[i]);
        }
    }

    @Test
    void perfectAbsorberOnAGridMatchesTheLimit() {
        WavelengthGrid grid = new WavelengthGrid(300, 800, 5);
        double[] bins = global.photonFluxPerBin(grid);
        assertEquals(101, bins.length);
        double sum = 0;
        for (double b : bins) {
            sum += b;
        }
        double j = SolarSpectrum.toMilliampPerCm2(sum);
        // source: device-model doc section 5 and PROVENANCE.md: within 0.1 % of the trapezoid value and the 800 nm limit
        assertEquals(1.0, j / global.photonCurrentLimit(300, 800), 1e-3);
        assertEquals(1.0, j / 27.27, 1e-3);
        // the bins tile [start, stop] exactly
        assertEquals(1.0, sum / global.photonFlux(300, 800), 1e-13);
        // also when the last step is shortened (stop not on the step)
        double[] odd = global.photonFluxPerBin(new WavelengthGrid(300, 802, 4));
        double oddSum = 0;
        for (double b : odd) {
            oddSum += b;
        }
        assertEquals(1.0, oddSum / global.photonFlux(300, 802), 1e-13);
    }

    @Test
    void binIntegralIsExactForLinearIrradiance() {
        // common practice: the exact segment integral agrees with a very fine midpoint rule on E(λ)λ/(hc)
        for (double[] ab : new double[][] {{400, 410.3}, {280.2, 281.7}, {1397.5, 1412.5}, {2500, 2537}}) {
            double a = ab[0];
            double b = ab[1];
            int n = 200000;
            double h = (b - a) / n;
            double s = 0;
            for (int i = 0; i < n; i++) {
                double x = a + (i + 0.5) * h;
                s += global.irradianceAt(x) * x;
            }
            s *= h * 1e-9 / (SolarSpectrum.H * SolarSpectrum.C);
            assertEquals(1.0, global.photonFlux(a, b) / s, 1e-8);
        }
        // one tabulated segment (1800–1805 nm), closed form ∫(E0 + m(λ−a))λ dλ worked by hand
        double a = 1800;
        double b = 1805;
        double e0 = global.irradianceAt(a);
        double m = (global.irradianceAt(b) - e0) / (b - a);
        double exact = e0 * (b * b - a * a) / 2 + m * ((b * b * b - a * a * a) / 3 - a * (b * b - a * a) / 2);
        assertEquals(1.0, global.photonFlux(a, b) / (exact * 1e-9 / (SolarSpectrum.H * SolarSpectrum.C)), 1e-12);
    }

    @Test
    void unitConversion() {
        // source: SI 2019 exact elementary charge; 1 A/m² = 0.1 mA/cm²
        assertEquals(16.02176634, SolarSpectrum.toMilliampPerCm2(1e21), 1e-12);
    }

    @Test
    void refusesGridsOutsideTheTable() {
        StudyException e = assertThrows(StudyException.class,
                () -> global.photonFluxPerBin(new WavelengthGrid(250, 800, 5)));
        assertTrue(e.getMessage().contains("280") && e.getMessage().contains("250"), e.getMessage());
        assertThrows(StudyException.class, () -> global.photonFluxPerBin(new WavelengthGrid(300, 4100, 5)));
        assertEquals(global.photonFluxPerBin(new WavelengthGrid(280, 4000, 10)).length, 373);
    }
}
