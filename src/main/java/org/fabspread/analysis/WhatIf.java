package org.fabspread.analysis;

import java.util.ArrayList;
import java.util.List;
import java.util.Locale;

import org.apache.commons.math3.linear.Array2DRowRealMatrix;
import org.apache.commons.math3.linear.CholeskyDecomposition;
import org.apache.commons.math3.linear.RealMatrix;
import org.fabspread.sampling.Distribution;
import org.fabspread.sampling.Distributions;
import org.fabspread.sampling.InputSpace;
import org.fabspread.sampling.SampleTable;
import org.fabspread.study.AnalysisSettings;
import org.fabspread.study.DistributionSpec;
import org.fabspread.study.SourceLocation;
import org.fabspread.study.SpecChanges;
import org.fabspread.study.Study;
import org.fabspread.study.StudyException;
import org.fabspread.study.Target;

/**
 * What-ifs without re-running the model: a changed input distribution reweights the samples already
 * run by the likelihood ratio w = p_new(x)/p_old(x) (importance sampling; e.g. Owen, Monte Carlo theory,
 * methods and examples (2013), ch. 9), with the self-normalised yield Σ w I / Σ w, its variance
 * Σ w² (I − p̂)² / (Σ w)², and Kish's effective sample size (Σ w)²/Σ w².
 *
 * <p>Independent inputs: w = Π over changed inputs of p_new(x_i)/p_old(x_i) (marginal densities,
 * truncation normalisation included). Correlated inputs (Gaussian copula): the joint density ratio,
 * which also multiplies by c(z_new)/c(z_old) with z_i = Φ⁻¹(F_i(x_i)) and
 * c(z) ∝ exp(−½ zᵀ(R⁻¹ − I)z); this needs the normal-score correlation matrix R
 * ({@link Options#normalScoreCorrelation()}); without it the what-if is refused.
 *
 * <p>Reweighting is refused, and a new run asked for, when the new support is not inside the old one,
 * or when the weights have infinite variance: for a normal (or lognormal, in log space) input once
 * σ_new ≥ √2 σ_old — Kish's number would then mislead. It is flagged as needing a new run when the
 * effective sample size falls below {@link Options#minEss()} or {@link Options#minEssFraction()} of n.
 * {@link #modifiedSpace} builds the input space of the changed distributions for that run.
 */
public final class WhatIf {

    private static final int QUANTILES = 4096;

    private WhatIf() {
    }

    /**
     * Options of the reweighting.
     *
     * @param confidence             confidence level of the intervals
     * @param normalScoreCorrelation the Gaussian copula's correlation matrix over all inputs (model order),
     *                               needed when the input space is correlated; null otherwise
     * @param minEss                 effective sample size below which a new run is asked for
     * @param minEssFraction         fraction of n below which a new run is asked for
     */
    public record Options(double confidence, double[][] normalScoreCorrelation, int minEss, double minEssFraction) {
        public static Options defaults() {
            return new Options(0.95, null, 200, 0.10);
        }

        public Options withCorrelation(double[][] r) {
            return new Options(confidence, r, minEss, minEssFraction);
        }

        public Options withConfidence(double c) {
            return new Options(c, normalScoreCorrelation, minEss, minEssFraction);
        }
    }

    /**
     * One input's change of distribution.
     *
     * @param input        input id
     * @param description  the change in words
     * @param beforeSpec   the distribution as written in the study
     * @param afterSpec    the changed distribution as a spec, or null when it has none (a truncated
     *                     lognormal, uniform or triangular)
     * @param before       the distribution the samples were drawn from
     * @param after        the changed distribution
     * @param secondMoment E_old[w²] for this input alone (+∞ when infinite)
     * @param refusal      why reweighting cannot be used, empty when it can
     */
    public record Change(String input, String description, DistributionSpec beforeSpec, DistributionSpec afterSpec,
                         Distribution before, Distribution after, double secondMoment, String refusal) {

        public boolean reweightable() {
            return refusal.isEmpty();
        }
    }

    /** The change a study's what-if asks for. */
    public static Change change(DistributionSpec spec, AnalysisSettings.WhatIf w) {
        return change(w.input(), spec, w.kind(), w.amount(), w.where());
    }

    /**
     * Builds a changed distribution. Scaling σ: normal and truncated normal scale σ (bounds kept);
     * lognormal scales σ_ln (median kept); uniform and triangular scale their half-widths about the
     * nominal (midpoint or mode). Shifting the nominal moves μ (truncation bounds kept: they are limits
     * of the process), the lognormal median (cv kept), or a uniform/triangular as a whole. Truncating at
     * ± k σ: a normal becomes N(μ, σ) on [μ − kσ, μ + kσ] (intersected with existing bounds); other
     * distributions are cut at mean ± k sd and renormalised.
     *
     * @throws StudyException for measured values (no density to reweight with, no parametric change),
     *                        a fixed value, or an amount out of range
     */
    public static Change change(String input, DistributionSpec spec, AnalysisSettings.WhatIf.Kind kind, double amount,
                                SourceLocation where) {
        SourceLocation at = where == null ? SourceLocation.unknown(input) : where;
        if (spec instanceof DistributionSpec.Empirical) {
            throw StudyException.at(at, "what-if on '" + input + "' refused: it is given by measured values, which"
                    + " have no parametric spread to scale or shift; edit the measured data and re-run instead");
        }
        if (spec.isFixed()) {
            throw StudyException.at(at, "what-if on '" + input + "' refused: the value is fixed, not uncertain");
        }
        if (!Double.isFinite(amount)) {
            throw StudyException.at(at, "what-if on '" + input + "' needs a finite amount, got " + amount);
        }
        Distribution before = Distributions.of(spec);
        DistributionSpec afterSpec = null;
        Distribution after;
        String description;
        switch (kind) {
            case SCALE_SIGMA -> {
                if (!(amount > 0)) {
                    throw StudyException.at(at, "sigma scale factor must be > 0, got " + amount);
                }
                afterSpec = scaled(spec, amount);
                after = Distributions.of(afterSpec);
                description = input + ": sigma x " + fmt(amount);
            }
            case SHIFT_NOMINAL -> {
                afterSpec = shifted(spec, amount, at);
                after = Distributions.of(afterSpec);
                description = input + ": nominal " + (amount >= 0 ? "+" : "") + fmt(amount);
            }
            case TRUNCATE_SIGMAS -> {
                if (!(amount > 0)) {
                    throw StudyException.at(at, "truncation must be at k > 0 sigmas, got " + amount);
                }
                if (spec instanceof DistributionSpec.Normal n) {
                    afterSpec = new DistributionSpec.TruncatedNormal(n.mean(), n.sigma(), n.mean() - amount * n.sigma(),
                            n.mean() + amount * n.sigma());
                    after = Distributions.of(afterSpec);
                } else if (spec instanceof DistributionSpec.TruncatedNormal t) {
                    afterSpec = new DistributionSpec.TruncatedNormal(t.mean(), t.sigma(),
                            Math.max(t.lower(), t.mean() - amount * t.sigma()),
                            Math.min(t.upper(), t.mean() + amount * t.sigma()));
                    after = Distributions.of(afterSpec);
                } else {
                    double m = before.mean();
                    double s = before.standardDeviation();
                    after = new TruncatedDistribution(before, m - amount * s, m + amount * s);
                }
                description = input + ": truncated at +/-" + fmt(amount) + " sigma";
            }
            default -> throw new IllegalArgumentException("unknown what-if kind " + kind);
        }
        String refusal = "";
        double tol = 1e-12 * Math.max(1, Math.abs(before.mean()));
        if (after.supportLower() < before.supportLower() - tol || after.supportUpper() > before.supportUpper() + tol) {
            refusal = String.format(Locale.ROOT, "the changed %s reaches outside the sampled range [%s, %s]:"
                            + " samples there do not exist, so reweighting cannot see it; needs a new run", input,
                    fmt(before.supportLower()), fmt(before.supportUpper()));
        }
        double m2 = refusal.isEmpty() ? secondMoment(spec, afterSpec, before, after) : Double.NaN;
        if (refusal.isEmpty() && m2 == Double.POSITIVE_INFINITY) {
            refusal = "the change widens " + input + " to sigma_new >= sqrt(2) sigma_old: the weights have infinite"
                    + " variance and the effective sample size would mislead; needs a new run";
        }
        return new Change(input, description, spec, afterSpec, before, after, m2, refusal);
    }

    private static DistributionSpec scaled(DistributionSpec spec, double s) {
        return SpecChanges.scaled(spec, s);
    }

    /** {@link SpecChanges#shifted}, refusing a lognormal median moved to zero or below with the what-if's place. */
    private static DistributionSpec shifted(DistributionSpec spec, double d, SourceLocation at) {
        if (spec instanceof DistributionSpec.LogNormal l && !(l.median() + d > 0)) {
            throw StudyException.at(at, "shifting the lognormal median " + fmt(l.median()) + " by " + fmt(d)
                    + " leaves it <= 0");
        }
        return SpecChanges.shifted(spec, d);
    }

    /**
     * E_old[w²] = ∫ p_new²/p_old. Normal to normal in closed form,
     * σ0²/(σ1 sqrt(2σ0² − σ1²)) exp(δ²/(2σ0² − σ1²)), infinite once σ1² ≥ 2σ0²; lognormal likewise in log
     * space; a normal-family input with an unbounded side is infinite under the same condition; otherwise
     * a midpoint rule over 4096 quantiles of the new distribution (E_new[w]).
     */
    static double secondMoment(DistributionSpec beforeSpec, DistributionSpec afterSpec, Distribution before,
                               Distribution after) {
        if (beforeSpec instanceof DistributionSpec.Normal a && afterSpec instanceof DistributionSpec.Normal b) {
            return normalSecondMoment(a.mean(), a.sigma(), b.mean(), b.sigma());
        }
        if (beforeSpec instanceof DistributionSpec.LogNormal a && afterSpec instanceof DistributionSpec.LogNormal b) {
            return normalSecondMoment(Math.log(a.median()), Math.sqrt(Math.log1p(a.cv() * a.cv())),
                    Math.log(b.median()), Math.sqrt(Math.log1p(b.cv() * b.cv())));
        }
        if (beforeSpec instanceof DistributionSpec.TruncatedNormal a && afterSpec instanceof DistributionSpec.TruncatedNormal b
                && (Double.isInfinite(b.lower()) || Double.isInfinite(b.upper()))
                && b.sigma() * b.sigma() >= 2 * a.sigma() * a.sigma()) {
            return Double.POSITIVE_INFINITY;
        }
        double s = 0;
        for (int t = 0; t < QUANTILES; t++) {
            double x = after.inverseCdf((t + 0.5) / QUANTILES);
            double p0 = before.density(x);
            double p1 = after.density(x);
            if (!(p0 > 0) || Double.isNaN(p1)) {
                return Double.NaN;
            }
            s += p1 / p0;
        }
        return s / QUANTILES;
    }

    /** E_old[w²] for N(m0, s0) → N(m1, s1). */
    static double normalSecondMoment(double m0, double s0, double m1, double s1) {
        double d = 2 * s0 * s0 - s1 * s1;
        if (d <= 0) {
            return Double.POSITIVE_INFINITY;
        }
        return s0 * s0 / (s1 * Math.sqrt(d)) * Math.exp((m1 - m0) * (m1 - m0) / d);
    }

    /**
     * Evaluates every what-if a study lists ({@code analysis.whatIfs()}), one at a time, against the
     * study's targets.
     *
     * @throws StudyException when a what-if names an input that is not uncertain, or asks for a change
     *                        that cannot be made (measured values, a fixed value, a bad amount)
     */
    public static List<WhatIfResult> evaluateAll(SampleTable table, InputSpace space, Study study, Options options) {
        java.util.Map<String, DistributionSpec> specs = ToleranceAdvisor.specs(study);
        List<WhatIfResult> out = new ArrayList<>();
        for (AnalysisSettings.WhatIf w : study.analysis().whatIfs()) {
            DistributionSpec spec = specs.get(w.input());
            if (spec == null || !space.ids().contains(w.input())) {
                throw StudyException.at(w.where(), "what-if names '" + w.input() + "', which is not an uncertain"
                        + " input; uncertain inputs: " + String.join(", ", space.ids()));
            }
            out.add(evaluate(table, space, study.targets(), List.of(change(spec, w)), options));
        }
        return out;
    }

    /** Evaluates the changes on the samples; see the class description. */
    public static WhatIfResult evaluate(SampleTable table, InputSpace space, List<Target> targets, List<Change> changes,
                                        Options options) {
        int[] col = YieldEstimate.columns(table, targets);
        String description = String.join("; ", changes.stream().map(Change::description).toList());
        List<String> inputs = changes.stream().map(Change::input).toList();
        int n = 0;
        for (boolean b : table.ok()) {
            n += b ? 1 : 0;
        }
        StringBuilder refusal = new StringBuilder();
        for (Change c : changes) {
            if (!c.reweightable()) {
                refusal.append(c.refusal()).append(". ");
            }
        }
        if (space.correlated() && options.normalScoreCorrelation() == null) {
            refusal.append("the inputs are correlated and no copula correlation matrix was given, so the joint"
                    + " density ratio cannot be formed; needs a new run. ");
        }
        if (refusal.length() > 0) {
            return new WhatIfResult(description, inputs, false, true, refusal.toString().trim(), n, Double.NaN,
                    Double.NaN, expectedFraction(changes, space), WeightedEstimates.summarise(table, targets, col, null, options),
                    WeightedEstimates.moments(table, null));
        }
        double[] w = weights(table, space, changes, options);
        return result(table, space, targets, col, changes, description, inputs, w, options, n);
    }

    static WhatIfResult result(SampleTable table, InputSpace space, List<Target> targets, int[] col,
                               List<Change> changes, String description, List<String> inputs, double[] w,
                               Options options, int n) {
        double sw = 0;
        double sw2 = 0;
        for (double v : w) {
            sw += v;
            sw2 += v * v;
        }
        double ess = sw > 0 ? sw * sw / sw2 : 0;
        double fraction = n > 0 ? ess / n : Double.NaN;
        boolean rerun = ess < options.minEss() || fraction < options.minEssFraction();
        String message = rerun ? String.format(Locale.ROOT, "effective sample size %.0f of %d (%.1f %%) is below"
                        + " the threshold (%d or %.0f %%): the estimate is unreliable; needs a new run", ess, n,
                100 * fraction, options.minEss(), 100 * options.minEssFraction()) : "";
        return new WhatIfResult(description, inputs, sw > 0, rerun, message, n, ess, fraction,
                expectedFraction(changes, space), WeightedEstimates.summarise(table, targets, col, sw > 0 ? w : null, options),
                WeightedEstimates.moments(table, sw > 0 ? w : null));
    }

    private static double expectedFraction(List<Change> changes, InputSpace space) {
        if (space.correlated()) {
            return Double.NaN;
        }
        double p = 1;
        for (Change c : changes) {
            p *= c.secondMoment();
        }
        return p == Double.POSITIVE_INFINITY ? 0 : 1 / p;
    }

    /** The likelihood-ratio weight of each sample (0 for samples that failed). */
    static double[] weights(SampleTable table, InputSpace space, List<Change> changes, Options options) {
        int size = table.size();
        double[] logw = new double[size];
        for (Change c : changes) {
            double[] lw = logWeights(table, c);
            for (int j = 0; j < size; j++) {
                logw[j] += lw[j];
            }
        }
        if (space.correlated()) {
            addCopulaTerm(table, space, changes, options.normalScoreCorrelation(), logw);
        }
        double[] w = new double[size];
        for (int j = 0; j < size; j++) {
            w[j] = table.ok()[j] ? Math.exp(logw[j]) : 0;
        }
        return w;
    }

    /** log p_new(x_j) − log p_old(x_j) of one changed input, for every sample. */
    static double[] logWeights(SampleTable table, Change c) {
        double[] x = table.input(c.input());
        double[] lw = new double[x.length];
        for (int j = 0; j < x.length; j++) {
            double p0 = c.before().density(x[j]);
            double p1 = c.after().density(x[j]);
            lw[j] = p1 > 0 && p0 > 0 ? Math.log(p1) - Math.log(p0) : Double.NEGATIVE_INFINITY;
        }
        return lw;
    }

    /** Adds log c(z_new) − log c(z_old) of the Gaussian copula, c(z) ∝ exp(−½ zᵀ(R⁻¹ − I) z). */
    private static void addCopulaTerm(SampleTable table, InputSpace space, List<Change> changes, double[][] r,
                                      double[] logw) {
        int k = space.dimension();
        if (r.length != k) {
            throw new IllegalArgumentException("correlation matrix is " + r.length + "x" + r.length + ", inputs " + k);
        }
        RealMatrix rm = new Array2DRowRealMatrix(r, true);
        double[][] q = new CholeskyDecomposition(rm).getSolver().getInverse().getData();
        for (int i = 0; i < k; i++) {
            q[i][i] -= 1;
        }
        List<Distribution> marg = space.marginals();
        int[] tableCol = new int[k];
        for (int i = 0; i < k; i++) {
            tableCol[i] = table.inputIds().indexOf(space.ids().get(i));
        }
        Distribution[] afterMarg = marg.toArray(new Distribution[0]);
        for (Change c : changes) {
            afterMarg[space.ids().indexOf(c.input())] = c.after();
        }
        double[] z0 = new double[k];
        double[] z1 = new double[k];
        for (int j = 0; j < table.size(); j++) {
            if (!table.ok()[j] || logw[j] == Double.NEGATIVE_INFINITY) {
                continue;
            }
            for (int i = 0; i < k; i++) {
                double x = table.inputs()[tableCol[i]][j];
                z0[i] = normalScore(marg.get(i).cdf(x));
                z1[i] = afterMarg[i] == marg.get(i) ? z0[i] : normalScore(afterMarg[i].cdf(x));
            }
            logw[j] += -0.5 * (quad(q, z1) - quad(q, z0));
        }
    }

    private static double normalScore(double p) {
        return Stats.normalQuantile(Math.min(1 - 1e-16, Math.max(1e-300, p)));
    }

    private static double quad(double[][] q, double[] z) {
        double s = 0;
        for (int a = 0; a < z.length; a++) {
            double t = 0;
            for (int b = 0; b < z.length; b++) {
                t += q[a][b] * z[b];
            }
            s += z[a] * t;
        }
        return s;
    }

    /**
     * The input space of the changed distributions, for a new run when reweighting is refused or
     * flagged. Independent inputs: x_i = F_new⁻¹(u_i). Correlated inputs: the old map first, then
     * x_i ← F_new⁻¹(F_old(x_i)) on the changed inputs, which keeps the copula and replaces the marginal.
     */
    public static InputSpace modifiedSpace(InputSpace space, List<Change> changes) {
        Distribution[] m = space.marginals().toArray(new Distribution[0]);
        boolean[] changed = new boolean[m.length];
        for (Change c : changes) {
            int i = space.ids().indexOf(c.input());
            if (i < 0) {
                throw new IllegalArgumentException("no input " + c.input());
            }
            m[i] = c.after();
            changed[i] = true;
        }
        return new Modified(space, List.of(m), changed);
    }

    private record Modified(InputSpace base, List<Distribution> marginals, boolean[] changed) implements InputSpace {
        @Override public List<String> ids() {
            return base.ids();
        }

        @Override public boolean correlated() {
            return base.correlated();
        }

        @Override public void map(double[] u, double[] x) {
            base.map(u, x);
            boolean corr = base.correlated();
            for (int i = 0; i < x.length; i++) {
                if (changed[i]) {
                    double p = corr ? base.marginals().get(i).cdf(x[i]) : u[i];
                    p = Math.min(1 - 1e-16, Math.max(1e-300, p));
                    x[i] = marginals.get(i).inverseCdf(p);
                }
            }
        }
    }

    /** Four significant digits without trailing zeros: 0.5, 1.25, 1.235e+05. */
    static String fmt(double v) {
        if (!Double.isFinite(v)) {
            return Double.toString(v);
        }
        return new java.math.BigDecimal(v).round(new java.math.MathContext(4)).stripTrailingZeros().toString();
    }
}
