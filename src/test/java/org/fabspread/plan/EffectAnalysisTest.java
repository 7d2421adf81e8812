package org.fabspread.plan;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertNotNull;
import static org.junit.jupiter.api.Assertions.assertNull;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.List;
import java.util.Map;

import org.apache.commons.math3.distribution.NormalDistribution;
import org.apache.commons.rng.UniformRandomProvider;
import org.apache.commons.rng.sampling.distribution.ZigguratSampler;
import org.apache.commons.rng.simple.RandomSource;
import org.junit.jupiter.api.Test;

class EffectAnalysisTest {

    @Test
    void lenthMultipliersMatchThePublishedTable() {
        // source: Lenth, Technometrics 31, 469 (1989), table of ME/SME multipliers (as listed in
        // statistics-and-doe.md): m = 7: 3.764/9.008, m = 15: 2.571/5.219, m = 31: 2.218/4.218
        double[][] expected = {{7, 3.764, 9.008}, {15, 2.571, 5.219}, {31, 2.218, 4.218}};
        for (double[] e : expected) {
            double[] mult = Lenth.multipliers((int) e[0]);
            assertEquals(e[1], mult[0], 6e-4, "ME m = " + e[0]);
            assertEquals(e[2], mult[1], 6e-4, "SME m = " + e[0]);
        }
    }

    @Test
    void lenthPseudoStandardErrorOfAConstructedCase() {
        // derived by hand from Lenth's definition (Technometrics 31, 469 (1989)):
        // |c| sorted 0.5 1 1 1.5 2 8 10 -> median 1.5, s0 = 2.25; keep |c| < 5.625 -> 0.5 1 1 1.5 2,
        // median 1 -> PSE = 1.5; ME = 1.5 t_{0.975, 7/3}, SME = 1.5 t_{gamma, 7/3}
        Lenth l = Lenth.of(new double[]{10, -8, 1, -1, 2, 0.5, -1.5});
        assertEquals(2.25, l.s0(), 1e-12);
        assertEquals(1.5, l.pse(), 1e-12);
        assertEquals(7 / 3.0, l.dof(), 1e-12);
        double[] mult = Lenth.multipliers(7);
        assertEquals(1.5 * mult[0], l.me(), 1e-12);
        assertEquals(1.5 * mult[1], l.sme(), 1e-12);
    }

    /** Coded runs of a design in standard order, replicated r times. */
    private static double[][] coded(TwoLevelDesign d, int r) {
        int[][] m = d.matrix();
        double[][] x = new double[m.length * r][d.factors()];
        for (int q = 0; q < r; q++) {
            for (int i = 0; i < m.length; i++) {
                for (int j = 0; j < d.factors(); j++) {
                    x[q * m.length + i][j] = m[i][j];
                }
            }
        }
        return x;
    }

    @Test
    void unreplicatedFractionRecoversKnownEffectsAndFlagsThemWithLenth() {
        // common practice: for y = 10 + 3A - 2B + 1.5AB (+ tiny noise) in a 2^(5-1) the contrasts equal
        // twice the coefficients and only A, B, AB exceed Lenth's margin of error
        TwoLevelDesign d = MinimumAberrationCatalog.design(5, 16);
        double[][] x = coded(d, 1);
        UniformRandomProvider rng = RandomSource.XO_RO_SHI_RO_128_PP.create(7L);
        ZigguratSampler.NormalizedGaussian g = ZigguratSampler.NormalizedGaussian.of(rng);
        double[] y = new double[x.length];
        for (int r = 0; r < x.length; r++) {
            y[r] = 10 + 1.5 * x[r][0] - 1.0 * x[r][1] + 0.75 * x[r][0] * x[r][1] + 0.05 * g.sample();
        }
        List<String> ids = List.of("a", "b", "c", "d", "e");
        EffectAnalysis.Result res = EffectAnalysis.analyse(x, y, ids, Map.of("A", 3.0), 0.05);
        assertEquals(15, res.effects().size());
        assertNotNull(res.lenth());
        assertEquals(15, res.lenth().m());
        for (EffectAnalysis.Estimate e : res.effects()) {
            switch (e.label()) {
                case "A" -> {
                    assertEquals(3.0, e.estimate(), 0.1);
                    assertEquals(3.0, e.predicted());
                    assertTrue(e.active());
                }
                case "B" -> {
                    assertEquals(-2.0, e.estimate(), 0.1);
                    assertTrue(e.active());
                }
                case "AB" -> {
                    assertEquals(1.5, e.estimate(), 0.1);
                    assertTrue(e.active());
                }
                // inert effects stay inside the simultaneous margin (95 % for all 15 together)
                default -> assertTrue(Math.abs(e.estimate()) < res.lenth().sme(), e.label() + " " + e.estimate());
            }
        }
        // half-normal quantiles: Phi^-1(0.5 + 0.5 (i - 0.5)/m), ascending |effect|
        List<EffectAnalysis.HalfNormalPoint> hn = res.halfNormal();
        NormalDistribution n = new NormalDistribution(null, 0, 1);
        assertEquals(n.inverseCumulativeProbability(0.5 + 0.5 * 0.5 / 15), hn.get(0).quantile(), 1e-12);
        assertEquals(3.0, hn.get(14).absEffect(), 0.1);
    }

    @Test
    void replicatedPlanGivesAnAnovaAgainstPureError() {
        // common practice: with 2 replicates of a 2^3 the pure error has 8 df and F = SS/MS_PE,
        // SS = N effect^2 / 4
        TwoLevelDesign d = TwoLevelDesign.full(3);
        double[][] x = coded(d, 2);
        UniformRandomProvider rng = RandomSource.XO_RO_SHI_RO_128_PP.create(11L);
        ZigguratSampler.NormalizedGaussian g = ZigguratSampler.NormalizedGaussian.of(rng);
        double[] y = new double[x.length];
        for (int r = 0; r < x.length; r++) {
            y[r] = 5 + 2 * x[r][2] + 0.2 * g.sample();
        }
        EffectAnalysis.Result res = EffectAnalysis.analyse(x, y, List.of("p", "q", "s"), Map.of(), 0.05);
        assertEquals(8, res.pureErrorDof());
        assertNull(res.lenth());
        EffectAnalysis.Estimate c = res.effects().stream().filter(e -> e.label().equals("C")).findFirst().orElseThrow();
        assertEquals(4, c.estimate(), 0.3);
        assertTrue(c.pValue() < 1e-6);
        EffectAnalysis.AnovaRow pe = res.anova().get(res.anova().size() - 1);
        assertEquals("pure error", pe.source());
        assertEquals(16 * c.estimate() * c.estimate() / 4 / pe.meanSquare(), c.statistic(), 1e-9);
        long activeOthers = res.effects().stream().filter(e -> !e.label().equals("C") && e.active()).count();
        assertTrue(activeOthers <= 1);
    }

    @Test
    void plackettBurmanAnalysisUsesTheUnusedColumnsAsError() {
        // source: Plackett & Burman (1946): the N - 1 columns are orthogonal; unused ones estimate error
        CodedDesign pb = CodedDesign.plackettBurman(6, 12);
        double[][] x = pb.points();
        double[] y = new double[x.length];
        for (int r = 0; r < x.length; r++) {
            y[r] = 1 + 0.8 * x[r][0] - 0.5 * x[r][3] + 0.01 * ((r * 7) % 5 - 2);
        }
        EffectAnalysis.Result res = EffectAnalysis.analyse(x, y, List.of("a", "b", "c", "d", "e", "f"), Map.of(), 0.05);
        assertEquals(11, res.effects().size());
        assertEquals(1.6, res.effects().get(0).estimate(), 0.05);
        assertEquals(-1.0, res.effects().get(3).estimate(), 0.05);
        assertTrue(res.effects().get(0).active());
        assertTrue(res.effects().get(10).label().startsWith("e"));
    }

    @Test
    void secondOrderRegressionForACentralCompositePlan() {
        // common practice: a quadratic response is recovered exactly by the second-order fit of a CCD
        CodedDesign ccd = CodedDesign.centralComposite(2, ResponseSurfaceDesigns.Axial.ROTATABLE);
        Plan plan = Plan.build(ccd, List.of(new Factor("a", "nm", 0, 1, -1, 1, "t"), new Factor("b", "nm", 0, 1, -1, 1, "t")),
                1, 3, 1, 5);
        double[][] x = plan.runs().stream().map(Run::coded).toArray(double[][]::new);
        double[] y = new double[x.length];
        for (int r = 0; r < x.length; r++) {
            y[r] = 2 + x[r][0] - 0.5 * x[r][1] * x[r][1] + 0.25 * x[r][0] * x[r][1] + 0.001 * (r % 3 - 1);
        }
        EffectAnalysis.Result res = EffectAnalysis.analyse(x, y, List.of("a", "b"), Map.of(), 0.05);
        assertTrue(res.method().startsWith("second-order"));
        Map<String, Double> byLabel = new java.util.HashMap<>();
        res.effects().forEach(e -> byLabel.put(e.label(), e.estimate()));
        assertEquals(2.0, byLabel.get("A"), 0.01);
        assertEquals(0.5, byLabel.get("AB"), 0.01);
        assertEquals(-0.5, byLabel.get("B^2"), 0.01);
    }
}
