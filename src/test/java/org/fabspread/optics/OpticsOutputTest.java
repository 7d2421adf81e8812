package org.fabspread.optics;

import static org.junit.jupiter.api.Assertions.assertEquals;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;

import org.fabspread.study.Study;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

class OpticsOutputTest {

    @Test
    void writesNominalSpectra(@TempDir Path dir) throws IOException {
        Study study = TestStudies.sixLayer();
        double jsc = OpticsOutput.write(study, dir);
        PlanarOptics po = PlanarOptics.of(study);
        assertEquals(po.evaluateNominal(po.newResult()), jsc, 1e-12);
        List<String> lines = Files.readAllLines(dir.resolve("spectra.csv"));
        assertEquals("wavelength_nm,R,T,A_glass,A_ito,A_etl,A_absorber,A_htl,A_back,eqe_absorber", lines.get(0));
        assertEquals(122, lines.size());
        double photons = 0;
        double[] flux = po.photonFlux();
        for (int i = 1; i < lines.size(); i++) {
            String[] f = lines.get(i).split(",");
            assertEquals(10, f.length);
            assertEquals(320 + 4 * (i - 1), Double.parseDouble(f[0]), 1e-9);
            double sum = 0;
            for (int c = 1; c <= 8; c++) {
                sum += Double.parseDouble(f[c]);
            }
            // source: energy conservation (device-model doc section 3), to the file's 8 decimals
            assertEquals(1.0, sum, 1e-7);
            assertEquals(f[6], f[9]);
            photons += flux[i - 1] * Double.parseDouble(f[9]);
        }
        assertEquals(jsc, SolarSpectrum.toMilliampPerCm2(photons), 1e-5);
        try (var s = Files.list(dir)) {
            assertEquals(1, s.count()); // no temporary file left behind
        }
    }
}
