package org.fabspread.particles;

/**
 * The ensemble averages of {@link ParticleEnsemble} at its last computed wavelength, per axis
 * ({@link ParticleEnsemble#AXIS_A}, {@link ParticleEnsemble#AXIS_B}, {@link ParticleEnsemble#AXIS_C}) for
 * the polarisability and per polarisation ({@link ParticleEnsemble#AXIS_A}, {@link ParticleEnsemble#AXIS_B},
 * {@link ParticleEnsemble#UNPOLARIZED}) for the rest. A mutable result holder owned by one ensemble.
 */
final class EnsembleAverages {
    final double[] alphaRe = new double[3];
    final double[] alphaIm = new double[3];
    final double[] absMetal = new double[3];
    final double[] sca = new double[3];
    /** ⟨σ_sca into the forward hemisphere⟩ (nm²). */
    final double[] fwd = new double[3];
    final double[] a2r3 = new double[3];
    final double[] a2z3 = new double[3];
    final double[] nearHost = new double[3];
    final double[] nearQuench = new double[3];
    final double[] nearNeighbour = new double[3];
    double shellHost;
    /**
     * Σ_i w_i B_i/κ_h along a (nm³): the nodes' near-field budgets in the units of the near-field integral
     * ({@link NodeOptics#hostBudget}); +∞ in a loss-free host. For a one-node ensemble, that node's cap.
     */
    double hostCap;
    /** Scratch of the exact path: one node's optics. */
    final NodeOptics node = new NodeOptics();

    /** Sets the a and b polarisations and their unpolarised mean. */
    static void set(double[] q, double a, double b) {
        q[ParticleEnsemble.AXIS_A] = a;
        q[ParticleEnsemble.AXIS_B] = b;
        q[ParticleEnsemble.UNPOLARIZED] = 0.5 * (a + b);
    }
}
