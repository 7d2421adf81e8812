package org.fabspread.plan;

import java.util.Locale;

/**
 * What a plan's power means for the line: the replicates (and runs) that reach the power asked,
 * whatever the budget, said in one sentence beside the power the plan has. The search is the same
 * as the plan's ({@link Power#replicatesNeeded}: exact noncentral t power, ν recomputed for every
 * replicate count since it grows with them), only without the budget's cap.
 *
 * @param replicates replicates that reach the wanted power (-1 when {@link #MAX_REPLICATES} do not)
 * @param runs       runs of that plan, centre points included (-1 as above)
 * @param statement  the sentence
 */
public record PowerNeeded(int replicates, int runs, String statement) {

    /** The largest replicate count searched. */
    public static final int MAX_REPLICATES = 1000;

    /**
     * @param chosen       the plan's replicates and power
     * @param effect       Δ to detect
     * @param sigma        run-to-run noise
     * @param runsPerRep   effective runs per replicate for the effect (1/c_jj)
     * @param points       design points per replicate
     * @param centre       centre points (not replicated)
     * @param terms        model terms besides the intercept
     */
    public static PowerNeeded of(Power.Replicates chosen, double effect, double sigma, double runsPerRep, int points,
                                 int centre, int terms, double alpha, double wantedPower) {
        Power.Replicates r = chosen.reached() ? chosen : Power.replicatesNeeded(effect, sigma, runsPerRep,
                q -> points * q + centre - 1.0 - terms, alpha, wantedPower, MAX_REPLICATES);
        String have = String.format(Locale.ROOT, "Power %.0f %% with %d replicate%s (%d runs)", 100 * chosen.power(),
                chosen.replicates(), chosen.replicates() > 1 ? "s" : "", points * chosen.replicates() + centre);
        if (!r.reached()) {
            return new PowerNeeded(-1, -1, String.format(Locale.ROOT, "%s; even %d replicates (%d runs) do not reach "
                            + "the %.0f %% asked: detect a larger effect, or reduce the run-to-run noise first.", have,
                    MAX_REPLICATES, points * MAX_REPLICATES + centre, 100 * wantedPower));
        }
        int runs = points * r.replicates() + centre;
        if (chosen.reached()) {
            return new PowerNeeded(r.replicates(), runs, String.format(Locale.ROOT, "%s reaches the %.0f %% asked.",
                    have, 100 * wantedPower));
        }
        return new PowerNeeded(r.replicates(), runs, String.format(Locale.ROOT, "%s; reaching the %.0f %% asked needs "
                        + "%d replicates: %d x %d + %d centre points = %d runs (power %.0f %%).", have,
                100 * wantedPower, r.replicates(), r.replicates(), points, centre, runs, 100 * r.power()));
    }
}
