package org.fabspread.analysis;

import java.util.List;

/**
 * Given-data sensitivity from one plain Monte Carlo sample.
 *
 * @param samples   samples used (those that evaluated)
 * @param bins      equal-count bins M of the correlation ratio
 * @param binBias   the upward bias (M − 1)/(n − 1) subtracted from each binned index
 * @param method    the methods in words
 * @param outputs   results per output
 */
public record ScreeningResult(int samples, int bins, double binBias, String method, List<OutputScreening> outputs) {

    public ScreeningResult {
        outputs = List.copyOf(outputs);
    }

    public OutputScreening output(String id) {
        for (OutputScreening o : outputs) {
            if (o.output().equals(id)) {
                return o;
            }
        }
        throw new IllegalArgumentException("no output " + id);
    }

    /**
     * @param rankRSquared R² of the rank regression: how much of the output's rank variance a monotone
     *                     additive picture explains (low values: interactions or non-monotone effects,
     *                     where the SRRC understate)
     */
    public record OutputScreening(String output, double rankRSquared, List<InputScreening> inputs) {
        public OutputScreening {
            inputs = List.copyOf(inputs);
        }

        public InputScreening input(String id) {
            for (InputScreening e : inputs) {
                if (e.input().equals(id)) {
                    return e;
                }
            }
            throw new IllegalArgumentException("no input " + id);
        }
    }

    /**
     * @param srrc          standardised rank regression coefficient (sign = direction of the effect)
     * @param firstOrder    binned first-order index with the bias (M − 1)/(n − 1) subtracted (may be negative)
     * @param firstOrderRaw the correlation ratio before the bias correction
     */
    public record InputScreening(String input, double srrc, double firstOrder, double firstOrderRaw) {
    }
}
