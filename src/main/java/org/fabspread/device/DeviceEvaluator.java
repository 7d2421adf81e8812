package org.fabspread.device;

import org.fabspread.model.ModelException;
import org.fabspread.particles.LossSplit;

/**
 * One thread's evaluator of a {@link DeviceModel}: a short sequence of stages, each reading only its own
 * slots and owning its scratch — {@link OpticsStage} (layers and transfer matrix), {@link ParticleStage} or
 * {@link EnhancementStage} (the particle layer), {@link CollectionStage} (Hecht collection and η_d),
 * {@link DiffuseStage} (scattered light), {@link DiodeStage} (V_oc, FF, efficiency) — whose per-sample
 * results pass through small holders ({@link ParticlePlacement}, {@link StackSolve}, {@link WavelengthTally},
 * {@link SpectrumTotals}). Allocates nothing per sample or per wavelength.
 */
final class DeviceEvaluator {
    private final CompiledDevice d;
    /** the model that counts capped table evaluations. */
    private final DeviceModel model;
    private final StackLayout layout;
    private final ParameterVector params;
    final double[] v;
    private final OpticsStage optics;
    private final CollectionStage collection;
    /** the built-in particle optics (null: no particles, or an enhancement table). */
    private final ParticleStage particles;
    private final DiffuseStage diffuse;
    /** the user's enhancement table (null: none). */
    private final EnhancementStage enhancement;
    private final DiodeStage diode;
    private final ParticlePlacement placement = new ParticlePlacement();
    private final StackSolve solve = new StackSolve();
    private final WavelengthTally tally;
    private final SpectrumTotals totals = new SpectrumTotals();

    DeviceEvaluator(CompiledDevice d, DeviceModel model) {
        this.d = d;
        this.model = model;
        layout = d.layout();
        params = d.parameters();
        v = new double[params.size()];
        optics = new OpticsStage(d);
        collection = new CollectionStage(d);
        particles = d.builtInParticles() ? new ParticleStage(d) : null;
        diffuse = d.builtInParticles() ? new DiffuseStage(d) : null;
        enhancement = d.usesTable() ? new EnhancementStage(d) : null;
        diode = d.diode() != null ? new DiodeStage(d.diode(), d.outputSlots()) : null;
        tally = new WavelengthTally(layout.layers());
    }

    /** Copies the nominal vector and overwrites the uncertain slots. */
    double[] sampleVector(double[] inputs) {
        int[] slots = params.inputSlots();
        if (inputs.length != slots.length) {
            throw new IllegalArgumentException("expected " + slots.length + " inputs, got " + inputs.length);
        }
        double[] out = params.nominal().clone();
        for (int i = 0; i < inputs.length; i++) {
            out[slots[i]] = inputs[i];
        }
        return out;
    }

    /** Evaluates at one input vector (in {@link DeviceModel#inputIds()} order); counts capped table evaluations. */
    void evaluate(double[] inputs, double[] outputs) {
        int[] slots = params.inputSlots();
        if (inputs.length != slots.length) {
            throw new IllegalArgumentException("expected " + slots.length + " inputs, got " + inputs.length);
        }
        System.arraycopy(params.nominal(), 0, v, 0, v.length);
        for (int i = 0; i < inputs.length; i++) {
            v[slots[i]] = inputs[i];
        }
        run(v, outputs, null);
        int capped = cappedWavelengths();
        if (capped > 0) {
            model.countCapped(capped);
        }
    }

    /** Wavelengths of the last run at which the table's absorber absorption was capped (0 without a table). */
    int cappedWavelengths() {
        return enhancement == null ? 0 : enhancement.cappedWavelengths();
    }

    /**
     * Runs the model; a failure inside the optics or particle code (an argument it refuses) becomes a
     * {@link ModelException}, and so does a NaN output.
     */
    void run(double[] values, double[] out, SpectraRecorder rec) {
        try {
            runUnchecked(values, out, rec);
        } catch (IllegalArgumentException | ArithmeticException ex) {
            throw new ModelException("out-of-range", ex.getMessage());
        }
        for (double o : out) {
            if (Double.isNaN(o)) {
                throw new ModelException("nan", "the device model produced NaN");
            }
        }
    }

    /** Checks the parameter vector and runs every stage's per-sample part, in order. */
    void prepare(double[] values) {
        if (values != v) {
            System.arraycopy(values, 0, v, 0, v.length);
        }
        for (int s = 0; s < v.length; s++) {
            if (Double.isNaN(v[s])) {
                throw params.error("nan", s, "is NaN");
            }
        }
        optics.prepare(v);
        collection.prepare(v, optics);
        placement.clear();
        if (enhancement != null) {
            enhancement.prepare(v, optics, placement);
        } else if (particles != null) {
            particles.prepare(v, optics, collection.quenchDistance(), placement);
        }
        optics.split(placement);
        collection.weigh(optics, placement);
    }

    /** Runs the model on the parameter vector; records spectra when {@code rec} is not null. */
    private void runUnchecked(double[] values, double[] out, SpectraRecorder rec) {
        prepare(values);
        double etaD = collection.dissociation();
        boolean planarRef = d.outputSlots().planar() >= 0;
        totals.clear();
        for (int i = 0; i < d.wavelengths(); i++) {
            tally.clear();
            int passes = placement.on ? particles.spectra().passes : 1;
            double wgt = 1.0 / passes;
            for (int pass = 0; pass < passes; pass++) {
                solvePass(i, pass, wgt, rec);
            }
            double phi = d.flux()[i];
            double planarCol = tally.collected * etaD;
            if (enhancement != null) {
                double s = enhancement.apply(i, tally);
                if (rec != null) {
                    rec.profile(i, 1, solve.entry * s, optics);
                }
            }
            double col = tally.collected * etaD;
            totals.add(phi, tally, col);
            if (rec != null) {
                rec.record(i, tally, col);
                rec.hostLayer(i, tally, placement);
            }
            if (planarRef) {
                totals.addPlanar(phi * (placement.on ? planarCollected(i) : planarCol));
            }
        }
        double jsc = totals.write(out, d.outputSlots(), d.totalFlux());
        if (diode != null) {
            diode.solve(v, jsc, out);
        }
    }

    /** One polarisation pass at wavelength i: the stack solve, the layers' absorption, the particle layer's split. */
    private void solvePass(int i, int pass, double wgt, SpectraRecorder rec) {
        ParticleSpectra ps = placement.on ? particles.spectra() : null;
        ParticleSpectra ss = ps != null && particles.spans() ? particles.sliceSpectra() : null;
        if (ss != null) {
            optics.solve(i, true, ps.effectiveN[pass][i], ps.effectiveK[pass][i], ss.effectiveN[pass][i],
                    ss.effectiveK[pass][i], solve);
        } else if (ps != null) {
            optics.solve(i, true, ps.effectiveN[pass][i], ps.effectiveK[pass][i], 0, 0, solve);
        } else {
            optics.solve(i, false, 0, 0, 0, 0, solve);
        }
        double f = solve.entry;
        tally.reflectance += wgt * solve.reflectance;
        tally.transmittance += wgt * solve.transmittance;
        tally.substrate += wgt * solve.substrate;
        var stack = optics.stack();
        for (int c = 0; c < layout.compCount(); c++) {
            if (layout.particleComp(c)) {
                continue;
            }
            int j = layout.compLayer()[c];
            double a = f * stack.absorptance(c);
            tally.layer[j] += wgt * a;
            if (layout.absorber()[j]) {
                tally.optical += wgt * a;
                if (a != 0) {
                    tally.collected += wgt * f * collection.weighted(c, stack);
                }
            } else {
                tally.bucket[layout.bucket()[j]] += wgt * a;
            }
        }
        if (rec != null && enhancement == null) {
            rec.profile(i, wgt, f, optics);
        }
        if (ps != null) {
            splitParticleLayer(i, f * stack.absorptance(layout.effective()), ps.share[pass], wgt,
                    placement.forwardGiven ? placement.forward : ps.forwardShare[i], layout.host(),
                    collection.hostAverageEta());
        }
        if (ss != null) {
            splitParticleLayer(i, f * stack.absorptance(layout.slice()), ss.share[pass], wgt,
                    placement.forwardGiven ? placement.forward : ss.forwardShare[i], layout.sliceLayer(),
                    collection.sliceAverageEta());
        }
    }

    /**
     * Splits a particle slice's absorptance {@code ap} by the pass's shares, its host absorption counted in
     * study layer {@code h} (collected with {@code hostEta} there when it is an absorber); the scattered part
     * becomes diffuse light.
     */
    private void splitParticleLayer(int i, double ap, double[][] share, double wgt, double forward, int h,
                                    double hostEta) {
        double metal = ap * share[LossSplit.METAL][i];
        double sca = ap * share[LossSplit.SCATTERING][i];
        double hostPart = ap * share[LossSplit.HOST_USEFUL][i];
        double quench = ap * share[LossSplit.HOST_QUENCHED][i];
        double nf = ap * share[LossSplit.NEIGHBOUR][i];
        tally.metal += wgt * metal;
        tally.scattered += wgt * sca;
        tally.host += wgt * hostPart;
        tally.quenched += wgt * quench;
        tally.nearField += wgt * nf;
        if (layout.absorber()[h]) {
            tally.optical += wgt * hostPart;
            tally.collected += wgt * hostPart * hostEta;
        } else {
            tally.bucket[layout.bucket()[h]] += wgt * hostPart;
        }
        tally.optical += wgt * nf;
        tally.collected += wgt * nf * collection.nearFieldEta();
        if (sca > 0) {
            // born at the particles' centres, the layer's mid-plane (used only inside the absorber)
            double depth = placement.centre();
            diffuse.redistribute(i, sca, wgt, forward, depth, optics, collection, tally);
        }
    }

    /** Collected fraction (η_d included) of the planar stack (no particles) at wavelength i. */
    private double planarCollected(int i) {
        optics.solvePlanar(i, solve);
        double f = solve.entry;
        var stack = optics.stack();
        double col = 0;
        for (int c = 0; c < layout.compCount(); c++) {
            int j = layout.compLayer()[c];
            if (layout.absorber()[j] && !layout.particleComp(c) && optics.planarThickness(c) > 0) {
                // the planar host keeps its whole thickness in the front part, and a split neighbour in its
                // rest, both from offset 0
                col += f * collection.weightedPlanar(c, stack);
            }
        }
        return col * collection.dissociation();
    }

    // ---- read by DeviceModel and SpectraRecorder (not on the hot path) ----

    OpticsStage optics() {
        return optics;
    }

    ParticlePlacement placement() {
        return placement;
    }

    /** The built-in particle stage (null without it). */
    ParticleStage particles() {
        return particles;
    }
}
