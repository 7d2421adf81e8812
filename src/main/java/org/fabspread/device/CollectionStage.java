package org.fabspread.device;

import org.fabspread.optics.CoherentStack;

/**
 * The collection stage of one evaluator: reads the dissociation efficiency η_d, the μτ products, the
 * built-in voltage and the quenching distance from {@link CollectionSlots} and turns absorption into
 * collected current by the Hecht relation ({@link HechtCollection}): the coherent absorption profile
 * weighted by η(x) in closed form ({@link CoherentStack#absorbedWeighted}); the useful host part of the
 * particle layer by the mean of η over the layer's depth; the neighbour near field by η at that interface;
 * diffuse light by ⟨η⟩ of the absorber. Owns the Hecht coefficients; allocation-free.
 */
final class CollectionStage {
    private final CollectionSlots slots;
    private final ParameterVector params;
    private final StackLayout layout;
    private final int nl;
    private final int nc;
    private final double[] ellE;
    private final double[] ellH;
    private final double[] avgEta;
    private final double[][] hs;
    /** per computational layer: Hecht coefficient times e^{s x0} of its offset in its absorber. */
    private final double[][] compCoef;
    /** the same at offset 0, for the planar reference (where every layer is whole). */
    private final double[][] compCoef0;
    private double etaD;
    private double quench;
    private double hostAverageEta;
    private double nearFieldEta;
    private double sliceAverageEta;

    CollectionStage(CompiledDevice d) {
        slots = d.collection();
        params = d.parameters();
        layout = d.layout();
        nl = layout.layers();
        nc = layout.compCount();
        ellE = new double[nl];
        ellH = new double[nl];
        avgEta = new double[nl];
        hs = new double[nl][HechtCollection.TERMS];
        compCoef = new double[nc][HechtCollection.TERMS];
        compCoef0 = new double[nc][HechtCollection.TERMS];
    }

    /** Reads and checks the collection inputs; drift lengths and ⟨η⟩ of every absorber at its thickness. */
    void prepare(double[] v, OpticsStage optics) {
        etaD = v[slots.dissociation()];
        if (!(etaD >= 0 && etaD <= 1)) {
            throw params.error("out-of-range", slots.dissociation(), "dissociation efficiency must be in [0, 1], got " + etaD);
        }
        double muE = v[slots.electronMuTau()];
        double muH = v[slots.holeMuTau()];
        double vbi = v[slots.builtInVoltage()];
        if (!(muE >= 0)) {
            throw params.error("out-of-range", slots.electronMuTau(), "must be >= 0 cm^2/V, got " + muE);
        }
        if (!(muH >= 0)) {
            throw params.error("out-of-range", slots.holeMuTau(), "must be >= 0 cm^2/V, got " + muH);
        }
        if (!(vbi > 0)) {
            throw params.error("out-of-range", slots.builtInVoltage(), "built-in voltage must be > 0 V, got " + vbi);
        }
        quench = ParameterVector.value(v, slots.quenchingDistance(), 0);
        if (!(quench >= 0)) {
            throw params.error("out-of-range", slots.quenchingDistance(), "quenching distance must be >= 0 nm, got " + quench);
        }
        for (int j = 0; j < nl; j++) {
            if (layout.absorber()[j]) {
                double d = optics.thickness(j);
                ellE[j] = HechtCollection.clampDrift(HechtCollection.driftLengthNm(muE, vbi, d), d);
                ellH[j] = HechtCollection.clampDrift(HechtCollection.driftLengthNm(muH, vbi, d), d);
                avgEta[j] = HechtCollection.uniformAverage(ellE[j], ellH[j], d);
            }
        }
    }

    /** The Hecht coefficients of every computational absorber layer at its depth, and η over the particle layer. */
    void weigh(OpticsStage optics, ParticlePlacement p) {
        boolean front = slots.electronsAtFront();
        for (int c = 0; c < nc; c++) {
            int j = layout.compLayer()[c];
            if (layout.absorber()[j]) {
                double[] cc = compCoef[c];
                HechtCollection.exponentials(ellE[j], ellH[j], optics.thickness(j), front, cc, hs[j]);
                System.arraycopy(cc, 0, compCoef0[c], 0, HechtCollection.TERMS);
                double x0 = optics.compOffset(c);
                for (int t = 0; t < HechtCollection.TERMS; t++) {
                    cc[t] *= Math.exp(hs[j][t] * x0);
                }
            }
        }
        if (layout.hasParticles()) {
            int j = layout.host();
            hostAverageEta = layout.absorber()[j]
                    ? HechtCollection.averageOver(ellE[j], ellH[j], optics.thickness(j), front, p.offset,
                            p.offset + (p.height - p.protrusion))
                    : 0;
            int sj = layout.sliceLayer();
            if (p.protrusion > 0 && layout.absorber()[sj]) {
                double ds = optics.thickness(sj);
                double from = layout.sliceBehind() ? 0 : ds - p.protrusion;
                sliceAverageEta = HechtCollection.averageOver(ellE[sj], ellH[sj], ds, front, from, from + p.protrusion);
            } else {
                sliceAverageEta = 0;
            }
            int nb = layout.neighbour();
            if (nb >= 0) {
                double x = layout.neighbourBehind() ? 0 : optics.thickness(nb);
                nearFieldEta = HechtCollection.eta(ellE[nb], ellH[nb], optics.thickness(nb), front, x);
            } else {
                nearFieldEta = 0;
            }
        }
    }

    /** Hecht-weighted absorption of computational layer c (absorber part) in the last solve, before η_d and the entry factor. */
    double weighted(int c, CoherentStack stack) {
        int j = layout.compLayer()[c];
        double[] cc = compCoef[c];
        double[] ss = hs[j];
        double s = 0;
        for (int t = 0; t < HechtCollection.TERMS; t++) {
            s += cc[t] * stack.absorbedWeighted(c, ss[t]);
        }
        return s;
    }

    /** The same for computational layer c taken whole from its layer's front face (the planar reference). */
    double weightedPlanar(int c, CoherentStack stack) {
        int j = layout.compLayer()[c];
        double[] cc = compCoef0[c];
        double[] ss = hs[j];
        double s = 0;
        for (int t = 0; t < HechtCollection.TERMS; t++) {
            s += cc[t] * stack.absorbedWeighted(c, ss[t]);
        }
        return s;
    }

    /** Mean η over the slice of protruding caps when it lies in an absorber (0 otherwise, or without one). */
    double sliceAverageEta() {
        return sliceAverageEta;
    }

    /** The dissociation efficiency η_d. */
    double dissociation() {
        return etaD;
    }

    /** The quenching distance, nm (0 when the study sets none). */
    double quenchDistance() {
        return quench;
    }

    /** ⟨η⟩ of absorber j over its depth (diffuse light). */
    double averageEta(int j) {
        return avgEta[j];
    }

    /** Mean η over the particle layer's depth in an absorbing host (0 in a non-absorbing host). */
    double hostAverageEta() {
        return hostAverageEta;
    }

    /** η at the neighbouring absorber's face towards the particles (0 without a neighbour). */
    double nearFieldEta() {
        return nearFieldEta;
    }
}
