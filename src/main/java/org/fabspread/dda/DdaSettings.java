package org.fabspread.dda;

/**
 * Settings of the discrete-dipole solver.
 *
 * @param pitchNm       lattice pitch for voxelising analytic shapes (nm); the dipole spacing is then rescaled
 *                      to hold the true volume
 * @param tolerance     the iterative solve stops at ‖b − A p‖ ≤ tolerance·‖b‖ (relative residual)
 * @param maxIterations iteration limit (operator applications); a solve that does not converge is an error
 * @param shellNm       thickness of the host shell around the particle over which the near-field intensity
 *                      is averaged (nm); 0 turns the near-field average off
 */
public record DdaSettings(double pitchNm, double tolerance, int maxIterations, double shellNm) {

    /** Default pitch: 2 nm (20 dipoles across a 40 nm sphere). */
    public static final double DEFAULT_PITCH_NM = 2.0;
    /** Default relative residual of the iterative solve. */
    public static final double DEFAULT_TOLERANCE = 1e-5;

    public DdaSettings {
        if (!(pitchNm > 0) || Double.isInfinite(pitchNm)) {
            throw new IllegalArgumentException("DDA pitch must be > 0 nm, got " + pitchNm);
        }
        if (!(tolerance > 0 && tolerance < 1)) {
            throw new IllegalArgumentException("DDA tolerance must be in (0, 1), got " + tolerance);
        }
        if (maxIterations < 1) {
            throw new IllegalArgumentException("DDA iteration limit must be >= 1, got " + maxIterations);
        }
        if (!(shellNm >= 0) || Double.isInfinite(shellNm)) {
            throw new IllegalArgumentException("near-field shell must be >= 0 nm, got " + shellNm);
        }
    }

    /** 2 nm pitch, tolerance 1e-5, 3000 iterations, 10 nm near-field shell. */
    public static DdaSettings defaults() {
        return new DdaSettings(DEFAULT_PITCH_NM, DEFAULT_TOLERANCE, 3000, 10);
    }

    public DdaSettings withPitch(double pitch) {
        return new DdaSettings(pitch, tolerance, maxIterations, shellNm);
    }

    public DdaSettings withTolerance(double tol) {
        return new DdaSettings(pitchNm, tol, maxIterations, shellNm);
    }

    public DdaSettings withShell(double shell) {
        return new DdaSettings(pitchNm, tolerance, maxIterations, shell);
    }
}
