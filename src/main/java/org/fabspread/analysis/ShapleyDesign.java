package org.fabspread.analysis;

import java.util.List;

/**
 * The rows of one Shapley design (see {@link ShapleyEffects}): first N_v rows drawn from the joint input
 * law (for the variance), then for each order l, each step s = 1 … k − 1, each outer draw o and each inner
 * draw t the row N_v + ((l (k − 1) + s − 1) N_o + o) N_i + t, in which the first s inputs of the order vary
 * given the others.
 *
 * @param ids          input ids
 * @param permutations m
 * @param outer        N_o
 * @param inner        N_i
 * @param variance     N_v
 * @param order        the orders, row-major m × k (input indices)
 * @param inputs       input values, row-major rows × k
 * @param outputs      outputs[output][row] (NaN: failed), null before the model ran
 */
public record ShapleyDesign(List<String> ids, int permutations, int outer, int inner, int variance, int[] order,
                            double[] inputs, double[][] outputs) {

    public ShapleyDesign {
        ids = List.copyOf(ids);
    }

    public int rows() {
        return inputs.length / ids.size();
    }

    ShapleyDesign withOutputs(double[][] y) {
        return new ShapleyDesign(ids, permutations, outer, inner, variance, order, inputs, y);
    }

    /** The order of row {@code r}'s block, or −1 for a variance row. */
    public int permutationOf(int r) {
        return r < variance ? -1 : (r - variance) / ((ids.size() - 1) * outer * inner);
    }

    /** The step s (1 … k − 1) of row {@code r}, or 0 for a variance row. */
    public int stepOf(int r) {
        return r < variance ? 0 : (r - variance) / (outer * inner) % (ids.size() - 1) + 1;
    }

    /** The outer draw of row {@code r} (0 for a variance row). */
    public int outerOf(int r) {
        return r < variance ? 0 : (r - variance) / inner % outer;
    }

    /** The input that joins at row {@code r}'s step: the s-th of its order; −1 for a variance row. */
    public int joiningInput(int r) {
        return r < variance ? -1 : order[permutationOf(r) * ids.size() + stepOf(r) - 1];
    }
}
