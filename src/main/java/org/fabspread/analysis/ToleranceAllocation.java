package org.fabspread.analysis;

import java.util.List;

import org.fabspread.sampling.Interval;

/**
 * The cheapest tolerances found (greedily) to reach a yield goal, with the trade-off curve.
 *
 * @param goal                  the yield goal (all targets)
 * @param reached               true when the lower bound of the predicted yield's interval meets the goal
 * @param predictedYield        reweighted yield with the chosen σ scales
 * @param predictedLow          its interval
 * @param change                paired interval of the predicted yield minus today's on the same samples
 * @param totalCost             Σ c_i log2(1/scale_i)
 * @param ess                   effective sample size of the final reweighting
 * @param confirmationRunNeeded the effective sample size collapsed: confirm with a new run
 * @param choices               the chosen scale of each input (1 = unchanged)
 * @param curve                 cost against predicted yield along the greedy path, starting at no change
 * @param note                  explanations, empty when none
 */
public record ToleranceAllocation(double goal, boolean reached, double predictedYield, double predictedLow,
                                  double predictedHigh, Interval change, double totalCost, double ess, double essFraction,
                                  boolean confirmationRunNeeded, List<Choice> choices, List<TradeOffPoint> curve,
                                  String note) {

    public ToleranceAllocation {
        choices = List.copyOf(choices);
        curve = List.copyOf(curve);
    }

    public Choice choice(String input) {
        for (Choice c : choices) {
            if (c.input().equals(input)) {
                return c;
            }
        }
        throw new IllegalArgumentException("no input " + input);
    }

    /** @param costOfHalving the study's cost of halving this input's σ (1 when not given) */
    public record Choice(String input, double scale, double costOfHalving, double cost) {
    }

    /** One step of the greedy path: after tightening {@code input} to {@code scale}. */
    public record TradeOffPoint(int step, String input, double scale, double cumulativeCost, double predictedYield,
                                double predictedLow, double predictedHigh, double ess, boolean rerunNeeded) {
    }
}
