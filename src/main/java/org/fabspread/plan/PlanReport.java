package org.fabspread.plan;

import java.util.List;

/**
 * What {@code plan.json} (and the summary) holds about a proposed plan. Jackson-serialisable.
 *
 * @param design          e.g. {@code 2^(6-2) fractional factorial, resolution IV}
 * @param resolution      {@code III}, {@code IV}, {@code V}, …, {@code full}, or empty for second-order designs
 * @param generators      e.g. {@code [E = ABC, F = BCD]}
 * @param aliases         alias structure up to two-factor interactions (null when not a regular design)
 * @param blockGenerators confounded with blocks (lowest-order effect of each block contrast)
 * @param predictions     predicted effects from the model
 * @param power           noise, effect of interest, replicates and power
 * @param explanation     the advisor's paragraph
 */
public record PlanReport(String study, String response, String unit, String kind, String design, String resolution,
                         List<String> generators, AliasStructure aliases, List<Factor> factors, List<String> leftOut,
                         int runs, int replicates, int centrePoints, int blocks, List<String> blockGenerators,
                         long seed, List<PredictedEffect> predictions, PowerReport power, String explanation) {

    /** A predicted effect: letters, name with ids, value in the response unit. */
    public record PredictedEffect(String term, String name, double effect) {
    }

    /**
     * @param effectOfInterest Δ
     * @param effectSource     where Δ came from (the study, or the smallest predicted main effect)
     * @param sigmaNoise       σ from the uncontrolled inputs (Monte Carlo)
     * @param noiseDraws       draws per design point
     * @param noisePoints      design points used for σ
     * @param effectRuns       N in δ = Δ sqrt(N)/(2σ) at the chosen replicates
     * @param dof              ν
     * @param dofKind          which degrees of freedom ν counts
     * @param noncentrality    δ
     * @param power            exact power (noncentral t)
     * @param normalApproximation the normal approximation at the same δ, for comparison
     * @param reached          whether the wanted power was reached within the budget
     * @param replicatesNeeded replicates that reach the wanted power, whatever the budget (-1: more than
     *                         {@link PowerNeeded#MAX_REPLICATES})
     * @param runsNeeded       the runs those replicates take, centre points included (-1 as above)
     * @param statement        one sentence: the power, and the replicates and runs that reach the power asked
     */
    public record PowerReport(double effectOfInterest, String effectSource, double sigmaNoise, int noiseDraws,
                              int noisePoints, double alpha, double wantedPower, int replicates, double effectRuns,
                              double dof, String dofKind, double noncentrality, double power,
                              double normalApproximation, boolean reached, int replicatesNeeded, int runsNeeded,
                              String statement) {
    }
}
