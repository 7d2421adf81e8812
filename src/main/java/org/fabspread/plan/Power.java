package org.fabspread.plan;

import java.util.function.IntToDoubleFunction;

import org.apache.commons.math3.distribution.NormalDistribution;
import org.apache.commons.math3.distribution.TDistribution;

/**
 * Power of the two-sided t test of one effect of a two-level plan and the replicates needed.
 *
 * <p>An effect Δ (mean at the high level minus mean at the low level) estimated from N runs has
 * standard error 2σ/sqrt(N), so the test statistic is noncentral t with δ = Δ sqrt(N)/(2σ) and ν
 * error degrees of freedom: power = 1 − F_{ν,δ}(t_{1−α/2,ν}) + F_{ν,δ}(−t_{1−α/2,ν})
 * (e.g. Montgomery, Design and Analysis of Experiments, power of factorial designs), with F the
 * noncentral t CDF of {@link NoncentralT}. The normal approximation Φ(δ − z_{α/2}) + Φ(−δ − z_{α/2})
 * overstates it at small ν.
 */
public final class Power {

    private static final NormalDistribution STD = new NormalDistribution(null, 0, 1);

    private Power() {
    }

    /** δ = Δ sqrt(N)/(2σ). */
    public static double noncentrality(double effect, double sigma, double runs) {
        return Math.abs(effect) * Math.sqrt(runs) / (2 * sigma);
    }

    /** Exact power of the two-sided level-α t test with ν degrees of freedom at noncentrality δ. */
    public static double power(double delta, double nu, double alpha) {
        double tc = new TDistribution(null, nu).inverseCumulativeProbability(1 - alpha / 2);
        return 1 - NoncentralT.cdf(tc, nu, delta) + NoncentralT.cdf(-tc, nu, delta);
    }

    /** The large-ν limit Φ(δ − z_{α/2}) + Φ(−δ − z_{α/2}). */
    public static double normalApproximation(double delta, double alpha) {
        double z = STD.inverseCumulativeProbability(1 - alpha / 2);
        return STD.cumulativeProbability(delta - z) + STD.cumulativeProbability(-delta - z);
    }

    /**
     * The result of a replicate search.
     *
     * @param replicates   replicates of the base plan
     * @param effectRuns   effective runs that estimate the effect (N in δ; 1/c_jj of (XᵀX)⁻¹ for non-orthogonal plans)
     * @param dof          error degrees of freedom ν at that replication
     * @param noncentrality δ
     * @param power        achieved power
     * @param reached      false when the cap was hit before the wanted power
     */
    public record Replicates(int replicates, double effectRuns, double dof, double noncentrality, double power,
                             boolean reached) {
    }

    /**
     * The fewest replicates r (1 … maxReplicates) whose power reaches {@code wantedPower}; ν is
     * recomputed for every r by {@code dofForReplicates}, since it grows with the replicates.
     *
     * @param effect           Δ to detect
     * @param sigma            run-to-run standard deviation
     * @param runsPerReplicate runs of one replicate that estimate the effect
     */
    public static Replicates replicatesNeeded(double effect, double sigma, double runsPerReplicate,
                                              IntToDoubleFunction dofForReplicates, double alpha,
                                              double wantedPower, int maxReplicates) {
        Replicates last = null;
        for (int r = 1; r <= Math.max(1, maxReplicates); r++) {
            double n = r * runsPerReplicate;
            double nu = dofForReplicates.applyAsDouble(r);
            double delta = sigma > 0 ? noncentrality(effect, sigma, n) : Double.POSITIVE_INFINITY;
            double pw;
            if (!(nu >= 1)) {
                pw = 0;
            } else if (Double.isInfinite(delta)) {
                pw = 1;
            } else {
                pw = power(delta, nu, alpha);
            }
            last = new Replicates(r, n, nu, delta, pw, pw >= wantedPower);
            if (pw >= wantedPower) {
                return last;
            }
        }
        return last;
    }
}
