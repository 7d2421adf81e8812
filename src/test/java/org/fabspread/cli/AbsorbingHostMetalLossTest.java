package org.fabspread.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.io.PrintWriter;
import java.io.StringWriter;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.List;

import org.fabspread.optics.MaterialLibrary;
import org.fabspread.optics.NkTable;
import org.fabspread.particles.MetalPermittivity;
import org.fabspread.particles.Mie;
import org.fabspread.particles.MieResult;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * Issue 13: the metal loss of a sphere inside the absorber, read through {@code fabspread particles}, against
 * an answer derived here from the internal field (model document §4.2). The old code took the loss-free
 * reference sphere's absorption with the absorbing host's wavenumber (and the dipole term alone): for 60 nm
 * Ag in PTB7:PC71BM it was about 30 % low.
 */
class AbsorbingHostMetalLossTest {

    @TempDir
    Path dir;

    @Test
    void sixtyNanometreSilverInTheAbsorber() throws IOException {
        Path study = dir.resolve("study.yaml");
        Files.writeString(study, String.join("\n",
                "name: 60 nm Ag inside the absorber (invented test case)",
                "wavelengths: {from: 400 nm, to: 700 nm, step: 50 nm}",
                "stack:",
                "  - {name: glass, material: soda-lime-rubin, thickness: 1.1 mm, role: substrate, incoherent: true}",
                "  - {name: ito, material: ito-konig, thickness: 110 nm ± 5 nm at 2 sigma, role: electrode}",
                "  - {name: absorber, material: ptb7-pc71bm-stelling, thickness: 200 nm, role: absorber}",
                "  - {name: back, material: ag-johnson-christy, thickness: 100 nm, role: electrode}",
                "particles:",
                "  metal: ag-johnson-christy",
                "  host: absorber",
                "  placement: 70 nm",
                "  diameter: 60 nm",
                "  coverage: 5 %",
                "collection:",
                "  electron_mu_tau: 2e-9 cm^2/V",
                "  hole_mu_tau: 1e-9 cm^2/V",
                "  built_in_voltage: 0.8 V",
                "  electrons_collected_at: front",
                ""));
        StringWriter out = new StringWriter();
        StringWriter err = new StringWriter();
        int code = Main.run(new String[] {"particles", study.toString(), "--out", dir.toString()},
                new PrintWriter(out), new PrintWriter(err));
        assertEquals(0, code, err.toString());
        List<String> rows = Files.readAllLines(dir.resolve("particles.csv"));
        NkTable ag = MaterialLibrary.bundled().get("ag-johnson-christy");
        NkTable host = MaterialLibrary.bundled().get("ptb7-pc71bm-stelling");
        double r = 30;
        int checked = 0;
        for (String row : rows.subList(1, rows.size())) {
            String[] c = row.split(",");
            double lam = Double.parseDouble(c[0]);
            double got = Double.parseDouble(c[3]);
            double expect = derived(lam, r, ag, host);
            assertTrue(got >= 0);
            assertEquals(expect, got, 1e-5 * expect, "λ " + lam);
            checked++;
        }
        assertEquals(7, checked);
    }

    /**
     * Derived answer. Internal dissipation of a sphere (model document §4.2, Bohren &amp; Huffman 1983 §5.2):
     * σ_int = (2π/λ) V Im ε |3ε_h/(ε + 2ε_h)|² |α/α_qs|² / Re n_h = (2π/λ) Im ε |ε_h|² |α|² / (V |ε − ε_h|² Re n_h)
     * with α = 6π i a_1/k³. The metal loss in the absorbing host is the exact loss of the same sphere in the
     * loss-free host (Re ε_h, 0) — the full Mie series of {@link Mie#compute} with that host's wavenumber
     * k₀ = 2π √(Re ε_h)/λ — times σ_int(ε_h)/σ_int(Re ε_h).
     */
    private static double derived(double lam, double r, NkTable ag, NkTable host) {
        double n = ag.n(lam);
        double k = ag.k(lam);
        double[] eps = new double[2];
        // source: Kreibig & Vollmer (1995) size correction with the study defaults for silver (Ordal et al. 1985,
        // Kittel): ħω_p 9.01 eV, ħγ₀ 0.018 eV, v_F 1.39e6 m/s, A_s = 1, ℓ = 4r/3
        MetalPermittivity.sizeCorrected(lam, n * n - k * k, 2 * n * k, 4 * r / 3, 9.01, 0.018, 1.39e6, 1, eps);
        double hn = host.n(lam);
        double hk = host.k(lam);
        double hRe = hn * hn - hk * hk;
        double hIm = 2 * hn * hk;
        // loss-free reference
        double n0 = Math.sqrt(hRe);
        double k0 = 2 * Math.PI * n0 / lam;
        double[] m0 = sqrt(eps[0] / hRe, eps[1] / hRe);
        MieResult ref = Mie.compute(m0[0], m0[1], k0 * r);
        double loss0 = Math.PI * r * r * ref.qAbs();
        double a0 = dipoleAbs2(ref, k0);
        // absorbing host: m = √(ε/ε_h), real x = k r with k = 2π Re n_h/λ
        double h2 = hRe * hRe + hIm * hIm;
        double[] m = sqrt((eps[0] * hRe + eps[1] * hIm) / h2, (eps[1] * hRe - eps[0] * hIm) / h2);
        double kh = 2 * Math.PI * hn / lam;
        double a = dipoleAbs2(Mie.compute(m[0], m[1], kh * r), kh);
        double intAbs = eps[1] * h2 * a / (((eps[0] - hRe) * (eps[0] - hRe) + (eps[1] - hIm) * (eps[1] - hIm)) * hn);
        double intReal = eps[1] * hRe * hRe * a0 / (((eps[0] - hRe) * (eps[0] - hRe) + eps[1] * eps[1]) * n0);
        return loss0 * intAbs / intReal;
    }

    /** |α|² of α = 6π i a_1/k³. */
    private static double dipoleAbs2(MieResult res, double k) {
        double s = 6 * Math.PI / (k * k * k);
        return s * s * res.a1().abs2();
    }

    private static double[] sqrt(double a, double b) {
        double mod = Math.hypot(a, b);
        double re = Math.sqrt(0.5 * (mod + a));
        double im = Math.copySign(Math.sqrt(0.5 * (mod - a)), b);
        return new double[] {re, im};
    }
}
