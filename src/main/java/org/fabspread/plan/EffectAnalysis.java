package org.fabspread.plan;

import java.util.ArrayList;
import java.util.Comparator;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;

import org.apache.commons.math3.distribution.FDistribution;
import org.apache.commons.math3.distribution.NormalDistribution;
import org.apache.commons.math3.distribution.TDistribution;

/**
 * Analysis of measured results of a plan.
 *
 * <p>Two-level plans (every non-centre run at ±1): the effect basis is rebuilt from the runs alone —
 * products of factor columns taken in order of increasing size and kept when orthogonal to every
 * column kept before (a product equal to a kept column up to sign is recorded as its alias), completed
 * for Plackett–Burman plans by the design's unused columns. Each effect is the contrast
 * mean(y | +) − mean(y | −). When runs are repeated (replicates or several centre points) an ANOVA
 * against pure error is given (F tests, Commons Math F distribution), with a curvature test when there
 * are centre points; when the factorial part is unreplicated, Lenth's method (see {@link Lenth}) judges
 * the effects. Half-normal plot data: the ordered |effects| against Φ⁻¹(0.5 + 0.5(i − 0.5)/m)
 * (Daniel, Technometrics 1, 311 (1959)).
 *
 * <p>Other plans (central composite, Box–Behnken): least squares of the full second-order model with
 * t tests on the residual mean square.
 */
public final class EffectAnalysis {

    private static final NormalDistribution STD = new NormalDistribution(null, 0, 1);

    private EffectAnalysis() {
    }

    /**
     * One estimated effect.
     *
     * @param label     letters, e.g. {@code AB}
     * @param name      with factor ids
     * @param aliases   effects of at most two factors confounded with it (letters)
     * @param estimate  the contrast (or 2β; β for a square)
     * @param stdError  standard error when an error estimate exists, else NaN
     * @param statistic F (ANOVA), t (regression) or |estimate|/PSE (Lenth)
     * @param pValue    p-value where defined, else NaN
     * @param active    beyond the margin of error (Lenth ME) or p &lt; alpha
     * @param predicted the model's prediction for the same term, NaN when none
     */
    public record Estimate(String label, String name, List<String> aliases, double estimate, double stdError,
                           double statistic, double pValue, boolean active, double predicted) {
        public Estimate {
            aliases = List.copyOf(aliases);
        }
    }

    /** One ANOVA line. */
    public record AnovaRow(String source, double sumOfSquares, double dof, double meanSquare, double f,
                           double pValue) {
    }

    /** One point of the half-normal plot. */
    public record HalfNormalPoint(String label, double absEffect, double quantile) {
    }

    /**
     * @param method        {@code contrasts + ANOVA}, {@code contrasts + Lenth} or {@code second-order regression}
     * @param pureErrorDof  degrees of freedom of pure error (repeated points)
     * @param sigma         error standard deviation used (pure error, or residual), NaN when none
     * @param lenth         Lenth's statistics, or null
     */
    public record Result(String method, int runs, int factorialRuns, int centreRuns, double pureErrorDof,
                         double sigma, List<Estimate> effects, List<AnovaRow> anova, Lenth lenth,
                         List<HalfNormalPoint> halfNormal) {
        public Result {
            effects = List.copyOf(effects);
            anova = List.copyOf(anova);
            halfNormal = List.copyOf(halfNormal);
        }
    }

    /**
     * @param coded     coded levels of each run [run][factor]
     * @param y         measured response of each run
     * @param ids       factor ids
     * @param predicted predicted effect by label (may be empty)
     * @param alpha     significance level
     */
    public static Result analyse(double[][] coded, double[] y, List<String> ids, Map<String, Double> predicted,
                                 double alpha) {
        int n = y.length;
        int k = ids.size();
        boolean twoLevel = true;
        int nCentre = 0;
        for (double[] x : coded) {
            boolean centre = true;
            boolean corner = true;
            for (double v : x) {
                centre &= Math.abs(v) < 1e-6;
                corner &= Math.abs(Math.abs(v) - 1) < 1e-6;
            }
            if (centre) {
                nCentre++;
            } else if (!corner) {
                twoLevel = false;
            }
        }
        if (!twoLevel) {
            return regression(coded, y, ids, predicted, alpha);
        }
        // group factorial runs by sign pattern
        Map<Integer, List<Integer>> groups = new LinkedHashMap<>();
        List<Double> centreY = new ArrayList<>();
        for (int r = 0; r < n; r++) {
            if (isCentre(coded[r])) {
                centreY.add(y[r]);
                continue;
            }
            int key = 0;
            for (int i = 0; i < k; i++) {
                if (coded[r][i] > 0) {
                    key |= 1 << i;
                }
            }
            groups.computeIfAbsent(key, q -> new ArrayList<>()).add(r);
        }
        int[] keys = groups.keySet().stream().mapToInt(Integer::intValue).toArray();
        int u = keys.length;
        if (u < 2) {
            throw new IllegalArgumentException("the runs hold fewer than two distinct factorial points");
        }
        List<int[]> basis = new ArrayList<>();
        List<String> labels = new ArrayList<>();
        List<List<String>> aliases = new ArrayList<>();
        List<String> names = new ArrayList<>();
        List<Integer> masks = new ArrayList<>();
        List<Integer> bySize = new ArrayList<>();
        for (int s = 1; s < (1 << k); s++) {
            bySize.add(s);
        }
        bySize.sort(Comparator.comparingInt(Integer::bitCount).thenComparing(s -> EffectNames.word(s)));
        for (int s : bySize) {
            int[] col = new int[u];
            for (int p = 0; p < u; p++) {
                col[p] = (Integer.bitCount(~keys[p] & s) & 1) == 0 ? 1 : -1;
            }
            boolean orthogonal = true;
            int same = -1;
            for (int b = 0; b < basis.size(); b++) {
                int dot = 0;
                for (int p = 0; p < u; p++) {
                    dot += col[p] * basis.get(b)[p];
                }
                if (Math.abs(dot) == u) {
                    same = b;
                }
                if (dot != 0) {
                    orthogonal = false;
                }
            }
            if (same >= 0) {
                if (Integer.bitCount(s) <= 2) {
                    aliases.get(same).add(EffectNames.word(s));
                }
            } else if (orthogonal && basis.size() < u - 1) {
                int sum = 0;
                for (int c : col) {
                    sum += c;
                }
                if (sum != 0) {
                    continue;
                }
                basis.add(col);
                labels.add(EffectNames.word(s));
                names.add(EffectNames.named(s, ids));
                aliases.add(new ArrayList<>());
                masks.add(s);
            }
        }
        if (basis.size() < u - 1 && (u == 12 || u == 20 || u == 24)) {
            addScreeningColumns(keys, k, basis, labels, names, aliases);
        }
        // contrasts over all factorial runs
        int m = basis.size();
        double[] effect = new double[m];
        int nF = n - nCentre;
        for (int b = 0; b < m; b++) {
            double sp = 0;
            int np = 0;
            double sm = 0;
            int nm = 0;
            for (int p = 0; p < u; p++) {
                for (int r : groups.get(keys[p])) {
                    if (basis.get(b)[p] > 0) {
                        sp += y[r];
                        np++;
                    } else {
                        sm += y[r];
                        nm++;
                    }
                }
            }
            effect[b] = sp / np - sm / nm;
        }
        // pure error
        double ssPE = 0;
        int dfPE = 0;
        for (List<Integer> g : groups.values()) {
            double mean = g.stream().mapToDouble(r -> y[r]).average().orElse(0);
            for (int r : g) {
                ssPE += (y[r] - mean) * (y[r] - mean);
            }
            dfPE += g.size() - 1;
        }
        double centreMean = centreY.stream().mapToDouble(Double::doubleValue).average().orElse(Double.NaN);
        for (double c : centreY) {
            ssPE += (c - centreMean) * (c - centreMean);
        }
        dfPE += Math.max(0, centreY.size() - 1);
        boolean replicatedFactorial = nF > u;
        List<Estimate> est = new ArrayList<>();
        List<AnovaRow> anova = new ArrayList<>();
        Lenth lenth = null;
        String method;
        double sigma = Double.NaN;
        if (dfPE >= 1) {
            method = "contrasts + ANOVA against pure error (" + dfPE + " df)";
            double msPE = ssPE / dfPE;
            sigma = Math.sqrt(msPE);
            FDistribution f = new FDistribution(null, 1, dfPE);
            for (int b = 0; b < m; b++) {
                double ss = nF * effect[b] * effect[b] / 4;
                double fv = ss / msPE;
                double p = 1 - f.cumulativeProbability(fv);
                double se = 2 * sigma / Math.sqrt(nF);
                anova.add(new AnovaRow(labels.get(b), ss, 1, ss, fv, p));
                est.add(new Estimate(labels.get(b), names.get(b), aliases.get(b), effect[b], se, fv, p, p < alpha,
                        predicted.getOrDefault(labels.get(b), Double.NaN)));
            }
            if (!centreY.isEmpty()) {
                double meanF = 0;
                for (int r = 0; r < n; r++) {
                    if (!isCentre(coded[r])) {
                        meanF += y[r];
                    }
                }
                meanF /= nF;
                int nC = centreY.size();
                double ss = nF * nC * (meanF - centreMean) * (meanF - centreMean) / (nF + nC);
                double fv = ss / msPE;
                anova.add(new AnovaRow("curvature (centre points)", ss, 1, ss, fv, 1 - f.cumulativeProbability(fv)));
            }
            int lofDf = u - 1 - m;
            if (lofDf > 0) {
                double ssModel = 0;
                for (AnovaRow a : anova) {
                    ssModel += a.sumOfSquares();
                }
                double mean = 0;
                for (double v : y) {
                    mean += v;
                }
                mean /= n;
                double ssTot = 0;
                for (double v : y) {
                    ssTot += (v - mean) * (v - mean);
                }
                double ssLof = Math.max(0, ssTot - ssModel - ssPE);
                FDistribution fl = new FDistribution(null, lofDf, dfPE);
                double fv = ssLof / lofDf / msPE;
                anova.add(new AnovaRow("lack of fit", ssLof, lofDf, ssLof / lofDf, fv, 1 - fl.cumulativeProbability(fv)));
            }
            anova.add(new AnovaRow("pure error", ssPE, dfPE, msPE, Double.NaN, Double.NaN));
        } else {
            method = "contrasts + Lenth's pseudo standard error (unreplicated)";
        }
        if (!replicatedFactorial && m >= 3) {
            lenth = Lenth.of(effect);
            if (dfPE < 1) {
                for (int b = 0; b < m; b++) {
                    est.add(new Estimate(labels.get(b), names.get(b), aliases.get(b), effect[b], lenth.pse(),
                            Math.abs(effect[b]) / lenth.pse(), Double.NaN, Math.abs(effect[b]) > lenth.me(),
                            predicted.getOrDefault(labels.get(b), Double.NaN)));
                }
            }
        }
        return new Result(method, n, nF, nCentre, dfPE, sigma, est, anova, lenth, halfNormal(labels, effect));
    }

    private static void addScreeningColumns(int[] keys, int k, List<int[]> basis, List<String> labels,
                                            List<String> names, List<List<String>> aliases) {
        int u = keys.length;
        int[][] pb = PlackettBurman.matrix(u);
        int[] rowOf = new int[u];
        for (int p = 0; p < u; p++) {
            rowOf[p] = -1;
            for (int r = 0; r < u; r++) {
                boolean match = true;
                for (int i = 0; i < k && match; i++) {
                    match = (pb[r][i] > 0) == ((keys[p] & (1 << i)) != 0);
                }
                if (match) {
                    rowOf[p] = r;
                    break;
                }
            }
            if (rowOf[p] < 0) {
                return;
            }
        }
        int dummy = 1;
        for (int c = k; c < u - 1 && basis.size() < u - 1; c++) {
            int[] col = new int[u];
            for (int p = 0; p < u; p++) {
                col[p] = pb[rowOf[p]][c];
            }
            basis.add(col);
            labels.add("e" + dummy);
            names.add("unused column " + dummy + " (error)");
            aliases.add(new ArrayList<>());
            dummy++;
        }
    }

    private static boolean isCentre(double[] x) {
        for (double v : x) {
            if (Math.abs(v) >= 1e-6) {
                return false;
            }
        }
        return true;
    }

    /** Ordered |effects| against half-normal quantiles Φ⁻¹(0.5 + 0.5(i − 0.5)/m). */
    public static List<HalfNormalPoint> halfNormal(List<String> labels, double[] effects) {
        int m = effects.length;
        Integer[] order = new Integer[m];
        for (int i = 0; i < m; i++) {
            order[i] = i;
        }
        java.util.Arrays.sort(order, Comparator.comparingDouble(i -> Math.abs(effects[i])));
        List<HalfNormalPoint> out = new ArrayList<>();
        for (int i = 1; i <= m; i++) {
            int j = order[i - 1];
            out.add(new HalfNormalPoint(labels.get(j), Math.abs(effects[j]),
                    STD.inverseCumulativeProbability(0.5 + 0.5 * (i - 0.5) / m)));
        }
        return out;
    }

    private static Result regression(double[][] coded, double[] y, List<String> ids, Map<String, Double> predicted,
                                     double alpha) {
        int k = ids.size();
        List<Term> terms = new ArrayList<>();
        for (int i = 0; i < k; i++) {
            terms.add(Term.main(i));
        }
        for (int i = 0; i < k; i++) {
            for (int j = i + 1; j < k; j++) {
                terms.add(Term.interaction(i, j));
            }
        }
        for (int i = 0; i < k; i++) {
            terms.add(Term.square(i));
        }
        LeastSquares fit = LeastSquares.fit(terms, coded, y);
        int nCentre = 0;
        for (double[] x : coded) {
            if (isCentre(x)) {
                nCentre++;
            }
        }
        double sigma = fit.dof() > 0 ? Math.sqrt(fit.rss() / fit.dof()) : Double.NaN;
        TDistribution t = fit.dof() > 0 ? new TDistribution(null, fit.dof()) : null;
        List<Estimate> est = new ArrayList<>();
        double[] eff = new double[terms.size()];
        List<String> labels = new ArrayList<>();
        for (int i = 0; i < terms.size(); i++) {
            Term term = terms.get(i);
            eff[i] = fit.effect(terms, i);
            labels.add(term.label());
            double se = t == null ? Double.NaN : fit.effectStdError(terms, i, sigma);
            double tv = eff[i] / se;
            double p = t == null ? Double.NaN : 2 * (1 - t.cumulativeProbability(Math.abs(tv)));
            est.add(new Estimate(term.label(), term.named(ids), List.of(), eff[i], se, tv, p, p < alpha,
                    predicted.getOrDefault(term.label(), Double.NaN)));
        }
        List<AnovaRow> anova = new ArrayList<>();
        if (fit.dof() > 0) {
            anova.add(new AnovaRow("residual", fit.rss(), fit.dof(), fit.rss() / fit.dof(), Double.NaN, Double.NaN));
        }
        return new Result("second-order regression (t tests on the residual, " + fit.dof() + " df)", y.length,
                y.length - nCentre, nCentre, Double.NaN, sigma, est, anova, null, halfNormal(labels, eff));
    }
}
