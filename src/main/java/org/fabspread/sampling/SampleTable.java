package org.fabspread.sampling;

import java.util.List;

/**
 * Samples held in memory, column by column: {@code inputs[i][j]} is input i of sample j,
 * {@code outputs[m][j]} output m of sample j, in sample order. {@code ok[j]} is false for a sample
 * whose evaluation failed (its outputs are NaN). Used by the analysis layer; runs too large for
 * memory stream to {@code samples.csv} instead.
 */
public record SampleTable(List<String> inputIds, List<String> outputIds, double[][] inputs, double[][] outputs,
                          boolean[] ok) {

    public int size() {
        return ok.length;
    }

    public double[] input(String id) {
        int i = inputIds.indexOf(id);
        if (i < 0) {
            throw new IllegalArgumentException("no input " + id);
        }
        return inputs[i];
    }

    public double[] output(String id) {
        int i = outputIds.indexOf(id);
        if (i < 0) {
            throw new IllegalArgumentException("no output " + id);
        }
        return outputs[i];
    }
}
