package org.fabspread.device;

import java.util.Arrays;

import org.fabspread.study.ParticleLayer;

/**
 * The particle stage of one evaluator (built-in particle optics): reads the particle inputs from
 * {@link ParticleSlots} — the one range check of each, naming the parameter — into a {@link ParticleSample},
 * lets the {@link ParticleOptics} set the shape and give the layer's height, places the layer in its host
 * ({@link ParticlePlacement}), sets the media and has the optics fill the {@link ParticleSpectra} read per
 * wavelength by the evaluator. So {@code particles.coverage} goes {@code ParticleSlots.coverage →
 * ParticleSample.coverage → ParticleOptics.shape → ParticleEnsemble.setShape}.
 *
 * <p>A fill is reused while every input of the particle optics keeps its value (a what-if or a Sobol design
 * re-evaluates the same particles with other layers): the reuse is exact, the key holds every input.
 *
 * <p>A particle taller than what its host leaves sticks out into the next layer ({@link StackLayout}): the
 * effective layer is then two slices, the part in the host (height h − p) and the slice of protruding caps in
 * the next layer (height p), each with its own host and the share of the particles' volume it holds,
 * w = {@link SphericalCap#share} of the median particle (h²(3r − h)/(4r³) with r = h_layer/2), so the slices
 * keep the layer's n_A⟨V⟩: the volume fraction of a slice of height t holding share w is f·w·h/t, which the
 * ensemble gets as the coverage θ·w·h/t. Each slice is mixed (Maxwell Garnett or Bruggeman) with its own host's
 * permittivity; the slice in the next layer has no neighbour near-field term and the quenching distance only
 * when that layer is an absorber. Approximations, stated: the share is the median particle's for the whole
 * size spread, and a particle across an interface is polarised as if wholly inside each host in turn.
 * Spanning needs the built-in quasi-static or Mie ensemble ({@link EnsembleOptics}); with other particle
 * physics such a sample is refused as before.
 */
final class ParticleStage {
    /** Inputs of a fill: the sample's ten particle values, the neighbour distance, host and neighbour n shift, k scale. */
    private static final int KEY_SIZE = 15;

    private final ParticleSlots slots;
    private final ParticleLayer layer;
    private final ParameterVector params;
    private final StackLayout layout;
    private final String hostName;
    private final int nw;
    private final ParticleOptics physics;
    private final ParticleSample sample;
    private final ParticleSpectra spectra;
    private final double[] key;
    private final double[] filledKey;
    private boolean filled;
    /** the slice of protruding caps: its physics (null: spanning not supported), sample, spectra and reuse key. */
    private final ParticleOptics slicePhysics;
    private final ParticleSample sliceSample;
    private final ParticleSpectra sliceSpectra;
    private final double[] sliceKey;
    private final double[] sliceFilledKey;
    private boolean sliceFilled;
    /** whether the prepared sample sticks out into the next layer (the slice's spectra are valid). */
    private boolean spans;
    /** the sample's quenching distance, nm. */
    private double quench;

    ParticleStage(CompiledDevice d) {
        ParticleSetup p = d.particles();
        slots = p.slots();
        layer = p.layer();
        params = d.parameters();
        layout = d.layout();
        hostName = d.study().stack().get(layout.host()).name();
        nw = d.wavelengths();
        physics = p.newOptics(d.lambda());
        sample = new ParticleSample(nw, slots.shape().length);
        key = new double[KEY_SIZE + slots.shape().length];
        filledKey = new double[key.length];
        spectra = new ParticleSpectra(nw);
        // the slice sits in another host than the sphere table was made for: the exact path, no table
        boolean span = layout.sliceLayer() >= 0 && physics instanceof EnsembleOptics;
        slicePhysics = span ? new EnsembleOptics(layer, d.lambda(), p.metalEpsRe(), p.metalEpsIm(), null) : null;
        sliceSample = span ? new ParticleSample(nw, 0) : null;
        sliceSpectra = span ? new ParticleSpectra(nw) : null;
        sliceKey = new double[KEY_SIZE];
        sliceFilledKey = new double[KEY_SIZE];
    }

    /**
     * Reads and checks the sample's particle inputs, places the layer in its host and, at coverage &gt; 0,
     * fills the per-wavelength particle optics.
     *
     * @param quench the sample's quenching distance, nm (applies only in an absorbing host)
     * @throws InputException for a value outside its range, or a layer that does not fit in its host
     */
    void prepare(double[] v, OpticsStage optics, double quench, ParticlePlacement place) {
        this.quench = quench;
        read(v, layout.absorber()[layout.host()] ? quench : 0);
        physics.shape(sample);
        int h = layout.host();
        double hostD = optics.thickness(h);
        place.height = physics.layerHeight();
        double room = slicePhysics != null ? optics.thickness(layout.sliceLayer()) : -1;
        place.placeInHost(layer, slots, v, hostD, hostName, room);
        spans = place.protrusion > 0;
        if (spans) {
            shareAcrossInterface(place, optics);
        }
        double fwd = ParameterVector.value(v, slots.forwardFraction(), 0.5);
        if (!(fwd >= 0 && fwd <= 1)) {
            throw fail(slots.forwardFraction(), "forward fraction must be in [0, 1], got " + fwd);
        }
        place.forward = fwd;
        place.forwardGiven = slots.forwardFraction() >= 0;
        double centre = place.centre();
        sample.neighbourDistance = layout.neighbourBehind() ? hostD - centre : centre;
        if (spans) {
            // a particle across the interface: its centre is at least a radius from either face of the host
            sample.neighbourDistance = Math.max(sample.neighbourDistance, 0.5 * place.height);
        }
        sample.hasNeighbour = layout.neighbour() >= 0;
        place.on = sample.coverage > 0;
        if (place.on) {
            fill(optics, false);
        }
    }

    /**
     * For a layer that sticks out by p: the coverages that give each slice its volume fraction (class comment),
     * the host part's set into {@link #sample}, the slice's into {@link #sliceSample}.
     */
    private void shareAcrossInterface(ParticlePlacement place, OpticsStage optics) {
        double h = place.height;
        double out = place.protrusion;
        double w = SphericalCap.share(0.5 * h, out);
        double theta = sample.coverage;
        double inHost = theta * (1 - w) * h / (h - out);
        double inSlice = theta * w * h / out;
        if (!(inHost < 1) || !(inSlice < 1)) {
            throw fail(slots.coverage(), String.format(java.util.Locale.ROOT,
                    "the particles sticking %.4g nm out of their host fill more than a monolayer", out));
        }
        ParticleSample s = sliceSample;
        s.diameter = sample.diameter;
        s.sizeCv = sample.sizeCv;
        s.inPlaneAspect = sample.inPlaneAspect;
        s.outOfPlaneAspect = sample.outOfPlaneAspect;
        s.coverage = inSlice;
        s.plasmaEnergy = sample.plasmaEnergy;
        s.bulkDamping = sample.bulkDamping;
        s.fermiVelocity = sample.fermiVelocity;
        s.surfaceScattering = sample.surfaceScattering;
        s.quenchDistance = layout.absorber()[layout.sliceLayer()] ? quench : 0;
        s.neighbourDistance = 0;
        s.hasNeighbour = false;
        slicePhysics.shape(s);
        sample.coverage = inHost;
        physics.shape(sample);
    }

    /** Reads the particle inputs into {@link #sample}, one range check each. */
    private void read(double[] v, double quenchNm) {
        double d50 = v[slots.diameter()];
        double cv = ParameterVector.value(v, slots.sizeCv(), 0);
        double p = ParameterVector.value(v, slots.inPlaneAspect(), 1);
        double q = ParameterVector.value(v, slots.outOfPlaneAspect(), 1);
        double cov = v[slots.coverage()];
        if (!(d50 > 0 && !Double.isInfinite(d50))) {
            throw fail(slots.diameter(), "median diameter must be > 0 nm, got " + d50);
        }
        if (!(cv >= 0 && !Double.isInfinite(cv))) {
            throw fail(slots.sizeCv(), "size CV must be >= 0, got " + cv);
        }
        if (!(p >= 1 && !Double.isInfinite(p))) {
            throw fail(slots.inPlaneAspect(), "in-plane aspect ratio must be >= 1, got " + p);
        }
        if (!(q > 0 && !Double.isInfinite(q))) {
            throw fail(slots.outOfPlaneAspect(), "out-of-plane aspect ratio must be > 0, got " + q);
        }
        if (!(cov >= 0 && cov < 1)) {
            throw fail(slots.coverage(), "coverage must be in [0, 1), got " + cov);
        }
        double wp = v[slots.plasmaEnergy()];
        double g0 = v[slots.bulkDamping()];
        double vf = v[slots.fermiVelocity()];
        double as = v[slots.surfaceScattering()];
        if (!(wp > 0 && !Double.isInfinite(wp))) {
            throw fail(slots.plasmaEnergy(), "plasma energy must be > 0 eV, got " + wp);
        }
        if (!(g0 >= 0 && !Double.isInfinite(g0))) {
            throw fail(slots.bulkDamping(), "bulk damping must be >= 0 eV, got " + g0);
        }
        if (!(vf >= 0 && !Double.isInfinite(vf))) {
            throw fail(slots.fermiVelocity(), "Fermi velocity must be >= 0 m/s, got " + vf);
        }
        if (!(as >= 0 && !Double.isInfinite(as))) {
            throw fail(slots.surfaceScattering(), "surface scattering must be >= 0, got " + as);
        }
        sample.diameter = d50;
        sample.sizeCv = cv;
        sample.inPlaneAspect = p;
        sample.outOfPlaneAspect = q;
        sample.coverage = cov;
        sample.plasmaEnergy = wp;
        sample.bulkDamping = g0;
        sample.fermiVelocity = vf;
        sample.surfaceScattering = as;
        sample.quenchDistance = quenchNm;
        int[] sh = slots.shape();
        for (int j = 0; j < sh.length; j++) {
            double x = v[sh[j]];
            if (!(x >= 0 && !Double.isInfinite(x))) {
                throw fail(sh[j], "shape parameter must be >= 0 nm, got " + x);
            }
            sample.shapeValues[j] = x;
        }
    }

    /**
     * Fills {@link #spectra} for the prepared sample unless the last fill had the same inputs (always with
     * {@code force}).
     */
    void fill(OpticsStage optics, boolean force) {
        int h = layout.host();
        int nb = layout.neighbour();
        key[0] = sample.diameter;
        key[1] = sample.sizeCv;
        key[2] = sample.inPlaneAspect;
        key[3] = sample.outOfPlaneAspect;
        key[4] = sample.coverage;
        key[5] = sample.plasmaEnergy;
        key[6] = sample.bulkDamping;
        key[7] = sample.fermiVelocity;
        key[8] = sample.surfaceScattering;
        key[9] = sample.quenchDistance;
        key[10] = sample.neighbourDistance;
        key[11] = optics.shift(h);
        key[12] = optics.scale(h);
        key[13] = nb >= 0 ? optics.shift(nb) : 0;
        key[14] = nb >= 0 ? optics.scale(nb) : 1;
        System.arraycopy(sample.shapeValues, 0, key, KEY_SIZE, sample.shapeValues.length);
        if (spans) {
            fillSlice(optics, force);
        }
        if (!force && filled && Arrays.equals(key, filledKey)) {
            return;
        }
        for (int i = 0; i < nw; i++) {
            double hn = optics.n(h, i);
            double hk = optics.k(h, i);
            sample.hostEpsRe[i] = hn * hn - hk * hk;
            sample.hostEpsIm[i] = 2 * hn * hk;
            if (nb >= 0) {
                sample.neighbourEpsIm[i] = 2 * optics.n(nb, i) * optics.k(nb, i);
            }
        }
        filled = false;
        physics.fill(sample, spectra);
        System.arraycopy(key, 0, filledKey, 0, key.length);
        filled = true;
    }

    /** Fills the slice's spectra when the prepared sample spans the interface (and its inputs changed). */
    private void fillSlice(OpticsStage optics, boolean force) {
        int h = layout.sliceLayer();
        ParticleSample s = sliceSample;
        sliceKey[0] = s.diameter;
        sliceKey[1] = s.sizeCv;
        sliceKey[2] = s.inPlaneAspect;
        sliceKey[3] = s.outOfPlaneAspect;
        sliceKey[4] = s.coverage;
        sliceKey[5] = s.plasmaEnergy;
        sliceKey[6] = s.bulkDamping;
        sliceKey[7] = s.fermiVelocity;
        sliceKey[8] = s.surfaceScattering;
        sliceKey[9] = s.quenchDistance;
        sliceKey[10] = optics.shift(h);
        sliceKey[11] = optics.scale(h);
        if (!force && sliceFilled && Arrays.equals(sliceKey, sliceFilledKey)) {
            return;
        }
        for (int i = 0; i < nw; i++) {
            double hn = optics.n(h, i);
            double hk = optics.k(h, i);
            s.hostEpsRe[i] = hn * hn - hk * hk;
            s.hostEpsIm[i] = 2 * hn * hk;
        }
        sliceFilled = false;
        slicePhysics.fill(s, sliceSpectra);
        System.arraycopy(sliceKey, 0, sliceFilledKey, 0, KEY_SIZE);
        sliceFilled = true;
    }

    /** Whether the prepared sample sticks out of its host (then {@link #sliceSpectra} is valid). */
    boolean spans() {
        return spans;
    }

    /** The particle optics of the slice of protruding caps (valid while {@link #spans}). */
    ParticleSpectra sliceSpectra() {
        return sliceSpectra;
    }

    /** The particle optics of the prepared sample, per wavelength (valid after a fill). */
    ParticleSpectra spectra() {
        return spectra;
    }

    private InputException fail(int slot, String what) {
        String id = slot >= 0 ? params.ids()[slot] : "particles";
        return new InputException("out-of-range", slot, id + ": " + what);
    }
}
