package org.fabspread.device;

import org.fabspread.optics.SolarSpectrum;

/**
 * Photon-flux-weighted sums over the wavelengths of one evaluation, and their conversion to the model's
 * outputs (photons m⁻² s⁻¹ → mA/cm², {@link SolarSpectrum#toMilliampPerCm2}). A mutable holder, one per
 * evaluator.
 */
final class SpectrumTotals {
    private double collected;
    private double optical;
    private double metal;
    private double electrodes;
    private double transport;
    private double substrate;
    private double scatteringLost;
    private double quenched;
    private double reflected;
    private double transmitted;
    private double planar;

    void clear() {
        collected = 0;
        optical = 0;
        metal = 0;
        electrodes = 0;
        transport = 0;
        substrate = 0;
        scatteringLost = 0;
        quenched = 0;
        reflected = 0;
        transmitted = 0;
        planar = 0;
    }

    /** Adds one wavelength of photon flux phi whose collected fraction (η_d included) is {@code col}. */
    void add(double phi, WavelengthTally w, double col) {
        collected += phi * col;
        optical += phi * w.optical;
        metal += phi * w.metal;
        electrodes += phi * w.bucket[StackLayout.ELECTRODE];
        transport += phi * w.bucket[StackLayout.TRANSPORT];
        substrate += phi * (w.bucket[StackLayout.SUBSTRATE] + w.substrate);
        scatteringLost += phi * w.scatteringLost;
        quenched += phi * w.quenched;
        reflected += phi * w.reflectance;
        transmitted += phi * w.transmittance;
    }

    /** Adds one wavelength of the planar reference's collected photons (flux times fraction). */
    void addPlanar(double photons) {
        planar += photons;
    }

    /**
     * Writes the current and loss outputs; returns J_sc (mA/cm²).
     *
     * @param totalFlux the grid's total photon flux (for the absorptance)
     */
    double write(double[] out, OutputSlots o, double totalFlux) {
        double jsc = SolarSpectrum.toMilliampPerCm2(collected);
        double jOpt = SolarSpectrum.toMilliampPerCm2(optical);
        out[o.jsc()] = jsc;
        out[o.jscOptical()] = jOpt;
        out[o.absorptance()] = (optical + quenched) / totalFlux;
        out[o.metal()] = SolarSpectrum.toMilliampPerCm2(metal);
        out[o.electrodes()] = SolarSpectrum.toMilliampPerCm2(electrodes);
        out[o.transport()] = SolarSpectrum.toMilliampPerCm2(transport);
        out[o.substrate()] = SolarSpectrum.toMilliampPerCm2(substrate);
        out[o.scattering()] = SolarSpectrum.toMilliampPerCm2(scatteringLost);
        out[o.quenching()] = SolarSpectrum.toMilliampPerCm2(quenched);
        out[o.collection()] = jOpt - jsc;
        out[o.reflection()] = SolarSpectrum.toMilliampPerCm2(reflected);
        out[o.transmission()] = SolarSpectrum.toMilliampPerCm2(transmitted);
        if (o.planar() >= 0) {
            double jp = SolarSpectrum.toMilliampPerCm2(planar);
            out[o.planar()] = jp;
            out[o.enhancement()] = jp > 0 ? jsc / jp : (jsc > 0 ? Double.POSITIVE_INFINITY : 1.0);
        }
        return jsc;
    }
}
