package org.fabspread.device;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertNotEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;

import org.fabspread.model.Evaluator;
import org.fabspread.model.ModelException;
import org.fabspread.model.OutputDef;
import org.fabspread.optics.PlanarOptics;
import org.fabspread.optics.SolarSpectrum;
import org.fabspread.study.ParticleLayer;
import org.fabspread.study.Study;
import org.fabspread.study.StudyException;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

class DeviceModelTest {

    private static double out(DeviceModel m, double[] o, String id) {
        int i = m.outputIndex(id);
        assertTrue(i >= 0, "no output " + id);
        return o[i];
    }

    private static double[] nominal(DeviceModel m) {
        return m.evaluate(m.nominalInputs());
    }

    @Test
    void inputsAreTheUncertainParametersInOrder() {
        DemoStudy d = new DemoStudy();
        d.normal("stack.absorber.thickness", 100, 5).normal("particles.coverage", 0.05, 0.01)
                .normal("stack.etl.thickness", 30, 1);
        DeviceModel m = DeviceModel.of(d.build());
        // document order of Study.parameters(): the stack first, then the particles
        assertEquals(List.of("stack.etl.thickness", "stack.absorber.thickness", "particles.coverage"), m.inputIds());
        List<String> ids = m.outputs().stream().map(OutputDef::id).toList();
        assertTrue(ids.containsAll(List.of("jsc", "jsc_optical", "absorber_absorptance", "loss_metal", "loss_electrodes",
                "loss_transport", "loss_scattering", "loss_quenching", "loss_collection")));
        assertEquals(-1, m.outputIndex("jsc_planar"));
        assertEquals(-1, m.outputIndex("voc"));
        assertEquals("mA/cm^2", m.outputs().get(m.outputIndex("jsc")).unit());
        d.planarReference = true;
        d.diode = true;
        DeviceModel full = DeviceModel.of(d.build());
        for (String id : new String[] {"jsc_planar", "enhancement", "voc", "ff", "efficiency"}) {
            assertTrue(full.outputIndex(id) >= 0, id);
        }
        assertThrows(IllegalArgumentException.class, () -> full.evaluate(new double[2]));
    }

    @Test
    void energyClosesAtEveryWavelength() {
        // source: device-model.md sections 2-4.5: R + T + every absorbed and lost share = 1 at every wavelength
        DemoStudy[] cases = new DemoStudy[5];
        cases[0] = new DemoStudy();
        cases[1] = new DemoStudy();
        cases[1].aligned = true;
        cases[1].fixed("particles.in_plane_aspect", 1.6).fixed("particles.out_of_plane_aspect", 0.6);
        cases[2] = new DemoStudy();
        cases[2].fixed("particles.in_plane_aspect", 1.6).fixed("particles.out_of_plane_aspect", 0.6);
        cases[3] = new DemoStudy();
        cases[3].host = "absorber";
        cases[3].placement = ParticleLayer.Placement.OFFSET;
        cases[3].fixed("particles.offset", 30).fixed("collection.quenching_distance", 3);
        cases[4] = new DemoStudy();
        cases[4].host = "htl";
        cases[4].fixed("stack.htl.thickness", 20).fixed("particles.diameter", 12).fixed("particles.coverage", 0.1);
        for (DemoStudy d : cases) {
            DeviceModel m = DeviceModel.of(d.build());
            Spectra s = m.nominalSpectra();
            double maxSca = 0;
            for (int i = 0; i < s.size(); i++) {
                assertEquals(0, s.closure(i), 1e-9, "host " + d.host + " at " + s.wavelengthNm()[i]);
                maxSca = Math.max(maxSca, s.particleScattering()[i]);
                assertEquals(s.particleScattering()[i], s.diffuseAbsorbed()[i] + s.scatteringLost()[i], 1e-15);
            }
            assertTrue(maxSca > 0, "the particles scatter");
        }
    }

    @Test
    void photonFluxIsAccountedFor() {
        // source: device-model.md section 6 (losses by cause) with energy closure: jsc + every loss + reflection
        // + transmission equals the photon-flux current of the grid
        DemoStudy d = new DemoStudy();
        d.fixed("collection.quenching_distance", 2);
        DeviceModel m = DeviceModel.of(d.build());
        double[] o = nominal(m);
        double[] flux = SolarSpectrum.astmG173Global().photonFluxPerBin(d.build().grid());
        double total = 0;
        for (double f : flux) {
            total += f;
        }
        double limit = SolarSpectrum.toMilliampPerCm2(total);
        double sum = 0;
        for (String id : new String[] {"jsc", "loss_collection", "loss_quenching", "loss_metal", "loss_electrodes",
                "loss_transport", "loss_substrate", "loss_scattering", "loss_reflection", "loss_transmission"}) {
            double x = out(m, o, id);
            assertTrue(x >= 0, id + " = " + x);
            sum += x;
        }
        assertEquals(limit, sum, 1e-9 * limit);
        assertEquals(out(m, o, "absorber_absorptance"),
                (out(m, o, "jsc_optical") + out(m, o, "loss_quenching")) / limit, 1e-12);
    }

    @Test
    void currentStaysBelowTheLimits() {
        // source: shared/data/PROVENANCE.md: complete absorption 280-800 nm gives 27.27 mA/cm^2
        DemoStudy d = new DemoStudy();
        d.fixed("particles.coverage", 0.2);
        for (DemoStudy s : new DemoStudy[] {new DemoStudy(), d}) {
            DeviceModel m = DeviceModel.of(s.build());
            double[] o = nominal(m);
            assertTrue(out(m, o, "jsc") <= out(m, o, "jsc_optical"));
            assertTrue(out(m, o, "jsc_optical") < 27.27);
            assertTrue(out(m, o, "jsc") > 5, "a 100 nm PTB7:PC71BM cell gives a sizeable current");
        }
    }

    @Test
    void perfectCollectionGivesTheOpticalCurrent() {
        // source: Hecht, Z. Phys. 77, 235 (1932): eta -> 1 for drift lengths >> d; with dissociation 1 every
        // absorbed photon is collected
        DemoStudy d = new DemoStudy();
        d.fixed("collection.electron_mu_tau", 1.0).fixed("collection.hole_mu_tau", 1.0)
                .fixed("collection.dissociation", 1.0);
        DeviceModel m = DeviceModel.of(d.build());
        double[] o = nominal(m);
        assertEquals(out(m, o, "jsc_optical"), out(m, o, "jsc"), 1e-6 * out(m, o, "jsc"));
        // and dissociation scales the collected current exactly
        d.fixed("collection.dissociation", 0.8);
        DeviceModel m8 = DeviceModel.of(d.build());
        assertEquals(0.8 * out(m, o, "jsc"), out(m8, nominal(m8), "jsc"), 1e-9);
    }

    @Test
    void zeroCoverageIsThePlanarStack() {
        // source: device-model.md section 4.4: theta -> 0 gives exactly the planar stack
        DemoStudy zero = new DemoStudy();
        zero.fixed("particles.coverage", 0);
        zero.planarReference = true;
        zero.diode = true;
        DemoStudy plain = new DemoStudy();
        plain.particles = false;
        plain.planarReference = true;
        plain.diode = true;
        DeviceModel mz = DeviceModel.of(zero.build());
        DeviceModel mp = DeviceModel.of(plain.build());
        double[] oz = nominal(mz);
        double[] op = nominal(mp);
        for (int i = 0; i < oz.length; i++) {
            assertEquals(op[i], oz[i], 1e-12 * Math.max(1, Math.abs(op[i])), mz.outputs().get(i).id());
        }
        assertEquals(out(mz, oz, "jsc"), out(mz, oz, "jsc_planar"), 0);
        assertEquals(0, out(mz, oz, "loss_metal"), 0);
        // cross-check the optical current with the optics package's own planar evaluation
        PlanarOptics po = PlanarOptics.of(plain.build());
        double optical = po.evaluateNominal(po.newResult());
        assertEquals(optical, out(mp, op, "jsc_optical"), 1e-9 * optical);
    }

    @Test
    void particlesOfTheHostMaterialAreInvisible() {
        // source: device-model.md section 4.4: metal eps = host eps gives exactly the planar stack
        // (zno-stelling as the "metal", no size correction: A_s = 0)
        DemoStudy same = new DemoStudy();
        same.fixed("particles.surface_scattering", 0).fixed("particles.coverage", 0.2);
        Study s = same.build();
        ParticleLayer pl = s.particles();
        ParticleLayer ghost = new ParticleLayer(org.fabspread.study.MaterialRef.bundled("zno-stelling"), pl.host(),
                pl.placement(), pl.offset(), pl.diameter(), pl.sizeCv(), pl.inPlaneAspect(), pl.outOfPlaneAspect(),
                pl.coverage(), pl.forwardFraction(), pl.aligned(), pl.mixingRule(), pl.metalParameters(), null);
        Study ghostStudy = new Study(null, "ghost", "", s.grid(), s.stack(), ghost, s.collection(), null, List.of(),
                s.analysis(), null, java.util.Map.of(), List.of());
        DemoStudy plain = new DemoStudy();
        plain.particles = false;
        DeviceModel mg = DeviceModel.of(ghostStudy);
        DeviceModel mp = DeviceModel.of(plain.build());
        double[] og = nominal(mg);
        double[] op = nominal(mp);
        for (String id : new String[] {"jsc", "jsc_optical", "loss_reflection", "loss_transmission", "loss_electrodes"}) {
            assertEquals(out(mp, op, id), out(mg, og, id), 1e-9, id);
        }
        assertEquals(0, out(mg, og, "loss_scattering"), 1e-12);
        // the host-material "metal" absorbs like the host it replaces: transport + metal = planar transport
        assertEquals(out(mp, op, "loss_transport"), out(mg, og, "loss_transport") + out(mg, og, "loss_metal"), 1e-9);
    }

    @Test
    void moreCoverageMoreMetalLoss() {
        // common practice: more metal particles absorb more parasitically
        double prev = 0;
        for (double cov : new double[] {0.01, 0.05, 0.1, 0.2}) {
            DemoStudy d = new DemoStudy();
            d.fixed("particles.coverage", cov);
            DeviceModel m = DeviceModel.of(d.build());
            double metal = out(m, nominal(m), "loss_metal");
            assertTrue(metal > prev, "coverage " + cov);
            prev = metal;
        }
    }

    @Test
    void particleLayerOutsideItsHost() {
        // source: device-model.md section 4.3: a particle layer thicker than its host is an input error
        DemoStudy big = new DemoStudy();
        big.fixed("particles.diameter", 40);
        StudyException se = assertThrows(StudyException.class, () -> DeviceModel.of(big.build()));
        assertTrue(se.getMessage().contains("particles.diameter"), se.getMessage());
        DemoStudy off = new DemoStudy();
        off.placement = ParticleLayer.Placement.OFFSET;
        off.fixed("particles.offset", 15);
        assertThrows(StudyException.class, () -> DeviceModel.of(off.build()));
        DemoStudy sampled = new DemoStudy();
        sampled.normal("particles.diameter", 20, 4);
        DeviceModel m = DeviceModel.of(sampled.build());
        Evaluator e = m.newEvaluator();
        double[] o = new double[m.outputs().size()];
        // a sampled particle taller than its 30 nm host sticks out into the ITO in front of it (placement back,
        // 150 nm): computed; one taller than host and ITO together is still refused
        e.evaluate(new double[] {35}, o);
        assertTrue(o[0] > 0);
        ModelException me = assertThrows(ModelException.class, () -> e.evaluate(new double[] {185}, o));
        assertEquals("particle-layer-outside-host", me.reason());
        e.evaluate(new double[] {25}, o);
        assertTrue(o[0] > 0);
        ModelException nan = assertThrows(ModelException.class, () -> e.evaluate(new double[] {Double.NaN}, o));
        assertEquals("nan", nan.reason());
    }

    @Test
    void badCollectionInputs() {
        // source: device-model.md section 5: V_bi <= 0 is an input error
        DemoStudy d = new DemoStudy();
        d.fixed("collection.built_in_voltage", 0);
        StudyException se = assertThrows(StudyException.class, () -> DeviceModel.of(d.build()));
        assertTrue(se.getMessage().contains("collection.built_in_voltage"), se.getMessage());
        DemoStudy s = new DemoStudy();
        s.normal("collection.built_in_voltage", 0.8, 0.1).normal("stack.ito.thickness", 150, 10);
        DeviceModel m = DeviceModel.of(s.build());
        double[] o = new double[m.outputs().size()];
        assertEquals(List.of("stack.ito.thickness", "collection.built_in_voltage"), m.inputIds());
        assertThrows(ModelException.class, () -> m.newEvaluator().evaluate(new double[] {150, -0.1}, o));
        ModelException neg = assertThrows(ModelException.class, () -> m.newEvaluator().evaluate(new double[] {-1, 0.8}, o));
        assertEquals("negative-thickness", neg.reason());
    }

    @Test
    void alignedAndRandomOrientation() {
        // source: device-model.md section 4.4: aligned particles average two polarisation solves; for p = 1
        // both descriptions are the same particle layer
        DemoStudy a = new DemoStudy();
        a.aligned = true;
        DemoStudy r = new DemoStudy();
        DeviceModel ma = DeviceModel.of(a.build());
        DeviceModel mr = DeviceModel.of(r.build());
        assertEquals(out(mr, nominal(mr), "jsc"), out(ma, nominal(ma), "jsc"), 1e-13);
        a.fixed("particles.in_plane_aspect", 2).fixed("particles.out_of_plane_aspect", 0.5);
        r.fixed("particles.in_plane_aspect", 2).fixed("particles.out_of_plane_aspect", 0.5);
        double ja = out(DeviceModel.of(a.build()), nominal(DeviceModel.of(a.build())), "loss_metal");
        double jr = out(DeviceModel.of(r.build()), nominal(DeviceModel.of(r.build())), "loss_metal");
        assertNotEquals(ja, jr);
        assertEquals(ja, jr, 0.5 * ja, "the two approximations stay close");
    }

    @Test
    void collectionWeightsTheProfileByHecht() {
        // source: Hecht, Z. Phys. 77, 235 (1932) and device-model.md section 5: J_sc = q eta_d int G(x) eta(x) dx;
        // the model's closed-form weighted integrals against a midpoint rule on the recorded profile,
        // for both orientations (inverted and conventional cells)
        for (boolean front : new boolean[] {true, false}) {
            DemoStudy d = new DemoStudy();
            d.particles = false;
            d.electronsAtFront = front;
            d.fixed("collection.hole_mu_tau", 3e-11).fixed("collection.electron_mu_tau", 2e-10);
            DeviceModel m = DeviceModel.of(d.build());
            double jsc = out(m, nominal(m), "jsc");
            Spectra s = m.nominalSpectra();
            HechtCollection h = HechtCollection.of(2e-10, 3e-11, 0.8, 100, front);
            double dx = s.depthNm()[1] - s.depthNm()[0];
            double photons = 0;
            for (int k = 0; k < s.depthNm().length; k++) {
                photons += s.generation()[k] * h.eta(s.depthNm()[k]) * dx / 1e3;
            }
            assertEquals(jsc, 0.95 * SolarSpectrum.toMilliampPerCm2(photons), 2e-3 * jsc, "front=" + front);
        }
        // the orientation changes the collected current, not the optics
        DemoStudy inv = new DemoStudy();
        inv.fixed("collection.hole_mu_tau", 1e-11);
        DemoStudy conv = new DemoStudy();
        conv.electronsAtFront = false;
        conv.fixed("collection.hole_mu_tau", 1e-11);
        DeviceModel mi = DeviceModel.of(inv.build());
        DeviceModel mc = DeviceModel.of(conv.build());
        assertNotEquals(out(mc, nominal(mc), "jsc"), out(mi, nominal(mi), "jsc"));
        assertEquals(out(mc, nominal(mc), "jsc_optical"), out(mi, nominal(mi), "jsc_optical"), 1e-12);
    }

    @Test
    void diodeOutputsFollowTheOneDiodeModel() {
        // source: Jain & Kapoor 2004 via OneDiode, with J_L = the collected J_sc
        DemoStudy d = new DemoStudy();
        d.diode = true;
        DeviceModel m = DeviceModel.of(d.build());
        double[] o = nominal(m);
        OneDiode.Performance p = new OneDiode(out(m, o, "jsc"), 1e-7, 1.5, 2, 1000, 298.15).performance();
        assertEquals(p.openCircuitVoltage(), out(m, o, "voc"), 1e-12);
        assertEquals(p.fillFactor(), out(m, o, "ff"), 1e-12);
        assertEquals(p.efficiency(), out(m, o, "efficiency"), 1e-12);
    }

    @Test
    void spectraAgreeWithTheOutputs() {
        // source: device-model.md section 5: J_sc = q sum_bins Phi * EQE; the depth profile integrates to the
        // absorber's coherent absorption (midpoint rule on 100 points)
        DemoStudy d = new DemoStudy();
        DeviceModel m = DeviceModel.of(d.build());
        double[] o = nominal(m);
        Spectra s = m.nominalSpectra();
        double col = 0;
        double coherent = 0;
        for (int i = 0; i < s.size(); i++) {
            col += s.photonFlux()[i] * s.absorberEqe()[i];
            coherent += s.photonFlux()[i] * s.layerAbsorptance().get("absorber")[i];
        }
        assertEquals(out(m, o, "jsc"), SolarSpectrum.toMilliampPerCm2(col), 1e-9);
        assertEquals("absorber", s.absorberName());
        double dx = s.depthNm()[1] - s.depthNm()[0];
        double g = 0;
        for (double x : s.generation()) {
            g += x * dx;
        }
        // cm^-3 s^-1 nm -> m^-2 s^-1: divide by 1e3
        assertEquals(coherent, g / 1e3, 2e-3 * coherent);
        assertTrue(s.layerAbsorptance().containsKey("etl") && !s.layerAbsorptance().containsKey("glass"));
    }

    @Test
    void samplesOverwriteOnlyTheirSlots() {
        // common practice: a sample at the nominal values reproduces the nominal evaluation exactly
        DemoStudy d = new DemoStudy();
        d.normal("particles.coverage", 0.05, 0.01).normal("stack.absorber.thickness", 100, 5);
        DeviceModel m = DeviceModel.of(d.build());
        Evaluator e = m.newEvaluator();
        double[] a = new double[m.outputs().size()];
        double[] b = new double[m.outputs().size()];
        e.evaluate(new double[] {110, 0.08}, a);
        e.evaluate(m.nominalInputs(), b);
        assertNotEquals(a[0], b[0]);
        DemoStudy fixed = new DemoStudy();
        DeviceModel mf = DeviceModel.of(fixed.build());
        assertEquals(nominal(mf)[0], b[0], 0);
        // and the cache of the particle optics gives the same numbers as a fresh evaluator
        double[] c = new double[m.outputs().size()];
        m.newEvaluator().evaluate(new double[] {110, 0.08}, c);
        e.evaluate(new double[] {110, 0.08}, b);
        assertEquals(c[0], a[0], 0);
        assertEquals(c[0], b[0], 0);
    }

    @Test
    void particleCrossSectionsFile(@TempDir Path dir) throws Exception {
        // source: device-model.md section 4.3: per-area values are n_A sigma; extinction = absorption + scattering
        DemoStudy d = new DemoStudy();
        DeviceModel.writeParticleCrossSections(d.build(), dir);
        List<String> lines = Files.readAllLines(dir.resolve("particles.csv"));
        assertEquals(1 + 121, lines.size());
        assertTrue(lines.get(0).startsWith("wavelength_nm,extinction_nm2,scattering_nm2,absorption_nm2"));
        double nA = 0.05 / (Math.PI * 100 * 1.04 * 1.04);
        for (String line : lines.subList(1, lines.size())) {
            String[] f = line.split(",");
            double ext = Double.parseDouble(f[1]);
            double sca = Double.parseDouble(f[2]);
            double abs = Double.parseDouble(f[3]);
            assertEquals(ext, sca + abs, 1e-6 * ext);
            assertTrue(sca > 0 && abs > 0);
            // n_A = theta / (pi <ab>), <ab> = <D^2>/4 = D50^2 e^{2 sigma_ln^2}/4 = 100 (1 + CV^2)^2 nm^2
            // source: device-model.md section 4.3 (the quadrature reproduces the lognormal moment closely)
            assertEquals(nA * ext, Double.parseDouble(f[4]), 1e-4 * nA * ext);
        }
    }
}
