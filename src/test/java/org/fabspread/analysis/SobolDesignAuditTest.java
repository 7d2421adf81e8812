package org.fabspread.analysis;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.HashMap;
import java.util.List;
import java.util.Map;

import org.fabspread.sampling.Engine;
import org.fabspread.sampling.InputSpace;
import org.fabspread.study.DistributionSpec;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

class SobolDesignAuditTest {

    private static final double A = 7;
    private static final double B = 0.1;

    private static InputSpace ishigamiSpace() {
        DistributionSpec u = new DistributionSpec.Uniform(-Math.PI, Math.PI);
        return TestSpaces.Independent.of(u, u, u);
    }

    private static final List<InputGroup> GROUPS = List.of(new InputGroup("x1 and x3", List.of("x1", "x3")),
            new InputGroup("x2 alone", List.of("x2")), new InputGroup("all", List.of("x1", "x2", "x3")));

    @Test
    void indicesRecomputedFromTheExportedDesignAgreeToRounding(@TempDir Path dir) throws IOException {
        TestModels.Ishigami model = new TestModels.Ishigami(A, B);
        InputSpace space = ishigamiSpace();
        SobolIndices.Options o = SobolIndices.Options.random(512, 41).withBootstrap(20).withThreads(2);
        SobolIndices.Run run = SobolIndices.run(Engine.local(2), model, space, o, GROUPS, null);
        Path csv = dir.resolve(DesignCsv.SOBOL_FILE);
        DesignCsv.writeSobol(csv, run.design(), List.of("f", "twice"));
        // a second code path: parse the file and apply the published estimators directly
        // source: Saltelli et al., Comput. Phys. Commun. 181, 259 (2010), first order; Jansen, Comput. Phys.
        // Commun. 117, 35 (1999), total
        Map<String, double[]> fA = new HashMap<>();
        Map<String, double[]> fB = new HashMap<>();
        Map<String, Map<String, double[]>> fAB = new HashMap<>();
        List<String> lines = Files.readAllLines(csv);
        String[] head = lines.get(0).split(",");
        assertEquals("block", head[0]);
        int n = 512;
        for (String out : List.of("f", "twice")) {
            fA.put(out, new double[n]);
            fB.put(out, new double[n]);
            fAB.put(out, new HashMap<>());
        }
        for (String line : lines.subList(1, lines.size())) {
            String[] f = line.split(",", -1);
            int row = Integer.parseInt(f[2]);
            for (int c = 4 + 3; c < f.length; c++) {
                String out = head[c];
                double y = Double.parseDouble(f[c]);
                switch (f[0]) {
                    case "A" -> fA.get(out)[row] = y;
                    case "B" -> fB.get(out)[row] = y;
                    default -> fAB.get(out).computeIfAbsent(f[3], s -> new double[n])[row] = y;
                }
            }
        }
        assertEquals(1 + n * (2 + 3 + GROUPS.size()), lines.size());
        for (String out : List.of("f", "twice")) {
            double[] a = fA.get(out);
            double[] b = fB.get(out);
            double mu = 0;
            for (int j = 0; j < n; j++) {
                mu += a[j] + b[j];
            }
            mu /= 2 * n;
            double v = 0;
            for (int j = 0; j < n; j++) {
                v += (a[j] - mu) * (a[j] - mu) + (b[j] - mu) * (b[j] - mu);
            }
            v /= 2 * n - 1;
            SobolResult.OutputIndices oi = run.result().output(out);
            List<String> cols = new ArrayList<>(List.of("x1", "x2", "x3"));
            GROUPS.forEach(g -> cols.add(g.name()));
            for (int c = 0; c < cols.size(); c++) {
                double[] ab = fAB.get(out).get(cols.get(c));
                double sf = 0;
                double st = 0;
                for (int j = 0; j < n; j++) {
                    sf += (b[j] - mu) * (ab[j] - a[j]);
                    st += (a[j] - ab[j]) * (a[j] - ab[j]);
                }
                double first = sf / n / v;
                double total = st / (2.0 * n) / v;
                double expFirst = c < 3 ? oi.indices().get(c).first() : oi.groups().get(c - 3).first();
                double expTotal = c < 3 ? oi.indices().get(c).total() : oi.groups().get(c - 3).total();
                assertEquals(expFirst, first, 1e-12, out + " " + cols.get(c));
                assertEquals(expTotal, total, 1e-12, out + " " + cols.get(c));
            }
        }
    }

    @Test
    void groupIndicesOfIndependentGroupsAreTheSumsTheyMustBe() {
        // source: Ishigami & Homma (1990) closed form (Saltelli et al., Primer (2008)): V_1, V_2, V_13 are the
        // only nonzero terms, so the group {x1, x3} has closed first order and total (V_1 + V_13)/V = 1 − S_2,
        // the group {x2} has S_2 for both, and the group of all inputs has total index 1 (Sobol 2001)
        double pi4 = Math.pow(Math.PI, 4);
        double v = A * A / 8 + B * pi4 / 5 + B * B * pi4 * pi4 / 18 + 0.5;
        double v1 = Math.pow(1 + B * pi4 / 5, 2) / 2;
        double v2 = A * A / 8;
        double v13 = B * B * pi4 * pi4 * (1.0 / 18 - 1.0 / 50);
        SobolIndices.Options o = SobolIndices.Options.random(4096, 7).withBootstrap(200).withConfidence(0.99);
        SobolResult r = SobolIndices.run(Engine.local(2), new TestModels.Ishigami(A, B), ishigamiSpace(), o, GROUPS,
                null).result();
        List<SobolResult.GroupEstimate> g = r.output("f").groups();
        double[] truth = {(v1 + v13) / v, v2 / v};
        for (int i = 0; i < 2; i++) {
            assertTrue(g.get(i).firstInterval().contains(truth[i]), g.get(i) + " truth " + truth[i]);
            assertTrue(g.get(i).totalInterval().contains(truth[i]), g.get(i) + " truth " + truth[i]);
        }
        assertEquals(1.0, (v1 + v13 + v2) / v, 1e-12);
        assertTrue(g.get(2).totalInterval().contains(1.0), g.get(2).toString());
        assertTrue(g.get(2).firstInterval().contains(1.0), g.get(2).toString());
        // a single-input group equals that input's own indices exactly (same matrix)
        assertEquals(r.output("f").input("x2").first(), g.get(1).first(), 0);
        assertEquals(r.output("f").input("x2").total(), g.get(1).total(), 0);
        assertEquals(SobolIndices.cost(4096, 3, 3), r.modelRuns());
    }

    @Test
    void aCorrelatedPairIsAGroupWhoseIndicesDoNotDependOnTheOrder() {
        // source: Sobol (2001): a set of inputs independent of the rest has well-defined closed indices; the
        // copula's pair (x2, x3) is such a set whatever order the copula factors it in. Linear model
        // y = x1 + 2 x2 + 1.5 x3, standard normals, corr(x2, x3) = 0.6: closed index of {x2, x3} =
        // (4 + 2.25 + 2·2·1.5·0.6) / (1 + that) (linear-Gaussian variance, common practice)
        double inner = 4 + 2.25 + 2 * 2 * 1.5 * 0.6;
        double truth = inner / (1 + inner);
        GaussianCopula copula = new GaussianCopula(TestModels.ids(3), List.of(
                org.fabspread.sampling.Distributions.of(new DistributionSpec.Normal(0, 1)),
                org.fabspread.sampling.Distributions.of(new DistributionSpec.Normal(0, 1)),
                org.fabspread.sampling.Distributions.of(new DistributionSpec.Normal(0, 1))),
                new double[][] {{1, 0, 0}, {0, 1, 0.6}, {0, 0.6, 1}});
        List<InputGroup> auto = InputGroup.correlated(copula);
        assertEquals(List.of(new InputGroup("correlated: x2 + x3", List.of("x2", "x3"))), auto);
        SobolIndices.Options o = SobolIndices.Options.random(4096, 3).withBootstrap(200).withConfidence(0.99);
        InputSpace space = org.fabspread.sampling.StudyInputSpace.of(TestModels.ids(3), copula.marginals(),
                List.of(new org.fabspread.study.Correlation("x2", "x3", 6 / Math.PI * Math.asin(0.3),
                        org.fabspread.study.SourceLocation.unknown("correlations[0]"))));
        SobolResult r = SobolIndices.run(Engine.local(2), new TestModels.Linear(new double[] {1, 2, 1.5}), space, o,
                auto, null).result();
        SobolResult.GroupEstimate g = r.output("y").groups().get(0);
        assertTrue(g.firstInterval().contains(truth), g + " truth " + truth);
        assertTrue(g.totalInterval().contains(truth), g + " truth " + truth);
    }
}
