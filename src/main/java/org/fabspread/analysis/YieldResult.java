package org.fabspread.analysis;

import java.util.List;

/**
 * Yield per target and for all targets together.
 *
 * @param samples       samples that evaluated (the n of every line)
 * @param failedSamples samples whose evaluation failed, left out of n
 * @param confidence    confidence level of the intervals
 * @param perTarget     one line per target
 * @param all           all targets met at once
 * @param note          caveats, empty when none
 */
public record YieldResult(int samples, int failedSamples, double confidence, List<YieldLine> perTarget,
                          YieldLine all, String note) {

    public YieldResult {
        perTarget = List.copyOf(perTarget);
    }

    /**
     * @param spec       the target in words, or "all targets"
     * @param passed     samples meeting it
     * @param n          samples counted
     * @param yield      passed / n
     * @param wilsonLow  Wilson score interval (Wilson, JASA 22, 209 (1927))
     * @param exactLow   Clopper–Pearson interval (Biometrika 26, 404 (1934))
     */
    public record YieldLine(String spec, long passed, long n, double yield, double wilsonLow, double wilsonHigh,
                            double exactLow, double exactHigh) {
    }
}
