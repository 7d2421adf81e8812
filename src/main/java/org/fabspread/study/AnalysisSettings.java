package org.fabspread.study;

import java.util.List;

/**
 * How to sample and analyse.
 *
 * @param samples        Monte Carlo sample count
 * @param seed           master seed
 * @param sampler        RANDOM, LATIN_HYPERCUBE or SOBOL
 * @param sensitivity    NONE, SCREENING (given-data), SOBOL (Saltelli design)
 * @param sobolBase      N of the Saltelli design (cost N(k+2)); a power of two for SOBOL points
 * @param bootstrap      bootstrap resamples for intervals
 * @param onFailure      what to do with a failed sample
 * @param whatIfs        what-ifs to report without re-running
 * @param yieldGoal      yield goal for tolerance allocation (fraction), NaN when none
 * @param confidence     confidence level of intervals (e.g. 0.95)
 * @param planarReference also compute the planar reference J_sc without particles (a second optical
 *                       solve per sample) and the enhancement
 */
public record AnalysisSettings(long samples, long seed, Sampler sampler, Sensitivity sensitivity, int sobolBase,
                               int bootstrap, FailurePolicy onFailure, List<WhatIf> whatIfs, double yieldGoal,
                               double confidence, boolean planarReference, List<Group> groups) {

    public AnalysisSettings {
        groups = List.copyOf(groups);
    }

    /** As the canonical constructor with no groups of inputs. */
    public AnalysisSettings(long samples, long seed, Sampler sampler, Sensitivity sensitivity, int sobolBase,
                            int bootstrap, FailurePolicy onFailure, List<WhatIf> whatIfs, double yieldGoal,
                            double confidence, boolean planarReference) {
        this(samples, seed, sampler, sensitivity, sobolBase, bootstrap, onFailure, whatIfs, yieldGoal, confidence,
                planarReference, List.of());
    }

    /** A named set of uncertain inputs whose Sobol indices are reported together ({@code analysis.groups}). */
    public record Group(String name, List<String> inputs, SourceLocation where) {
        public Group {
            inputs = List.copyOf(inputs);
        }
    }

    public enum Sampler { RANDOM, LATIN_HYPERCUBE, SOBOL }

    public enum Sensitivity { NONE, SCREENING, SOBOL }

    /** REJECT: drop and count; TRUNCATE: redraw inside the valid range (counted); STOP: fail the run. */
    public enum FailurePolicy { REJECT, TRUNCATE, STOP }

    /**
     * A what-if on one input: scale its sigma, shift its nominal, or truncate it at ± k sigma.
     * Fields not used by the kind are NaN.
     */
    public record WhatIf(String input, Kind kind, double amount, SourceLocation where) {
        public enum Kind { SCALE_SIGMA, SHIFT_NOMINAL, TRUNCATE_SIGMAS }
    }
}
