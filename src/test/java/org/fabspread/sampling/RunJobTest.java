package org.fabspread.sampling;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertNull;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.nio.file.StandardOpenOption;
import java.util.ArrayList;
import java.util.List;
import java.util.Map;

import org.apache.commons.math3.stat.descriptive.DescriptiveStatistics;
import org.apache.commons.math3.stat.descriptive.rank.Percentile;
import org.fabspread.study.AnalysisSettings.FailurePolicy;
import org.fabspread.study.AnalysisSettings.Sampler;
import org.fabspread.study.DistributionSpec;
import org.fabspread.study.Study;
import org.fabspread.study.StudyException;
import org.fabspread.study.Target;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

class RunJobTest {

    @TempDir
    Path tmp;

    static final double[] C = {1.0, -2.0, 0.5};

    static Study linearStudy(long n, Sampler sampler, FailurePolicy policy, List<Target> targets) {
        return TestStudies.study("linear", List.of(
                        TestStudies.input("x0", new DistributionSpec.Normal(10, 1)),
                        TestStudies.input("x1", new DistributionSpec.Normal(3, 0.5)),
                        TestStudies.input("x2", new DistributionSpec.Normal(-4, 2))),
                targets, List.of(), TestStudies.settings(n, 2024, sampler, policy));
    }

    static TestModels.Linear linear(double floor, double nanAbove) {
        return new TestModels.Linear(List.of("x0", "x1", "x2"), C, floor, nanAbove);
    }

    static RunJob.Options opts(int threads) {
        return RunJob.Options.defaults().withThreads(threads).withChunkSize(256);
    }

    @Test
    void linearGaussianMomentsAndYieldAreExact() throws IOException {
        double t = 1.0;
        Study s = linearStudy(40_000, Sampler.RANDOM, FailurePolicy.REJECT,
                List.of(TestStudies.atLeast("y", t), TestStudies.atMost("z", 25)));
        RunJob.Result r = new RunJob(s, linear(Double.NEGATIVE_INFINITY, Double.POSITIVE_INFINITY), opts(2), tmp).run();
        assertTrue(r.completed());
        RunSummary sum = r.summary();
        // closed form: y = Σ c_i x_i with independent normals is normal, mean Σ c_i μ_i, variance Σ c_i² σ_i²
        double mu = 10 - 6 - 2;
        double sd = Math.sqrt(1 + 4 * 0.25 + 0.25 * 4);
        RunSummary.OutputStats y = sum.outputs().get(0);
        assertEquals(mu, y.mean(), 4 * sd / Math.sqrt(40_000));
        assertEquals(sd, y.sd(), 4 * sd / Math.sqrt(2 * 40_000));
        // source: statistics-and-doe reference, "Yield against a target": a linear-Gaussian model has
        // yield Φ((μ_y − t)/σ_y) exactly; it must fall inside the Wilson interval (up to 3σ of it)
        double exact = StandardNormal.cdf((mu - t) / sd);
        RunSummary.YieldStats yy = sum.yields().get(0);
        assertTrue(Math.abs(yy.yield() - exact) < 3 * Math.sqrt(exact * (1 - exact) / 40_000),
                yy.yield() + " vs " + exact);
        assertTrue(yy.lower() < yy.yield() && yy.yield() < yy.upper());
        // P(y ≥ 1 and y² ≤ 25) = P(1 ≤ y ≤ 5)
        double both = StandardNormal.cdf((5 - mu) / sd) - StandardNormal.cdf((1 - mu) / sd);
        assertEquals(both, sum.allTargets().yield(), 3 * Math.sqrt(both * (1 - both) / 40_000));

        // the streaming statistics equal Commons Math on the same samples
        DescriptiveStatistics ref = new DescriptiveStatistics(r.table().output("y"));
        assertEquals(ref.getMean(), y.mean(), 1e-12 * Math.abs(ref.getMean()));
        assertEquals(ref.getStandardDeviation(), y.sd(), 1e-11);
        assertEquals(ref.getSkewness(), y.skewness(), 1e-9);
        assertEquals(ref.getMin(), y.min(), 0.0);
        assertEquals(ref.getMax(), y.max(), 0.0);
        assertEquals(y.sd() / Math.sqrt(40_000), y.standardError(), 1e-15);
        Percentile r7 = new Percentile().withEstimationType(Percentile.EstimationType.R_7);
        for (RunSummary.QuantileStats q : y.quantiles()) {
            // source: Hyndman & Fan, Am. Stat. 50, 361 (1996), definition 7 (Commons Math R_7)
            assertEquals(r7.evaluate(r.table().output("y"), q.p() * 100), q.value(), 1e-12);
            assertTrue(q.lower() <= q.value() && q.value() <= q.upper());
            double zq = mu + sd * StandardNormal.quantile(q.p());
            assertTrue(Math.abs(q.value() - zq) < 0.1, "quantile " + q.p());
        }
        assertTrue(Files.exists(tmp.resolve("samples.csv")) && Files.exists(tmp.resolve("summary.json")));
        assertFalse(Files.exists(tmp.resolve("samples.csv.part")) || Files.exists(tmp.resolve("checkpoint.json")));
        assertEquals(sum, RunSummary.read(tmp.resolve("summary.json")));
    }

    private byte[][] runFiles(Study s, RunJob.Options o, String dir) throws IOException {
        Path d = tmp.resolve(dir);
        RunJob.Result r = new RunJob(s, linear(8.0, 12.5), o, d).run();
        assertTrue(r.completed());
        return new byte[][] {Files.readAllBytes(d.resolve("samples.csv")), Files.readAllBytes(d.resolve("summary.json"))};
    }

    @Test
    void filesAreByteIdenticalForAnyThreadCountAndSampler() throws IOException {
        for (Sampler sampler : Sampler.values()) {
            Study s = linearStudy(3000, sampler, FailurePolicy.REJECT, List.of(TestStudies.atLeast("y", 1)));
            byte[][] one = runFiles(s, opts(1), sampler + "-1");
            byte[][] two = runFiles(s, opts(2), sampler + "-2");
            byte[][] three = runFiles(s, opts(3), sampler + "-3");
            assertArrayEquals(one[0], two[0], sampler + " samples.csv");
            assertArrayEquals(one[1], two[1], sampler + " summary.json");
            assertArrayEquals(one[0], three[0]);
            assertArrayEquals(one[1], three[1]);
        }
    }

    @Test
    void cancelledRunResumesToByteIdenticalFiles() throws IOException {
        Study s = linearStudy(5000, Sampler.LATIN_HYPERCUBE, FailurePolicy.REJECT, List.of(TestStudies.atLeast("y", 1)));
        byte[][] whole = runFiles(s, opts(2), "whole");

        Path d = tmp.resolve("interrupted");
        RunJob[] job = new RunJob[1];
        RunJob.Options cancelling = opts(2).withProgress((chunks, done) -> {
            if (chunks == 3) {
                job[0].cancel();
            }
        });
        job[0] = new RunJob(s, linear(8.0, 12.5), cancelling, d);
        RunJob.Result r = job[0].run();
        assertFalse(r.completed());
        assertEquals(3, r.chunksDone());
        assertFalse(Files.exists(d.resolve("samples.csv")) || Files.exists(d.resolve("summary.json")));
        Checkpoint ck = Checkpoint.read(d.resolve("checkpoint.json"));
        assertEquals(3, ck.chunksDone());
        assertEquals(Files.size(d.resolve("samples.csv.part")), ck.partBytes());
        // a crash after the checkpoint may leave extra bytes: they are cut off on resume
        Files.writeString(d.resolve("samples.csv.part"), "768,garbage", StandardOpenOption.APPEND);

        RunJob.Result done = new RunJob(s, linear(8.0, 12.5), opts(1).withResume(true), d).run();
        assertTrue(done.completed());
        assertArrayEquals(whole[0], Files.readAllBytes(d.resolve("samples.csv")));
        assertArrayEquals(whole[1], Files.readAllBytes(d.resolve("summary.json")));
        assertFalse(Files.exists(d.resolve("checkpoint.json")) || Files.exists(d.resolve("samples.csv.part")));
    }

    @Test
    void resumeRefusesAnotherRun() throws IOException {
        Study s = linearStudy(5000, Sampler.RANDOM, FailurePolicy.REJECT, List.of());
        Path d = tmp.resolve("x");
        RunJob[] job = new RunJob[1];
        job[0] = new RunJob(s, linear(8.0, 12.5), opts(1).withProgress((c, n) -> job[0].cancel()), d);
        assertFalse(job[0].run().completed());
        StudyException e = assertThrows(StudyException.class,
                () -> new RunJob(s, linear(8.0, 12.5), opts(1).withResume(true).withSeed(7L), d));
        assertTrue(e.getMessage().contains("different run"), e.getMessage());
        assertThrows(StudyException.class, () -> new RunJob(s, linear(8.0, 12.5), opts(1).withResume(true), tmp.resolve("none")));
    }

    @Test
    void failuresAreCountedKeptInTheFileAndExcludedFromStatistics() throws IOException {
        // x0 ~ N(10, 1): P(x0 < 8) = Φ(−2), P(x0 > 12.5) = Φ(−2.5) gives a NaN output
        Study s = linearStudy(20_000, Sampler.RANDOM, FailurePolicy.REJECT, List.of(TestStudies.atLeast("y", 1)));
        RunJob.Result r = new RunJob(s, linear(8.0, 12.5), opts(2), tmp).run();
        RunSummary sum = r.summary();
        long below = sum.failures().get("below-floor");
        long nan = sum.failures().get("nan-output");
        assertEquals(20_000, sum.samplesOk() + below + nan);
        double pb = StandardNormal.cdf(-2);
        assertEquals(pb, below / 20_000.0, 4 * Math.sqrt(pb / 20_000));
        List<String> lines = Files.readAllLines(tmp.resolve("samples.csv"));
        assertEquals("sample,x0,x1,x2,y,z,status", lines.get(0));
        assertEquals(20_001, lines.size());
        long statusBelow = lines.stream().filter(l -> l.endsWith(",below-floor")).count();
        assertEquals(below, statusBelow);
        assertEquals(sum.samplesOk(), sum.outputs().get(0).n());
        double minOk = sum.outputs().get(0).min();
        assertTrue(Double.isFinite(minOk));
        assertNull(sum.truncatedByModel());
    }

    @Test
    void truncatePolicyReportsTheMassTheModelRemoved() throws IOException {
        Study s = linearStudy(4000, Sampler.RANDOM, FailurePolicy.TRUNCATE, List.of());
        RunSummary sum = new RunJob(s, linear(9.0, Double.POSITIVE_INFINITY), opts(1), tmp).run().summary();
        double p = StandardNormal.cdf(-1);
        assertEquals(p, sum.truncatedByModel(), 4 * Math.sqrt(p * (1 - p) / 4000));
        // the good samples follow x0 conditioned on x0 ≥ 9: their y mean exceeds the unconditioned one
        assertTrue(sum.outputs().get(0).mean() > 2.0);
    }

    @Test
    void stopPolicyEndsTheRunAndLeavesNoFiles() throws IOException {
        Study s = linearStudy(4000, Sampler.RANDOM, FailurePolicy.STOP, List.of());
        RunFailedException e = assertThrows(RunFailedException.class,
                () -> new RunJob(s, linear(8.0, Double.POSITIVE_INFINITY), opts(2), tmp).run());
        assertTrue(e.getMessage().contains("below-floor") && e.getMessage().contains("stop"), e.getMessage());
        try (var files = Files.list(tmp)) {
            assertEquals(0, files.count());
        }
    }

    @Test
    void badInputCreatesNothing() {
        Study s = linearStudy(100, Sampler.RANDOM, FailurePolicy.REJECT, List.of(TestStudies.atLeast("jsc", 1)));
        Path d = tmp.resolve("out");
        StudyException e = assertThrows(StudyException.class,
                () -> new RunJob(s, linear(0, 1), opts(1), d).run());
        assertTrue(e.getMessage().contains("targets.jsc") && e.getMessage().contains("no model output 'jsc'"), e.getMessage());
        assertFalse(Files.exists(d));
        Study bad = TestStudies.study("bad", List.of(TestStudies.input("x0", new DistributionSpec.Normal(1, -1))),
                List.of(), List.of(), TestStudies.settings(10, 1, Sampler.RANDOM, FailurePolicy.REJECT));
        StudyException e2 = assertThrows(StudyException.class, () -> new RunJob(bad,
                new TestModels.Linear(List.of("x0"), new double[] {1}, 0, 1), opts(1), d));
        assertTrue(e2.getMessage().startsWith("<study>: x0: normal needs"), e2.getMessage());
        assertFalse(Files.exists(d));
    }

    @Test
    void quantilesFromTheFileEqualThoseFromMemory() throws IOException {
        Study s = linearStudy(5000, Sampler.SOBOL, FailurePolicy.REJECT, List.of(TestStudies.atLeast("y", 1)));
        RunJob.Result inMemory = new RunJob(s, linear(8.0, 12.5), opts(2), tmp.resolve("a")).run();
        RunJob.Result strided = new RunJob(s, linear(8.0, 12.5), opts(2).withTableLimit(1000), tmp.resolve("b")).run();
        assertEquals(1, inMemory.tableStride());
        assertEquals(5, strided.tableStride());
        assertEquals(inMemory.summary(), strided.summary());
        assertEquals(1000, strided.table().size());
        assertArrayEquals(new double[] {inMemory.table().input("x1")[0], inMemory.table().input("x1")[5]},
                new double[] {strided.table().input("x1")[0], strided.table().input("x1")[1]}, 0.0);
    }

    @Test
    void ishigamiMeanAndVarianceWithSobolPoints() throws IOException {
        double a = 7;
        double b = 0.1;
        List<org.fabspread.study.Parameter> in = new ArrayList<>();
        for (String id : List.of("x1", "x2", "x3")) {
            in.add(TestStudies.input(id, new DistributionSpec.Uniform(-Math.PI, Math.PI)));
        }
        Study s = TestStudies.study("ishigami", in, List.of(), List.of(),
                TestStudies.settings(1 << 14, 11, Sampler.SOBOL, FailurePolicy.REJECT));
        RunSummary sum = new RunJob(s, new TestModels.Ishigami(a, b), opts(2), tmp).run().summary();
        // source: Ishigami & Homma, Proc. ISUMA '90, 398 (1990); Sobol' & Levitan, Comput. Phys. Commun.
        // 117, 52 (1999): E f = a/2, V f = a²/8 + bπ⁴/5 + b²π⁸/18 + 1/2
        double mean = a / 2;
        double var = a * a / 8 + b * Math.pow(Math.PI, 4) / 5 + b * b * Math.pow(Math.PI, 8) / 18 + 0.5;
        // cross-check of the closed form by a 3-d Gauss–Legendre product rule
        double[] q = gaussLegendre(40);
        double m1 = 0;
        double m2 = 0;
        for (int i = 0; i < 40; i++) {
            for (int j = 0; j < 40; j++) {
                for (int k = 0; k < 40; k++) {
                    double w = q[80 + i] * q[80 + j] * q[80 + k] / 8;
                    double f = TestModels.Ishigami.f(a, b, Math.PI * q[i], Math.PI * q[j], Math.PI * q[k]);
                    m1 += w * f;
                    m2 += w * f * f;
                }
            }
        }
        assertEquals(mean, m1, 1e-10);
        assertEquals(var, m2 - m1 * m1, 1e-8);
        assertEquals(13.8446, var, 1e-4);
        RunSummary.OutputStats f = sum.outputs().get(0);
        assertEquals(mean, f.mean(), 0.02);
        assertEquals(Math.sqrt(var), f.sd(), 0.02);
    }

    /** Nodes (first n), unused slot block, weights (from 2n) of the n-point Gauss–Legendre rule on [−1, 1]. */
    static double[] gaussLegendre(int n) {
        org.apache.commons.math3.analysis.integration.gauss.GaussIntegrator g =
                new org.apache.commons.math3.analysis.integration.gauss.GaussIntegratorFactory().legendre(n, -1, 1);
        double[] out = new double[3 * n];
        for (int i = 0; i < n; i++) {
            out[i] = g.getPoint(i);
            out[2 * n + i] = g.getWeight(i);
        }
        return out;
    }

    @Test
    void summaryTakesExtraSections() throws IOException {
        Study s = linearStudy(500, Sampler.RANDOM, FailurePolicy.REJECT, List.of());
        RunSummary sum = new RunJob(s, linear(0, 100), opts(1), tmp).run().summary();
        Path f = tmp.resolve("with.json");
        sum.write(f, Map.of("sensitivity", Map.of("x0", 0.5)));
        String text = Files.readString(f);
        assertTrue(text.contains("\"sensitivity\"") && text.contains("\"study\" : \"linear\""), text);
        assertEquals(sum, RunSummary.read(f));
        assertThrows(IllegalArgumentException.class, () -> sum.toJson(Map.of("seed", 1)));
    }
}
