package org.fabspread.device;

import java.nio.file.Path;
import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;

import org.fabspread.study.AnalysisSettings;
import org.fabspread.study.ChargeCollection;
import org.fabspread.study.Diode;
import org.fabspread.study.DistributionSpec;
import org.fabspread.study.Layer;
import org.fabspread.study.LayerRole;
import org.fabspread.study.MaterialRef;
import org.fabspread.study.MetalParameters;
import org.fabspread.study.Parameter;
import org.fabspread.study.ParticleLayer;
import org.fabspread.study.SourceLocation;
import org.fabspread.study.Study;
import org.fabspread.study.WavelengthGrid;

/**
 * Builds demo-like studies in code: glass 1 mm / ITO 150 / ZnO 30 (particle host) / PTB7:PC71BM 100 /
 * MoO3 10 / Ag 100 nm, grid 320–800 nm step 4, Ag spheres D50 20 nm, CV 0.2, 5 % coverage at the back of
 * the ZnO, inverted cell. Every value can be changed, and any parameter can be given a distribution.
 */
final class DemoStudy {
    final Map<String, DistributionSpec> specs = new LinkedHashMap<>();
    boolean particles = true;
    boolean planarReference = false;
    boolean diode = false;
    boolean aligned = false;
    boolean electronsAtFront = true;
    String host = "etl";
    ParticleLayer.Placement placement = ParticleLayer.Placement.BACK;
    ParticleLayer.MixingRule mixing = ParticleLayer.MixingRule.MAXWELL_GARNETT;
    double gridStep = 4;
    double gridStart = 320;
    double gridStop = 800;
    /** an enhancement table replacing the built-in particle optics, or null. */
    Path enhancementTable;

    DemoStudy() {
        fixed("stack.glass.thickness", 1e6);
        fixed("stack.ito.thickness", 150);
        fixed("stack.etl.thickness", 30);
        fixed("stack.absorber.thickness", 100);
        fixed("stack.htl.thickness", 10);
        fixed("stack.electrode.thickness", 100);
        fixed("particles.offset", 0);
        fixed("particles.diameter", 20);
        fixed("particles.size_cv", 0.2);
        fixed("particles.in_plane_aspect", 1);
        fixed("particles.out_of_plane_aspect", 1);
        fixed("particles.coverage", 0.05);
        fixed("particles.forward_fraction", 0.5);
        // source: Ordal et al., Appl. Opt. 24, 4493 (1985) via device-model.md 4.1 (Ag plasma and damping energies)
        fixed("particles.plasma_energy", 9.01);
        fixed("particles.bulk_damping", 0.018);
        // source: Kittel, Introduction to Solid State Physics, via device-model.md 4.1 (Ag Fermi velocity)
        fixed("particles.fermi_velocity", 1.39e6);
        fixed("particles.surface_scattering", 1);
        fixed("collection.dissociation", 0.95);
        fixed("collection.electron_mu_tau", 1e-8);
        fixed("collection.hole_mu_tau", 1e-8);
        fixed("collection.built_in_voltage", 0.8);
        fixed("collection.quenching_distance", 0);
        fixed("diode.saturation_current", 1e-7);
        fixed("diode.ideality", 1.5);
        fixed("diode.series_resistance", 2);
        fixed("diode.shunt_resistance", 1000);
        fixed("diode.temperature", 298.15);
    }

    DemoStudy fixed(String id, double value) {
        specs.put(id, new DistributionSpec.Fixed(value));
        return this;
    }

    DemoStudy normal(String id, double mean, double sigma) {
        specs.put(id, new DistributionSpec.Normal(mean, sigma));
        return this;
    }

    private Parameter p(String id, String unit) {
        return new Parameter(id, unit, specs.get(id), SourceLocation.unknown(id));
    }

    private Layer layer(String name, String material, boolean incoherent, LayerRole role) {
        String shift = "stack." + name + ".n_shift";
        String scale = "stack." + name + ".k_scale";
        return new Layer(name, MaterialRef.bundled(material), p("stack." + name + ".thickness", "nm"), incoherent, role,
                specs.containsKey(shift) ? p(shift, "1") : null, specs.containsKey(scale) ? p(scale, "1") : null);
    }

    Study build() {
        List<Layer> stack = new ArrayList<>();
        stack.add(layer("glass", "soda-lime-rubin", true, LayerRole.SUBSTRATE));
        stack.add(layer("ito", "ito-konig", false, LayerRole.ELECTRODE));
        stack.add(layer("etl", "zno-stelling", false, LayerRole.ELECTRON_TRANSPORT));
        stack.add(layer("absorber", "ptb7-pc71bm-stelling", false, LayerRole.ABSORBER));
        stack.add(layer("htl", "moo3-stelling", false, LayerRole.HOLE_TRANSPORT));
        stack.add(layer("electrode", "ag-johnson-christy", false, LayerRole.ELECTRODE));
        ParticleLayer pl = null;
        if (particles) {
            MetalParameters mp = new MetalParameters(p("particles.plasma_energy", "eV"), p("particles.bulk_damping", "eV"),
                    p("particles.fermi_velocity", "m/s"), p("particles.surface_scattering", "1"));
            pl = new ParticleLayer(MaterialRef.bundled("ag-johnson-christy"), host, placement, p("particles.offset", "nm"),
                    p("particles.diameter", "nm"), p("particles.size_cv", "1"), p("particles.in_plane_aspect", "1"),
                    p("particles.out_of_plane_aspect", "1"), p("particles.coverage", "fraction"),
                    p("particles.forward_fraction", "fraction"), aligned, mixing, mp, enhancementTable);
        }
        ChargeCollection cc = new ChargeCollection(p("collection.dissociation", "fraction"),
                p("collection.electron_mu_tau", "cm^2/V"), p("collection.hole_mu_tau", "cm^2/V"),
                p("collection.built_in_voltage", "V"), p("collection.quenching_distance", "nm"), electronsAtFront);
        Diode d = diode ? new Diode(p("diode.saturation_current", "mA/cm^2"), p("diode.ideality", "1"),
                p("diode.series_resistance", "ohm cm^2"), p("diode.shunt_resistance", "ohm cm^2"),
                p("diode.temperature", "K")) : null;
        AnalysisSettings as = new AnalysisSettings(1000, 1, AnalysisSettings.Sampler.RANDOM,
                AnalysisSettings.Sensitivity.NONE, 64, 0, AnalysisSettings.FailurePolicy.REJECT, List.of(), Double.NaN,
                0.95, planarReference);
        return new Study(null, "demo", "demo-like stack", new WavelengthGrid(gridStart, gridStop, gridStep), stack, pl,
                cc, d, List.of(), as, null, Map.of(), List.of());
    }
}
