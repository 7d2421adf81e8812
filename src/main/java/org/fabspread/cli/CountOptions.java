package org.fabspread.cli;

import org.fabspread.study.Limits;
import org.fabspread.study.StudyException;

/**
 * The checks on the counts {@code run} and {@code demo} take on the command line ({@code --samples},
 * {@code --sobol-base}, {@code --threads}): one message per option, naming the option and the value given.
 */
final class CountOptions {

    private CountOptions() {
    }

    /** Refuses a negative sample count or Sobol base, a thread count below one, or too many samples. */
    static void check(long samples, int sobolBase, int threads) {
        if (samples < 0) {
            throw new StudyException("--samples: must be >= 0 (0 takes the study's), got " + samples);
        }
        if (samples > Limits.MAX_SAMPLES) {
            throw new StudyException("--samples: at most " + Limits.MAX_SAMPLES
                    + " (each sample is kept in memory and written to samples.csv), got " + samples);
        }
        if (sobolBase < 0) {
            throw new StudyException("--sobol-base: must be >= 0 (0 takes the study's), got " + sobolBase);
        }
        if (threads < 1) {
            throw new StudyException("--threads: must be >= 1, got " + threads);
        }
    }
}
