package org.fabspread.optics;

import java.util.ArrayList;
import java.util.List;
import java.util.Map;

import org.fabspread.study.AnalysisSettings;
import org.fabspread.study.ChargeCollection;
import org.fabspread.study.Layer;
import org.fabspread.study.LayerRole;
import org.fabspread.study.MaterialRef;
import org.fabspread.study.Parameter;
import org.fabspread.study.PlanSettings;
import org.fabspread.study.Study;
import org.fabspread.study.WavelengthGrid;

/** Studies built in code for the optics tests. */
final class TestStudies {

    private TestStudies() {
    }

    /** One layer spec: name, bundled material, thickness nm, incoherent, role. */
    record L(String name, String material, double thicknessNm, boolean incoherent, LayerRole role) {
    }

    static Layer layer(L l) {
        return new Layer(l.name(), MaterialRef.bundled(l.material()),
                Parameter.fixed("stack." + l.name() + ".thickness", "nm", l.thicknessNm()), l.incoherent(), l.role(),
                Parameter.fixed("stack." + l.name() + ".n_shift", "1", 0.0),
                Parameter.fixed("stack." + l.name() + ".k_scale", "1", 1.0));
    }

    static Study study(WavelengthGrid grid, L... layers) {
        List<Layer> stack = new ArrayList<>();
        for (L l : layers) {
            stack.add(layer(l));
        }
        ChargeCollection cc = new ChargeCollection(
                Parameter.fixed("collection.dissociation", "1", 0.95),
                Parameter.fixed("collection.electron_mu_tau", "cm^2/V", 1e-8),
                Parameter.fixed("collection.hole_mu_tau", "cm^2/V", 1e-8),
                Parameter.fixed("collection.built_in_voltage", "V", 0.7),
                Parameter.fixed("collection.quenching_distance", "nm", 0.0), true);
        AnalysisSettings as = new AnalysisSettings(1000, 1, AnalysisSettings.Sampler.SOBOL,
                AnalysisSettings.Sensitivity.NONE, 256, 200, AnalysisSettings.FailurePolicy.REJECT, List.of(),
                Double.NaN, 0.95, false);
        PlanSettings ps = new PlanSettings(List.of(), 0, 2.0, List.of(), PlanSettings.Kind.AUTO, 0, 0, 1, 0,
                Double.NaN, "jsc", 0.05, 0.8, 1);
        return new Study(null, "test", "built in code", grid, stack, null, cc, null, List.of(), as, ps, Map.of(),
                List.of());
    }

    /** Glass 1 mm (incoherent) / ITO 150 / ZnO 30 / PTB7:PC71BM 100 / MoO3 10 / Ag 100 nm, 320–800 nm step 4. */
    static Study sixLayer() {
        return sixLayer(new WavelengthGrid(320, 800, 4));
    }

    static Study sixLayer(WavelengthGrid grid) {
        return study(grid,
                new L("glass", "soda-lime-rubin", 1e6, true, LayerRole.SUBSTRATE),
                new L("ito", "ito-konig", 150, false, LayerRole.ELECTRODE),
                new L("etl", "zno-stelling", 30, false, LayerRole.ELECTRON_TRANSPORT),
                new L("absorber", "ptb7-pc71bm-stelling", 100, false, LayerRole.ABSORBER),
                new L("htl", "moo3-stelling", 10, false, LayerRole.HOLE_TRANSPORT),
                new L("back", "ag-johnson-christy", 100, false, LayerRole.ELECTRODE));
    }
}
