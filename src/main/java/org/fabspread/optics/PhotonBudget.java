package org.fabspread.optics;

/**
 * The photons of a spectrum on a wavelength grid counted as a current: the band sum Σ Φ_i of the
 * per-bin photon flux ({@link SolarSpectrum#photonFluxPerBin}) and the short-circuit current density
 * q Σ Φ_i it would give if every photon yielded one collected electron (the photon-flux limit of
 * J_sc; Shockley &amp; Queisser, J. Appl. Phys. 32, 510 (1961)).
 */
public final class PhotonBudget {

    private PhotonBudget() {
    }

    /**
     * The band sum of a per-bin photon flux, photons m⁻² s⁻¹; bins that are NaN are refused.
     *
     * @param photonFluxPerBin photons m⁻² s⁻¹ in each bin of the grid
     */
    public static double bandSum(double[] photonFluxPerBin) {
        double sum = 0;
        for (int i = 0; i < photonFluxPerBin.length; i++) {
            double f = photonFluxPerBin[i];
            if (!(f >= 0) || Double.isInfinite(f)) {
                throw new IllegalArgumentException("photon flux of bin " + i + " must be finite and >= 0, got " + f);
            }
            sum += f;
        }
        return sum;
    }

    /**
     * The current density, mA/cm², that the photons of all bins would give at one electron each:
     * q Σ Φ_i, with 1 A/m² = 0.1 mA/cm².
     */
    public static double incidentCurrent(double[] photonFluxPerBin) {
        return SolarSpectrum.toMilliampPerCm2(bandSum(photonFluxPerBin));
    }
}
