package org.fabspread.device;

/**
 * Where the light of one wavelength went, summed over the polarisation passes with their weights: the
 * stages add to it, the evaluator weighs it by the bin's photon flux ({@link SpectrumTotals}). Fractions of
 * the incident photons. A mutable holder, one per evaluator.
 */
final class WavelengthTally {
    /** total reflectance and transmittance, and the incoherent substrate's absorptance. */
    double reflectance;
    double transmittance;
    double substrate;
    /** coherent absorptance of each study layer (a host: outside the particle layer). */
    final double[] layer;
    /** absorptance of the non-absorber layers by {@link StackLayout} loss bucket. */
    final double[] bucket = new double[StackLayout.BUCKETS];
    /** absorbed usefully in the absorber (optical current), and its Hecht-collected part before η_d. */
    double optical;
    double collected;
    /** the particle layer's absorptance split: metal, scattered, host (useful), quenched, neighbour near field. */
    double metal;
    double scattered;
    double host;
    double quenched;
    double nearField;
    /** scattered light absorbed in the absorber as diffuse light, and scattered light lost. */
    double diffuse;
    double scatteringLost;

    WavelengthTally(int layers) {
        layer = new double[layers];
    }

    void clear() {
        reflectance = 0;
        transmittance = 0;
        substrate = 0;
        java.util.Arrays.fill(layer, 0);
        java.util.Arrays.fill(bucket, 0);
        optical = 0;
        collected = 0;
        metal = 0;
        scattered = 0;
        host = 0;
        quenched = 0;
        nearField = 0;
        diffuse = 0;
        scatteringLost = 0;
    }
}
