package org.fabspread.plan;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import org.junit.jupiter.api.Test;

class ScreeningAndSurfaceDesignsTest {

    @Test
    void plackettBurmanColumnsAreBalancedAndPairwiseOrthogonal() {
        // source: Plackett & Burman, Biometrika 33, 305 (1946); first rows from memory, cross-checked
        // by the orthogonality of every column pair, which a wrong row breaks
        for (int n : PlackettBurman.RUN_SIZES) {
            int[][] x = PlackettBurman.matrix(n);
            assertEquals(n, x.length);
            for (int i = 0; i < n - 1; i++) {
                int sum = 0;
                for (int[] row : x) {
                    sum += row[i];
                }
                assertEquals(0, sum, n + " runs, column " + i);
                for (int j = i + 1; j < n - 1; j++) {
                    int dot = 0;
                    for (int[] row : x) {
                        dot += row[i] * row[j];
                    }
                    assertEquals(0, dot, n + " runs, columns " + i + "," + j);
                }
            }
        }
    }

    @Test
    void aWrongFirstRowIsCaughtByTheOrthogonalityCheck() {
        // common practice: a first row with two neighbouring signs swapped (still balanced) no longer
        // gives orthogonal columns, so the check above would catch a misremembered row
        for (int n : PlackettBurman.RUN_SIZES) {
            String row = PlackettBurman.firstRow(n);
            for (int p = 0; p + 1 < row.length(); p++) {
                if (row.charAt(p) == row.charAt(p + 1)) {
                    continue;
                }
                char[] c = row.toCharArray();
                c[p] = row.charAt(p + 1);
                c[p + 1] = row.charAt(p);
                assertTrue(!orthogonal(new String(c)), n + " runs, swap at " + p);
            }
            assertTrue(orthogonal(row));
        }
        assertEquals(12, PlackettBurman.runsFor(11));
        assertEquals(20, PlackettBurman.runsFor(12));
        assertEquals(-1, PlackettBurman.runsFor(24));
    }

    private static boolean orthogonal(String first) {
        int m = first.length();
        int[][] x = new int[m + 1][m];
        for (int r = 0; r < m; r++) {
            for (int c = 0; c < m; c++) {
                x[r][c] = first.charAt(Math.floorMod(c - r, m)) == '+' ? 1 : -1;
            }
        }
        for (int c = 0; c < m; c++) {
            x[m][c] = -1;
        }
        for (int i = 0; i < m; i++) {
            for (int j = i + 1; j < m; j++) {
                int dot = 0;
                for (int[] rr : x) {
                    dot += rr[i] * rr[j];
                }
                if (dot != 0) {
                    return false;
                }
            }
        }
        return true;
    }

    @Test
    void rotatableAxialDistance() {
        // source: Box & Hunter, Ann. Math. Stat. 28, 195 (1957); statistics-and-doe.md: k = 5 on a 2^(5-1) cube
        // gives alpha = 2, not 2.378
        TwoLevelDesign cube5 = ResponseSurfaceDesigns.cubeFor(5);
        assertEquals(16, cube5.runs());
        assertEquals(2.0, ResponseSurfaceDesigns.alpha(ResponseSurfaceDesigns.Axial.ROTATABLE, cube5), 1e-12);
        assertEquals(Math.sqrt(2), ResponseSurfaceDesigns.alpha(ResponseSurfaceDesigns.Axial.ROTATABLE,
                ResponseSurfaceDesigns.cubeFor(2)), 1e-12);
        assertEquals(1.0, ResponseSurfaceDesigns.alpha(ResponseSurfaceDesigns.Axial.FACE_CENTRED, cube5));
        assertThrows(IllegalArgumentException.class,
                () -> ResponseSurfaceDesigns.centralComposite(MinimumAberrationCatalog.design(6, 16), 2));
    }

    @Test
    void rotatableCentralCompositeDesignsSatisfyTheMomentCondition() {
        // source: Box & Hunter (1957): rotatable iff sum x_i^4 = 3 sum x_i^2 x_j^2 (with odd moments zero)
        for (int k = 2; k <= 8; k++) {
            TwoLevelDesign cube = ResponseSurfaceDesigns.cubeFor(k);
            double a = ResponseSurfaceDesigns.alpha(ResponseSurfaceDesigns.Axial.ROTATABLE, cube);
            double[][] pts = ResponseSurfaceDesigns.centralComposite(cube, a);
            assertEquals(cube.runs() + 2 * k, pts.length);
            double s4 = 0;
            double s22 = 0;
            double odd = 0;
            for (double[] x : pts) {
                s4 += Math.pow(x[0], 4);
                s22 += x[0] * x[0] * x[1] * x[1];
                odd += x[0] * x[1] + x[0] * x[0] * x[1] + x[0];
            }
            assertEquals(3 * s22, s4, 1e-9 * s4, "k = " + k);
            assertEquals(0, odd, 1e-9);
            // face-centred is not rotatable
            double[][] fc = ResponseSurfaceDesigns.centralComposite(cube, 1);
            double f4 = 0;
            double f22 = 0;
            for (double[] x : fc) {
                f4 += Math.pow(x[0], 4);
                f22 += x[0] * x[0] * x[1] * x[1];
            }
            assertTrue(Math.abs(f4 - 3 * f22) > 1);
        }
    }

    @Test
    void boxBehnkenRunCountsAndPairCoverage() {
        // source: Box & Behnken, Technometrics 2, 455 (1960): 12, 24, 40, 48, 56 runs without centre points
        int[] expected = {12, 24, 40, 48, 56};
        for (int k = 3; k <= 7; k++) {
            double[][] pts = ResponseSurfaceDesigns.boxBehnken(k);
            assertEquals(expected[k - 3], pts.length, "k = " + k);
            for (int i = 0; i < k; i++) {
                for (int j = i + 1; j < k; j++) {
                    int together = 0;
                    for (double[] x : pts) {
                        if (x[i] != 0 && x[j] != 0) {
                            together++;
                        }
                    }
                    assertTrue(together >= 4, "pair " + i + "," + j + " for k = " + k);
                    if (k == 7) {
                        // every pair in exactly one triple: one 2^3 block gives 8 runs with both non-zero
                        assertEquals(8, together);
                    }
                }
                double sum = 0;
                for (double[] x : pts) {
                    sum += x[i];
                }
                assertEquals(0, sum, 1e-12);
            }
        }
        assertThrows(IllegalArgumentException.class, () -> ResponseSurfaceDesigns.boxBehnken(8));
    }
}
