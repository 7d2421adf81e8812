package org.fabspread.report;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.Locale;
import java.util.SplittableRandom;

import org.fabspread.sampling.Interval;

/**
 * A realistic report built from synthetic data (seeded, so it is the same every run): what the
 * integrated program will hand a design review, used to look at the charts and to exercise the
 * renderers. Test code only; the product never draws made-up numbers.
 */
final class SampleDocument {

    static final String[] INPUTS = {
        "stack.absorber.thickness", "particles.diameter", "particles.coverage", "stack.etl.thickness",
        "stack.htl.thickness", "stack.ito.thickness",
    };

    private SampleDocument() {
    }

    static ReportDocument build(ChartFactory f) {
        SplittableRandom rng = new SplittableRandom(20240611L);
        List<Section> sections = new ArrayList<>();

        // Monte Carlo: J_sc depends mostly on absorber thickness and particle diameter
        int n = 12000;
        double[] dAbs = new double[n];
        double[] diam = new double[n];
        double[] jsc = new double[n];
        for (int i = 0; i < n; i++) {
            dAbs[i] = 100 + 6 * gauss(rng);
            diam[i] = 40 * Math.exp(0.15 * gauss(rng));
            jsc[i] = 15.8 + 0.06 * (dAbs[i] - 100) - 0.0009 * Math.pow(dAbs[i] - 100, 2)
                    + 0.025 * (diam[i] - 40) + 0.25 * gauss(rng);
        }
        jsc[17] = Double.NaN; // a failed sample
        int met = 0;
        int valid = 0;
        for (double j : jsc) {
            if (Double.isFinite(j)) {
                valid++;
                if (j >= 15.0) {
                    met++;
                }
            }
        }
        double y = (double) met / valid;
        double half = 1.96 * Math.sqrt(y * (1 - y) / valid);
        Chart hist = f.histogram("jsc-histogram", "Short-circuit current density", Quantity.of("J_sc", "mA/cm²"),
                jsc, 15.0, true, y, new Interval(y - half, y + half));
        Chart scatter = f.scatter("jsc-vs-absorber", "J_sc against absorber thickness",
                Quantity.of("stack.absorber.thickness", "nm"), dAbs, Quantity.of("J_sc", "mA/cm²"), jsc);
        sections.add(new Section("summary", "Summary",
                new Paragraph("Monte Carlo over " + n + " samples of the study's process scatter. One sample failed "
                        + "to converge and is left out."),
                new KeyValues(List.of(KeyValues.pair("Target", "J_sc ≥ 15.0 mA/cm²"),
                        KeyValues.pair("Yield", String.format(Locale.ROOT, "%.1f %% (95 %% interval %.1f–%.1f %%)",
                                100 * y, 100 * (y - half), 100 * (y + half))),
                        KeyValues.pair("Samples", n + " (1 failed)"))),
                new Figure(hist, "Distribution of J_sc over the Monte Carlo samples; the dashed line is the target."),
                new Figure(scatter, "J_sc against the absorber thickness, evenly thinned to 5000 samples.")));

        // Sensitivity
        double[] first = {0.52, 0.21, 0.09, 0.04, 0.012, -0.004};
        double[] total = {0.61, 0.27, 0.12, 0.05, 0.02, 0.003};
        double[] fl = new double[6];
        double[] fh = new double[6];
        double[] tl = new double[6];
        double[] th = new double[6];
        for (int i = 0; i < 6; i++) {
            fl[i] = first[i] - 0.03;
            fh[i] = first[i] + 0.035;
            tl[i] = total[i] - 0.02;
            th[i] = total[i] + 0.025;
        }
        fl[5] = Double.NaN; // interval not computed
        fh[5] = Double.NaN;
        Chart sobol = f.varianceContributions("variance-contributions", "Variance contributions to J_sc", INPUTS,
                first, fl, fh, total, tl, th);
        double[] sizes = {256, 512, 1024, 2048, 4096, 8192, 16384};
        double[][] conv = new double[4][sizes.length];
        for (int i = 0; i < 4; i++) {
            for (int k = 0; k < sizes.length; k++) {
                conv[i][k] = total[i] + 1.2 * gauss(rng) / Math.sqrt(sizes[k]);
            }
        }
        Chart convergence = f.convergence("index-convergence", "Convergence of the total indices",
                Quantity.dimensionless("total index S_Ti"), sizes, Arrays.copyOf(INPUTS, 4), conv);
        List<List<String>> rows = new ArrayList<>();
        for (int i = 0; i < 6; i++) {
            rows.add(List.of(INPUTS[i], fmt(first[i]), fmt(total[i]),
                    Double.isNaN(fl[i]) ? "" : fmt(fl[i]) + "–" + fmt(fh[i])));
        }
        sections.add(new Section("sensitivity", "Where the variance comes from",
                new Paragraph("First-order and total Sobol indices of J_sc with 95 % bootstrap intervals."),
                Table.of("Sobol indices of J_sc", List.of("input", "S_i", "S_Ti", "interval of S_i"), rows),
                new Figure(sobol, "First-order and total indices per input, largest total on top."),
                new Figure(convergence, "Total indices against the base sample size."),
                new Caution("The indices assume independent inputs. Coverage and diameter are correlated in this "
                        + "study; their indices are those of the independent underlying variables.")));

        // Tolerance
        double[] gain = {0.061, 0.034, 0.012, 0.004, 0.001, 0.0};
        Chart ranking = f.toleranceRanking("tolerance-ranking", "Yield gained by halving each input's spread",
                INPUTS, gain);
        double[] cost = {1, 1.6, 2.2, 3.1, 4.5, 6.0, 8.2};
        double[] alloc = {0.873, 0.905, 0.926, 0.941, 0.952, 0.958, 0.962};
        Chart tradeoff = f.allocationTradeoff("allocation-tradeoff", "Tolerance allocation: cost against yield",
                Quantity.of("relative process cost", "1 = today"), cost, alloc, 0.95);
        sections.add(new Section("tolerance", "What tightening buys",
                new Figure(ranking, "Yield gained when one input's standard deviation is halved, others unchanged."),
                new Figure(tradeoff, "Cheapest allocations for a range of yields; dashed: the goal.")));

        // Device
        int nw = 101;
        double[] wl = new double[nw];
        String[] layers = {"ITO", "PEDOT:PSS", "absorber", "ZnO", "Ag particles", "Ag contact"};
        double[][] a = new double[layers.length][nw];
        double[] eqe = new double[nw];
        double[] r = new double[nw];
        for (int j = 0; j < nw; j++) {
            double l = 300 + 5 * j;
            wl[j] = l;
            a[0][j] = 0.25 * Math.exp(-(l - 300) / 40) + 0.02;
            a[1][j] = 0.02 + 0.02 * (l - 300) / 500;
            a[2][j] = 0.55 * Math.exp(-Math.pow((l - 520) / 90, 2)) + 0.2 * Math.exp(-Math.pow((l - 380) / 40, 2));
            a[3][j] = l < 380 ? 0.1 * (380 - l) / 80 : 0;
            a[4][j] = 0.06 * Math.exp(-Math.pow((l - 450) / 50, 2));
            a[5][j] = 0.03;
            eqe[j] = 0.82 * a[2][j];
            double sum = 0;
            for (double[] row : a) {
                sum += row[j];
            }
            r[j] = Math.min(1 - sum, 0.08 + 0.1 * Math.pow((l - 300) / 500, 2));
        }
        Chart spectra = f.absorptionSpectra("absorption-spectra", "Nominal absorption by layer", wl, layers, a, eqe, r);
        int nx = 101;
        double[] x = new double[nx];
        double[][] g = new double[2][nx];
        for (int k = 0; k < nx; k++) {
            x[k] = k;
            g[0][k] = 1e22 * (0.8 * Math.exp(-k / 60.0) + 0.35 * Math.pow(Math.sin(Math.PI * (k + 30) / 110), 2));
            g[1][k] = 1e22 * (0.7 * Math.exp(-k / 60.0) + 0.3 * Math.pow(Math.sin(Math.PI * (k + 30) / 110), 2));
        }
        Chart gen = f.generationProfile("generation-profile", "Generation in the absorber", x,
                new String[] {"with particles", "planar reference"}, g, "cm⁻³ s⁻¹");
        double[] ext = new double[nw];
        double[] sca = new double[nw];
        double[] abs = new double[nw];
        for (int j = 0; j < nw; j++) {
            double l = wl[j];
            double lor = 1 / (1 + Math.pow((l - 430) / 35, 2));
            abs[j] = 2600 * lor + 150;
            sca[j] = 1900 * lor * Math.pow(430 / l, 4) + 60;
            ext[j] = abs[j] + sca[j];
        }
        Chart xs = f.crossSections("particle-cross-sections", "Ag particle, D = 40 nm, in the host", wl, ext, sca,
                abs, "nm²");
        sections.add(new Section("device", "The nominal device",
                new Figure(spectra, "Absorptance of each layer stacked in stack order, the absorber's EQE (dashed) "
                        + "and 1 − R (dotted)."),
                new Figure(gen, "Generation rate against depth in the absorber."),
                new Figure(xs, "Cross-sections of one particle of the nominal diameter.")));

        // Plan
        String[] effects = {"A: d_absorber", "B: D_particle", "C: coverage", "D: d_ETL", "AB", "AC", "AD", "BC",
            "BD", "CD", "ABC", "ABD", "ACD", "BCD", "ABCD"};
        double[] predicted = {0.74, 0.41, -0.22, 0.08, 0.05, -0.03, 0.01, 0.12, 0.0, -0.02, 0.01, 0.0, 0.0, 0.01, 0.0};
        double[] measured = new double[effects.length];
        for (int i = 0; i < effects.length; i++) {
            measured[i] = predicted[i] + 0.05 * gauss(rng);
        }
        double[] absE = new double[measured.length];
        for (int i = 0; i < measured.length; i++) {
            absE[i] = Math.abs(measured[i]);
        }
        double s0 = 1.5 * median(absE);
        double[] small = Arrays.stream(absE).filter(v -> v < 2.5 * s0).toArray();
        double pse = 1.5 * median(small);
        Chart pred = f.predictedEffects("predicted-effects", "Predicted effects of the 2^4 plan",
                Quantity.of("J_sc", "mA/cm²"), effects, predicted);
        Chart hn = f.halfNormal("half-normal", "Measured effects, half-normal plot", Quantity.of("J_sc", "mA/cm²"),
                effects, measured, 2.571 * pse, 5.219 * pse, 3);
        sections.add(new Section("plan", "Experiment plan",
                new Figure(pred, "Effects the model predicts for the plan, sorted by size."),
                new Figure(hn, "Measured effects; dashed ME and dotted SME from Lenth's pseudo standard error."),
                new Preformatted("plan:\n  design: fractional\n  factors: [A, B, C, D]\n  replicates: 1\n")));

        sections.add(new Section("limits", "Limits of this model and cautions",
                new BulletList(List.of("The particle layer is laterally homogeneous: no grating or guided-mode coupling.",
                        "Particles are independent beyond Maxwell Garnett mixing.")),
                new Caution("The near field reaching the absorber is a dipole estimate without the interface's image field.")));
        return new ReportDocument("Process scatter of the plasmonic cell, study demo.yaml",
                "fabspread report — synthetic data for the renderer tests", sections);
    }

    private static String fmt(double v) {
        return String.format(Locale.ROOT, "%.3f", v);
    }

    private static double median(double[] v) {
        double[] s = v.clone();
        Arrays.sort(s);
        int m = s.length;
        return m % 2 == 1 ? s[m / 2] : 0.5 * (s[m / 2 - 1] + s[m / 2]);
    }

    /** Standard normal by Box–Muller (Box &amp; Muller, Ann. Math. Stat. 29, 610 (1958)). */
    static double gauss(SplittableRandom rng) {
        double u = 1 - rng.nextDouble();
        double v = rng.nextDouble();
        return Math.sqrt(-2 * Math.log(u)) * Math.cos(2 * Math.PI * v);
    }
}
