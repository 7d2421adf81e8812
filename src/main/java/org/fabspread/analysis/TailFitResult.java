package org.fabspread.analysis;

/**
 * A failure probability beyond one target, extrapolated from a plain Monte Carlo sample by fitted tails
 * ({@link TailFit}). Probabilities are of the target being violated; yields are 1 minus them.
 *
 * @param spec          the target in words
 * @param output        the output it constrains
 * @param failureSide   "below" when values under the limit fail ({@code >=} targets), "above" otherwise
 * @param samples       samples that evaluated (failed evaluations left out)
 * @param failedSamples samples whose evaluation failed
 * @param confidence    confidence level of the intervals
 * @param counted       failures counted in the sample, with the Clopper–Pearson interval
 * @param normal        normal fitted to all samples
 * @param pareto        generalised Pareto fitted to the exceedances beyond a threshold near the failure side
 * @param preferred     which estimate the yield below uses: "counted", "generalised-pareto" or "normal"
 * @param yield         1 − the preferred failure probability
 * @param yieldLow      1 − its upper bound
 * @param yieldHigh     1 − its lower bound
 * @param caveat        what the extrapolation assumes, and any warning
 */
public record TailFitResult(String spec, String output, String failureSide, int samples, int failedSamples,
                            double confidence, Counted counted, NormalTail normal, ParetoTail pareto, String preferred,
                            double yield, double yieldLow, double yieldHigh, String caveat) {

    /**
     * @param failures    samples violating the target
     * @param probability failures / samples
     * @param low         Clopper–Pearson bounds (Biometrika 26, 404 (1934))
     */
    public record Counted(long failures, double probability, double low, double high) {
    }

    /**
     * @param mean        sample mean of the output
     * @param sd          sample standard deviation
     * @param distance    (limit − mean)/sd on the failure side, in standard deviations
     * @param probability Φ(−distance)
     * @param low         parametric-bootstrap percentile interval
     */
    public record NormalTail(double mean, double sd, double distance, double probability, double low, double high) {
    }

    /**
     * @param applicable   false when the limit lies inside the fitted threshold (the failure is not rare: use the
     *                     count) or too few exceedances were available
     * @param threshold    threshold in the output's unit
     * @param tailFraction fraction of samples beyond the threshold
     * @param exceedances  samples beyond it
     * @param shape        fitted ξ (in the orientation where failures lie in the upper tail)
     * @param scale        fitted σ, output unit
     * @param shapeLow     bootstrap interval of ξ
     * @param probability  tailFraction · S_GPD(|limit − threshold|)
     * @param low          parametric-bootstrap percentile interval
     * @param note         why it is not applicable, or the finite end of the fitted tail; empty otherwise
     */
    public record ParetoTail(boolean applicable, double threshold, double tailFraction, int exceedances, double shape,
                             double scale, double shapeLow, double shapeHigh, double probability, double low,
                             double high, String note) {
    }
}
