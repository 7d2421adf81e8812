package org.fabspread.device;

import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;

import org.fabspread.model.OutputDef;
import org.fabspread.optics.LayerOptics;
import org.fabspread.optics.MaterialLibrary;
import org.fabspread.optics.NkTable;
import org.fabspread.optics.SolarSpectrum;
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
 * Compiles a study once into a {@link CompiledDevice}: the parameters into one flat vector, each block's
 * parameters into its slot record ({@link StackSlots}, {@link ParticleSlots}, {@link CollectionSlots},
 * {@link DiodeSlots}), the stack into its {@link StackLayout}, the outputs into {@link OutputSlots}. A study
 * the model cannot represent is a {@link StudyException} naming the key.
 */
final class StudyCompiler {
    private final Study study;
    private final Map<String, Integer> index = new LinkedHashMap<>();

    private StudyCompiler(Study study) {
        this.study = study;
    }

    /**
     * Compiles the study.
     *
     * @param tabulate whether the built-in particle optics may read a {@link SphereTable} (false: always exact)
     */
    static CompiledDevice compile(Study study, boolean tabulate) {
        return new StudyCompiler(study).compile(tabulate);
    }

    private CompiledDevice compile(boolean tabulate) {
        if (study.stack().isEmpty()) {
            throw new StudyException(prefix(study) + "stack: the stack has no layers");
        }
        LayerOptics optics = LayerOptics.of(study);
        double[] lambda = study.grid().wavelengths();
        double[] flux = SolarSpectrum.astmG173Global().photonFluxPerBin(study.grid());
        double totalFlux = 0;
        for (double f : flux) {
            totalFlux += f;
        }
        ParameterVector params = parameters();
        StackSlots stack = stackSlots();
        StackLayout layout = layout(optics, lambda, stack);
        ParticleSetup particles = layout.hasParticles()
                ? particles(params, stack, layout, optics, lambda, tabulate) : null;
        ChargeCollection col = study.collection();
        CollectionSlots collection = new CollectionSlots(required(col.dissociation(), "collection.dissociation"),
                required(col.electronMuTau(), "collection.electron_mu_tau"),
                required(col.holeMuTau(), "collection.hole_mu_tau"),
                required(col.builtInVoltage(), "collection.built_in_voltage"), slot(col.quenchingDistance()),
                col.electronsAtFront());
        Diode d = study.diodeModel().orElse(null);
        DiodeSlots diode = d == null ? null : new DiodeSlots(required(d.saturationCurrent(), "diode.saturation_current"),
                required(d.ideality(), "diode.ideality"), required(d.seriesResistance(), "diode.series_resistance"),
                required(d.shuntResistance(), "diode.shunt_resistance"), required(d.temperature(), "diode.temperature"));
        boolean planarReference = study.analysis() != null && study.analysis().planarReference();
        List<OutputDef> outputs = OutputSlots.definitions(planarReference, diode != null);
        return new CompiledDevice(study, optics, lambda, flux, totalFlux, params, inputIds(params), stack, layout, particles, collection,
                diode, outputs, OutputSlots.of(outputs));
    }

    /** One flat vector in {@link Study#parameters()} order; the uncertain inputs' slots in their order. */
    private ParameterVector parameters() {
        Map<String, Parameter> all = study.parameters();
        int np = all.size();
        String[] ids = new String[np];
        SourceLocation[] where = new SourceLocation[np];
        double[] nominal = new double[np];
        int k = 0;
        for (Parameter p : all.values()) {
            ids[k] = p.id();
            where[k] = p.where();
            nominal[k] = p.nominal();
            index.put(p.id(), k);
            k++;
        }
        List<Parameter> unc = study.uncertainInputs();
        int[] inputSlots = new int[unc.size()];
        for (int i = 0; i < unc.size(); i++) {
            inputSlots[i] = index.get(unc.get(i).id());
        }
        return new ParameterVector(ids, where, nominal, inputSlots);
    }

    private static List<String> inputIds(ParameterVector params) {
        List<String> ids = new ArrayList<>();
        for (int s : params.inputSlots()) {
            ids.add(params.ids()[s]);
        }
        return List.copyOf(ids);
    }

    private StackSlots stackSlots() {
        List<Layer> stack = study.stack();
        int n = stack.size();
        int[] thick = new int[n];
        int[] shift = new int[n];
        int[] scale = new int[n];
        for (int j = 0; j < n; j++) {
            Layer l = stack.get(j);
            thick[j] = slot(l.thickness());
            shift[j] = slot(l.nShift());
            scale[j] = slot(l.kScale());
        }
        return new StackSlots(thick, shift, scale);
    }

    /** The layers' roles, the computational layers and the particles' host, diffuse absorber and neighbour. */
    private StackLayout layout(LayerOptics optics, double[] lambda, StackSlots slots) {
        List<Layer> stack = study.stack();
        int n = stack.size();
        int[] bucket = new int[n];
        boolean[] absorber = new boolean[n];
        double[] minN = new double[n];
        boolean anyAbsorber = false;
        for (int j = 0; j < n; j++) {
            Layer l = stack.get(j);
            if (slots.thickness()[j] < 0) {
                throw new StudyException(prefix(study) + "stack[" + j + "] (" + l.name() + "): the layer has no thickness");
            }
            absorber[j] = l.isAbsorber();
            anyAbsorber |= absorber[j];
            bucket[j] = switch (l.role()) {
                case ABSORBER -> StackLayout.ABSORBER;
                case ELECTRODE -> StackLayout.ELECTRODE;
                case SUBSTRATE -> StackLayout.SUBSTRATE;
                default -> StackLayout.TRANSPORT;
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
        boolean glass = stack.get(0).incoherent();
        int first = glass ? 1 : 0;
        int host = host(first);
        boolean hasParticles = host >= 0;
        // computational layers: the host splits into front part / effective layer / back part, and the layer
        // next to it on the side the placement leaves open into the slice of protruding caps and the rest
        int sliceLayer = -1;
        boolean sliceBehind = false;
        if (hasParticles) {
            ParticleLayer pl = study.particleLayer().orElseThrow();
            sliceBehind = pl.placement() != ParticleLayer.Placement.BACK;
            int sj = sliceBehind ? host + 1 : host - 1;
            sliceLayer = sj >= first && sj < n ? sj : -1;
        }
        int cc = n - first + (hasParticles ? 2 : 0) + (sliceLayer >= 0 ? 1 : 0);
        int slice = -1;
        int[] compLayer = new int[cc];
        int[] compKind = new int[cc];
        int[] compFirst = new int[n];
        int[] compLast = new int[n];
        int c = 0;
        int eff = -1;
        for (int j = 0; j < n; j++) {
            if (j < first) {
                compFirst[j] = -1;
                compLast[j] = -1;
                continue;
            }
            compFirst[j] = c;
            if (j == host) {
                compLayer[c] = j;
                compKind[c++] = StackLayout.KIND_HOST_FRONT;
                eff = c;
                compLayer[c] = j;
                compKind[c++] = StackLayout.KIND_EFFECTIVE;
                compLayer[c] = j;
                compKind[c++] = StackLayout.KIND_HOST_BACK;
            } else if (j == sliceLayer) {
                if (sliceBehind) {
                    slice = c;
                    compLayer[c] = j;
                    compKind[c++] = StackLayout.KIND_SLICE;
                }
                compLayer[c] = j;
                compKind[c++] = StackLayout.KIND_SLICE_REST;
                if (!sliceBehind) {
                    slice = c;
                    compLayer[c] = j;
                    compKind[c++] = StackLayout.KIND_SLICE;
                }
            } else {
                compLayer[c] = j;
                compKind[c++] = StackLayout.KIND_PLAIN;
            }
            compLast[j] = c - 1;
        }
        int[] site = hasParticles ? absorbersNear(host, absorber, first) : new int[] {-1, -1, 0};
        return new StackLayout(n, bucket, absorber, minN, glass, first, cc, compLayer, compKind, compFirst, compLast,
                host, eff, site[0], site[1], site[2] == 1, slice, sliceLayer, sliceBehind);
    }

    /** The particles' host layer (−1 without particles). */
    private int host(int firstCoherent) {
        ParticleLayer particles = study.particleLayer().orElse(null);
        if (particles == null) {
            return -1;
        }
        List<Layer> stack = study.stack();
        int host = -1;
        for (int j = 0; j < stack.size(); j++) {
            if (stack.get(j).name().equals(particles.host())) {
                host = j;
            }
        }
        SourceLocation where = particles.coverage() != null ? particles.coverage().where()
                : SourceLocation.unknown("particles");
        if (host < 0) {
            throw new StudyException(atKey(where, "particles.host") + ": no layer named '" + particles.host() + "'");
        }
        if (host < firstCoherent) {
            throw new StudyException(atKey(where, "particles.host") + ": the particles cannot sit in the incoherent substrate");
        }
        return host;
    }

    /**
     * {diffuse absorber, neighbour, neighbour behind (1) or not (0)}: a host that is an absorber receives the
     * diffuse light itself; otherwise the absorber touching the host (the nearer side; behind wins a tie) is
     * the neighbour the near field reaches and receives the diffuse light, and without one the nearest absorber.
     */
    private static int[] absorbersNear(int host, boolean[] absorber, int firstCoherent) {
        if (absorber[host]) {
            return new int[] {host, -1, 0};
        }
        int n = absorber.length;
        if (host + 1 < n && absorber[host + 1]) {
            return new int[] {host + 1, host + 1, 1};
        }
        if (host - 1 >= firstCoherent && absorber[host - 1]) {
            return new int[] {host - 1, host - 1, 0};
        }
        int diff = -1;
        int best = Integer.MAX_VALUE;
        for (int j = firstCoherent; j < n; j++) {
            if (absorber[j] && Math.abs(j - host) < best) {
                best = Math.abs(j - host);
                diff = j;
            }
        }
        return new int[] {diff, -1, 0};
    }

    private ParticleSetup particles(ParameterVector params, StackSlots stack, StackLayout layout, LayerOptics optics,
                                    double[] lambda, boolean tabulate) {
        ParticleLayer particles = study.particleLayer().orElseThrow();
        EnhancementTable.OnGrid table = null;
        if (particles.enhancementTable() != null) {
            EnhancementTable t = EnhancementTable.read(particles.enhancementTable());
            try {
                table = t.onGrid(lambda);
            } catch (StudyException ex) {
                throw new StudyException(prefix(study) + "particles.enhancement_table: " + ex.getMessage(), ex);
            }
        }
        double[] epsRe = null;
        double[] epsIm = null;
        if (table == null) {
            NkTable metal = MaterialLibrary.bundled().resolve(particles.metal());
            epsRe = new double[lambda.length];
            epsIm = new double[lambda.length];
            for (int i = 0; i < lambda.length; i++) {
                if (!metal.covers(lambda[i])) {
                    throw new StudyException(prefix(study) + "particles.metal: material " + metal.id()
                            + " is tabulated from " + metal.minWavelength() + " to " + metal.maxWavelength()
                            + " nm; the grid reaches " + lambda[i] + " nm");
                }
                double n = metal.n(lambda[i]);
                double k = metal.k(lambda[i]);
                epsRe[i] = n * n - k * k;
                epsIm[i] = 2 * n * k;
            }
        }
        MetalParameters mp = particles.metalParameters();
        ParticleSlots slots = new ParticleSlots(slot(particles.offset()), required(particles.diameter(), "particles.diameter"),
                slot(particles.sizeCv()), slot(particles.inPlaneAspect()), slot(particles.outOfPlaneAspect()),
                required(particles.coverage(), "particles.coverage"), slot(particles.forwardFraction()),
                required(mp.plasmaEnergyEv(), "particles.plasma_energy"),
                required(mp.bulkDampingEv(), "particles.bulk_damping"),
                required(mp.fermiVelocity(), "particles.fermi_velocity"),
                required(mp.surfaceScattering(), "particles.surface_scattering"), shapeSlots(particles));
        int h = layout.host();
        var sphere = tabulate && table == null
                ? SphereTable.build(study, params, slots, stack.nShift()[h], stack.kScale()[h], h, optics, lambda, epsRe, epsIm)
                : null;
        // the particle physics of the study: a named shape's discrete-dipole table, else the quasi-static ensemble
        ParticleOptics.Maker maker = EnsembleOptics.MAKER;
        ShapeTables.Built shapeTable = null;
        if (table == null && particles.shape() != null) {
            shapeTable = ShapeTables.build(study, params, slots, stack, h, optics, lambda, epsRe, epsIm);
            maker = TabulatedOptics.maker(shapeTable);
            sphere = null;
        }
        return new ParticleSetup(particles, slots, epsRe, epsIm, sphere, table, maker, shapeTable);
    }

    // ---- helpers ----

    private int[] shapeSlots(ParticleLayer particles) {
        if (particles.shape() == null) {
            return new int[0];
        }
        return particles.shape().parameters().values().stream().mapToInt(this::slot).toArray();
    }

    /** "file: " (or "&lt;study&gt;: ") before a message about the study. */
    static String prefix(Study study) {
        return study.file() == null ? "<study>: " : study.file().getFileName() + ": ";
    }

    private static String atKey(SourceLocation where, String key) {
        String f = where.file() == null ? "<study>" : where.file().getFileName().toString();
        return where.line() > 0 ? f + ":" + where.line() + ":" + where.column() + ": " + key : f + ": " + key;
    }

    private int slot(Parameter p) {
        return p == null ? ParameterVector.NONE : index.get(p.id());
    }

    private int required(Parameter p, String key) {
        if (p == null) {
            throw new StudyException(prefix(study) + key + ": missing");
        }
        return index.get(p.id());
    }
}
