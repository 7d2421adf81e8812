package org.fabspread.device;

import java.io.IOException;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.Optional;
import java.util.concurrent.atomic.LongAdder;

import org.fabspread.io.AtomicFiles;
import org.fabspread.model.Evaluator;
import org.fabspread.model.Model;
import org.fabspread.model.ModelException;
import org.fabspread.model.OutputDef;
import org.fabspread.optics.CoherentStack;
import org.fabspread.optics.IncoherentSubstrate;
import org.fabspread.optics.SolarSpectrum;
import org.fabspread.particles.DipoleTable;
import org.fabspread.particles.EffectiveMedium;
import org.fabspread.particles.ParticleEnsemble;
import org.fabspread.study.ParticleLayer;
import org.fabspread.study.Study;
import org.fabspread.study.StudyException;

/**
 * The device model: from a study and a vector of sampled inputs to the short-circuit current, its
 * losses by cause and, with a diode block, V_oc, FF and efficiency.
 *
 * <p><b>Optics.</b> Light arrives from air at normal incidence. A first layer marked incoherent (the
 * glass) is treated by intensities ({@link IncoherentSubstrate}: Pettersson, Roman &amp; Inganäs,
 * J. Appl. Phys. 86, 487 (1999)); the other layers by coherent transfer matrices
 * ({@link CoherentStack}), with the glass as incident medium (real index Re n_glass) and air as exit
 * medium. Every coherent absorptance, and the absorption profile, is scaled by the substrate's entry
 * factor. The particle layer becomes an effective-medium layer of thickness h (2c of the median particle)
 * inside its host, which it splits into a front part, the effective layer and a back part (Maxwell Garnett
 * with the ensemble polarisability, or Bruggeman; see {@link EnsembleOptics}). Aligned particles with an
 * in-plane aspect ratio ≠ 1 are solved once per in-plane polarisation and R, T and every absorptance are
 * averaged; for a random in-plane orientation ε_eff is averaged over the two in-plane axes before a single
 * solve — an approximation that ignores the difference between averaging permittivities and averaging
 * the two polarisations' optical responses.
 *
 * <p><b>Where the particle layer's light goes.</b> Its absorptance is split per wavelength into metal
 * absorption, scattering, host absorption (with the dipole near field), a quenched share and the near
 * field absorbed in a neighbouring absorber, in proportion to the loss rates of the model document (§4.5).
 * The scattered part becomes diffuse light in the absorber ({@link LambertianSlab}): the forward share
 * f_fwd is injected into the absorber; the rest heads away from it — towards the front, where 1 − R_f
 * escapes and R_f returns into the absorber as forward light (particles in front of the absorber), or
 * towards the back electrode, where R_b returns and 1 − R_b is lost (particles behind it); with the
 * particles inside the absorber the forward share enters at its front and the rest at its back.
 * R_f = 1 − 1/n² with n the absorber's index; R_b is the normal-incidence reflectance of everything
 * behind the absorber seen from inside it (a second, short transfer-matrix solve), used for all angles.
 *
 * <p><b>Current.</b> Photon flux per wavelength bin from ASTM G173-03 global (exact bin integrals,
 * {@link SolarSpectrum#photonFluxPerBin}). Collection by the Hecht relation ({@link HechtCollection})
 * times the dissociation efficiency η_d: the coherent absorption profile is weighted by η(x) in closed
 * form ({@link CoherentStack#absorbedWeighted}); the useful host part of the particle layer by the mean
 * of η over the layer's depth; the neighbour near field by η at that interface; diffuse light by ⟨η⟩ of
 * the absorber. Quenched parts give no current.
 *
 * <p><b>Inputs.</b> {@link #inputIds()} are the ids of {@link Study#uncertainInputs()} in order; every
 * other parameter takes its nominal value. A sample copies the nominal parameter vector and overwrites
 * the uncertain slots. A point outside the model's domain throws {@link ModelException} (reasons
 * {@code negative-thickness}, {@code particle-layer-outside-host}, {@code out-of-range}, {@code nan});
 * the nominal point itself is checked when the model is built and a failure there is a
 * {@link StudyException} naming the parameter.
 *
 * <p><b>With an enhancement table</b> ({@code particles.enhancement_table}, read by {@link EnhancementTable})
 * the user's rigorous results replace the built-in particle optics: the particle layer is not put into the
 * transfer matrix, and per wavelength the planar absorber absorption and its Hecht-weighted collection are
 * multiplied by the enhancement interpolated at the sample's ({@code particles.diameter},
 * {@code particles.coverage}[, λ]). Energy bookkeeping ({@link EnhancementTable#ASSUMPTION}): the extra
 * absorption is taken from the reflection R (a factor below 1 returns the lost absorption to R); every other
 * layer keeps its planar absorption and the collected share keeps the planar depth profile. The absorber
 * absorption is capped at A + R so R never goes negative; each evaluation that hits the cap is counted
 * ({@link #enhancementCapSamples()}, {@link #enhancementCapWavelengths()}). The table gives only the net
 * absorber absorption, so loss_metal, loss_scattering and loss_quenching are 0: whatever the particles
 * absorb or scatter away is inside loss_reflection. jsc_planar is the same stack before the enhancement.
 * A diameter or coverage outside the table's range is a {@link ModelException} with reason
 * {@value EnhancementTable#OUTSIDE_REASON} (a {@link StudyException} at the nominal point); a wavelength axis
 * must cover the whole grid. The particle layer must still fit in its host (median particle height); the
 * size spread, forward fraction and metal parameters have no effect then (the table holds their physics).
 *
 * <p>Limits (to repeat in reports): the near field reaching a neighbouring absorber is a dipole estimate
 * without the interface's image field; the particle layer is laterally homogeneous (no grating or
 * guided-mode coupling); the 3D Lorentz local field is an approximation for a monolayer and substrate
 * image fields are ignored; particles are independent beyond Maxwell Garnett; diffuse light uses ray
 * optics in a ~100 nm film, re-randomised at every reflection, and ignores absorption in the layers it
 * crosses on the way to the absorber; the photocurrent of the diode block does not depend on voltage.
 */
public final class DeviceModel implements Model {
    /** The study compiled into slots, layout and outputs ({@link StudyCompiler}). */
    final CompiledDevice device;
    private final LongAdder capSamples = new LongAdder();
    private final LongAdder capWavelengths = new LongAdder();

    private DeviceModel(CompiledDevice device) {
        this.device = device;
    }

    /**
     * Builds the model of a study and evaluates it once at the nominal point.
     *
     * @throws StudyException when the study cannot be modelled, or its nominal point is outside the
     *                        model's domain (the message names the parameter)
     */
    public static DeviceModel of(Study study) {
        return checked(new DeviceModel(StudyCompiler.compile(study, true)));
    }

    /**
     * The reference model: as {@link #of} but every sample takes the exact particle optics (no
     * {@link SphereTable}); the tests hold the tabulated path to it.
     */
    static DeviceModel exact(Study study) {
        return checked(new DeviceModel(StudyCompiler.compile(study, false)));
    }

    /** The model of a compiled study (one whose particle physics may have been swapped), checked at the nominal point. */
    static DeviceModel of(CompiledDevice compiled) {
        return checked(new DeviceModel(compiled));
    }

    private static DeviceModel checked(DeviceModel m) {
        Study study = m.device.study();
        ParameterVector p = m.device.parameters();
        DeviceEvaluator e = m.newDeviceEvaluator();
        try {
            e.run(p.nominal().clone(), new double[m.device.outputs().size()], null);
        } catch (InputException ex) {
            String where = ex.slot >= 0 ? p.where()[ex.slot].prefix() : StudyCompiler.prefix(study) + "study";
            String msg = ex.getMessage();
            String id = ex.slot >= 0 ? p.ids()[ex.slot] : null;
            if (id != null && where.endsWith(": " + id) && msg.startsWith(id + ": ")) {
                // the location already ends with the parameter's key: do not name it twice
                msg = msg.substring(id.length() + 2);
            }
            throw new StudyException(where + ": " + msg + " (at the nominal point)", ex);
        } catch (ModelException ex) {
            throw new StudyException(StudyCompiler.prefix(study) + "study: " + ex.getMessage() + " (at the nominal point)", ex);
        }
        ParticlePlacement pl = e.placement();
        if (pl.on && pl.protrusion > 0) {
            // the study's own particles must fit their host (as the study reader says); only sampled ones
            // that come out larger stick out into the next layer
            ParticleSlots ps = m.device.particles().slots();
            boolean byOffset = m.device.particles().layer().placement() == ParticleLayer.Placement.OFFSET
                    && ps.offset() >= 0;
            int slot = byOffset ? ps.offset() : ps.diameter();
            StackLayout l = m.device.layout();
            throw new StudyException(p.where()[slot].prefix() + ": " + String.format(java.util.Locale.ROOT,
                    "the particle layer (%.4g nm high) does not fit in its host layer '%s' (%.4g nm) at the nominal"
                    + " point; sampled particles that come out larger stick out into the next layer",
                    pl.height, study.stack().get(l.host()).name(), e.optics().thickness(l.host())));
        }
        return m;
    }

    @Override
    public List<String> inputIds() {
        return device.inputIds();
    }

    @Override
    public List<OutputDef> outputs() {
        return device.outputs();
    }

    /** A new judge of samples against the validity envelope (one per thread or consumer). */
    public EnvelopeJudge envelopeJudge() {
        return new EnvelopeJudge(device);
    }

    /** The nominal point's place with respect to the validity envelope. */
    public EnvelopeStatus nominalEnvelope() {
        return envelopeJudge().status(nominalInputs());
    }

    @Override
    public Evaluator newEvaluator() {
        DeviceEvaluator e = newDeviceEvaluator();
        return e::evaluate;
    }

    DeviceEvaluator newDeviceEvaluator() {
        return new DeviceEvaluator(device, this);
    }

    /** Counts one evaluation whose table absorption was capped at {@code wavelengths} wavelengths. */
    void countCapped(int wavelengths) {
        capSamples.increment();
        capWavelengths.add(wavelengths);
    }

    /** The built-in particle optics' sphere table, or null when they read none (tests). */
    DipoleTable sphereTable() {
        return device.builtInParticles() ? device.particles().sphereTable() : null;
    }

    /** The study this model was built from. */
    public Study study() {
        return device.study();
    }

    /**
     * The particle layer's volume fraction f = n_A⟨V⟩/h at an input vector (model doc 4.3), or NaN
     * without a particle layer. Maxwell Garnett is strained above {@link EffectiveMedium#DENSE_LIMIT}.
     */
    double particleVolumeFraction(double[] inputs) {
        if (device.particles() == null) {
            return Double.NaN;
        }
        ParameterVector p = device.parameters();
        double[] v = p.nominal().clone();
        for (int i = 0; i < inputs.length; i++) {
            v[p.inputSlots()[i]] = inputs[i];
        }
        ParticleSlots s = device.particles().slots();
        return ParticleEnsemble.geometry(v[s.diameter()], ParameterVector.value(v, s.sizeCv(), 0),
                ParameterVector.value(v, s.inPlaneAspect(), 1), ParameterVector.value(v, s.outOfPlaneAspect(), 1),
                v[s.coverage()]).volumeFraction();
    }

    /**
     * Warnings about the study as the model sees it at the nominal point (empty when none): a dense
     * particle layer mixed by Maxwell Garnett (f above {@link EffectiveMedium#DENSE_LIMIT}; Bruggeman is the
     * alternative rule for dense layers).
     */
    public List<String> warnings() {
        List<String> w = new ArrayList<>();
        if (device.builtInParticles()) {
            double f = particleVolumeFraction(nominalInputs());
            if (EffectiveMedium.isDense(f)
                    && device.particles().layer().mixingRule() == ParticleLayer.MixingRule.MAXWELL_GARNETT) {
                w.add(String.format(Locale.ROOT, "particles: the particle layer's volume fraction is %.3f at the"
                        + " nominal point, above %.1f where Maxwell Garnett is unreliable; consider mixing: bruggeman",
                        f, EffectiveMedium.DENSE_LIMIT));
            }
        }
        return w;
    }

    /** Nominal values of the inputs, in {@link #inputIds()} order. */
    public double[] nominalInputs() {
        ParameterVector p = device.parameters();
        double[] x = new double[p.inputSlots().length];
        for (int i = 0; i < x.length; i++) {
            x[i] = p.nominal()[p.inputSlots()[i]];
        }
        return x;
    }

    /** Evaluates the outputs at one input vector (a convenience; allocates). */
    public double[] evaluate(double[] inputs) {
        double[] out = new double[device.outputs().size()];
        newEvaluator().evaluate(inputs, out);
        return out;
    }

    /** Per-wavelength optics at the nominal point. */
    public Spectra nominalSpectra() {
        return spectra(nominalInputs());
    }

    /** Per-wavelength optics at an input vector (in {@link #inputIds()} order). */
    Spectra spectra(double[] inputs) {
        DeviceEvaluator e = newDeviceEvaluator();
        double[] v = e.sampleVector(inputs);
        SpectraRecorder rec = new SpectraRecorder(device);
        e.run(v, new double[device.outputs().size()], rec);
        return rec.build();
    }

    /** The user's enhancement table when the study gives one (it then replaces the built-in particle optics). */
    public Optional<EnhancementTable> enhancementTable() {
        return device.usesTable() ? Optional.of(device.particles().table().table()) : Optional.empty();
    }

    /**
     * Number of evaluations through {@link #newEvaluator()} in which the enhancement table's absorption had to
     * be capped at some wavelength so the reflection would not go negative (0 without a table).
     */
    long enhancementCapSamples() {
        return capSamples.sum();
    }

    /** Number of (evaluation, wavelength) pairs capped as in {@link #enhancementCapSamples()}. */
    long enhancementCapWavelengths() {
        return capWavelengths.sum();
    }

    /**
     * Writes {@code particles.csv} into {@code outDir}: per wavelength the ensemble-average extinction,
     * scattering and absorption cross-sections per particle (nm², unpolarised: the mean of the two
     * in-plane axes) at the nominal point, and the same per unit area (n_A σ, a fraction).
     *
     * @throws StudyException when the study has no particle layer, or an enhancement table replaces the
     *                        particle optics
     */
    public static void writeParticleCrossSections(Study study, Path outDir) throws IOException {
        CrossSections cs = of(study).particleCrossSections();
        StringBuilder sb = new StringBuilder();
        sb.append("wavelength_nm,extinction_nm2,scattering_nm2,absorption_nm2,extinction_per_area,")
                .append("scattering_per_area,absorption_per_area\n");
        for (int i = 0; i < cs.wavelengthNm().length; i++) {
            double nA = cs.numberPerArea();
            sb.append(String.format(Locale.ROOT, "%.6g,%.8g,%.8g,%.8g,%.8g,%.8g,%.8g%n", cs.wavelengthNm()[i],
                    cs.extinction()[i], cs.scattering()[i], cs.absorption()[i], nA * cs.extinction()[i],
                    nA * cs.scattering()[i], nA * cs.absorption()[i]));
        }
        AtomicFiles.writeString(outDir.resolve("particles.csv"), sb.toString());
    }

    /**
     * The nominal ensemble's cross-sections per particle (nm², unpolarised: the mean of the two in-plane
     * axes) against wavelength, the number of particles per nm² of film and, for a named shape, what its
     * discrete-dipole table says per polarisation (null otherwise).
     */
    public record CrossSections(double[] wavelengthNm, double[] extinction, double[] scattering, double[] absorption,
                                double numberPerArea, ShapeTableSummary shape) {

        /** Cross-sections of a particle without a shape table. */
        public CrossSections(double[] wavelengthNm, double[] extinction, double[] scattering, double[] absorption,
                             double numberPerArea) {
            this(wavelengthNm, extinction, scattering, absorption, numberPerArea, null);
        }
    }

    /**
     * The nominal particle ensemble's cross-sections.
     *
     * @throws StudyException when the study has no particle layer, or an enhancement table replaces the
     *                        particle optics
     */
    public CrossSections particleCrossSections() {
        Study study = device.study();
        if (device.particles() == null) {
            throw new StudyException(StudyCompiler.prefix(study) + "particles: the study has no particle layer");
        }
        if (device.usesTable()) {
            throw new StudyException(StudyCompiler.prefix(study) + "particles.enhancement_table: the particle optics come from "
                    + device.particles().table().table().source() + "; no cross-sections are computed");
        }
        DeviceEvaluator e = newDeviceEvaluator();
        e.prepare(device.parameters().nominal().clone());
        e.particles().fill(e.optics(), true);
        ParticleSpectra ps = e.particles().spectra();
        int n = device.wavelengths();
        double[] ext = new double[n];
        for (int i = 0; i < n; i++) {
            ext[i] = ps.absorptionCrossSection[i] + ps.scatteringCrossSection[i];
        }
        return new CrossSections(device.lambda().clone(), ext, ps.scatteringCrossSection.clone(),
                ps.absorptionCrossSection.clone(), ps.numberPerArea, shapeSummary());
    }

    /**
     * For a named particle shape, one line saying whether its discrete-dipole table was solved now or read from
     * the cache, and where the cache is; empty otherwise.
     */
    public Optional<String> shapeTableOrigin() {
        ParticleSetup setup = device.particles();
        return setup == null || setup.shapeTable() == null ? Optional.empty() : Optional.of(setup.shapeTable().origin());
    }

    /** The nominal particle's per-polarisation account from its shape table, or null without one. */
    private ShapeTableSummary shapeSummary() {
        ParticleSetup setup = device.particles();
        if (setup.shapeTable() == null) {
            return null;
        }
        List<String> names = new ArrayList<>(setup.layer().shape().parameters().keySet());
        int[] slots = setup.slots().shape();
        double[] nominal = new double[slots.length];
        for (int j = 0; j < slots.length; j++) {
            nominal[j] = device.parameters().nominal()[slots[j]];
        }
        return setup.shapeTable().summary(names, nominal);
    }
}
