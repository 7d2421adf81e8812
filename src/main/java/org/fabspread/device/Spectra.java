package org.fabspread.device;

import java.util.Collections;
import java.util.LinkedHashMap;
import java.util.Map;

/**
 * Per-wavelength optics of one device (one input vector), for charts and the optics/particles outputs.
 * Every per-wavelength array is a fraction of the incident photons at that wavelength, on the study's
 * grid. Shares of the particle layer are already scaled by the light that reaches it (the incoherent
 * substrate's entry factor included).
 *
 * <p>Energy closes at every wavelength: R + T + A_substrate + Σ_layers A + metal + hostAbsorbed +
 * quenched + nearField + diffuseAbsorbed + scatteringLost = 1 (see {@link #closure(int)}); the
 * scattered share is split into diffuseAbsorbed + scatteringLost.
 *
 * @param wavelengthNm          the grid, nm
 * @param photonFlux            photons m⁻² s⁻¹ in each wavelength bin (ASTM G173-03 global)
 * @param reflectance           total reflectance R (incoherent substrate included)
 * @param transmittance         total transmittance T into the exit air
 * @param substrateAbsorptance  absorptance of an incoherent first layer (0 when there is none)
 * @param layerAbsorptance      coherent absorptance of each layer by layer name (a host layer: its
 *                              parts outside the particle layer)
 * @param particleMetal         absorbed in the metal particles
 * @param particleScattering    scattered by the particle layer (before redistribution)
 * @param particleHost          absorbed by the host material inside the particle layer, quenched share
 *                              excluded (useful only when the host is an absorber)
 * @param particleQuenched      absorbed in the host within the quenching distance of a metal surface
 * @param particleNearField     dipole near field absorbed in the neighbouring absorber (useful)
 * @param diffuseAbsorbed       scattered light absorbed in the absorber as diffuse light
 * @param scatteringLost        scattered light that escapes through the front or dies in the back electrode
 * @param absorberEqe           collected electrons per incident photon (external quantum efficiency)
 * @param depthNm               depth grid of the generation profile, nm from the absorber's front face
 * @param generation            photon-weighted absorption rate of the coherent field in the absorber,
 *                              cm⁻³ s⁻¹ (a host particle layer's absorption spread evenly over its
 *                              depth; diffuse light and the neighbour near field are not included)
 * @param absorberName          name of the absorber layer whose profile is given
 */
public record Spectra(double[] wavelengthNm, double[] photonFlux, double[] reflectance, double[] transmittance,
                      double[] substrateAbsorptance, Map<String, double[]> layerAbsorptance,
                      double[] particleMetal, double[] particleScattering, double[] particleHost,
                      double[] particleQuenched, double[] particleNearField, double[] diffuseAbsorbed,
                      double[] scatteringLost, double[] absorberEqe, double[] depthNm, double[] generation,
                      String absorberName) {

    public Spectra {
        layerAbsorptance = Collections.unmodifiableMap(new LinkedHashMap<>(layerAbsorptance));
    }

    /** Number of wavelengths. */
    public int size() {
        return wavelengthNm.length;
    }

    /** R + T + every absorbed and lost share at wavelength i, minus 1 (0 when energy closes). */
    public double closure(int i) {
        double s = reflectance[i] + transmittance[i] + substrateAbsorptance[i];
        for (double[] a : layerAbsorptance.values()) {
            s += a[i];
        }
        s += particleMetal[i] + particleHost[i] + particleQuenched[i] + particleNearField[i] + diffuseAbsorbed[i]
                + scatteringLost[i];
        return s - 1;
    }
}
