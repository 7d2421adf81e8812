package org.fabspread.optics;

/**
 * The spectra of one optical evaluation, owned and reused by the caller (one per thread): per
 * wavelength the total reflectance R, transmittance T, the absorptance of every layer of the stack
 * (index = stack position; an incoherent substrate's entry is its glass absorptance) and the
 * absorbers' external quantum efficiency at 100 % internal quantum efficiency (the sum of the absorber
 * layers' absorptances). Overwritten by every evaluation; the element accessors allocate nothing.
 */
public final class SpectralResult {
    private final double[] wavelengths;
    final double[] reflectance;
    final double[] transmittance;
    final double[] glass;
    final double[][] absorptance;
    final double[] eqe;
    double jsc;

    /**
     * @param wavelengths the grid (copied)
     * @param layers      number of layers of the stack
     */
    public SpectralResult(double[] wavelengths, int layers) {
        this.wavelengths = wavelengths.clone();
        int w = wavelengths.length;
        reflectance = new double[w];
        transmittance = new double[w];
        glass = new double[w];
        absorptance = new double[layers][w];
        eqe = new double[w];
    }

    public int wavelengthCount() {
        return wavelengths.length;
    }

    public int layerCount() {
        return absorptance.length;
    }

    public double wavelength(int i) {
        return wavelengths[i];
    }

    public double reflectance(int i) {
        return reflectance[i];
    }

    public double transmittance(int i) {
        return transmittance[i];
    }

    /** Absorptance of the incoherent substrate (0 when the stack has none). */
    public double glassAbsorptance(int i) {
        return glass[i];
    }

    /** Fraction of the incident power absorbed in stack layer j at wavelength index i. */
    public double absorptance(int layer, int i) {
        return absorptance[layer][i];
    }

    /** External quantum efficiency of the absorber layer(s) at 100 % internal quantum efficiency. */
    public double eqe(int i) {
        return eqe[i];
    }

    /** The optical-limit short-circuit current density of the last evaluation, mA/cm². */
    public double jsc() {
        return jsc;
    }

    /** Copies of the spectra, for reports. */
    public double[] reflectanceSpectrum() {
        return reflectance.clone();
    }

    public double[] transmittanceSpectrum() {
        return transmittance.clone();
    }

    public double[] absorptanceSpectrum(int layer) {
        return absorptance[layer].clone();
    }

    public double[] eqeSpectrum() {
        return eqe.clone();
    }
}
