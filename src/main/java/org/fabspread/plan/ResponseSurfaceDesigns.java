package org.fabspread.plan;

import java.util.ArrayList;
import java.util.List;

/**
 * Second-order designs in coded units (centre 0, factorial levels ±1), without centre points.
 *
 * <p>Central composite (Box &amp; Hunter, Ann. Math. Stat. 28, 195 (1957)): a two-level cube of
 * resolution V or higher, plus 2k axial points at ±α on each axis. Rotatable α = (r_F n_F / r_a)^{1/4}
 * with n_F the cube points and r_F, r_a the replications of cube and axial points (so α = 2 for five
 * factors on a 2^(5−1) cube); face-centred α = 1.
 *
 * <p>Box–Behnken (Technometrics 2, 455 (1960)): for k = 3–5 a 2² factorial on every pair of factors
 * with the others at 0; for k = 6 a 2³ on each of the blocks {1,2,4}, {2,3,5}, {3,4,6}, {1,4,5},
 * {2,5,6}, {1,3,6}; for k = 7 a 2³ on each of the seven triples of a balanced incomplete block
 * design in which every pair appears once. 12, 24, 40, 48 and 56 runs for k = 3 … 7.
 */
public final class ResponseSurfaceDesigns {

    /** Axial distance choice of a central composite design. */
    public enum Axial { ROTATABLE, FACE_CENTRED }

    private static final int[][] BBD6 = {{1, 2, 4}, {2, 3, 5}, {3, 4, 6}, {1, 4, 5}, {2, 5, 6}, {1, 3, 6}};
    private static final int[][] BBD7 = {{1, 2, 4}, {2, 3, 5}, {3, 4, 6}, {4, 5, 7}, {1, 5, 6}, {2, 6, 7}, {1, 3, 7}};

    private ResponseSurfaceDesigns() {
    }

    /** Rotatable axial distance α = (r_F n_F / r_a)^{1/4}. */
    public static double rotatableAlpha(int cubePoints, int cubeReplicates, int axialReplicates) {
        return Math.pow((double) cubeReplicates * cubePoints / axialReplicates, 0.25);
    }

    /** The cube of a central composite design for k factors: the smallest tabled design of resolution ≥ V. */
    public static TwoLevelDesign cubeFor(int k) {
        return MinimumAberrationCatalog.smallest(k, 5).orElseThrow(
                () -> new IllegalArgumentException("no resolution V cube for " + k + " factors"));
    }

    /** Central composite points: the cube (standard order) then the axial pairs ±α per factor. */
    public static double[][] centralComposite(TwoLevelDesign cube, double alpha) {
        if (cube.resolution() < 5) {
            throw new IllegalArgumentException("the cube of a central composite design must be resolution V or higher, got "
                    + cube.resolutionLabel());
        }
        int k = cube.factors();
        int[][] c = cube.matrix();
        double[][] pts = new double[c.length + 2 * k][k];
        for (int r = 0; r < c.length; r++) {
            for (int i = 0; i < k; i++) {
                pts[r][i] = c[r][i];
            }
        }
        for (int i = 0; i < k; i++) {
            pts[c.length + 2 * i][i] = -alpha;
            pts[c.length + 2 * i + 1][i] = alpha;
        }
        return pts;
    }

    /** Axial distance of the kind for a cube, with the cube and axial points each run once. */
    public static double alpha(Axial kind, TwoLevelDesign cube) {
        return kind == Axial.FACE_CENTRED ? 1.0 : rotatableAlpha(cube.runs(), 1, 1);
    }

    /** The factor groups (0-based) that carry a factorial in the Box–Behnken design of k factors. */
    public static int[][] boxBehnkenBlocks(int k) {
        if (k >= 3 && k <= 5) {
            List<int[]> pairs = new ArrayList<>();
            for (int i = 0; i < k; i++) {
                for (int j = i + 1; j < k; j++) {
                    pairs.add(new int[]{i, j});
                }
            }
            return pairs.toArray(int[][]::new);
        }
        int[][] src = k == 6 ? BBD6 : k == 7 ? BBD7 : null;
        if (src == null) {
            throw new IllegalArgumentException("Box-Behnken designs here have 3 to 7 factors, not " + k);
        }
        int[][] out = new int[src.length][];
        for (int b = 0; b < src.length; b++) {
            out[b] = new int[src[b].length];
            for (int i = 0; i < src[b].length; i++) {
                out[b][i] = src[b][i] - 1;
            }
        }
        return out;
    }

    /** Box–Behnken points, block by block, each block's factorial in standard order. */
    public static double[][] boxBehnken(int k) {
        int[][] blocks = boxBehnkenBlocks(k);
        List<double[]> pts = new ArrayList<>();
        for (int[] blk : blocks) {
            int n = 1 << blk.length;
            for (int r = 0; r < n; r++) {
                double[] x = new double[k];
                for (int i = 0; i < blk.length; i++) {
                    x[blk[i]] = (r & (1 << i)) != 0 ? 1 : -1;
                }
                pts.add(x);
            }
        }
        return pts.toArray(double[][]::new);
    }
}
