package org.fabspread.device;

import org.fabspread.particles.ParticleEnsemble;

/**
 * Judges samples against the {@link ValidityEnvelope} from their input vectors, as the device model sees
 * them (the study's nominal values, then the sample's uncertain inputs in the model's input order). One per
 * thread or consumer, with its own scratch vector and ensemble; {@link #tally} allocates nothing. A study
 * without built-in particle optics (none, or an enhancement table) is always inside.
 */
public final class EnvelopeJudge {
    private final CompiledDevice device;
    private final double[] v;
    private final ParticleEnsemble ensemble = new ParticleEnsemble();
    private final double lambdaMin;
    private final double hostIndexAtMin;
    private boolean sizeParameter;
    private boolean volumeFraction;
    private boolean largerThanFilm;
    private boolean beyondMonolayer;
    private final ShapeTables.Built shape;
    private final double[] at;
    private final double[] weights;
    private final int heightSlot;

    EnvelopeJudge(CompiledDevice device) {
        this.device = device;
        this.v = device.parameters().nominal().clone();
        this.shape = device.builtInParticles() ? device.particles().shapeTable() : null;
        this.at = shape == null ? null : new double[shape.varying().length];
        this.weights = shape == null ? null : new double[shape.table().scratchSize()];
        this.heightSlot = shape == null ? -1 : new java.util.ArrayList<>(device.particles().layer().shape().parameters()
                .keySet()).indexOf(ShapeTables.heightParameter(shape.kind()));
        int iMin = 0;
        double[] lambda = device.lambda();
        for (int i = 1; i < lambda.length; i++) {
            if (lambda[i] < lambda[iMin]) {
                iMin = i;
            }
        }
        lambdaMin = lambda[iMin];
        hostIndexAtMin = device.builtInParticles() ? device.optics().n(device.layout().host(), iMin) : 1;
    }

    /** Judges the inputs {@code x[off .. off + k − 1]} and adds the result to {@code tally}. */
    public void tally(double[] x, int off, EnvelopeCounts.Tally tally) {
        judge(x, off);
        tally.add(sizeParameter, volumeFraction, largerThanFilm, beyondMonolayer);
    }

    /** The status of the inputs {@code x} (model input order; allocates the record). */
    public EnvelopeStatus status(double[] x) {
        judge(x, 0);
        return new EnvelopeStatus(sizeParameter, volumeFraction, largerThanFilm, beyondMonolayer);
    }

    private void judge(double[] x, int off) {
        sizeParameter = false;
        volumeFraction = false;
        largerThanFilm = false;
        beyondMonolayer = false;
        if (!device.builtInParticles()) {
            return;
        }
        int[] in = device.parameters().inputSlots();
        for (int i = 0; i < in.length; i++) {
            v[in[i]] = x[off + i];
        }
        ParticleSlots s = device.particles().slots();
        if (shape != null) {
            judgeShape(s);
            return;
        }
        double d = v[s.diameter()];
        double cv = ParameterVector.value(v, s.sizeCv(), 0);
        double p = ParameterVector.value(v, s.inPlaneAspect(), 1);
        double q = ParameterVector.value(v, s.outOfPlaneAspect(), 1);
        double cov = v[s.coverage()];
        if (!(d > 0 && cv >= 0 && p >= 1 && q > 0 && cov >= 0 && cov < 1)
                || Double.isInfinite(d) || Double.isInfinite(cv) || Double.isInfinite(p) || Double.isInfinite(q)) {
            return;
        }
        beyondMonolayer = ValidityEnvelope.beyondMonolayer(cov);
        if (cov == 0) {
            return;
        }
        int host = device.layout().host();
        if (ValidityEnvelope.sizeLimited(p, q)) {
            double nh = hostIndexAtMin + ParameterVector.value(v, device.stack().nShift()[host], 0);
            double xs = ValidityEnvelope.sizeParameter(ValidityEnvelope.largestSemiAxis(d, p, q), nh, lambdaMin);
            sizeParameter = ValidityEnvelope.beyondSize(xs);
        }
        ensemble.setShape(d, cv, p, q, cov);
        volumeFraction = ValidityEnvelope.beyondFill(ensemble.volumeFraction());
        largerThanFilm = ValidityEnvelope.largerThanFilm(ensemble.thickness(), v[device.stack().thickness()[host]]);
    }

    /**
     * A named shape solved by the discrete-dipole method: no size limit (the solver is full-wave; its lattice
     * is the study's choice), the layer's height is the shape's height parameter, and the volume fraction
     * n_A V / h with n_A = coverage / projected area, area and volume interpolated from the table's nodes as
     * the optics does.
     */
    private void judgeShape(ParticleSlots s) {
        double cov = v[s.coverage()];
        if (!(cov >= 0 && cov < 1)) {
            return;
        }
        beyondMonolayer = ValidityEnvelope.beyondMonolayer(cov);
        if (cov == 0) {
            return;
        }
        int[] slots = s.shape();
        int[] var = shape.varying();
        for (int d = 0; d < var.length; d++) {
            at[d] = Math.min(shape.high()[d], Math.max(shape.low()[d], v[slots[var[d]]]));
        }
        shape.table().weights(at, weights);
        double area = 0;
        double volume = 0;
        for (int node = 0; node < shape.area().length; node++) {
            area += weights[node] * shape.area()[node];
            volume += weights[node] * shape.volume()[node];
        }
        double height = v[slots[heightSlot]];
        if (!(area > 0 && volume > 0 && height > 0)) {
            return;
        }
        volumeFraction = ValidityEnvelope.beyondFill(Math.min(1, cov / area / height * volume));
        largerThanFilm = ValidityEnvelope.largerThanFilm(height, v[device.stack().thickness()[device.layout().host()]]);
    }
}
