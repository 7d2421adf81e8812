package org.fabspread.dda;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;
import java.util.Map;
import java.util.concurrent.atomic.AtomicInteger;

import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

class ShapeTableTest {

    private static TableSpec spec(int nodes) {
        ParametricFamily fam = new ParametricFamily("crescent",
                Map.of("outer_diameter", 60.0, "bite_diameter", 40.0, "thickness", 16.0), List.of("bite_offset"));
        double[] wl = {500, 560, 620, 680, 740, 800};
        double[] er = new double[wl.length];
        double[] ei = new double[wl.length];
        double[] nh = new double[wl.length];
        for (int i = 0; i < wl.length; i++) {
            double[] e = Drude.eps(wl[i]);
            er[i] = e[0];
            ei[i] = e[1];
            nh[i] = 1.5;
        }
        return new TableSpec(fam, new double[][] {Nodes.chebyshev(12, 24, nodes)}, wl, er, ei, nh,
                DdaSettings.defaults().withPitch(8).withTolerance(1e-6).withShell(8));
    }

    /** Determinism rule of the project: the same table for one thread and for two, bit for bit. */
    @Test
    void tableIsBitIdenticalForAnyThreadCountAndCachedOnDisk(@TempDir Path dir) throws Exception {
        TableSpec spec = spec(3);
        AtomicInteger calls = new AtomicInteger();
        ShapeTable one = TableCache.loadOrTabulate(dir, spec, 1, (d, t) -> calls.incrementAndGet());
        ShapeTable two = ShapeTabulator.tabulate(spec, 2, null);
        assertArrayEquals(one.data(), two.data());
        assertEquals(spec.nodeCount() * spec.wavelengths().length, calls.get(), "progress once per wavelength and node");
        assertTrue(Files.isRegularFile(TableCache.file(dir, spec)));
        calls.set(0);
        ShapeTable again = TableCache.loadOrTabulate(dir, spec, 2, (d, t) -> calls.incrementAndGet());
        assertEquals(0, calls.get(), "a second run reads the cache");
        assertArrayEquals(one.data(), again.data());
        assertTrue(!spec.key().equals(spec(4).key()), "a different grid is a different key");
    }

    /**
     * source: barycentric interpolation reproduces the nodes exactly and, on Chebyshev nodes, approximates
     * smooth responses (Berrut &amp; Trefethen 2004); the leave-one-out estimate bounds the error at a point
     * between nodes within a factor of a few (checked against a direct solve there).
     */
    @Test
    void interpolationReproducesNodesAndItsErrorEstimateIsHonest() {
        TableSpec spec = spec(4);
        ShapeTable t = ShapeTabulator.tabulate(spec, 2, null);
        double[] w = new double[t.scratchSize()];
        double[] nodes = t.nodes(0);
        t.weights(new double[] {nodes[1]}, w);
        assertEquals(t.at(Quantity.EXTINCTION, 0, 1, 2), t.value(Quantity.EXTINCTION, 0, 2, w), 0);
        InterpolationError err = InterpolationError.estimate(t);
        double mid = 0.5 * (nodes[1] + nodes[2]);
        DdaSolver direct = new DdaSolver(spec.family().shape(new double[] {mid}).voxelise(8), spec.settings());
        direct.setMedium(620, spec.epsRe()[2], spec.epsIm()[2], 1.5);
        double exact = direct.solve(Incidence.Y).extinction();
        t.weights(new double[] {mid}, w);
        double scale = 0;
        for (int node = 0; node < t.nodeCount(); node++) {
            for (int k = 0; k < t.wavelengthCount(); k++) {
                scale = Math.max(scale, t.at(Quantity.EXTINCTION, 1, node, k));
            }
        }
        double actual = Math.abs(t.value(Quantity.EXTINCTION, 1, 2, w) - exact) / scale;
        String rec = "leave-one-out " + err.parameter()[0] + ", actual " + actual;
        System.out.println("table interpolation: " + rec);
        assertTrue(err.parameter()[0] > 0 && Double.isFinite(err.wavelength()), rec);
        assertTrue(actual <= 3 * err.parameter()[0] + 1e-6, rec);
        ShapeTable fine = t.resample(new double[] {500, 530, 800});
        assertEquals(t.at(Quantity.ALPHA_IM, 0, 0, 0), fine.at(Quantity.ALPHA_IM, 0, 0, 0), 1e-9);
        assertEquals(t.at(Quantity.NEAR_FIELD, 1, 3, 5), fine.at(Quantity.NEAR_FIELD, 1, 3, 2), 1e-9);
    }
}
