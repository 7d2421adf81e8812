package org.fabspread.analysis;

import java.util.List;

import org.fabspread.sampling.Interval;

/**
 * Which tolerance to tighten: each uncertain input with its σ halved, one at a time, by reweighting.
 *
 * @param sdOutput      the output whose spread is followed (the first target's, normally J_sc)
 * @param baselineYield counted yield of all targets as run
 * @param entries       sorted by yield gained, largest first (inputs that cannot be scaled last)
 */
public record ToleranceRanking(String sdOutput, double baselineYield, List<Entry> entries) {

    public ToleranceRanking {
        entries = List.copyOf(entries);
    }

    /**
     * @param yieldAfter   reweighted yield of all targets with this σ halved
     * @param yieldLow     its interval
     * @param yieldGain    yieldAfter − baseline
     * @param gain         its paired interval on the same samples ({@link WhatIfResult.WeightedYield#change()})
     * @param sdBefore     sd of {@link ToleranceRanking#sdOutput()} as run
     * @param sdAfter      its reweighted sd with this σ halved
     * @param ess          Kish effective sample size of the reweighting
     * @param rerunNeeded  reweighting refused or too few effective samples
     * @param note         why, or empty
     */
    public record Entry(String input, double yieldAfter, double yieldLow, double yieldHigh, double yieldGain,
                        Interval gain, double sdBefore, double sdAfter, double ess, double essFraction,
                        boolean rerunNeeded, String note) {

        public double sdReduction() {
            return sdBefore - sdAfter;
        }
    }
}
