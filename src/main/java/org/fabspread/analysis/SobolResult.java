package org.fabspread.analysis;

import java.util.List;

import org.fabspread.sampling.Interval;

/**
 * Sobol indices of every model output. Raw estimates: they may be negative, a first-order index may
 * exceed its total, and their sum may exceed 1 through sampling noise; nothing is clipped.
 *
 * @param method      the estimators and interval method in words
 * @param points      random or randomised quasi-random points
 * @param n           base sample size N (rows of A and B)
 * @param inputs      input ids, in the order of {@link ConvergenceStep#first()}
 * @param modelRuns   model evaluations made, N (k + 2)
 * @param failedRows  rows dropped because one of their k + 2 evaluations failed
 * @param confidence  confidence level of the intervals
 * @param note        caveats (correlated inputs, constant outputs, failures), empty when none
 * @param outputs     indices per output
 * @param convergence the indices from the first N/8, N/4, N/2 and N rows of the same runs
 */
public record SobolResult(String method, SobolIndices.Points points, int n, List<String> inputs, long modelRuns,
                          int failedRows, double confidence, String note, List<OutputIndices> outputs,
                          List<ConvergenceStep> convergence) {

    public SobolResult {
        inputs = List.copyOf(inputs);
        outputs = List.copyOf(outputs);
        convergence = List.copyOf(convergence);
    }

    /** The indices of one output by id. */
    public OutputIndices output(String id) {
        for (OutputIndices o : outputs) {
            if (o.output().equals(id)) {
                return o;
            }
        }
        throw new IllegalArgumentException("no output " + id);
    }

    /**
     * Indices of one output.
     *
     * @param mean     mean of the output over f(A) and f(B)
     * @param variance the sample variance V of the 2N values f(A), f(B)
     * @param sumFirst the sum of the first-order estimates (1 minus it is the share of interactions)
     */
    public record OutputIndices(String output, double mean, double variance, double sumFirst,
                                List<IndexEstimate> indices, List<GroupEstimate> groups) {
        public OutputIndices {
            indices = List.copyOf(indices);
            groups = List.copyOf(groups);
        }

        public IndexEstimate input(String id) {
            for (IndexEstimate e : indices) {
                if (e.input().equals(id)) {
                    return e;
                }
            }
            throw new IllegalArgumentException("no input " + id);
        }
    }

    /** First-order and total index of one input with their intervals. */
    public record IndexEstimate(String input, double first, double firstLow, double firstHigh, double total,
                                double totalLow, double totalHigh) {

        public Interval firstInterval() {
            return new Interval(firstLow, firstHigh);
        }

        public Interval totalInterval() {
            return new Interval(totalLow, totalHigh);
        }
    }

    /**
     * Closed first-order and total index of one group of inputs ({@link InputGroup}).
     *
     * @param first closed first-order index S_G^c, Saltelli 2010 estimator with all of G's columns from B
     * @param total total index S_TG, Jansen 1999 estimator on the same matrix
     */
    public record GroupEstimate(String group, List<String> inputs, double first, Interval firstInterval,
                                double total, Interval totalInterval) {
        public GroupEstimate {
            inputs = List.copyOf(inputs);
        }
    }

    /** Point estimates from the first {@code n} rows, inputs in {@link SobolResult#inputs()} order. */
    public record ConvergenceStep(int n, String output, double[] first, double[] total) {
    }
}
