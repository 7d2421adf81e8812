package org.fabspread.analysis;

import java.util.List;

import org.fabspread.sampling.Interval;

/**
 * Shapley effects of every model output: each input's share of the output's variance, with correlated
 * inputs sharing what they explain jointly (Owen, SIAM/ASA J. Uncertain. Quantif. 2, 245 (2014); Song,
 * Nelson &amp; Staum (2016)). The shares of one output sum to 1 and do not depend on the order of the inputs.
 *
 * @param method             the estimator and interval method in words
 * @param permutations       random input orders m
 * @param outer              outer samples N_o per order and step
 * @param inner              inner (conditional) samples N_i per outer sample
 * @param varianceSamples    independent samples N_v for the output variance
 * @param modelRuns          model evaluations made, N_v + m (k − 1) N_o N_i
 * @param failedPermutations orders dropped because one of their runs failed
 * @param confidence         confidence level of the intervals
 * @param note               caveats, empty when none
 * @param outputs            effects per output
 */
public record ShapleyResult(String method, int permutations, int outer, int inner, int varianceSamples,
                            long modelRuns, int failedPermutations, double confidence, String note,
                            List<OutputEffects> outputs) {

    public ShapleyResult {
        outputs = List.copyOf(outputs);
    }

    /** The effects of one output by id. */
    public OutputEffects output(String id) {
        for (OutputEffects o : outputs) {
            if (o.output().equals(id)) {
                return o;
            }
        }
        throw new IllegalArgumentException("no output " + id);
    }

    /**
     * @param variance the output's variance from the N_v samples; the effects in variance units sum to it
     * @param effects  in the inputs' order
     */
    public record OutputEffects(String output, double variance, List<Effect> effects) {
        public OutputEffects {
            effects = List.copyOf(effects);
        }

        public Effect input(String id) {
            for (Effect e : effects) {
                if (e.input().equals(id)) {
                    return e;
                }
            }
            throw new IllegalArgumentException("no input " + id);
        }
    }

    /**
     * One input's Shapley effect.
     *
     * @param share    Sh_i / Var(Y), the input's share of the variance
     * @param interval the share's percentile bootstrap interval
     * @param variance Sh_i in the output's squared unit
     */
    public record Effect(String input, double share, Interval interval, double variance) {
    }
}
