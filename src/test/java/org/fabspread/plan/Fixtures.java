package org.fabspread.plan;

import java.util.ArrayList;
import java.util.List;
import java.util.Map;

import org.fabspread.model.Evaluator;
import org.fabspread.model.Model;
import org.fabspread.model.OutputDef;
import org.fabspread.sampling.Distribution;
import org.fabspread.sampling.Distributions;
import org.fabspread.sampling.InputSpace;
import org.fabspread.study.ChargeCollection;
import org.fabspread.study.DistributionSpec;
import org.fabspread.study.Layer;
import org.fabspread.study.LayerRole;
import org.fabspread.study.MaterialRef;
import org.fabspread.study.Parameter;
import org.fabspread.study.PlanSettings;
import org.fabspread.study.SourceLocation;
import org.fabspread.study.Study;
import org.fabspread.study.WavelengthGrid;

/** A study built in code, an independent input space over it, and a closed-form model of its inputs. */
final class Fixtures {

    private Fixtures() {
    }

    static Parameter normal(String id, String unit, double mean, double sd) {
        return new Parameter(id, unit, new DistributionSpec.Normal(mean, sd), SourceLocation.unknown(id));
    }

    static Study study(PlanSettings plan) {
        Layer etl = new Layer("etl", MaterialRef.bundled("zno"), normal("stack.etl.thickness", "nm", 40, 2), false,
                LayerRole.ELECTRON_TRANSPORT, null, null);
        Layer abs = new Layer("absorber", MaterialRef.bundled("p3ht-pcbm"), normal("stack.absorber.thickness", "nm", 100, 4),
                false, LayerRole.ABSORBER, null, normal("stack.absorber.k_scale", "1", 1, 0.05));
        ChargeCollection cc = new ChargeCollection(normal("collection.dissociation", "1", 0.9, 0.02),
                Parameter.fixed("collection.electron_mu_tau", "cm^2/V", 1e-8),
                Parameter.fixed("collection.hole_mu_tau", "cm^2/V", 1e-8),
                normal("collection.built_in_voltage", "V", 0.8, 0.02),
                normal("collection.quenching_distance", "nm", 5, 1), false);
        return new Study(null, "test cell", "", new WavelengthGrid(400, 800, 10), List.of(etl, abs), null, cc, null,
                List.of(), null, plan, Map.of(), List.of());
    }

    static PlanSettings settings(List<String> factors, int maxRuns, PlanSettings.Kind kind, int resolution,
                                 int centre, int blocks, int replicates, double effect) {
        return new PlanSettings(factors, maxRuns, 2.0, List.of(), kind, resolution, centre, blocks, replicates, effect,
                "jsc", 0.05, 0.8, 42L);
    }

    /** Independent marginals of the study's uncertain inputs, in study order. */
    static final class Space implements InputSpace {
        private final List<String> ids = new ArrayList<>();
        private final List<Distribution> marginals = new ArrayList<>();

        Space(Study s) {
            for (Parameter p : s.uncertainInputs()) {
                ids.add(p.id());
                marginals.add(Distributions.of(p.distribution()));
            }
        }

        @Override public List<String> ids() { return ids; }
        @Override public List<Distribution> marginals() { return marginals; }
        @Override public boolean correlated() { return false; }
        @Override public void map(double[] u, double[] x) {
            for (int i = 0; i < u.length; i++) {
                x[i] = marginals.get(i).inverseCdf(u[i]);
            }
        }
    }

    /**
     * jsc = η [10 + 0.05 (t_a − 100) − 0.03 (t_e − 40) − 0.4 (q − 5) + 0.01 (t_a − 100)(q − 5)]
     *       + 3 (k − 1)(t_a/100)² + 0.5 (V − 0.8); voc = V − 0.1.
     */
    static final class ClosedForm implements Model {
        private final List<String> ids;
        private final int te;
        private final int ta;
        private final int k;
        private final int eta;
        private final int v;
        private final int q;

        ClosedForm(List<String> ids) {
            this.ids = List.copyOf(ids);
            te = ids.indexOf("stack.etl.thickness");
            ta = ids.indexOf("stack.absorber.thickness");
            k = ids.indexOf("stack.absorber.k_scale");
            eta = ids.indexOf("collection.dissociation");
            v = ids.indexOf("collection.built_in_voltage");
            q = ids.indexOf("collection.quenching_distance");
        }

        @Override public List<String> inputIds() { return ids; }

        @Override public List<OutputDef> outputs() {
            return List.of(new OutputDef("jsc", "mA/cm^2", "short-circuit current"), new OutputDef("voc", "V", "open circuit"));
        }

        @Override public Evaluator newEvaluator() {
            return (x, y) -> {
                double a = x[ta] - 100;
                double qq = x[q] - 5;
                y[0] = x[eta] * (10 + 0.05 * a - 0.03 * (x[te] - 40) - 0.4 * qq + 0.01 * a * qq)
                        + 3 * (x[k] - 1) * (x[ta] / 100) * (x[ta] / 100) + 0.5 * (x[v] - 0.8);
                y[1] = x[v] - 0.1;
            };
        }
    }

    static List<RankedInput> ranking() {
        return List.of(new RankedInput("collection.built_in_voltage", 0.001),
                new RankedInput("stack.absorber.thickness", 0.50),
                new RankedInput("collection.quenching_distance", 0.25),
                new RankedInput("stack.etl.thickness", 0.12),
                new RankedInput("stack.absorber.k_scale", 0.07),
                new RankedInput("collection.dissociation", 0.05));
    }
}
