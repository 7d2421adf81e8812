package org.fabspread.analysis;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.file.Path;
import java.util.List;
import java.util.Map;

import org.apache.commons.math3.distribution.NormalDistribution;
import org.fabspread.sampling.Distributions;
import org.fabspread.sampling.InputSpace;
import org.fabspread.sampling.SampleTable;
import org.fabspread.study.AnalysisSettings;
import org.fabspread.study.ChargeCollection;
import org.fabspread.study.DistributionSpec;
import org.fabspread.study.Layer;
import org.fabspread.study.LayerRole;
import org.fabspread.study.MaterialRef;
import org.fabspread.study.Parameter;
import org.fabspread.study.SourceLocation;
import org.fabspread.study.Study;
import org.fabspread.study.StudyException;
import org.fabspread.study.Target;
import org.junit.jupiter.api.Test;

/** The study-level entry points: what-ifs, ranking and allocation read from a Study record. */
class StudyAnalysisTest {

    private static final DistributionSpec ETL = new DistributionSpec.Normal(30, 2);
    private static final DistributionSpec ABS = new DistributionSpec.Normal(100, 5);

    private static Parameter p(String id, DistributionSpec d) {
        return new Parameter(id, "nm", d, SourceLocation.unknown(id));
    }

    private static Study study(List<AnalysisSettings.WhatIf> whatIfs) {
        Layer etl = new Layer("etl", MaterialRef.bundled("zno"), p("stack.etl.thickness", ETL), false,
                LayerRole.ELECTRON_TRANSPORT, null, null);
        Layer abs = new Layer("absorber", MaterialRef.bundled("p3ht-pcbm"), p("stack.absorber.thickness", ABS), false,
                LayerRole.ABSORBER, null, null);
        ChargeCollection cc = new ChargeCollection(Parameter.fixed("collection.dissociation", "1", 0.9),
                Parameter.fixed("collection.electron_mu_tau", "cm^2/V", 1e-8),
                Parameter.fixed("collection.hole_mu_tau", "cm^2/V", 1e-8),
                Parameter.fixed("collection.built_in_voltage", "V", 0.6),
                Parameter.fixed("collection.quenching_distance", "nm", 5), true);
        AnalysisSettings a = new AnalysisSettings(4000, 1, AnalysisSettings.Sampler.RANDOM,
                AnalysisSettings.Sensitivity.SCREENING, 1024, 200, AnalysisSettings.FailurePolicy.REJECT, whatIfs,
                0.8, 0.95, false);
        List<Target> targets = List.of(new Target("y", true, 125, "mA/cm^2", SourceLocation.unknown("targets[0]")));
        return new Study(Path.of("study.yaml"), "t", "", null, List.of(etl, abs), null, cc, null, targets, a, null,
                Map.of("stack.absorber.thickness", 4.0), List.of());
    }

    private static InputSpace space() {
        return new TestSpaces.Independent(List.of("stack.etl.thickness", "stack.absorber.thickness"),
                List.of(Distributions.of(ETL), Distributions.of(ABS)));
    }

    @Test
    void whatIfsRankingAndAllocationFromAStudy() {
        AnalysisSettings.WhatIf halve = new AnalysisSettings.WhatIf("stack.absorber.thickness",
                AnalysisSettings.WhatIf.Kind.SCALE_SIGMA, 0.5, SourceLocation.unknown("analysis.what_if[0]"));
        Study s = study(List.of(halve));
        // y = etl + absorber: mean 130, var 4 + 25
        SampleTable table = TestSpaces.monteCarlo(new TestModels.Linear(new double[] {1, 1}), space(), 20000, 12);
        List<WhatIfResult> w = WhatIf.evaluateAll(table, space(), s, WhatIf.Options.defaults().withConfidence(0.99));
        assertEquals(1, w.size());
        // source: statistics-and-doe.md: linear-Gaussian yield Φ((μ_y − t)/σ_y)
        double truth = new NormalDistribution(0, 1).cumulativeProbability(5 / Math.sqrt(4 + 6.25));
        assertTrue(w.get(0).allTargets().afterLow() <= truth && truth <= w.get(0).allTargets().afterHigh());

        ToleranceRanking r = ToleranceAdvisor.rank(table, space(), s, WhatIf.Options.defaults());
        assertEquals("stack.absorber.thickness", r.entries().get(0).input());
        ToleranceAllocation a = ToleranceAdvisor.allocate(table, space(), s, WhatIf.Options.defaults());
        assertEquals(0.8, a.goal(), 0);
        assertEquals(4.0, a.choice("stack.absorber.thickness").costOfHalving(), 0);
        assertEquals(1.0, a.choice("stack.etl.thickness").costOfHalving(), 0);
    }

    @Test
    void aWhatIfOnAnUnknownInputNamesWhereItWasWritten() {
        AnalysisSettings.WhatIf bad = new AnalysisSettings.WhatIf("stack.htl.thickness",
                AnalysisSettings.WhatIf.Kind.SCALE_SIGMA, 0.5,
                new SourceLocation(Path.of("study.yaml"), 33, 7, "analysis.what_if[1].input"));
        SampleTable table = TestSpaces.monteCarlo(new TestModels.Linear(new double[] {1, 1}), space(), 100, 1);
        StudyException e = assertThrows(StudyException.class,
                () -> WhatIf.evaluateAll(table, space(), study(List.of(bad)), WhatIf.Options.defaults()));
        assertTrue(e.getMessage().startsWith("study.yaml:33:7: analysis.what_if[1].input: what-if names"),
                e.getMessage());
    }
}
