package org.fabspread.device;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.SplittableRandom;

import org.fabspread.model.ModelException;
import org.fabspread.study.StudyException;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

class EnhancementTableTest {

    @TempDir
    Path dir;

    private Path write(String text) throws IOException {
        Path p = dir.resolve("t.csv");
        Files.writeString(p, text);
        return p;
    }

    private String error(String text) throws IOException {
        Path p = write(text);
        return assertThrows(StudyException.class, () -> EnhancementTable.read(p)).getMessage();
    }

    /** A multilinear function of (d, theta, lambda): its multilinear interpolant is itself. */
    private static double trilinear(double d, double c, double w) {
        return 2 + 0.03 * d - 1.5 * c + 0.002 * w + 0.1 * d * c - 1e-4 * d * w + 3e-3 * c * w + 1e-5 * d * c * w;
    }

    private static final double[] D = {10, 25, 40};
    private static final double[] C = {2, 5, 10};
    private static final double[] W = {300, 550, 800};

    /** The 3 x 3 x 3 table of {@link #trilinear}, with comments, a blank line and shuffled columns. */
    private Path trilinearTable() throws IOException {
        StringBuilder sb = new StringBuilder("# invented values for a test\n#   second comment line\n\n");
        sb.append(" wavelength_nm , enhancement,diameter_nm, coverage_percent\n");
        for (double d : D) {
            for (double c : C) {
                for (double w : W) {
                    sb.append(w).append(',').append(trilinear(d, c / 100, w)).append(',').append(d).append(',')
                            .append(c).append('\n');
                }
            }
        }
        return write(sb.toString());
    }

    @Test
    void readsAGoodTable() throws IOException {
        // common practice: a CSV with a header row, comment lines and columns in any order
        EnhancementTable t = EnhancementTable.read(trilinearTable());
        assertTrue(t.perWavelength());
        assertEquals("t.csv", t.source());
        assertArrayEquals(D, t.diameters(), 0);
        assertArrayEquals(new double[] {0.02, 0.05, 0.1}, t.coverages(), 0);
        assertArrayEquals(W, t.wavelengths(), 0);
        // rows given in any order land on their grid points
        Path p = write("diameter_nm,coverage_percent,enhancement\n40,10,1.4\n10,2,1.0\n40,2,1.2\n10,10,1.1\n");
        EnhancementTable u = EnhancementTable.read(p);
        assertFalse(u.perWavelength());
        assertEquals(0, u.wavelengths().length);
        assertEquals(1.0, u.at(10, 0.02, 500), 0);
        assertEquals(1.1, u.at(10, 0.10, 500), 0);
        assertEquals(1.2, u.at(40, 0.02, 500), 0);
        assertEquals(1.4, u.at(40, 0.10, 500), 0);
        assertTrue(EnhancementTable.assumption().contains("taken from the reflection"));
    }

    @Test
    void columnErrors() throws IOException {
        // common practice: one-line errors naming file, line and column
        assertEquals("t.csv:2: enhancement: missing column; the header names diameter_nm, coverage_percent, enhancment"
                        + " (expected diameter_nm, coverage_percent, enhancement and optionally wavelength_nm)",
                error("# comment\ndiameter_nm,coverage_percent,enhancment\n10,2,1\n"));
        assertEquals("t.csv:1: note: unknown column; expected diameter_nm, coverage_percent, enhancement and optionally"
                + " wavelength_nm", error("diameter_nm,coverage_percent,enhancement,note\n10,2,1,x\n"));
        assertEquals("t.csv:1: enhancement: the column appears twice in the header",
                error("diameter_nm,coverage_percent,enhancement,enhancement\n"));
        assertEquals("t.csv:1: header: the file has no header row; expected diameter_nm, coverage_percent, enhancement"
                + " and optionally wavelength_nm", error("# only a comment\n"));
    }

    @Test
    void cellErrors() throws IOException {
        // common practice: one-line errors naming file, line and column
        String head = "diameter_nm,coverage_percent,enhancement\n";
        assertEquals("t.csv:4: coverage_percent: not a number: 'five'", error(head + "10,2,1\n\n10,five,1\n"));
        assertEquals("t.csv:3: enhancement: must be >= 0 (a ratio of absorptions), got -0.5",
                error(head + "10,2,1\n10,5,-0.5\n"));
        assertEquals("t.csv:2: enhancement: empty cell; expected a number", error(head + "10,2\n"));
        assertEquals("t.csv:2: diameter_nm: not a finite number: 'NaN'", error(head + "NaN,2,1\n"));
        assertEquals("t.csv:2: diameter_nm: must be > 0 nm, got 0", error(head + "0,2,1\n"));
        assertEquals("t.csv:2: coverage_percent: must be in [0, 100] %, got 120", error(head + "10,120,1\n"));
        assertEquals("t.csv:2: row: 4 cells, but the header names 3 columns", error(head + "10,2,1,7\n"));
    }

    @Test
    void gridErrors() throws IOException {
        // common practice: a rectilinear grid needs every combination exactly once
        String head = "# c\ndiameter_nm,coverage_percent,enhancement\n";
        assertEquals("t.csv:6: diameter_nm: the point diameter_nm 20, coverage_percent 5 appears again (first at line 4);"
                        + " the table needs every combination exactly once",
                error(head + "10,5,1\n20,5,1.1\n10,2,1\n20,5.0,1.2\n20,2,1\n"));
        assertEquals("t.csv:4: diameter_nm: no row for the point diameter_nm 20, coverage_percent 10; the points must"
                        + " fill the grid 2 diameter_nm x 2 coverage_percent (every combination exactly once)",
                error(head + "10,5,1\n20,5,1.1\n10,10,1\n"));
        assertEquals("t.csv:2: coverage_percent: 1 distinct value(s) (5); every axis needs at least 2 to interpolate",
                error(head + "10,5,1\n20,5,1.1\n"));
        assertEquals("t.csv:1: wavelength_nm: 1 distinct value(s) (500); every axis needs at least 2 to interpolate",
                error("diameter_nm,coverage_percent,wavelength_nm,enhancement\n10,5,500,1\n20,5,500,1\n10,6,500,1\n"
                        + "20,6,500,1\n"));
        assertEquals("t.csv:1: diameter_nm: 0 distinct value(s); every axis needs at least 2 to interpolate",
                error("diameter_nm,coverage_percent,enhancement\n"));
        // the missing point of a per-wavelength table names all three coordinates
        assertEquals("t.csv:2: diameter_nm: no row for the point diameter_nm 10, coverage_percent 5, wavelength_nm 600;"
                        + " the points must fill the grid 2 diameter_nm x 2 coverage_percent x 2 wavelength_nm"
                        + " (every combination exactly once)",
                error("diameter_nm,coverage_percent,wavelength_nm,enhancement\n10,5,500,1\n10,6,500,1\n10,6,600,1\n"
                        + "20,5,500,1\n20,5,600,1\n20,6,500,1\n20,6,600,1\n"));
    }

    @Test
    void gridPointsAreReproducedExactly() throws IOException {
        // source: Press et al., Numerical Recipes, 3rd ed. (2007), section 3.6: the multilinear interpolant passes
        // through the tabulated values
        EnhancementTable t = EnhancementTable.read(trilinearTable());
        EnhancementTable.OnGrid g = t.onGrid(W);
        double[] out = new double[W.length];
        for (double d : D) {
            for (double c : C) {
                g.fill(d, c / 100, out);
                for (int k = 0; k < W.length; k++) {
                    double v = trilinear(d, c / 100, W[k]);
                    assertEquals(v, t.at(d, c / 100, W[k]), 0);
                    assertEquals(v, out[k], 0);
                }
            }
        }
    }

    @Test
    void linearBetweenGridPoints() throws IOException {
        // source: Press et al., Numerical Recipes, 3rd ed. (2007), section 3.6: linear along each axis, so a
        // multilinear function (products of distinct variables only) is reproduced everywhere in closed form
        EnhancementTable t = EnhancementTable.read(trilinearTable());
        double[] grid = new double[121];
        for (int i = 0; i < grid.length; i++) {
            grid[i] = 320 + 4 * i;
        }
        EnhancementTable.OnGrid g = t.onGrid(grid);
        double[] out = new double[grid.length];
        SplittableRandom rnd = new SplittableRandom(7);
        for (int n = 0; n < 200; n++) {
            double d = 10 + 30 * rnd.nextDouble();
            double c = 0.02 + 0.08 * rnd.nextDouble();
            double w = 300 + 500 * rnd.nextDouble();
            assertEquals(trilinear(d, c, w), t.at(d, c, w), 1e-12);
            g.fill(d, c, out);
            for (int i = 0; i < grid.length; i += 10) {
                assertEquals(trilinear(d, c, grid[i]), out[i], 1e-12);
                assertEquals(t.at(d, c, grid[i]), out[i], 1e-12);
            }
        }
        // a table that is not multilinear: between two diameters the value is (1 - t) v0 + t v1
        Path p = write("diameter_nm,coverage_percent,enhancement\n10,2,1.0\n10,10,3.0\n40,2,2.0\n40,10,7.0\n");
        EnhancementTable u = EnhancementTable.read(p);
        assertEquals(1.0 + (20.0 - 10) / 30 * (2.0 - 1.0), u.at(20, 0.02, 0), 1e-15);
        assertEquals(3.0 + (20.0 - 10) / 30 * (7.0 - 3.0), u.at(20, 0.10, 0), 1e-15);
        // the centre is the mean of the four corners
        assertEquals((1.0 + 3.0 + 2.0 + 7.0) / 4, u.at(25, 0.06, 0), 1e-15);
        // without a wavelength axis every wavelength gets the same factor
        EnhancementTable.OnGrid ug = u.onGrid(grid);
        ug.fill(25, 0.06, out);
        for (double x : out) {
            assertEquals(13.0 / 4, x, 1e-15);
        }
    }

    @Test
    void outsideTheRangeIsAnError() throws IOException {
        // common practice: a table is never extrapolated; the error names the axis, the value and the range
        EnhancementTable t = EnhancementTable.read(trilinearTable());
        ModelException d = assertThrows(ModelException.class, () -> t.at(45, 0.05, 500));
        assertEquals("outside-enhancement-table", d.reason());
        assertEquals("particles.diameter: 45 nm is outside the enhancement table t.csv: its diameter_nm axis runs from"
                + " 10 nm to 40 nm", d.getMessage());
        ModelException c = assertThrows(ModelException.class, () -> t.onGrid(W).fill(20, 0.12, new double[3]));
        assertEquals("outside-enhancement-table", c.reason());
        assertEquals("particles.coverage: 12 % is outside the enhancement table t.csv: its coverage_percent axis runs from"
                + " 2 % to 10 %", c.getMessage());
        ModelException w = assertThrows(ModelException.class, () -> t.at(20, 0.05, 850));
        assertTrue(w.getMessage().contains("850 nm is outside") && w.getMessage().contains("300 nm to 800 nm"),
                w.getMessage());
        // the edges themselves are inside
        assertEquals(trilinear(40, 0.1, 800), t.at(40, 0.1, 800), 0);
        assertTrue(t.covers(EnhancementTable.Axis.DIAMETER, 10) && !t.covers(EnhancementTable.Axis.DIAMETER, 9.9));
        // a wavelength axis must cover the whole grid it is resampled on
        StudyException se = assertThrows(StudyException.class, () -> t.onGrid(new double[] {280, 500, 820}));
        assertEquals("t.csv covers wavelength_nm 300 to 800; the study's wavelength grid runs from 280 to 820 nm",
                se.getMessage());
    }

    @Test
    void programmaticTablesAreChecked() {
        // common practice: the constructor refuses what the reader refuses
        double[] two = {1, 2};
        EnhancementTable t = EnhancementTable.of("code", two, new double[] {0, 0.1}, null, new double[] {1, 2, 3, 4});
        assertEquals(2.5, t.at(1.5, 0.05, 0), 1e-15);
        assertThrows(IllegalArgumentException.class,
                () -> EnhancementTable.of("code", new double[] {1}, two, null, new double[] {1, 2}));
        assertThrows(IllegalArgumentException.class,
                () -> EnhancementTable.of("code", new double[] {2, 1}, two, null, new double[] {1, 2, 3, 4}));
        assertThrows(IllegalArgumentException.class,
                () -> EnhancementTable.of("code", two, two, null, new double[] {1, 2, 3}));
        assertThrows(IllegalArgumentException.class,
                () -> EnhancementTable.of("code", two, two, null, new double[] {1, 2, -3, 4}));
        // the returned arrays are copies
        double[] d = t.diameters();
        d[0] = 99;
        assertEquals(1, t.diameters()[0]);
    }

    @Test
    void theExampleTableIsAFullGrid() throws IOException {
        // common practice: the shipped example must read cleanly, cover the templates' grid and say it is invented
        Path p = Path.of("studies/tables/enhancement-example.csv");
        EnhancementTable t = EnhancementTable.read(p);
        assertTrue(t.perWavelength());
        double[] w = t.wavelengths();
        assertTrue(w[0] <= 320 && w[w.length - 1] >= 800, "covers 320-800 nm");
        assertTrue(Files.readString(p).contains("invented"));
    }
}
