package org.fabspread.dda;

/**
 * What one discrete-dipole solve gives, for one incident plane wave of unit amplitude.
 *
 * @param wavelengthNm vacuum wavelength
 * @param extinction   C_ext (nm²), from the forward amplitude: 4πk Σ Im(E_inc*·P_j)
 * @param absorption   C_abs (nm²): 4πk Σ (−Im α_j⁻¹ − 2k³/3)|P_j|² (Draine, ApJ 333, 848 (1988))
 * @param scattering   C_sca (nm²), the far field integrated over all directions
 * @param forward      the part of C_sca scattered into the hemisphere around the incident direction (nm²)
 * @param asymmetry    ⟨cos θ⟩ of the scattered light
 * @param dipoleRe     real part of the total dipole over E₀, as a polarisability volume α with p = ε₀ε_h α E₀
 *                     (nm³, the convention of {@code particles.Polarizability}), components x, y, z
 * @param dipoleIm     its imaginary part
 * @param nearField    mean |E|²/|E₀|² over the host cells of the shell around the particle (NaN when off)
 * @param iterations   iterations of the linear solve (operator applications)
 * @param residual     final relative residual
 */
public record DdaSolution(double wavelengthNm, double extinction, double absorption, double scattering,
                          double forward, double asymmetry, double[] dipoleRe, double[] dipoleIm,
                          double nearField, int iterations, double residual) {

    public DdaSolution {
        dipoleRe = dipoleRe.clone();
        dipoleIm = dipoleIm.clone();
    }

    @Override
    public double[] dipoleRe() {
        return dipoleRe.clone();
    }

    @Override
    public double[] dipoleIm() {
        return dipoleIm.clone();
    }

    /** C_sca into the backward hemisphere (nm²). */
    public double backward() {
        return scattering - forward;
    }

    /** Share of the scattered light going forward, C_fwd / C_sca. */
    public double forwardFraction() {
        return scattering > 0 ? forward / scattering : 0.5;
    }
}
