package org.fabspread.device;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.file.Files;
import java.nio.file.Path;

import org.fabspread.model.Evaluator;
import org.fabspread.model.ModelException;
import org.fabspread.optics.SolarSpectrum;
import org.fabspread.study.Study;
import org.fabspread.study.StudyException;
import org.fabspread.study.StudyReader;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/** The device model with a user's enhancement table in place of the built-in particle optics. */
class EnhancementModelTest {

    @TempDir
    Path dir;

    private static final String[] ALL = {"jsc", "loss_collection", "loss_quenching", "loss_metal", "loss_electrodes",
            "loss_transport", "loss_substrate", "loss_scattering", "loss_reflection", "loss_transmission"};

    private static double out(DeviceModel m, double[] o, String id) {
        int i = m.outputIndex(id);
        assertTrue(i >= 0, "no output " + id);
        return o[i];
    }

    private static double[] nominal(DeviceModel m) {
        return m.evaluate(m.nominalInputs());
    }

    /** A 2 x 2 table (diameter 10 and 40 nm, coverage 1 and 10 %) with the same factor everywhere. */
    private Path uniform(double e) throws IOException {
        Path p = dir.resolve("uniform.csv");
        Files.writeString(p, "# invented\ndiameter_nm,coverage_percent,enhancement\n10,1," + e + "\n10,10," + e + "\n40,1,"
                + e + "\n40,10," + e + "\n");
        return p;
    }

    /** The demo study with a table and the planar reference. */
    private static DemoStudy withTable(Path table) {
        DemoStudy d = new DemoStudy();
        d.enhancementTable = table;
        d.planarReference = true;
        d.diode = true;
        return d;
    }

    /** The same stack with built-in particles at zero coverage: the planar stack with the same layout. */
    private static DeviceModel planar() {
        DemoStudy z = new DemoStudy();
        z.fixed("particles.coverage", 0);
        z.planarReference = true;
        z.diode = true;
        return DeviceModel.of(z.build());
    }

    private static double limit(DeviceModel m) {
        double total = 0;
        for (double f : m.device.flux()) {
            total += f;
        }
        return SolarSpectrum.toMilliampPerCm2(total);
    }

    @Test
    void anEnhancementOfOneIsThePlanarStack() throws IOException {
        // source: device-model.md section 4.4 (theta -> 0 is exactly the planar stack) and the definition of the
        // enhancement as a ratio of absorptions: a factor of exactly 1 leaves the planar result untouched
        DeviceModel mt = DeviceModel.of(withTable(uniform(1)).build());
        DeviceModel mp = planar();
        double[] ot = nominal(mt);
        double[] op = nominal(mp);
        assertEquals(mp.outputs(), mt.outputs(), "outputs keep their ids");
        for (int i = 0; i < ot.length; i++) {
            assertEquals(op[i], ot[i], 0, mt.outputs().get(i).id());
        }
        assertEquals(out(mt, ot, "jsc_planar"), out(mt, ot, "jsc"), 0);
        assertEquals(1, out(mt, ot, "enhancement"), 0);
        assertTrue(mt.enhancementTable().isPresent() && mp.enhancementTable().isEmpty());
        // and the stack without any particle section (other layout) agrees to round-off
        DemoStudy none = new DemoStudy();
        none.particles = false;
        DeviceModel mn = DeviceModel.of(none.build());
        assertEquals(out(mn, nominal(mn), "jsc"), out(mt, ot, "jsc"), 1e-12 * out(mt, ot, "jsc"));
    }

    @Test
    void tenPercentMoreAbsorption() throws IOException {
        // common practice (definition of the enhancement): a factor 1.1 raises the absorber's absorption and its
        // collected current by 10 % at each wavelength, taken from the reflection, except where R < 0.1 A: there
        // the cap gives A + R (factor s = min(1.1, 1 + R/A))
        DeviceModel mt = DeviceModel.of(withTable(uniform(1.1)).build());
        DeviceModel mp = planar();
        double[] ot = nominal(mt);
        double[] op = nominal(mp);
        Spectra sp = mp.nominalSpectra();
        double col = 0;
        double opt = 0;
        int capped = 0;
        for (int i = 0; i < sp.size(); i++) {
            double a = sp.layerAbsorptance().get("absorber")[i];
            double f = Math.min(1.1, 1 + sp.reflectance()[i] / a);
            capped += 0.1 * a > sp.reflectance()[i] ? 1 : 0;
            col += sp.photonFlux()[i] * sp.absorberEqe()[i] * f;
            opt += sp.photonFlux()[i] * a * (f - 1);
        }
        DeviceEvaluator e = mt.newDeviceEvaluator();
        e.evaluate(mt.nominalInputs(), new double[ot.length]);
        assertEquals(capped, e.cappedWavelengths());
        assertTrue(capped < sp.size() / 10, "the cap binds at few wavelengths: " + capped);
        double jp = out(mp, op, "jsc");
        double jsc = out(mt, ot, "jsc");
        assertEquals(SolarSpectrum.toMilliampPerCm2(col), jsc, 1e-12 * jp);
        assertTrue(jsc > 1.09 * jp && jsc <= 1.1 * jp, "about 10 % more, bounded by the cap: " + jsc / jp);
        assertEquals(jp, out(mt, ot, "jsc_planar"), 1e-12 * jp);
        assertEquals(jsc / jp, out(mt, ot, "enhancement"), 1e-15);
        double extra = SolarSpectrum.toMilliampPerCm2(opt);
        assertEquals(out(mp, op, "jsc_optical") + extra, out(mt, ot, "jsc_optical"), 1e-12 * jp);
        assertEquals(out(mp, op, "loss_reflection") - extra, out(mt, ot, "loss_reflection"), 1e-12 * jp);
        for (String id : new String[] {"loss_electrodes", "loss_transport", "loss_substrate", "loss_transmission"}) {
            assertEquals(out(mp, op, id), out(mt, ot, id), 1e-12, id + " keeps its planar value");
        }
        for (String id : new String[] {"loss_metal", "loss_scattering", "loss_quenching"}) {
            assertEquals(0, out(mt, ot, id), 0, id + ": the table cannot say");
        }
        // energy still closes: every output adds up to the photon-flux current, and per wavelength
        double sum = 0;
        for (String id : ALL) {
            assertTrue(out(mt, ot, id) >= 0, id);
            sum += out(mt, ot, id);
        }
        assertEquals(limit(mt), sum, 1e-9 * limit(mt));
        Spectra s = mt.nominalSpectra();
        for (int i = 0; i < s.size(); i++) {
            assertEquals(0, s.closure(i), 1e-12);
            double a = sp.layerAbsorptance().get("absorber")[i];
            double f = Math.min(1.1, 1 + sp.reflectance()[i] / a);
            assertEquals(f * a, s.layerAbsorptance().get("absorber")[i], 1e-14);
            assertEquals(f * sp.absorberEqe()[i], s.absorberEqe()[i], 1e-14);
        }
        // the diode follows the raised current
        assertTrue(out(mt, ot, "voc") > out(mp, op, "voc"));
    }

    @Test
    void theCapKeepsTheReflectionNonNegative() throws IOException {
        // common practice (energy conservation): the absorber cannot take more than A + R; with a factor of 3
        // the absorption is min(3 A, A + R) per wavelength, R is clipped at 0 and the clipping is counted
        DeviceModel mt = DeviceModel.of(withTable(uniform(3)).build());
        DeviceModel mp = planar();
        Spectra sp = mp.nominalSpectra();
        double expected = 0;
        int capped = 0;
        for (int i = 0; i < sp.size(); i++) {
            double a = sp.layerAbsorptance().get("absorber")[i];
            double r = sp.reflectance()[i];
            expected += sp.photonFlux()[i] * Math.min(3 * a, a + r);
            capped += 3 * a > a + r ? 1 : 0;
        }
        assertTrue(capped > 0 && capped < sp.size(), "some wavelengths hit the cap: " + capped);
        double[] ot = nominal(mt);
        double jOpt = SolarSpectrum.toMilliampPerCm2(expected);
        assertEquals(jOpt, out(mt, ot, "jsc_optical"), 1e-12 * jOpt);
        Spectra s = mt.nominalSpectra();
        for (int i = 0; i < s.size(); i++) {
            assertTrue(s.reflectance()[i] >= 0);
            assertEquals(0, s.closure(i), 1e-12);
        }
        // counted only for evaluations through the Model's evaluators (not the nominal check nor spectra)
        assertEquals(1, mt.enhancementCapSamples(), "the nominal() call above");
        Evaluator e = mt.newEvaluator();
        e.evaluate(mt.nominalInputs(), new double[ot.length]);
        assertEquals(2, mt.enhancementCapSamples());
        assertEquals(2L * capped, mt.enhancementCapWavelengths());
        assertEquals(0, planar().enhancementCapSamples());
    }

    @Test
    void perWavelengthTableInterpolatedAtTheSample() throws IOException {
        // source: Press et al., Numerical Recipes, 3rd ed. (2007), section 3.6 (multilinear interpolation): at
        // D = 20 nm, a third of the way from 10 to 40 nm, the factor is 1 + (1/3)(0.3) (1 - 0.5 + lambda term)
        Path p = dir.resolve("per-lambda.csv");
        StringBuilder sb = new StringBuilder("diameter_nm,coverage_percent,wavelength_nm,enhancement\n");
        for (double d : new double[] {10, 40}) {
            for (double c : new double[] {1, 10}) {
                for (double w : new double[] {300, 800}) {
                    // E = 1 at D = 10 nm; at 40 nm: 0.9 at 300 nm rising to 1.4 at 800 nm
                    double e = d == 10 ? 1 : 0.9 + 0.5 * (w - 300) / 500;
                    sb.append(d).append(',').append(c).append(',').append(w).append(',').append(e).append('\n');
                }
            }
        }
        Files.writeString(p, sb.toString());
        DeviceModel mt = DeviceModel.of(withTable(p).build());
        Spectra s = mt.nominalSpectra();
        Spectra sp = planar().nominalSpectra();
        for (int i = 0; i < s.size(); i++) {
            double lam = s.wavelengthNm()[i];
            double e40 = 0.9 + 0.5 * (lam - 300) / 500;
            double g = 1 + (e40 - 1) * (20.0 - 10) / 30;
            double a = sp.layerAbsorptance().get("absorber")[i];
            double expected = Math.min(g * a, a + sp.reflectance()[i]);
            assertEquals(expected, s.layerAbsorptance().get("absorber")[i], 1e-13, "at " + lam + " nm");
            if (g < 1) {
                assertEquals(sp.reflectance()[i] + (1 - g) * a, s.reflectance()[i], 1e-13, "lost absorption returns to R");
            }
        }
    }

    @Test
    void outsideTheTableAtTheNominalPoint() throws IOException {
        // common practice: a table is never extrapolated; at the nominal point the error is a study error
        DemoStudy d = withTable(uniform(1.1));
        d.fixed("particles.diameter", 8);
        StudyException se = assertThrows(StudyException.class, () -> DeviceModel.of(d.build()));
        assertEquals("<study>: particles.diameter: 8 nm is outside the enhancement table uniform.csv:"
                + " its diameter_nm axis runs from 10 nm to 40 nm (at the nominal point)", se.getMessage());
        DemoStudy c = withTable(uniform(1.1));
        c.fixed("particles.coverage", 0.15);
        se = assertThrows(StudyException.class, () -> DeviceModel.of(c.build()));
        assertTrue(se.getMessage().contains("15 % is outside the enhancement table uniform.csv: its coverage_percent axis"
                + " runs from 1 % to 10 %"), se.getMessage());
        // a wavelength axis must cover the study's grid
        Path p = dir.resolve("narrow.csv");
        Files.writeString(p, "diameter_nm,coverage_percent,wavelength_nm,enhancement\n10,1,400,1\n10,1,700,1\n10,10,400,1\n"
                + "10,10,700,1\n40,1,400,1\n40,1,700,1\n40,10,400,1\n40,10,700,1\n");
        se = assertThrows(StudyException.class, () -> DeviceModel.of(withTable(p).build()));
        assertEquals("<study>: particles.enhancement_table: narrow.csv covers wavelength_nm 400 to 700; the study's"
                + " wavelength grid runs from 320 to 800 nm", se.getMessage());
        // a broken table is reported with its own file and line
        Path bad = dir.resolve("bad.csv");
        Files.writeString(bad, "diameter_nm,coverage_percent,enhancement\n10,1,1\n10,10,-1\n");
        se = assertThrows(StudyException.class, () -> DeviceModel.of(withTable(bad).build()));
        assertEquals("bad.csv:3: enhancement: must be >= 0 (a ratio of absorptions), got -1", se.getMessage());
        // and the particle cross-sections are not computed when a table replaces the particle optics
        Study ok = withTable(uniform(1.1)).build();
        assertThrows(StudyException.class, () -> DeviceModel.writeParticleCrossSections(ok, dir));
    }

    @Test
    void outsideTheTableWhileSampling() throws IOException {
        // common practice: a sample outside the table is a counted model failure with its own reason
        DemoStudy d = withTable(uniform(1.1));
        d.normal("particles.diameter", 20, 4).normal("particles.coverage", 0.05, 0.01);
        d.fixed("stack.etl.thickness", 60);
        DeviceModel m = DeviceModel.of(d.build());
        Evaluator e = m.newEvaluator();
        double[] o = new double[m.outputs().size()];
        ModelException big = assertThrows(ModelException.class, () -> e.evaluate(new double[] {41, 0.05}, o));
        assertEquals("outside-enhancement-table", big.reason());
        assertTrue(big.getMessage().contains("particles.diameter") && big.getMessage().contains("41 nm"), big.getMessage());
        ModelException few = assertThrows(ModelException.class, () -> e.evaluate(new double[] {20, 0.005}, o));
        assertEquals("outside-enhancement-table", few.reason());
        assertTrue(few.getMessage().contains("0.5 %"), few.getMessage());
        // the edges are inside, and the evaluator recovers after a failure
        e.evaluate(new double[] {40, 0.10}, o);
        double atEdge = o[m.outputIndex("jsc")];
        e.evaluate(new double[] {20, 0.05}, o);
        assertEquals(out(m, nominal(m), "jsc"), o[m.outputIndex("jsc")], 0);
        assertEquals(atEdge, o[m.outputIndex("jsc")], 0, "a uniform table gives the same current everywhere");
        // the particles must still fit in their host (median height = D for spheres; host 30 nm)
        DemoStudy tall = withTable(uniform(1.1));
        tall.normal("particles.diameter", 20, 4);
        DeviceModel mt = DeviceModel.of(tall.build());
        ModelException fit = assertThrows(ModelException.class, () -> mt.newEvaluator().evaluate(new double[] {35}, o));
        assertEquals("particle-layer-outside-host", fit.reason());
    }

    @Test
    void theTemplateReadsTheExampleTable() throws IOException {
        // common practice: the shipped template, with its commented enhancement_table line switched on, runs
        String text = Files.readString(Path.of("studies/inverted-particles-in-etl.yaml"));
        String off = "  # enhancement_table: tables/enhancement-example.csv\n";
        assertTrue(text.contains(off), "the template mentions the example table");
        Path study = dir.resolve("study.yaml");
        Files.writeString(study, text.replace(off, "  enhancement_table: tables/enhancement-example.csv\n"));
        Files.createDirectories(dir.resolve("tables"));
        Files.copy(Path.of("studies/tables/enhancement-example.csv"), dir.resolve("tables/enhancement-example.csv"));
        DeviceModel m = DeviceModel.of(StudyReader.read(study));
        assertEquals("enhancement-example.csv", m.enhancementTable().orElseThrow().source());
        double[] o = nominal(m);
        double sum = 0;
        for (String id : ALL) {
            sum += out(m, o, id);
        }
        assertEquals(limit(m), sum, 1e-9 * limit(m));
        assertTrue(Math.abs(out(m, o, "enhancement") - 1) < 0.2, "the invented factors stay near 1");
    }
}
