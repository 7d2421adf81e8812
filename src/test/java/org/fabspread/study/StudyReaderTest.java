package org.fabspread.study;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertInstanceOf;
import static org.junit.jupiter.api.Assertions.assertNull;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;

import org.apache.commons.math3.special.Erf;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/** The study reader: values, units, distributions, defaults and the sections that name inputs. */
class StudyReaderTest {

    /** A small valid inverted cell; tests replace parts of it. */
    static final String BASE = """
            name: test cell
            wavelengths: {from: 400 nm, to: 700 nm, step: 10 nm}
            stack:
              - name: glass
                material: soda-lime-rubin
                thickness: 1 mm
                role: substrate
                incoherent: true
              - name: ito
                material: ito-konig
                thickness: 120 nm
                role: electrode
              - name: etl
                material: zno-stelling
                thickness: 30 nm ± 3 nm at 3 sigma
                role: electron-transport
              - name: absorber
                material: ptb7-pc71bm-stelling
                thickness: 100 nm ± 5 nm at 2 sigma
                role: absorber
              - name: htl
                material: moo3-stelling
                thickness: 10 nm
                role: hole-transport
              - name: back
                material: ag-johnson-christy
                thickness: 100 nm
                role: electrode
            particles:
              metal: ag-johnson-christy
              host: etl
              placement: back
              diameter: 20 nm
              coverage: 5 % ± 1 % at 2 sigma
            collection:
              electron_mu_tau: 2e-9 cm^2/V
              hole_mu_tau: 1e-9 cm^2/V
              built_in_voltage: 0.8 V
            """;

    @TempDir
    Path tmp;

    private Study read(String text) throws IOException {
        Path f = tmp.resolve("study.yaml");
        Files.writeString(f, text, StandardCharsets.UTF_8);
        return StudyReader.read(f);
    }

    private String error(String text) throws IOException {
        Path f = tmp.resolve("study.yaml");
        Files.writeString(f, text, StandardCharsets.UTF_8);
        return assertThrows(StudyException.class, () -> StudyReader.read(f)).getMessage();
    }

    private static String replace(String base, String from, String to) {
        assertTrue(base.contains(from), from);
        return base.replace(from, to);
    }

    @Test
    void pilotDemoReadsIntoTheRecords() {
        Study s = StudyReader.read(Path.of("demo-studies/pilot-line-inverted.yaml"));
        assertEquals(121, s.grid().count());
        assertEquals(List.of("glass", "ito", "etl", "absorber", "htl", "back"),
                s.stack().stream().map(Layer::name).toList());
        assertEquals(1.1e6, s.layer("glass").thickness().nominal(), 1e-6, "1.1 mm in nm");
        assertTrue(s.layer("glass").incoherent());
        // "120 nm ± 9 nm at 3 sigma" is a normal with sigma 3 nm
        assertEquals(new DistributionSpec.Normal(120, 3), s.layer("ito").thickness().distribution());
        assertEquals(9, s.uncertainInputs().size());
        assertEquals(ParticleLayer.Placement.BACK, s.particles().placement());
        assertEquals(0.06, s.particles().coverage().nominal(), 1e-15);
        assertTrue(s.collection().electronsAtFront());
        assertEquals(13.3, s.targets().get(0).value(), 0);
        assertEquals("mA/cm^2", s.targets().get(0).unit());
        assertEquals(AnalysisSettings.Sampler.LATIN_HYPERCUBE, s.analysis().sampler());
        assertEquals(AnalysisSettings.Sensitivity.SOBOL, s.analysis().sensitivity());
        assertEquals(128, s.analysis().sobolBase());
        assertEquals(2000, s.analysis().samples());
        assertEquals(3, s.analysis().whatIfs().size());
        assertEquals(9, s.costs().size());
        assertEquals(0.3, s.correlations().get(0).spearman(), 0);
        assertEquals(List.of(new PlanSettings.FactorLimits("stack.etl.thickness", 34, 46)), s.plan().limits());
        assertEquals(0.3, s.plan().effectOfInterest(), 1e-15);
        assertEquals(2, s.plan().levelSigmas(), 0);
        assertEquals(7, s.plan().seed());
    }

    @Test
    void plusMinusAtACoverageProbabilityUsesTheNormalQuantile() {
        Study s = StudyReader.read(Path.of("demo-studies/gold-rods-conventional.yaml"));
        DistributionSpec.Normal n = (DistributionSpec.Normal) s.layer("ito").thickness().distribution();
        // from memory: z_0.975 = 1.959963985 (two-sided 95 %)
        assertEquals(10 / 1.959963985, n.sigma(), 1e-8);
        // cross-check the same sigma a second way: P(|X - mean| <= 10 nm) = erf(10 / (sigma sqrt 2)) = 0.95
        assertEquals(0.95, Erf.erf(10 / (n.sigma() * Math.sqrt(2))), 1e-12);
        assertFalse(s.collection().electronsAtFront());
        assertInstanceOf(DistributionSpec.TruncatedNormal.class, s.layer("absorber").thickness().distribution());
        assertEquals(1.6, s.particles().inPlaneAspect().nominal(), 0);
        assertFalse(s.particles().aligned());
        assertEquals(AnalysisSettings.WhatIf.Kind.SHIFT_NOMINAL, s.analysis().whatIfs().get(1).kind());
        assertEquals(-5, s.analysis().whatIfs().get(1).amount(), 0);
    }

    @Test
    void unitsConvertToTheCanonicalUnits() {
        // common practice: SI prefixes; 1 A/m^2 = 1e-4 A/cm^2 = 0.1 mA/cm^2; 1 m^2 = 1e4 cm^2
        assertEquals(1.1e6, Units.toCanonical("1.1 mm", Units.Quantity.LENGTH), 1e-6);
        assertEquals(2000, Units.toCanonical("2 µm", Units.Quantity.LENGTH), 1e-9);
        assertEquals(2000, Units.toCanonical("2 um", Units.Quantity.LENGTH), 1e-9);
        assertEquals(2000, Units.toCanonical("2 \u03bcm", Units.Quantity.LENGTH), 1e-9);
        assertEquals(50, Units.toCanonical("0.05 A/cm^2", Units.Quantity.CURRENT_DENSITY), 1e-12);
        assertEquals(1, Units.toCanonical("10 A/m^2", Units.Quantity.CURRENT_DENSITY), 1e-12);
        assertEquals(2e-9, Units.toCanonical("2e-13 m^2/V", Units.Quantity.MU_TAU), 1e-24);
        assertEquals(2e-9, Units.toCanonical("2e-9 cm²/V", Units.Quantity.MU_TAU), 1e-24);
        assertEquals(0.8, Units.toCanonical("800 mV", Units.Quantity.VOLTAGE), 1e-12);
        assertEquals(0.05, Units.toCanonical("5 %", Units.Quantity.FRACTION), 1e-15);
        assertEquals(0.05, Units.toCanonical("0.05", Units.Quantity.FRACTION), 1e-15);
        assertEquals(2, Units.toCanonical("2 Ω cm²", Units.Quantity.AREA_RESISTANCE), 0);
        assertEquals(2, Units.toCanonical("2 ohm·cm^2", Units.Quantity.AREA_RESISTANCE), 0);
        assertEquals(Double.POSITIVE_INFINITY, Units.toCanonical("infinite", Units.Quantity.AREA_RESISTANCE), 0);
        IllegalArgumentException e = assertThrows(IllegalArgumentException.class,
                () -> Units.toCanonical("30", Units.Quantity.LENGTH));
        assertEquals("'30' needs a unit: a length in nm, µm, um, mm or m", e.getMessage());
        e = assertThrows(IllegalArgumentException.class, () -> Units.toCanonical("1.6 nm", Units.Quantity.DIMENSIONLESS));
        assertEquals("'1.6 nm': a dimensionless number takes no unit", e.getMessage());
    }

    /** Same id, unit, value and location (the default also carries its range and display unit). */
    private static void assertSameNumber(Parameter expected, Parameter actual) {
        assertEquals(expected.id(), actual.id());
        assertEquals(expected.unit(), actual.unit());
        assertEquals(expected.distribution(), actual.distribution());
        assertEquals(expected.where(), actual.where());
    }

    @Test
    void absentOptionalNumbersBecomeFixedDefaultsWithTheirIds() throws IOException {
        Study s = read(BASE);
        assertSameNumber(Parameter.fixed("stack.etl.k_scale", "1", 1), s.layer("etl").kScale());
        assertSameNumber(Parameter.fixed("stack.etl.n_shift", "1", 0), s.layer("etl").nShift());
        assertSameNumber(Parameter.fixed("collection.dissociation", "fraction", 1), s.collection().dissociation());
        assertSameNumber(Parameter.fixed("collection.quenching_distance", "nm", 0), s.collection().quenchingDistance());
        // issue 13: a left-out forward share is no input; the model takes it from the Mie series
        assertNull(s.particles().forwardFraction());
        assertSameNumber(Parameter.fixed("particles.size_cv", "fraction", 0), s.particles().sizeCv());
        // silver: Ordal et al., Appl. Opt. 24, 4493 (1985) and Kittel (the defaults the brief fixes)
        assertEquals(9.01, s.particles().metalParameters().plasmaEnergyEv().nominal(), 0);
        assertEquals(0.018, s.particles().metalParameters().bulkDampingEv().nominal(), 0);
        assertEquals(1.39e6, s.particles().metalParameters().fermiVelocity().nominal(), 0);
        assertEquals(1, s.particles().metalParameters().surfaceScattering().nominal(), 0);
        assertNull(s.diode());
        assertTrue(s.collection().electronsAtFront(), "inferred: the electron-transport layer precedes the absorber");
        assertEquals(1000, s.analysis().samples());
        assertEquals(0.95, s.analysis().confidence(), 0);
        assertTrue(Double.isNaN(s.analysis().yieldGoal()));
        assertEquals("jsc", s.plan().response());
        assertEquals(List.of("stack.glass.thickness", "stack.glass.n_shift", "stack.glass.k_scale"),
                s.parameters().keySet().stream().limit(3).toList());
        assertEquals(List.of("stack.etl.thickness", "stack.absorber.thickness", "particles.coverage"),
                s.uncertainInputs().stream().map(Parameter::id).toList());
        Parameter etl = s.layer("etl").thickness();
        assertEquals(15, etl.where().line());
        assertEquals(16, etl.where().column());
        assertEquals("stack[2].thickness", etl.where().keyPath());
    }

    @Test
    void distributionsInStructuredForm() throws IOException {
        Study s = read(replace(replace(replace(BASE,
                "    thickness: 30 nm ± 3 nm at 3 sigma\n",
                "    thickness: {triangular: {lower: 0.026 µm, mode: 30 nm, upper: 34 nm}}\n"
                        + "    k_scale: {uniform: {lower: 0.9, upper: 1.1}}\n"
                        + "    n_shift: {truncated_normal: {mean: 0, sigma: 0.05, upper: 0.1}}\n"),
                "  diameter: 20 nm\n", "  diameter: {lognormal: {median: 20 nm, cv: 10 %}}\n"),
                "  built_in_voltage: 0.8 V\n", "  built_in_voltage: {normal: {mean: 800 mV, sigma: 20 mV}}\n"));
        assertEquals(new DistributionSpec.Triangular(26, 30, 34), s.layer("etl").thickness().distribution());
        assertEquals(new DistributionSpec.Uniform(0.9, 1.1), s.layer("etl").kScale().distribution());
        assertEquals(new DistributionSpec.TruncatedNormal(0, 0.05, Double.NEGATIVE_INFINITY, 0.1),
                s.layer("etl").nShift().distribution());
        assertEquals(new DistributionSpec.LogNormal(20, 0.1), s.particles().diameter().distribution());
        DistributionSpec.Normal v = (DistributionSpec.Normal) s.collection().builtInVoltage().distribution();
        assertEquals(0.8, v.mean(), 1e-12);
        assertEquals(0.02, v.sigma(), 1e-12);
    }

    @Test
    void measuredValuesComeFromTheCsvColumnInItsUnit() throws IOException {
        Files.writeString(tmp.resolve("lots.csv"), "lot,etl_um\nA,0.029\nB,0.031\nC,\nD,0.030\n");
        Study s = read(replace(BASE, "    thickness: 30 nm ± 3 nm at 3 sigma\n",
                "    thickness: {measured: {file: lots.csv, column: etl_um, unit: um, smooth: true}}\n"));
        DistributionSpec.Empirical e = (DistributionSpec.Empirical) s.layer("etl").thickness().distribution();
        double[] v = e.values();
        assertEquals(3, v.length, "the empty cell is skipped");
        assertEquals(29, v[0], 1e-9);
        assertEquals(31, v[1], 1e-9);
        assertEquals(30, v[2], 1e-9);
        assertTrue(e.smooth());
        assertEquals("lots.csv:etl_um", e.source());
    }

    @Test
    void semiAxesGiveTheVolumeEquivalentDiameterAndAspects() throws IOException {
        Study s = read(replace(BASE, "  diameter: 20 nm\n", "  semi_axes: [12 nm, 8 nm, 6 nm]\n"));
        ParticleLayer p = s.particles();
        double d = p.diameter().nominal();
        double pp = p.inPlaneAspect().nominal();
        double q = p.outOfPlaneAspect().nominal();
        assertEquals(1.5, pp, 1e-15);
        assertEquals(0.5, q, 1e-15);
        // same volume: (D/2)^3 = abc
        assertEquals(12 * 8 * 6, Math.pow(d / 2, 3), 1e-9);
        // and back through ParticleLayer's formulas a = (D/2)(p/q)^(1/3), b = a/p, c = q a
        double a = d / 2 * Math.cbrt(pp / q);
        assertEquals(12, a, 1e-12);
        assertEquals(8, a / pp, 1e-12);
        assertEquals(6, q * a, 1e-12);
    }

    @Test
    void placementAsADistanceIsTheOffsetInput() throws IOException {
        Study s = read(replace(replace(BASE, "  host: etl\n", "  host: absorber\n"),
                "  placement: back\n", "  placement: 40 nm ± 6 nm at 3 sigma\n"));
        assertEquals(ParticleLayer.Placement.OFFSET, s.particles().placement());
        assertEquals(new DistributionSpec.Normal(40, 2), s.particles().offset().distribution());
        assertEquals("particles.offset", s.particles().offset().id());
        String e = error(replace(replace(BASE, "  host: etl\n", "  host: absorber\n"),
                "  placement: back\n", "  placement: 90 nm\n"));
        assertEquals("study.yaml:33:13: particles.diameter: the particle layer (20 nm high, starting 90 nm in) does not fit"
                + " in its host layer 'absorber' (100 nm)", e);
    }

    @Test
    void whatIfsPlanCostsAndCorrelations() throws IOException {
        Study s = read(BASE + """
                diode: {saturation_current: 1e-9 mA/cm^2, ideality: 1.5}
                targets: ["jsc >= 15 mA/cm^2", {output: efficiency, at_least: 8 %}, "enhancement >= 1.1"]
                analysis:
                  what_ifs:
                    - halve sigma of stack.etl.thickness
                    - scale sigma of particles.coverage by 0.7
                    - shift stack.absorber.thickness by +5 nm
                    - truncate particles.coverage at 2 sigma
                    - {input: stack.etl.thickness, truncate_at: 1.5 sigma}
                plan:
                  factors: [stack.etl.thickness, particles.coverage]
                  limits: {particles.coverage: [3 %, 7 %]}
                  kind: fractional
                  resolution: 4
                  levels: 1.5 sigma
                  response: efficiency
                  effect_of_interest: 0.5 %
                costs: {stack.etl.thickness: 2, particles.coverage: 5}
                correlations:
                  - {between: [stack.etl.thickness, stack.absorber.thickness], spearman: -0.4}
                """);
        List<AnalysisSettings.WhatIf> w = s.analysis().whatIfs();
        assertEquals(AnalysisSettings.WhatIf.Kind.SCALE_SIGMA, w.get(0).kind());
        assertEquals(0.5, w.get(0).amount(), 0);
        assertEquals(0.7, w.get(1).amount(), 0);
        assertEquals(5, w.get(2).amount(), 0);
        assertEquals(AnalysisSettings.WhatIf.Kind.TRUNCATE_SIGMAS, w.get(3).kind());
        assertEquals(2, w.get(3).amount(), 0);
        assertEquals(1.5, w.get(4).amount(), 0);
        assertTrue(s.analysis().planarReference(), "an enhancement target turns the planar reference on");
        assertEquals(0.08, s.targets().get(1).value(), 1e-15);
        assertEquals(new PlanSettings.FactorLimits("particles.coverage", 0.03, 0.07), s.plan().limits().get(0));
        assertEquals(PlanSettings.Kind.FRACTIONAL, s.plan().kind());
        assertEquals(0.005, s.plan().effectOfInterest(), 1e-15);
        assertEquals(1.5, s.plan().levelSigmas(), 0);
        assertEquals(Double.POSITIVE_INFINITY, s.diode().shuntResistance().nominal(), 0);
        assertEquals(300, s.diode().temperature().nominal(), 0);
        assertEquals(5.0, s.costs().get("particles.coverage"), 0);
        assertEquals(-0.4, s.correlations().get(0).spearman(), 0);
    }

    @Test
    void userMaterialTablesAreCheckedAgainstTheGrid() throws IOException {
        Files.writeString(tmp.resolve("my-zno.csv"), "# material: test\nwavelength_nm,n,k\n450,2.0,0.01\n900,1.9,0\n");
        String text = replace(BASE, "    material: zno-stelling\n", "    material: {file: my-zno.csv}\n");
        assertEquals("study.yaml:2:21: wavelengths.from: the grid 400 to 700 nm leaves the table of material 'my-zno'"
                + " (layer 'etl'), tabulated 450 to 900 nm", error(text));
        Study s = read(replace(text, "from: 400 nm, to: 700 nm", "from: 450 nm, to: 700 nm"));
        assertEquals("my-zno", s.layer("etl").material().id());
        assertEquals(tmp.resolve("my-zno.csv").toAbsolutePath().normalize(), s.layer("etl").material().csvFile());
    }

    @Test
    void moreLocatedErrors() throws IOException {
        assertEquals("study.yaml:2:47: wavelengths.step: the range 400 to 700 nm is not a whole number of 7 nm steps",
                error(replace(BASE, "step: 10 nm", "step: 7 nm")));
        assertEquals("study.yaml:15:16: stack[2].thickness: after 'at' give a number of sigmas ('3 sigma') or a"
                + " coverage probability ('95 %'), got 'three sigma'",
                error(replace(BASE, "30 nm ± 3 nm at 3 sigma", "30 nm ± 3 nm at three sigma")));
        assertEquals("study.yaml:33:13: particles.diameter: the particle layer (20 nm high) does not fit in its host"
                + " layer 'etl' (15 nm)", error(replace(BASE, "30 nm ± 3 nm at 3 sigma", "15 nm")));
        assertEquals("study.yaml:36:3: collection.electron_mu_tau: required key is missing",
                error(replace(BASE, "  electron_mu_tau: 2e-9 cm^2/V\n", "")));
        assertEquals("study.yaml:41:7: analysis.what_ifs[0]: write a what-if as 'halve sigma of ID', 'scale sigma of ID"
                + " by 0.7', 'shift ID by +5 nm' or 'truncate ID at 2 sigma', got 'double sigma of particles.coverage'",
                error(BASE + "analysis:\n  what_ifs:\n    - double sigma of particles.coverage\n"));
        assertEquals("study.yaml:40:41: plan.limits.stack.etl.thickness[1]: high (25 nm) must be above low (35 nm)",
                error(BASE + "plan:\n  limits: {stack.etl.thickness: [35 nm, 25 nm]}\n"));
    }

    @Test
    void suggestionsUseEditDistanceWithTranspositions() {
        // source: Damerau, Commun. ACM 7, 171 (1964): one transposition is one edit
        assertEquals(1, Suggestions.distance("jcs", "jsc"));
        assertEquals(1, Suggestions.distance("thicknes", "thickness"));
        // common practice: the textbook Levenshtein example kitten -> sitting needs three edits; cross-checked
        // against a plain recursive definition
        assertEquals(3, Suggestions.distance("kitten", "sitting"));
        for (String[] p : new String[][] {{"kitten", "sitting"}, {"coverage", "covrage"}, {"abc", ""}, {"flaw", "lawn"}}) {
            assertEquals(recursive(p[0], p[1]), Suggestions.distance(p[0], p[1]), p[0] + "/" + p[1]);
        }
        assertEquals("thickness", Suggestions.nearest("thicknes", List.of("name", "thickness", "role")));
        assertNull(Suggestions.nearest("zno", List.of("ito", "etl")));
    }

    /** Optimal string alignment distance by its recursive definition (exponential; short words only). */
    private static int recursive(String a, String b) {
        if (a.isEmpty()) {
            return b.length();
        }
        if (b.isEmpty()) {
            return a.length();
        }
        int i = a.length();
        int j = b.length();
        int best = Math.min(recursive(a.substring(0, i - 1), b) + 1, recursive(a, b.substring(0, j - 1)) + 1);
        best = Math.min(best, recursive(a.substring(0, i - 1), b.substring(0, j - 1))
                + (a.charAt(i - 1) == b.charAt(j - 1) ? 0 : 1));
        if (i > 1 && j > 1 && a.charAt(i - 1) == b.charAt(j - 2) && a.charAt(i - 2) == b.charAt(j - 1)) {
            best = Math.min(best, recursive(a.substring(0, i - 2), b.substring(0, j - 2)) + 1);
        }
        return best;
    }

    @Test
    void describeWritesDistributionsInTheParameterUnit() {
        assertEquals("normal(mean 30 nm, sigma 1 nm)",
                Describe.distribution(new Parameter("x", "nm", new DistributionSpec.Normal(30, 1), SourceLocation.unknown("x"))));
        assertEquals("lognormal(median 5 %, cv 10 %)",
                Describe.distribution(new Parameter("x", "fraction", new DistributionSpec.LogNormal(0.05, 0.1), SourceLocation.unknown("x"))));
        assertEquals("fixed infinite ohm cm^2", Describe.distribution(Parameter.fixed("x", "ohm cm^2", Double.POSITIVE_INFINITY)));
    }
}
