package org.fabspread.optics;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import org.junit.jupiter.api.Test;

class PlanarBenchmarkTest {

    @Test
    void runsAndReports() {
        double seconds = Double.parseDouble(System.getProperty("fabspread.bench.seconds", "0.5"));
        PlanarBenchmark.Result r = PlanarBenchmark.run(TestStudies.sixLayer(), seconds);
        System.out.printf("planar benchmark: %.0f evaluations/s, %.2f bytes/evaluation, %d layers, %d wavelengths%n",
                r.evaluationsPerSecond(), r.bytesPerEvaluation(), r.layers(), r.wavelengths());
        // speed is reported, not tested
        assertEquals(6, r.layers());
        assertEquals(121, r.wavelengths());
        assertTrue(r.evaluationsPerSecond() > 0);
        assertTrue(Double.isNaN(r.bytesPerEvaluation()) || r.bytesPerEvaluation() >= 0);
    }
}
