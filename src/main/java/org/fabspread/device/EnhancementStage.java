package org.fabspread.device;

import org.fabspread.study.ParticleLayer;

/**
 * The particle stage with a user's enhancement table ({@link EnhancementTable}) in place of the built-in
 * particle optics: reads the diameter, aspect ratios and coverage from {@link ParticleSlots}, checks that the
 * median particle fits in its host (height 2c = D p^{1/3} q^{2/3}, see {@link ParticleLayer}) and that the
 * table covers the sample, and multiplies each wavelength's planar absorber absorption by the interpolated
 * enhancement. The particle layer stays out of the transfer matrix ({@link ParticlePlacement#on} false).
 */
final class EnhancementStage {
    private final ParticleSlots slots;
    private final ParticleLayer layer;
    private final ParameterVector params;
    private final EnhancementTable.OnGrid table;
    private final int host;
    private final String hostName;
    private final boolean[] absorber;
    /** per wavelength: the table's enhancement at this sample. */
    private final double[] enh;
    /** wavelengths of the last evaluation at which the absorption was capped. */
    private int capped;

    EnhancementStage(CompiledDevice d) {
        slots = d.particles().slots();
        layer = d.particles().layer();
        params = d.parameters();
        table = d.particles().table();
        host = d.layout().host();
        hostName = d.study().stack().get(host).name();
        absorber = d.layout().absorber();
        enh = new double[d.wavelengths()];
    }

    /** Checks the sample, places the median particle's layer in its host and fills the enhancement per wavelength. */
    void prepare(double[] v, OpticsStage optics, ParticlePlacement place) {
        capped = 0;
        double hostD = optics.thickness(host);
        double d = v[slots.diameter()];
        double p = ParameterVector.value(v, slots.inPlaneAspect(), 1);
        double q = ParameterVector.value(v, slots.outOfPlaneAspect(), 1);
        if (!(d > 0)) {
            throw params.error("out-of-range", slots.diameter(), "diameter must be > 0 nm, got " + d);
        }
        if (!(p >= 1)) {
            throw params.error("out-of-range", slots.inPlaneAspect(), "in-plane aspect ratio must be >= 1, got " + p);
        }
        if (!(q > 0)) {
            throw params.error("out-of-range", slots.outOfPlaneAspect(), "out-of-plane aspect ratio must be > 0, got " + q);
        }
        place.height = d * Math.cbrt(p) * Math.pow(q, 2.0 / 3);
        place.placeInHost(layer, slots, v, hostD, hostName, -1);
        double theta = v[slots.coverage()];
        EnhancementTable t = table.table();
        if (!t.covers(EnhancementTable.Axis.DIAMETER, d)) {
            throw params.error(EnhancementTable.OUTSIDE_REASON, slots.diameter(),
                    t.outsideMessage(EnhancementTable.Axis.DIAMETER, d));
        }
        if (!t.covers(EnhancementTable.Axis.COVERAGE, theta)) {
            throw params.error(EnhancementTable.OUTSIDE_REASON, slots.coverage(),
                    t.outsideMessage(EnhancementTable.Axis.COVERAGE, theta));
        }
        table.fill(d, theta, enh);
    }

    /**
     * Applies the enhancement g at wavelength i to the planar result just tallied: every absorber layer's
     * absorptance, the optical and the collected share are multiplied by g, and the change is taken from (or,
     * for g &lt; 1, returned to) the reflection; capped at A + R so R stays ≥ 0 (counted). Returns the factor
     * applied.
     */
    double apply(int i, WavelengthTally w) {
        double a = w.optical;
        if (!(a > 0)) {
            return 1;
        }
        double s = enh[i];
        double extra = (s - 1) * a;
        if (extra > w.reflectance) {
            s = 1 + w.reflectance / a;
            extra = w.reflectance;
            capped++;
        }
        w.reflectance -= extra;
        for (int j = 0; j < absorber.length; j++) {
            if (absorber[j]) {
                w.layer[j] *= s;
            }
        }
        w.optical *= s;
        w.collected *= s;
        return s;
    }

    /** Wavelengths of the last evaluation at which the absorber absorption was capped. */
    int cappedWavelengths() {
        return capped;
    }
}
