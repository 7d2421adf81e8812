package org.fabspread.analysis;

import java.util.List;

import org.fabspread.sampling.Interval;

/**
 * A what-if evaluated by reweighting the existing samples (importance sampling), or refused.
 *
 * @param description         the changes in words
 * @param inputs              the inputs changed
 * @param reweighted          true when estimates were made by reweighting
 * @param rerunNeeded         true when reweighting was refused or its effective sample size is too
 *                            small: sample the changed distribution anew ({@link WhatIf#modifiedSpace})
 * @param message             why a re-run is needed and what was done, empty when all is well
 * @param samples             samples that evaluated
 * @param ess                 Kish effective sample size (Σw)²/Σw² (NaN when refused)
 * @param essFraction         ess / samples
 * @param expectedEssFraction 1/E[w²] from the distributions alone, for independent changes
 *                            (0 when the weight variance is infinite, NaN when unknown)
 * @param yields              yield of each target and of all, before and after
 * @param outputs             mean and standard deviation of each output, before and after
 */
public record WhatIfResult(String description, List<String> inputs, boolean reweighted, boolean rerunNeeded,
                           String message, int samples, double ess, double essFraction, double expectedEssFraction,
                           List<WeightedYield> yields, List<WeightedMoments> outputs) {

    public WhatIfResult {
        inputs = List.copyOf(inputs);
        yields = List.copyOf(yields);
        outputs = List.copyOf(outputs);
    }

    /** The line for all targets together (the last one). */
    public WeightedYield allTargets() {
        return yields.get(yields.size() - 1);
    }

    public WeightedMoments output(String id) {
        for (WeightedMoments m : outputs) {
            if (m.output().equals(id)) {
                return m;
            }
        }
        throw new IllegalArgumentException("no output " + id);
    }

    /**
     * @param before    counted yield of the samples as run
     * @param after     self-normalised reweighted yield Σ w I / Σ w
     * @param afterSe   its standard error, sqrt(Σ w² (I − p̂)²) / Σ w
     * @param afterLow  interval: p̂ ± z·se, or a Wilson interval with n = ESS when se is 0 (p̂ = 0 or 1)
     * @param change    paired interval of after − before: on the same samples the delta-method interval
     *                  of the difference of the two estimators (see {@link WeightedEstimates#weightedYield}); on new
     *                  samples Newcombe's interval for a difference of independent proportions
     */
    public record WeightedYield(String spec, double before, double after, double afterSe, double afterLow,
                                double afterHigh, Interval change) {

        /** The change after − before. */
        public double gain() {
            return after - before;
        }

        /** Whether the change is beyond sampling noise: its whole interval lies on one side of zero. */
        public boolean beyondNoise() {
            return change.above(0) || change.below(0);
        }
    }

    /** Weighted moments (divisor Σ w) of one output, before (w = 1) and after. */
    public record WeightedMoments(String output, double meanBefore, double sdBefore, double meanAfter,
                                  double sdAfter) {
    }
}
