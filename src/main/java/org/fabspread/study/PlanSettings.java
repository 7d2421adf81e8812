package org.fabspread.study;

import java.util.List;
import java.util.Map;

/**
 * The experiment-plan section.
 *
 * @param factors        input ids to vary (empty: the advisor picks from the sensitivity ranking)
 * @param maxRuns        run budget (0: no limit)
 * @param levelSigmas    low/high levels at nominal ∓ levelSigmas·σ (default 2)
 * @param limits         explicit low/high limits per factor (overrides levelSigmas)
 * @param kind           AUTO, FULL_FACTORIAL, FRACTIONAL, PLACKETT_BURMAN, CENTRAL_COMPOSITE, BOX_BEHNKEN
 * @param resolution     wanted resolution (3, 4 or 5; 0 = let the advisor choose)
 * @param centrePoints   centre points
 * @param blocks         blocks (1 = none)
 * @param replicates     replicates (0 = computed from power)
 * @param effectOfInterest the smallest effect to detect, in the response's unit (NaN: from the model)
 * @param response       output id the plan studies (default jsc)
 * @param alpha          significance level
 * @param power          wanted power 1 − β
 * @param seed           run-order randomisation seed
 * @param precision      run-sheet precision per input, canonical unit (inputs not named: from the unit)
 */
public record PlanSettings(List<String> factors, int maxRuns, double levelSigmas, List<FactorLimits> limits,
                           Kind kind, int resolution, int centrePoints, int blocks, int replicates,
                           double effectOfInterest, String response, double alpha, double power, long seed,
                           Map<String, Double> precision) {

    public PlanSettings {
        precision = precision == null ? Map.of() : Map.copyOf(precision);
    }

    /** Settings without run-sheet precisions (each input's precision then follows from its unit). */
    public PlanSettings(List<String> factors, int maxRuns, double levelSigmas, List<FactorLimits> limits,
                        Kind kind, int resolution, int centrePoints, int blocks, int replicates,
                        double effectOfInterest, String response, double alpha, double power, long seed) {
        this(factors, maxRuns, levelSigmas, limits, kind, resolution, centrePoints, blocks, replicates,
                effectOfInterest, response, alpha, power, seed, Map.of());
    }

    public enum Kind { AUTO, FULL_FACTORIAL, FRACTIONAL, PLACKETT_BURMAN, CENTRAL_COMPOSITE, BOX_BEHNKEN }

    /** Explicit levels for one factor, canonical unit. */
    public record FactorLimits(String input, double low, double high) {
    }
}
