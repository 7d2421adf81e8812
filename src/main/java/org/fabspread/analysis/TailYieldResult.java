package org.fabspread.analysis;

import java.util.List;

/**
 * A rare-failure probability estimated by importance sampling ({@link TailYield}).
 *
 * @param runs                  importance-sampling draws (model runs after the design-point search)
 * @param searchRuns            model runs spent finding the design points
 * @param failedRuns            draws whose model evaluation failed (exception or NaN output); they count
 *                              as meeting every target in the estimates and are reported through
 *                              {@link #errorProbability}
 * @param seed                  seed of the draws
 * @param confidence            confidence level of the intervals
 * @param designPoints          the most probable failure point of each target
 * @param proposal              the mixture of shifted standard normals the draws came from
 * @param perTarget             failure probability of each target alone
 * @param all                   probability that at least one target is violated
 * @param ess                   Kish's effective sample size (Σw)²/Σw² over all draws
 * @param essFraction           ess / runs
 * @param errorProbability      estimated probability of the inputs for which the model fails, mean(w·I_error)
 * @param errorSe               its standard error
 * @param yield                 1 − all.probability
 * @param yieldLow              1 − all.high
 * @param yieldHigh             1 − all.low
 * @param plainRunsForSameError plain Monte Carlo runs that would give the same standard error,
 *                              p̂(1 − p̂)/se² (NaN when no draw failed)
 * @param note                  caveats, empty when none
 */
public record TailYieldResult(int runs, int searchRuns, int failedRuns, long seed, double confidence,
                              List<DesignPoint> designPoints, List<ProposalComponent> proposal,
                              List<FailureLine> perTarget, FailureLine all, double ess, double essFraction,
                              double errorProbability, double errorSe, double yield, double yieldLow, double yieldHigh,
                              double plainRunsForSameError, String note) {

    public TailYieldResult {
        designPoints = List.copyOf(designPoints);
        proposal = List.copyOf(proposal);
        perTarget = List.copyOf(perTarget);
    }

    /** Model runs in all: the search and the draws. */
    public int totalRuns() {
        return runs + searchRuns;
    }

    /**
     * The most probable failure point of one target in the standard-normal space of the inputs
     * (z = Φ⁻¹(u), u the independent uniforms the input space maps).
     *
     * @param spec           the target in words
     * @param output         the output it constrains
     * @param beta           reliability index |z*|; 0 when the median point already fails
     * @param formProbability first-order estimate Φ(−β)
     * @param converged      true when the iteration met its tolerance
     * @param iterations     iterations taken
     * @param modelRuns      model runs spent (gradients by forward differences included)
     * @param coordinates    z*, the input values there, and the direction cosines z*_i/β
     * @param note           what went wrong in the search, empty when nothing did
     */
    public record DesignPoint(String spec, String output, double beta, double formProbability, boolean converged,
                              int iterations, int modelRuns, List<Coordinate> coordinates, String note) {

        public DesignPoint {
            coordinates = List.copyOf(coordinates);
        }

        /** z* as an array, model input order. */
        public double[] standardPoint() {
            double[] z = new double[coordinates.size()];
            for (int i = 0; i < z.length; i++) {
                z[i] = coordinates.get(i).z();
            }
            return z;
        }
    }

    /**
     * @param input  input id
     * @param z      standard-normal coordinate of the design point
     * @param value  the input's value there, canonical unit
     * @param cosine z / β: the input's share of the direction to failure (squares sum to 1)
     */
    public record Coordinate(String input, double z, double value, double cosine) {
    }

    /**
     * One component of the proposal, N(shift, I) in standard space.
     *
     * @param spec   the target whose design point it is centred on
     * @param weight mixture weight
     * @param draws  draws taken from it
     */
    public record ProposalComponent(String spec, double weight, int draws) {
    }

    /**
     * @param spec           the target in words, or "any target"
     * @param failingDraws   draws that violated it
     * @param probability    p̂ = mean(w·I_fail)
     * @param se             standard error of p̂
     * @param low            p̂ − z·se, clipped at 0
     * @param high           p̂ + z·se (NaN when no draw failed: nothing bounds it)
     * @param relativeError  se / p̂
     * @param essFailing     Kish's effective number of failing draws (Σ w I)²/Σ (w I)²
     */
    public record FailureLine(String spec, long failingDraws, double probability, double se, double low, double high,
                              double relativeError, double essFailing) {
    }
}
