package org.fabspread.particles;

/**
 * The per-node integrals of the quasi-static dipole near field that the loss split needs (model document
 * §4.5), for one distance z₀ to a neighbouring absorber and one quenching distance δ_q. They change with
 * the sample, not with the wavelength.
 *
 * <p>Model: quasi-static dipole outside the volume-equivalent sphere r_eq = D/2, in-plane dipole,
 * |E/E₀|² = |α|²(1 + 3cos²ψ)/(16π² r⁶). Over r &gt; r_eq it integrates to |α|²/(6π r_eq³); over the
 * half-space beyond a plane at z₀ ≥ r_eq from the centre to |α|²/(64π z₀³); the quenching shell
 * r_eq &lt; r &lt; r_eq + δ_q keeps its part on the host side of that plane ({@link #tail}).
 */
final class NearFieldIntegrals {
    /** (1/16π²) × host-side ∫(1 + 3cos²ψ) r⁻⁶ dV of node i. */
    final double[] hostNear16;
    /** (1/16π²) × the same integral over the host-side quenching shell. */
    final double[] quenchNear16;
    /** 1/z₀³ of node i with z₀ raised to r_eq; 0 without a neighbour. */
    final double[] invZ3;
    /** ⟨host-side quenching shell volume⟩ (nm³). */
    double shellSum;
    private boolean valid;
    private double z0;
    private double quench;

    NearFieldIntegrals(int nodes) {
        hostNear16 = new double[nodes];
        quenchNear16 = new double[nodes];
        invZ3 = new double[nodes];
    }

    /** Forgets the integrals (the shape changed). */
    void invalidate() {
        valid = false;
    }

    /** Makes the integrals those of (z₀, δ_q) for the nodes, recomputing only when either changed. */
    void prepare(EnsembleNodes nodes, double z0Nm, double quenchNm) {
        if (valid && z0Nm == z0 && quenchNm == quench) {
            return;
        }
        boolean neighbour = !Double.isInfinite(z0Nm);
        double sum = 0;
        double norm = 1 / (16 * Math.PI * Math.PI);
        for (int i = 0; i < nodes.active; i++) {
            double r = nodes.radius[i];
            double zi = Math.max(z0Nm, r);
            double rq = r + quenchNm;
            double hostNearInt = 8 * Math.PI / (3 * r * r * r);
            double quenchInt = quenchNm > 0 ? 8 * Math.PI / 3 * (1 / (r * r * r) - 1 / (rq * rq * rq)) : 0;
            double shell = quenchNm > 0 ? 4 * Math.PI / 3 * (rq * rq * rq - r * r * r) : 0;
            if (neighbour) {
                hostNearInt -= Math.PI / (4 * zi * zi * zi);
                if (quenchNm > 0 && zi < rq) {
                    quenchInt -= Math.PI / (4 * zi * zi * zi) - tail(zi, rq);
                    shell -= Math.PI * (rq - zi) * (rq - zi) * (2 * rq + zi) / 3;
                }
            }
            sum += nodes.weight[i] * Math.max(0, shell);
            hostNear16[i] = hostNearInt * norm;
            quenchNear16[i] = Math.max(0, quenchInt) * norm;
            invZ3[i] = neighbour ? 1 / (zi * zi * zi) : 0;
        }
        shellSum = sum;
        z0 = z0Nm;
        quench = quenchNm;
        valid = true;
    }

    /**
     * ∫ (1 + 3cos²ψ) r⁻⁶ dV over r &gt; R and z &gt; z₀ (in-plane dipole, R ≥ z₀):
     * 2π [2/(3R³) − 5z₀/(8R⁴) + z₀³/(12R⁶)], which is π/(4z₀³) at R = z₀.
     */
    static double tail(double z0, double rr) {
        double r3 = rr * rr * rr;
        return 2 * Math.PI * (2 / (3 * r3) - 5 * z0 / (8 * r3 * rr) + z0 * z0 * z0 / (12 * r3 * r3));
    }
}
