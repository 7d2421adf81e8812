package org.fabspread.device;

import java.io.IOException;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Collections;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.Optional;
import java.util.concurrent.atomic.LongAdder;

import org.fabspread.io.AtomicFiles;
import org.fabspread.model.Evaluator;
import org.fabspread.model.Model;
import org.fabspread.model.ModelException;
import org.fabspread.model.OutputDef;
import org.fabspread.optics.CoherentStack;
import org.fabspread.optics.IncoherentSubstrate;
import org.fabspread.optics.LayerOptics;
import org.fabspread.optics.MaterialLibrary;
import org.fabspread.optics.NkTable;
import org.fabspread.optics.SolarSpectrum;
import org.fabspread.particles.DipoleTable;
import org.fabspread.particles.EffectiveMedium;
import org.fabspread.particles.ParticleEnsemble;
import org.fabspread.study.ChargeCollection;
import org.fabspread.study.Diode;
import org.fabspread.study.Layer;
import org.fabspread.study.MetalParameters;
import org.fabspread.study.Parameter;
import org.fabspread.study.ParticleLayer;
import org.fabspread.study.SourceLocation;
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
 * with the ensemble polarisability, or Bruggeman; see {@link ParticleStep}). Aligned particles with an
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

    // ---- output ids ----
    static final String JSC = "jsc";
    static final String JSC_OPTICAL = "jsc_optical";
    static final String ABSORPTANCE = "absorber_absorptance";
    static final String LOSS_METAL = "loss_metal";
    static final String LOSS_ELECTRODES = "loss_electrodes";
    static final String LOSS_TRANSPORT = "loss_transport";
    static final String LOSS_SUBSTRATE = "loss_substrate";
    static final String LOSS_SCATTERING = "loss_scattering";
    static final String LOSS_QUENCHING = "loss_quenching";
    static final String LOSS_COLLECTION = "loss_collection";
    static final String LOSS_REFLECTION = "loss_reflection";
    static final String LOSS_TRANSMISSION = "loss_transmission";
    static final String JSC_PLANAR = "jsc_planar";
    static final String ENHANCEMENT = "enhancement";
    static final String VOC = "voc";
    static final String FF = "ff";
    static final String EFFICIENCY = "efficiency";

    // loss buckets of the layers
    static final int B_ABSORBER = 0;
    static final int B_ELECTRODE = 1;
    static final int B_TRANSPORT = 2;
    static final int B_SUBSTRATE = 3;

    // kinds of computational (coherent) layers
    static final int K_PLAIN = 0;
    static final int K_HOST_FRONT = 1;
    static final int K_EFFECTIVE = 2;
    static final int K_HOST_BACK = 3;

    final Study study;
    final LayerOptics optics;
    final double[] lambda;
    final double[] flux;
    final List<String> inputIds;
    final List<OutputDef> outputs;
    final String[] paramIds;
    final SourceLocation[] paramWhere;
    final double[] nominal;
    final int[] inputSlot;

    // stack layout
    final int layerCount;
    final int[] thickSlot;
    final int[] shiftSlot;
    final int[] scaleSlot;
    final int[] bucket;
    final boolean[] isAbsorber;
    final double[] minN;
    final boolean incoherentGlass;
    final int firstCoherent;
    final int compCount;
    final int[] compLayer;
    final int[] compKind;
    final int[] compOfLayerFirst;
    final int[] compOfLayerLast;

    // particles
    final boolean hasParticles;
    final int host;
    final int effComp;
    final int diffuseAbsorber;
    final int neighbour;
    final boolean neighbourBehind;
    final ParticleLayer particles;
    final double[] metalEpsRe;
    final double[] metalEpsIm;
    final int pOffset;
    final int pDiameter;
    final int pCv;
    final int pInPlane;
    final int pOutOfPlane;
    final int pCoverage;
    final int pForward;
    final int pPlasma;
    final int pDamping;
    final int pFermi;
    final int pSurface;
    /** the user's enhancement table on the grid, or null: the built-in particle optics. */
    final EnhancementTable.OnGrid tableOnGrid;
    final boolean usesTable;
    /** single-sphere quantities of the built-in particle optics tabulated in the diameter, or null ({@link SphereTable}). */
    final DipoleTable sphereTable;
    final LongAdder capSamples = new LongAdder();
    final LongAdder capWavelengths = new LongAdder();

    // collection
    final int cDissociation;
    final int cElectronMuTau;
    final int cHoleMuTau;
    final int cBuiltIn;
    final int cQuenching;
    final boolean electronsAtFront;

    // diode
    final boolean hasDiode;
    final int dJ0;
    final int dIdeality;
    final int dRs;
    final int dRsh;
    final int dTemperature;

    // output indices
    final int oJsc;
    final int oJscOptical;
    final int oAbsorptance;
    final int oMetal;
    final int oElectrodes;
    final int oTransport;
    final int oSubstrate;
    final int oScattering;
    final int oQuenching;
    final int oCollection;
    final int oReflection;
    final int oTransmission;
    final int oPlanar;
    final int oEnhancement;
    final int oVoc;
    final int oFf;
    final int oEfficiency;
    final double totalFlux;

    private DeviceModel(Study study, boolean tabulate) {
        this.study = study;
        if (study.stack().isEmpty()) {
            throw new StudyException(prefix(study) + "stack: the stack has no layers");
        }
        this.optics = LayerOptics.of(study);
        this.lambda = study.grid().wavelengths();
        this.flux = SolarSpectrum.astmG173Global().photonFluxPerBin(study.grid());
        double tf = 0;
        for (double f : flux) {
            tf += f;
        }
        this.totalFlux = tf;

        // parameters: one flat vector in Study.parameters() order
        Map<String, Parameter> params = study.parameters();
        int np = params.size();
        paramIds = new String[np];
        paramWhere = new SourceLocation[np];
        nominal = new double[np];
        Map<String, Integer> index = new LinkedHashMap<>();
        int k = 0;
        for (Parameter p : params.values()) {
            paramIds[k] = p.id();
            paramWhere[k] = p.where();
            nominal[k] = p.nominal();
            index.put(p.id(), k);
            k++;
        }
        List<Parameter> unc = study.uncertainInputs();
        inputSlot = new int[unc.size()];
        List<String> ids = new ArrayList<>();
        for (int i = 0; i < unc.size(); i++) {
            inputSlot[i] = index.get(unc.get(i).id());
            ids.add(unc.get(i).id());
        }
        inputIds = List.copyOf(ids);

        // stack
        List<Layer> stack = study.stack();
        layerCount = stack.size();
        thickSlot = new int[layerCount];
        shiftSlot = new int[layerCount];
        scaleSlot = new int[layerCount];
        bucket = new int[layerCount];
        isAbsorber = new boolean[layerCount];
        minN = new double[layerCount];
        boolean anyAbsorber = false;
        for (int j = 0; j < layerCount; j++) {
            Layer l = stack.get(j);
            thickSlot[j] = slot(index, l.thickness());
            shiftSlot[j] = slot(index, l.nShift());
            scaleSlot[j] = slot(index, l.kScale());
            if (thickSlot[j] < 0) {
                throw new StudyException(prefix(study) + "stack[" + j + "] (" + l.name() + "): the layer has no thickness");
            }
            isAbsorber[j] = l.isAbsorber();
            anyAbsorber |= isAbsorber[j];
            bucket[j] = switch (l.role()) {
                case ABSORBER -> B_ABSORBER;
                case ELECTRODE -> B_ELECTRODE;
                case SUBSTRATE -> B_SUBSTRATE;
                default -> B_TRANSPORT;
            };
            double mn = Double.POSITIVE_INFINITY;
            for (int i = 0; i < lambda.length; i++) {
                mn = Math.min(mn, optics.n(j, i));
            }
            minN[j] = mn;
            if (l.incoherent() && j > 0) {
                throw new StudyException(prefix(study) + "stack[" + j + "] (" + l.name()
                        + "): only the first layer (the substrate) may be incoherent");
            }
            if (l.incoherent() && l.isAbsorber()) {
                throw new StudyException(prefix(study) + "stack[" + j + "] (" + l.name()
                        + "): an absorber must be a coherent thin film");
            }
        }
        if (!anyAbsorber) {
            throw new StudyException(prefix(study) + "stack: no layer has the role ABSORBER");
        }
        incoherentGlass = stack.get(0).incoherent();
        firstCoherent = incoherentGlass ? 1 : 0;

        // particle layer
        particles = study.particleLayer().orElse(null);
        hasParticles = particles != null;
        int hostIdx = -1;
        if (hasParticles) {
            for (int j = 0; j < layerCount; j++) {
                if (stack.get(j).name().equals(particles.host())) {
                    hostIdx = j;
                }
            }
            SourceLocation where = particles.coverage() != null ? particles.coverage().where()
                    : SourceLocation.unknown("particles");
            if (hostIdx < 0) {
                throw new StudyException(atKey(where, "particles.host") + ": no layer named '" + particles.host() + "'");
            }
            if (hostIdx < firstCoherent) {
                throw new StudyException(atKey(where, "particles.host")
                        + ": the particles cannot sit in the incoherent substrate");
            }
        }
        host = hostIdx;
        usesTable = hasParticles && particles.enhancementTable() != null;
        if (usesTable) {
            EnhancementTable table = EnhancementTable.read(particles.enhancementTable());
            try {
                tableOnGrid = table.onGrid(lambda);
            } catch (StudyException ex) {
                throw new StudyException(prefix(study) + "particles.enhancement_table: " + ex.getMessage(), ex);
            }
        } else {
            tableOnGrid = null;
        }

        // computational layers: the host splits into front part / effective layer / back part
        int cc = layerCount - firstCoherent + (hasParticles ? 2 : 0);
        compCount = cc;
        compLayer = new int[cc];
        compKind = new int[cc];
        compOfLayerFirst = new int[layerCount];
        compOfLayerLast = new int[layerCount];
        int c = 0;
        int eff = -1;
        for (int j = 0; j < layerCount; j++) {
            if (j < firstCoherent) {
                compOfLayerFirst[j] = -1;
                compOfLayerLast[j] = -1;
                continue;
            }
            compOfLayerFirst[j] = c;
            if (j == host) {
                compLayer[c] = j;
                compKind[c++] = K_HOST_FRONT;
                eff = c;
                compLayer[c] = j;
                compKind[c++] = K_EFFECTIVE;
                compLayer[c] = j;
                compKind[c++] = K_HOST_BACK;
            } else {
                compLayer[c] = j;
                compKind[c++] = K_PLAIN;
            }
            compOfLayerLast[j] = c - 1;
        }
        effComp = eff;

        // absorbers related to the particles
        int diff = -1;
        int nb = -1;
        boolean nbBehind = false;
        if (hasParticles) {
            if (isAbsorber[host]) {
                diff = host;
            } else {
                // the neighbouring absorber touching the host (the nearer side; behind wins a tie)
                boolean behind = host + 1 < layerCount && isAbsorber[host + 1];
                boolean before = host - 1 >= firstCoherent && isAbsorber[host - 1];
                if (behind) {
                    nb = host + 1;
                    nbBehind = true;
                } else if (before) {
                    nb = host - 1;
                    nbBehind = false;
                }
                if (nb >= 0) {
                    diff = nb;
                } else {
                    int best = Integer.MAX_VALUE;
                    for (int j = firstCoherent; j < layerCount; j++) {
                        if (isAbsorber[j] && Math.abs(j - host) < best) {
                            best = Math.abs(j - host);
                            diff = j;
                        }
                    }
                }
            }
        }
        diffuseAbsorber = diff;
        neighbour = nb;
        neighbourBehind = nbBehind;
        if (hasParticles && !usesTable) {
            NkTable metal = MaterialLibrary.bundled().resolve(particles.metal());
            metalEpsRe = new double[lambda.length];
            metalEpsIm = new double[lambda.length];
            for (int i = 0; i < lambda.length; i++) {
                if (!metal.covers(lambda[i])) {
                    throw new StudyException(prefix(study) + "particles.metal: material " + metal.id()
                            + " is tabulated from " + metal.minWavelength() + " to " + metal.maxWavelength()
                            + " nm; the grid reaches " + lambda[i] + " nm");
                }
                double n = metal.n(lambda[i]);
                double kk = metal.k(lambda[i]);
                metalEpsRe[i] = n * n - kk * kk;
                metalEpsIm[i] = 2 * n * kk;
            }
        } else {
            metalEpsRe = null;
            metalEpsIm = null;
        }
        if (hasParticles) {
            MetalParameters mp = particles.metalParameters();
            pOffset = slot(index, particles.offset());
            pDiameter = required(index, particles.diameter(), "particles.diameter");
            pCv = slot(index, particles.sizeCv());
            pInPlane = slot(index, particles.inPlaneAspect());
            pOutOfPlane = slot(index, particles.outOfPlaneAspect());
            pCoverage = required(index, particles.coverage(), "particles.coverage");
            pForward = slot(index, particles.forwardFraction());
            pPlasma = required(index, mp.plasmaEnergyEv(), "particles.plasma_energy");
            pDamping = required(index, mp.bulkDampingEv(), "particles.bulk_damping");
            pFermi = required(index, mp.fermiVelocity(), "particles.fermi_velocity");
            pSurface = required(index, mp.surfaceScattering(), "particles.surface_scattering");
        } else {
            pOffset = pDiameter = pCv = pInPlane = pOutOfPlane = pCoverage = pForward = -1;
            pPlasma = pDamping = pFermi = pSurface = -1;
        }

        sphereTable = tabulate ? SphereTable.build(this) : null;

        ChargeCollection col = study.collection();
        cDissociation = required(index, col.dissociation(), "collection.dissociation");
        cElectronMuTau = required(index, col.electronMuTau(), "collection.electron_mu_tau");
        cHoleMuTau = required(index, col.holeMuTau(), "collection.hole_mu_tau");
        cBuiltIn = required(index, col.builtInVoltage(), "collection.built_in_voltage");
        cQuenching = slot(index, col.quenchingDistance());
        electronsAtFront = col.electronsAtFront();

        Diode diode = study.diodeModel().orElse(null);
        hasDiode = diode != null;
        if (hasDiode) {
            dJ0 = required(index, diode.saturationCurrent(), "diode.saturation_current");
            dIdeality = required(index, diode.ideality(), "diode.ideality");
            dRs = required(index, diode.seriesResistance(), "diode.series_resistance");
            dRsh = required(index, diode.shuntResistance(), "diode.shunt_resistance");
            dTemperature = required(index, diode.temperature(), "diode.temperature");
        } else {
            dJ0 = dIdeality = dRs = dRsh = dTemperature = -1;
        }

        // outputs
        List<OutputDef> outs = new ArrayList<>();
        outs.add(new OutputDef(JSC, "mA/cm^2", "short-circuit current density collected (Hecht drift and dissociation)"));
        outs.add(new OutputDef(JSC_OPTICAL, "mA/cm^2", "current if every photon absorbed usefully in the absorber gave one electron"));
        outs.add(new OutputDef(ABSORPTANCE, "fraction", "photon-weighted share of the incident photons absorbed in the absorber"));
        outs.add(new OutputDef(LOSS_METAL, "mA/cm^2", "photons absorbed in the metal particles"));
        outs.add(new OutputDef(LOSS_ELECTRODES, "mA/cm^2", "photons absorbed in the electrodes"));
        outs.add(new OutputDef(LOSS_TRANSPORT, "mA/cm^2", "photons absorbed in transport and other non-absorber layers"));
        outs.add(new OutputDef(LOSS_SUBSTRATE, "mA/cm^2", "photons absorbed in the substrate"));
        outs.add(new OutputDef(LOSS_SCATTERING, "mA/cm^2", "scattered light that escapes or dies in the back electrode"));
        outs.add(new OutputDef(LOSS_QUENCHING, "mA/cm^2", "photons absorbed in the absorber within the quenching distance of a particle"));
        outs.add(new OutputDef(LOSS_COLLECTION, "mA/cm^2", "optical current lost to dissociation and charge collection"));
        outs.add(new OutputDef(LOSS_REFLECTION, "mA/cm^2", "photons reflected by the device"));
        outs.add(new OutputDef(LOSS_TRANSMISSION, "mA/cm^2", "photons transmitted through the device"));
        if (study.analysis() != null && study.analysis().planarReference()) {
            outs.add(new OutputDef(JSC_PLANAR, "mA/cm^2", "collected current of the same stack without particles"));
            outs.add(new OutputDef(ENHANCEMENT, "1", "jsc / jsc_planar"));
        }
        if (hasDiode) {
            outs.add(new OutputDef(VOC, "V", "open-circuit voltage (one-diode model)"));
            outs.add(new OutputDef(FF, "fraction", "fill factor (one-diode model)"));
            outs.add(new OutputDef(EFFICIENCY, "fraction", "power conversion efficiency at 100 mW/cm^2"));
        }
        outputs = Collections.unmodifiableList(outs);
        oJsc = indexOf(outs, JSC);
        oJscOptical = indexOf(outs, JSC_OPTICAL);
        oAbsorptance = indexOf(outs, ABSORPTANCE);
        oMetal = indexOf(outs, LOSS_METAL);
        oElectrodes = indexOf(outs, LOSS_ELECTRODES);
        oTransport = indexOf(outs, LOSS_TRANSPORT);
        oSubstrate = indexOf(outs, LOSS_SUBSTRATE);
        oScattering = indexOf(outs, LOSS_SCATTERING);
        oQuenching = indexOf(outs, LOSS_QUENCHING);
        oCollection = indexOf(outs, LOSS_COLLECTION);
        oReflection = indexOf(outs, LOSS_REFLECTION);
        oTransmission = indexOf(outs, LOSS_TRANSMISSION);
        oPlanar = indexOf(outs, JSC_PLANAR);
        oEnhancement = indexOf(outs, ENHANCEMENT);
        oVoc = indexOf(outs, VOC);
        oFf = indexOf(outs, FF);
        oEfficiency = indexOf(outs, EFFICIENCY);
    }

    /**
     * Builds the model of a study and evaluates it once at the nominal point.
     *
     * @throws StudyException when the study cannot be modelled, or its nominal point is outside the
     *                        model's domain (the message names the parameter)
     */
    public static DeviceModel of(Study study) {
        return checked(new DeviceModel(study, true));
    }

    /**
     * The reference model: as {@link #of} but every sample takes the exact particle optics (no
     * {@link SphereTable}); the tests hold the tabulated path to it.
     */
    static DeviceModel exact(Study study) {
        return checked(new DeviceModel(study, false));
    }

    private static DeviceModel checked(DeviceModel m) {
        Study study = m.study;
        DeviceEvaluator e = m.newDeviceEvaluator();
        try {
            e.run(m.nominal.clone(), new double[m.outputs.size()], null);
        } catch (InputException ex) {
            String where = ex.slot >= 0 ? m.paramWhere[ex.slot].prefix() : prefix(study) + "study";
            String msg = ex.getMessage();
            if (ex.slot >= 0 && where.endsWith(": " + m.paramIds[ex.slot]) && msg.startsWith(m.paramIds[ex.slot] + ": ")) {
                // the location already ends with the parameter's key: do not name it twice
                msg = msg.substring(m.paramIds[ex.slot].length() + 2);
            }
            throw new StudyException(where + ": " + msg + " (at the nominal point)", ex);
        } catch (ModelException ex) {
            throw new StudyException(prefix(study) + "study: " + ex.getMessage() + " (at the nominal point)", ex);
        }
        return m;
    }

    @Override
    public List<String> inputIds() {
        return inputIds;
    }

    @Override
    public List<OutputDef> outputs() {
        return outputs;
    }

    @Override
    public Evaluator newEvaluator() {
        DeviceEvaluator e = newDeviceEvaluator();
        return e::evaluate;
    }

    DeviceEvaluator newDeviceEvaluator() {
        return new DeviceEvaluator(this);
    }

    /** The study this model was built from. */
    public Study study() {
        return study;
    }

    /**
     * The particle layer's volume fraction f = n_A⟨V⟩/h at an input vector (model doc 4.3), or NaN
     * without a particle layer. Maxwell Garnett is strained above {@link EffectiveMedium#DENSE_LIMIT}.
     */
    public double particleVolumeFraction(double[] inputs) {
        if (!hasParticles) {
            return Double.NaN;
        }
        double[] v = nominal.clone();
        for (int i = 0; i < inputs.length; i++) {
            v[inputSlot[i]] = inputs[i];
        }
        return ParticleEnsemble.geometry(v[pDiameter], pCv < 0 ? 0 : v[pCv], pInPlane < 0 ? 1 : v[pInPlane],
                pOutOfPlane < 0 ? 1 : v[pOutOfPlane], v[pCoverage]).volumeFraction();
    }

    /**
     * Warnings about the study as the model sees it at the nominal point (empty when none): a dense
     * particle layer mixed by Maxwell Garnett (f above {@link EffectiveMedium#DENSE_LIMIT}; Bruggeman is the
     * alternative rule for dense layers).
     */
    public List<String> warnings() {
        List<String> w = new ArrayList<>();
        if (hasParticles && tableOnGrid == null) {
            double f = particleVolumeFraction(nominalInputs());
            if (EffectiveMedium.isDense(f)
                    && study.particles().mixingRule() == ParticleLayer.MixingRule.MAXWELL_GARNETT) {
                w.add(String.format(Locale.ROOT, "particles: the particle layer's volume fraction is %.3f at the"
                        + " nominal point, above %.1f where Maxwell Garnett is unreliable; consider mixing: bruggeman",
                        f, EffectiveMedium.DENSE_LIMIT));
            }
        }
        return w;
    }

    /** Nominal values of the inputs, in {@link #inputIds()} order. */
    public double[] nominalInputs() {
        double[] x = new double[inputSlot.length];
        for (int i = 0; i < x.length; i++) {
            x[i] = nominal[inputSlot[i]];
        }
        return x;
    }

    /** Evaluates the outputs at one input vector (a convenience; allocates). */
    public double[] evaluate(double[] inputs) {
        double[] out = new double[outputs.size()];
        newEvaluator().evaluate(inputs, out);
        return out;
    }

    /** Per-wavelength optics at the nominal point. */
    public Spectra nominalSpectra() {
        return spectra(nominalInputs());
    }

    /** Per-wavelength optics at an input vector (in {@link #inputIds()} order). */
    public Spectra spectra(double[] inputs) {
        DeviceEvaluator e = newDeviceEvaluator();
        double[] v = e.sampleVector(inputs);
        SpectraRecorder rec = new SpectraRecorder(this);
        e.run(v, new double[outputs.size()], rec);
        return rec.build();
    }

    /** The user's enhancement table when the study gives one (it then replaces the built-in particle optics). */
    public Optional<EnhancementTable> enhancementTable() {
        return usesTable ? Optional.of(tableOnGrid.table()) : Optional.empty();
    }

    /**
     * Number of evaluations through {@link #newEvaluator()} in which the enhancement table's absorption had to
     * be capped at some wavelength so the reflection would not go negative (0 without a table).
     */
    public long enhancementCapSamples() {
        return capSamples.sum();
    }

    /** Number of (evaluation, wavelength) pairs capped as in {@link #enhancementCapSamples()}. */
    public long enhancementCapWavelengths() {
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
     * axes) against wavelength, and the number of particles per nm² of film.
     */
    public record CrossSections(double[] wavelengthNm, double[] extinction, double[] scattering, double[] absorption,
                                double numberPerArea) {
    }

    /**
     * The nominal particle ensemble's cross-sections.
     *
     * @throws StudyException when the study has no particle layer, or an enhancement table replaces the
     *                        particle optics
     */
    public CrossSections particleCrossSections() {
        if (!hasParticles) {
            throw new StudyException(prefix(study) + "particles: the study has no particle layer");
        }
        if (usesTable) {
            throw new StudyException(prefix(study) + "particles.enhancement_table: the particle optics come from "
                    + tableOnGrid.table().source() + "; no cross-sections are computed");
        }
        DeviceEvaluator e = newDeviceEvaluator();
        double[] v = nominal.clone();
        e.prepare(v);
        ParticleStep ps = e.particleStep;
        int n = lambda.length;
        double[] ext = new double[n];
        double[] sca = new double[n];
        double[] abs = new double[n];
        double nA = 0;
        for (int i = 0; i < n; i++) {
            e.particlesAt(i, false);
            nA = ps.numberPerArea();
            ext[i] = ps.extinctionCrossSection();
            sca[i] = ps.scatteringCrossSection();
            abs[i] = ps.absorptionCrossSection();
        }
        return new CrossSections(lambda.clone(), ext, sca, abs, nA);
    }

    // ---- helpers ----

    static String prefix(Study study) {
        return study.file() == null ? "<study>: " : study.file().getFileName() + ": ";
    }

    private static String atKey(SourceLocation where, String key) {
        String f = where.file() == null ? "<study>" : where.file().getFileName().toString();
        return where.line() > 0 ? f + ":" + where.line() + ":" + where.column() + ": " + key : f + ": " + key;
    }

    private static int slot(Map<String, Integer> index, Parameter p) {
        return p == null ? -1 : index.get(p.id());
    }

    private int required(Map<String, Integer> index, Parameter p, String key) {
        if (p == null) {
            throw new StudyException(prefix(study) + key + ": missing");
        }
        return index.get(p.id());
    }

    private static int indexOf(List<OutputDef> outs, String id) {
        for (int i = 0; i < outs.size(); i++) {
            if (outs.get(i).id().equals(id)) {
                return i;
            }
        }
        return -1;
    }

    /** A model exception tied to one parameter slot (so the nominal check can name it). */
    static final class InputException extends ModelException {
        final int slot;

        InputException(String reason, int slot, String message) {
            super(reason, message);
            this.slot = slot;
        }
    }
}
