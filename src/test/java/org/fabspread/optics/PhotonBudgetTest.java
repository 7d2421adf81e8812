package org.fabspread.optics;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;

import org.fabspread.study.WavelengthGrid;
import org.junit.jupiter.api.Test;

class PhotonBudgetTest {

    private final SolarSpectrum global = SolarSpectrum.astmG173Global();

    @Test
    void incidentCurrentOfTheGridMatchesThePublishedPhotonFluxLimits() {
        // source: ASTM G173-03 via /work/shared/data/PROVENANCE.md (photon-flux limits from 280 nm:
        // 27.27 mA/cm² to 800 nm, 43.52 mA/cm² to 1100 nm)
        assertEquals(27.27, PhotonBudget.incidentCurrent(global.photonFluxPerBin(new WavelengthGrid(280, 800, 5))), 0.03);
        assertEquals(43.52, PhotonBudget.incidentCurrent(global.photonFluxPerBin(new WavelengthGrid(280, 1100, 5))), 0.05);
    }

    @Test
    void bandSumAndConversionByHand() {
        // source: SI 2019 exact elementary charge 1.602176634e-19 C; 1 A/m² = 0.1 mA/cm² (worked by hand)
        double[] flux = {2.5e20, 5.0e20, 2.5e20};
        assertEquals(1e21, PhotonBudget.bandSum(flux), 1e6);
        assertEquals(16.02176634, PhotonBudget.incidentCurrent(flux), 1e-12);
        assertThrows(IllegalArgumentException.class, () -> PhotonBudget.bandSum(new double[] {1, Double.NaN}));
    }
}
