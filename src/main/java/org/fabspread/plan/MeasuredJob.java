package org.fabspread.plan;

import java.io.IOException;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.HashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;

import org.fabspread.io.AtomicFiles;
import org.fabspread.model.Evaluator;
import org.fabspread.model.Model;
import org.fabspread.sampling.InputSpace;
import org.fabspread.study.Layer;
import org.fabspread.study.PlanSettings;
import org.fabspread.study.Study;
import org.fabspread.study.StudyException;

/**
 * Analyses a filled run sheet: reads it back, codes the settings with the study's factor levels,
 * estimates the effects ({@link EffectAnalysis}), sets the model's predicted effects beside them (the
 * same analysis applied to the model's noise-free predictions at the same settings), calibrates up to
 * three model inputs against the measured runs ({@link Calibration}), and writes {@code measured.json}
 * and {@code measured.txt}.
 */
public final class MeasuredJob {

    private MeasuredJob() {
    }

    /** Calibrates the default inputs: exciton dissociation and the absorber's k scale, when uncertain. */
    public static MeasuredReport run(Study study, Model model, InputSpace space, Path runSheetCsv, Path outDir)
            throws IOException {
        List<String> cal = new ArrayList<>();
        cal.add("collection.dissociation");
        for (Layer l : study.stack()) {
            if (l.isAbsorber() && l.kScale() != null) {
                cal.add(l.kScale().id());
            }
        }
        return run(study, model, space, runSheetCsv, outDir, cal);
    }

    /** As {@link #run(Study, Model, InputSpace, Path, Path)} with the inputs to calibrate named. */
    public static MeasuredReport run(Study study, Model model, InputSpace space, Path runSheetCsv, Path outDir,
                                     List<String> calibrate) throws IOException {
        String fname = runSheetCsv.getFileName().toString();
        RunSheet.Measured m = RunSheet.read(runSheetCsv);
        List<Factor> factors = FactorLevels.of(study, space, m.factorIds());
        for (int i = 0; i < factors.size(); i++) {
            if (!factors.get(i).sheetUnit().equals(m.units().get(i))) {
                throw new StudyException(fname + ":1: " + m.factorIds().get(i) + " [" + m.units().get(i)
                        + "]: the sheet says [" + m.units().get(i) + "] but the plan writes this input in ["
                        + factors.get(i).sheetUnit() + "]");
            }
        }
        double[][] real = new double[m.real().length][factors.size()];
        for (int r = 0; r < real.length; r++) {
            for (int i = 0; i < factors.size(); i++) {
                real[r][i] = factors.get(i).fromSheet(m.real()[r][i]);
            }
        }
        int out = model.outputIndex(m.response());
        if (out < 0) {
            throw new StudyException(fname + ":1: " + RunSheet.MEASURED_PREFIX + m.response()
                    + ": the model has no output " + m.response());
        }
        String unit = model.outputs().get(out).unit();
        PlanSettings s = study.plan() == null ? PlanJob.defaults() : study.plan();
        double alpha = s.alpha() > 0 && s.alpha() < 1 ? s.alpha() : 0.05;
        int n = m.measured().length;
        int k = factors.size();
        double[][] coded = new double[n][k];
        for (int r = 0; r < n; r++) {
            for (int i = 0; i < k; i++) {
                coded[r][i] = snap(factors.get(i), real[r][i]);
            }
        }
        // model predictions at the same settings, others nominal
        int nIn = model.inputIds().size();
        double[] nominal = new double[nIn];
        for (int i = 0; i < nIn; i++) {
            int si = space.ids().indexOf(model.inputIds().get(i));
            nominal[i] = si >= 0 ? space.marginals().get(si).nominal() : Double.NaN;
        }
        int[] fIdx = new int[k];
        for (int i = 0; i < k; i++) {
            fIdx[i] = model.inputIndex(factors.get(i).id());
        }
        double[] predY = predictions(model, nominal, fIdx, real, out);
        List<String> notes = new ArrayList<>();
        Map<String, Double> predicted = new HashMap<>();
        EffectAnalysis.Result predAnalysis = EffectAnalysis.analyse(coded, predY, m.factorIds(), Map.of(), alpha);
        for (EffectAnalysis.Estimate e : predAnalysis.effects()) {
            predicted.put(e.label(), e.estimate());
        }
        EffectAnalysis.Result analysis = EffectAnalysis.analyse(coded, m.measured(), m.factorIds(), predicted, alpha);

        // the effect analysis is written first: a calibration that fails cannot lose it
        MeasuredReport first = new MeasuredReport(study.name(), fname, m.response(), unit, factors, analysis, null,
                notes);
        write(first, outDir);
        List<Integer> fit = new ArrayList<>();
        List<Double> scale = new ArrayList<>();
        List<double[]> ranges = new ArrayList<>();
        for (String id : calibrate) {
            int mi = model.inputIndex(id);
            int si = space.ids().indexOf(id);
            if (mi < 0 || si < 0) {
                notes.add("calibration: " + id + " is not an uncertain model input; skipped");
            } else if (m.factorIds().contains(id)) {
                notes.add("calibration: " + id + " is a plan factor; skipped");
            } else if (fit.size() < 3) {
                fit.add(mi);
                double sd = space.marginals().get(si).standardDeviation();
                scale.add(sd > 0 ? sd : Math.abs(nominal[mi]));
                ranges.add(physicalRange(study.parameters().containsKey(id) ? study.parameters().get(id).unit() : "1"));
            }
        }
        Calibration.Result cal = null;
        if (!fit.isEmpty()) {
            if (n <= fit.size()) {
                notes.add("calibration: " + n + " runs cannot fit " + fit.size() + " inputs; skipped");
            } else {
                double[][] settings = real;
                try {
                    cal = Calibration.fit(model, m.response(), nominal, fIdx, settings, m.measured(),
                            fit.stream().mapToInt(Integer::intValue).toArray(),
                            scale.stream().mapToDouble(Double::doubleValue).toArray(),
                            ranges.stream().mapToDouble(r -> r[0]).toArray(),
                            ranges.stream().mapToDouble(r -> r[1]).toArray(), 0.95);
                } catch (IllegalStateException e) {
                    notes.add("calibration failed: " + e.getMessage() + "; the effects above do not depend on it");
                }
            }
        }
        MeasuredReport rep = new MeasuredReport(study.name(), fname, m.response(), unit, factors, analysis, cal, notes);
        write(rep, outDir);
        return rep;
    }

    /** The model's noise-free response at each run's settings, every other input at nominal. */
    private static double[] predictions(Model model, double[] nominal, int[] fIdx, double[][] real, int out) {
        Evaluator ev = model.newEvaluator();
        double[] x = new double[nominal.length];
        double[] o = new double[model.outputs().size()];
        double[] predY = new double[real.length];
        for (int r = 0; r < real.length; r++) {
            System.arraycopy(nominal, 0, x, 0, x.length);
            for (int i = 0; i < fIdx.length; i++) {
                x[fIdx[i]] = real[r][i];
            }
            ev.evaluate(x, o);
            predY[r] = o[out];
        }
        return predY;
    }

    private static void write(MeasuredReport rep, Path outDir) throws IOException {
        java.nio.file.Files.createDirectories(outDir);
        AtomicFiles.writeString(outDir.resolve("measured.json"), PlanJob.json().writeValueAsString(rep));
        AtomicFiles.writeString(outDir.resolve("measured.txt"), text(rep));
    }

    /**
     * The physical range of an input by its canonical unit: a fraction lies in [0, 1]; lengths, scales,
     * mobility-lifetime products, resistances, temperatures and current densities are ≥ 0; anything
     * else (voltages, energies) is unbounded.
     */
    static double[] physicalRange(String unit) {
        return switch (unit) {
            case Factor.FRACTION -> new double[] {0, 1};
            case "nm", "1", "cm^2/V", "ohm cm^2", "K", "mA/cm^2" -> new double[] {0, Double.POSITIVE_INFINITY};
            default -> new double[] {Double.NEGATIVE_INFINITY, Double.POSITIVE_INFINITY};
        };
    }

    /**
     * The coded level of a setting: exactly −1, 0 or +1 when the setting is within half the factor's
     * precision (or 1e-4 coded units) of the setting the plan wrote for that level, so that a centre
     * rounded to the run sheet's precision still counts as the centre.
     */
    static double snap(Factor f, double real) {
        double c = f.coded(real);
        double r = Math.rint(c);
        if (Math.abs(r) > 1) {
            return c;
        }
        double tol = Math.max(0.5 * f.precision(), 1e-4 * f.halfRange());
        return Math.abs(real - f.setting(r)) <= tol + 1e-12 * Math.abs(real) || Math.abs(c - r) < 1e-4 ? r : c;
    }

    public static String text(MeasuredReport r) {
        StringBuilder b = new StringBuilder();
        EffectAnalysis.Result a = r.analysis();
        b.append("Measured results of ").append(r.runSheet()).append(" for ").append(r.study()).append(": response ")
                .append(r.response()).append(" [").append(r.unit()).append("]\n");
        b.append(String.format(Locale.ROOT, "%d runs (%d factorial/axial, %d centre); method: %s%n", a.runs(),
                a.factorialRuns(), a.centreRuns(), a.method()));
        for (int i = 0; i < r.factors().size(); i++) {
            b.append("  ").append(EffectNames.letter(i)).append(" = ").append(r.factors().get(i).id()).append('\n');
        }
        if (a.lenth() != null) {
            Lenth l = a.lenth();
            b.append(String.format(Locale.ROOT, "Lenth: m = %d, PSE = %.4g, ME = %.4g, SME = %.4g (d = %.3g)%n",
                    l.m(), l.pse(), l.me(), l.sme(), l.dof()));
        }
        b.append(String.format(Locale.ROOT, "%n%-8s %12s %12s %10s %10s %7s  %s%n", "effect", "measured", "predicted",
                "std.err", "p", "active", "aliases"));
        for (EffectAnalysis.Estimate e : a.effects()) {
            b.append(String.format(Locale.ROOT, "%-8s %12.5g %12.5g %10.3g %10.3g %7s  %s%n", e.label(), e.estimate(),
                    e.predicted(), e.stdError(), e.pValue(), e.active() ? "yes" : "", String.join(" ", e.aliases())));
        }
        if (!a.anova().isEmpty()) {
            b.append(String.format(Locale.ROOT, "%nANOVA%n%-28s %12s %6s %12s %10s %10s%n", "source", "SS", "df", "MS", "F", "p"));
            for (EffectAnalysis.AnovaRow row : a.anova()) {
                b.append(String.format(Locale.ROOT, "%-28s %12.5g %6.0f %12.5g %10.4g %10.3g%n", row.source(),
                        row.sumOfSquares(), row.dof(), row.meanSquare(), row.f(), row.pValue()));
            }
        }
        b.append("\nHalf-normal plot (|effect| vs quantile):\n");
        for (EffectAnalysis.HalfNormalPoint p : a.halfNormal()) {
            b.append(String.format(Locale.ROOT, "  %-8s %12.5g %8.4f%n", p.label(), p.absEffect(), p.quantile()));
        }
        Calibration.Result c = r.calibration();
        if (c != null) {
            if (!c.identifiability().isEmpty()) {
                b.append('\n').append(c.identifiability()).append('\n');
            }
            b.append(String.format(Locale.ROOT, "%nCalibrated inputs (%.0f %% profile-likelihood intervals inside the "
                    + "physical range, %d df, residual sd %.4g):%n", 100 * c.confidence(), c.dof(), c.residualSd()));
            for (int j = 0; j < c.ids().size(); j++) {
                b.append(String.format(Locale.ROOT, "  %-32s %12.6g  [%.6g%s, %.6g%s]  (nominal %.6g; %s)%n",
                        c.ids().get(j), c.estimates()[j], c.lower()[j], c.lowerAtLimit()[j] ? " (limit)" : "",
                        c.upper()[j], c.upperAtLimit()[j] ? " (limit)" : "", c.start()[j], c.excludesNominal(j)
                                ? "the interval leaves out the nominal value" : "consistent with the nominal value"));
            }
        }
        for (String note : r.notes()) {
            b.append("Note: ").append(note).append('\n');
        }
        return b.toString();
    }
}
