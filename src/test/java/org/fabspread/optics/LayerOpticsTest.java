package org.fabspread.optics;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;

import org.fabspread.study.LayerRole;
import org.fabspread.study.Study;
import org.fabspread.study.StudyException;
import org.fabspread.study.WavelengthGrid;
import org.junit.jupiter.api.Test;

class LayerOpticsTest {

    @Test
    void samplesEveryLayerOnTheGrid() {
        Study study = TestStudies.sixLayer();
        LayerOptics lo = LayerOptics.of(study);
        assertEquals(6, lo.layerCount());
        assertEquals(121, lo.wavelengthCount());
        NkTable ag = MaterialLibrary.bundled().get("ag-johnson-christy");
        for (int i = 0; i < lo.wavelengthCount(); i++) {
            // common practice: linear interpolation of the table (NkTable)
            assertEquals(ag.n(lo.wavelength(i)), lo.n(5, i), 0.0);
            assertEquals(ag.k(lo.wavelength(i)), lo.k(5, i), 0.0);
        }
        double[] n = new double[121];
        double[] k = new double[121];
        lo.applyLayer(3, 0.05, 0.8, n, k);
        double[][] nw = new double[121][5];
        double[][] kw = new double[121][5];
        lo.applySample(1, new double[] {0, 0, 0, 0.05, 0, 0}, new double[] {1, 1, 1, 0.8, 1, 1}, nw, kw);
        for (int i = 0; i < 121; i++) {
            assertEquals(lo.n(3, i) + 0.05, n[i], 1e-15);
            assertEquals(lo.k(3, i) * 0.8, k[i], 1e-15);
            assertEquals(n[i], nw[i][2], 0.0);
            assertEquals(k[i], kw[i][2], 0.0);
            assertEquals(lo.n(1, i), nw[i][0], 0.0);
        }
    }

    @Test
    void refusesAGridOutsideATable() {
        Study study = TestStudies.study(new WavelengthGrid(300, 800, 5),
                new TestStudies.L("glass", "fused-silica-malitson", 1e6, true, LayerRole.SUBSTRATE),
                new TestStudies.L("ito", "ito-konig", 150, false, LayerRole.ELECTRODE),
                new TestStudies.L("etl", "zno-stelling", 30, false, LayerRole.ELECTRON_TRANSPORT));
        StudyException e = assertThrows(StudyException.class, () -> LayerOptics.of(study));
        assertEquals("stack[2] (etl): material zno-stelling is tabulated from 301.58 to 1684.92 nm; "
                + "the grid starts at 300 nm", e.getMessage());
        Study high = TestStudies.study(new WavelengthGrid(400, 1100, 5),
                new TestStudies.L("ito", "ito-konig", 150, false, LayerRole.ELECTRODE));
        StudyException e2 = assertThrows(StudyException.class, () -> LayerOptics.of(high));
        assertEquals("stack[0] (ito): material ito-konig is tabulated from 251.57 to 1000 nm; "
                + "the grid stops at 1100 nm", e2.getMessage());
    }
}
