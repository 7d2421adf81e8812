package org.fabspread.analysis;

import java.util.List;

import org.fabspread.sampling.InputSpace;

/**
 * The rows of one Sobol design ({@link SobolIndices}): for each base row j (randomisation
 * j / (N / R) for quasi-random points) the matrices A, B, every A_B^(i) and every group's A_B^(G).
 *
 * @param ids        input ids
 * @param groups     the groups, in the order of the columns k, k + 1, … of {@code fAB}
 * @param replicates randomisations R (1 for random points)
 * @param n          base size N
 * @param u          the 2k-dimensional points, row-major: A_j in [0, k), B_j in [k, 2k)
 * @param members    each group's input indices
 * @param fA         f(A)[output][row] (NaN: failed)
 * @param fB         f(B)[output][row]
 * @param fAB        f(A_B)[output][column][row], columns 0 … k − 1 the inputs, then the groups
 * @param space      the map from uniforms to input values
 */
public record SobolDesign(List<String> ids, List<InputGroup> groups, int replicates, int n, double[] u,
                          int[][] members, double[][] fA, double[][] fB, double[][][] fAB, InputSpace space) {

    public SobolDesign {
        ids = List.copyOf(ids);
        groups = List.copyOf(groups);
    }

    /** The input values of A (block 0), B (block 1) or A_B of column c (block 2 + c) at base row j. */
    public void inputs(int block, int j, double[] ua, double[] x) {
        int k = ids.size();
        int off = j * 2 * k;
        System.arraycopy(u, off + (block == 1 ? k : 0), ua, 0, k);
        if (block >= 2) {
            int c = block - 2;
            if (c < k) {
                ua[c] = u[off + k + c];
            } else {
                for (int i : members[c - k]) {
                    ua[i] = u[off + k + i];
                }
            }
        }
        space.map(ua, x);
    }
}
