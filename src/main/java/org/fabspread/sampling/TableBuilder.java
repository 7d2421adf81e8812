package org.fabspread.sampling;

import java.util.List;

/**
 * Keeps samples in memory as a {@link SampleTable}: every sample when the run has at most
 * {@code limit} samples, otherwise every s-th sample (s = ⌈N/limit⌉, samples 0, s, 2s, …), a
 * systematic subsample that is itself an independent sample for plain Monte Carlo and a valid
 * (unstratified) sample of the same distribution for Latin hypercube and Sobol points.
 */
final class TableBuilder implements RowSink {

    private final List<String> inputIds;
    private final List<String> outputIds;
    private final long stride;
    private final double[][] inputs;
    private final double[][] outputs;
    private final boolean[] ok;

    TableBuilder(List<String> inputIds, List<String> outputIds, long samples, long limit) {
        this.inputIds = inputIds;
        this.outputIds = outputIds;
        this.stride = Math.max(1, (samples + limit - 1) / limit);
        int rows = (int) ((samples + stride - 1) / stride);
        this.inputs = new double[inputIds.size()][rows];
        this.outputs = new double[outputIds.size()][rows];
        this.ok = new boolean[rows];
    }

    long stride() {
        return stride;
    }

    @Override
    public void row(long sample, double[] x, int offX, double[] y, int offY, String status) {
        if (sample % stride != 0) {
            return;
        }
        int r = (int) (sample / stride);
        for (int i = 0; i < inputs.length; i++) {
            inputs[i][r] = x[offX + i];
        }
        for (int o = 0; o < outputs.length; o++) {
            outputs[o][r] = y[offY + o];
        }
        ok[r] = status == null;
    }

    SampleTable build() {
        return new SampleTable(inputIds, outputIds, inputs, outputs, ok);
    }
}
