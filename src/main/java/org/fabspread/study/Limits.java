package org.fabspread.study;

/**
 * The sizes a study may ask for, checked when the study is read so that a run never starts that
 * cannot finish in memory or in a working day. Each limit is far above what a pilot-line study needs
 * (the demo uses 2000 samples, 121 wavelengths, 6 layers) and well below what exhausts a laptop:
 * every Monte Carlo sample keeps its inputs and outputs in memory (about 40 doubles), a Sobol design
 * evaluates {@code base × (inputs + 2)} devices, and each wavelength costs one transfer-matrix solve
 * per layer per device.
 */
public final class Limits {

    /** Most Monte Carlo samples (about 0.3 GB of samples held in memory). */
    public static final long MAX_SAMPLES = 1_000_000;

    /** Most device evaluations of a Sobol design, {@code sobol_base × (uncertain inputs + 2)}. */
    public static final long MAX_SOBOL_EVALUATIONS = 2_000_000;

    /** Largest Sobol base (2^20). */
    public static final long MAX_SOBOL_BASE = 1L << 20;

    /** Most bootstrap resamples of an index. */
    public static final long MAX_BOOTSTRAP = 100_000;

    /** Most wavelengths of the grid (a 0.25 nm step over 300 to 800 nm). */
    public static final int MAX_WAVELENGTHS = 2001;

    /** Most layers in the stack. */
    public static final int MAX_LAYERS = 40;

    /** Most runs of an experiment plan and most centre points, blocks or replicates. */
    public static final long MAX_PLAN_RUNS = 10_000;

    /** Largest data file a study may name (n,k tables, measured values, enhancement tables), in bytes. */
    public static final long MAX_DATA_FILE_BYTES = 50L << 20;

    private Limits() {
    }
}
