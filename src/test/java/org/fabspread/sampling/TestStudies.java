package org.fabspread.sampling;

import java.util.ArrayList;
import java.util.List;
import java.util.Map;

import org.fabspread.study.AnalysisSettings;
import org.fabspread.study.ChargeCollection;
import org.fabspread.study.Correlation;
import org.fabspread.study.DistributionSpec;
import org.fabspread.study.Layer;
import org.fabspread.study.LayerRole;
import org.fabspread.study.MaterialRef;
import org.fabspread.study.Parameter;
import org.fabspread.study.SourceLocation;
import org.fabspread.study.Study;
import org.fabspread.study.Target;
import org.fabspread.study.WavelengthGrid;

/** Studies built in code whose uncertain inputs are exactly the given parameters, in order. */
final class TestStudies {

    private TestStudies() {
    }

    static Parameter input(String id, DistributionSpec spec) {
        return new Parameter(id, "1", spec, SourceLocation.unknown(id));
    }

    static Target atLeast(String output, double value) {
        return new Target(output, true, value, "1", SourceLocation.unknown("targets." + output));
    }

    static Target atMost(String output, double value) {
        return new Target(output, false, value, "1", SourceLocation.unknown("targets." + output));
    }

    static Correlation spearman(String a, String b, double rho) {
        return new Correlation(a, b, rho, SourceLocation.unknown("correlations"));
    }

    static AnalysisSettings settings(long samples, long seed, AnalysisSettings.Sampler sampler,
                                     AnalysisSettings.FailurePolicy policy) {
        return new AnalysisSettings(samples, seed, sampler, AnalysisSettings.Sensitivity.NONE, 64, 0, policy,
                List.of(), Double.NaN, 0.95, false);
    }

    static Study study(String name, List<Parameter> inputs, List<Target> targets, List<Correlation> corr,
                       AnalysisSettings settings) {
        List<Layer> stack = new ArrayList<>();
        for (Parameter p : inputs) {
            stack.add(new Layer("l" + stack.size(), MaterialRef.bundled("test"), p, false, LayerRole.OTHER, null, null));
        }
        ChargeCollection cc = new ChargeCollection(Parameter.fixed("collection.dissociation", "1", 1),
                Parameter.fixed("collection.electron_mu_tau", "cm^2/V", 1e-8),
                Parameter.fixed("collection.hole_mu_tau", "cm^2/V", 1e-8),
                Parameter.fixed("collection.built_in_voltage", "V", 0.8),
                Parameter.fixed("collection.quenching_distance", "nm", 0), false);
        return new Study(null, name, "test study", new WavelengthGrid(400, 800, 10), stack, null, cc, null, targets,
                settings, null, Map.of(), corr);
    }
}
