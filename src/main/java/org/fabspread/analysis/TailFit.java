package org.fabspread.analysis;

import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.Locale;

import org.apache.commons.math3.distribution.BinomialDistribution;
import org.apache.commons.rng.UniformRandomProvider;
import org.apache.commons.rng.sampling.distribution.AhrensDieterMarsagliaTsangGammaSampler;
import org.apache.commons.rng.sampling.distribution.ContinuousSampler;
import org.apache.commons.rng.sampling.distribution.ZigguratSampler;
import org.apache.commons.rng.simple.RandomSource;
import org.fabspread.sampling.Interval;
import org.fabspread.sampling.Intervals;
import org.fabspread.sampling.SampleTable;
import org.fabspread.study.Target;

/**
 * A rare-failure probability extrapolated from a plain Monte Carlo sample already run, by fitting the tail
 * of the output on the failure side.
 *
 * <ul>
 * <li>Normal: mean and standard deviation of all samples, P = Φ(−(limit − mean)/sd) on the failure side.
 * <li>Peaks over threshold (Pickands–Balkema–de Haan): the failure side is turned into the upper tail; the
 * threshold u is the order statistic leaving a fraction ζ of the samples above it (by default about 300
 * samples, between 0.5 % and 10 %: {@link Options#tailFraction(int)}); the
 * excesses over u get a generalised Pareto fit by probability-weighted moments (Hosking &amp; Wallis,
 * Technometrics 29, 339 (1987)); P = ζ · S_GPD(limit − u).
 * </ul>
 *
 * Both intervals come from a seeded parametric bootstrap. Normal: mean* = mean + sd·Z/√n,
 * sd*² = sd² χ²_(n−1)/(n − 1). Pareto, conditional on the threshold: the number of exceedances
 * N* ~ Binomial(n, ζ), N* excesses drawn from the fitted GPD and refitted, P* = (N* / n) · S*(limit − u);
 * percentile intervals (Efron &amp; Tibshirani, An Introduction to the Bootstrap (1993), ch. 13).
 *
 * <p>Both extrapolate: they assume the tail keeps the fitted shape beyond the sampled range, which the
 * caveat of each result says in words.
 */
public final class TailFit {

    private static final long SALT = 0x7a11_f17dL;

    private TailFit() {
    }

    /** Exceedances the automatic threshold aims at. */
    public static final int AUTO_EXCEEDANCES = 300;
    /** Range of the automatic tail fraction. */
    public static final double AUTO_MIN_FRACTION = 0.005;
    public static final double AUTO_MAX_FRACTION = 0.10;

    /**
     * @param tailFraction    fraction ζ of the samples beyond the threshold, in (0, 0.5]; 0 = automatic:
     *                        {@link #AUTO_EXCEEDANCES}/n clamped to [0.5 %, 10 %] (see {@link #tailFraction(int)})
     * @param bootstrap       parametric-bootstrap replicates
     * @param seed            seed of the bootstrap
     * @param confidence      confidence level of the intervals
     * @param minExceedances  fewest exceedances for a Pareto fit
     */
    public record Options(double tailFraction, int bootstrap, long seed, double confidence, int minExceedances) {

        public Options {
            if (!(tailFraction >= 0 && tailFraction <= 0.5)) {
                throw new IllegalArgumentException("tail fraction must lie in (0, 0.5] (0 = automatic), got "
                        + tailFraction);
            }
            if (bootstrap < 20) {
                throw new IllegalArgumentException("the bootstrap needs at least 20 replicates, got " + bootstrap);
            }
            if (!(confidence > 0 && confidence < 1)) {
                throw new IllegalArgumentException("confidence must lie in (0, 1), got " + confidence);
            }
            if (minExceedances < 3) {
                throw new IllegalArgumentException("a Pareto fit needs at least 3 exceedances, got " + minExceedances);
            }
        }

        public static Options defaults() {
            return new Options(0, 1000, 1, 0.95, 30);
        }

        public Options withTailFraction(double f) {
            return new Options(f, bootstrap, seed, confidence, minExceedances);
        }

        public Options withBootstrap(int b) {
            return new Options(tailFraction, b, seed, confidence, minExceedances);
        }

        public Options withSeed(long s) {
            return new Options(tailFraction, bootstrap, s, confidence, minExceedances);
        }

        public Options withConfidence(double c) {
            return new Options(tailFraction, bootstrap, seed, c, minExceedances);
        }

        /**
         * The tail fraction used for n samples. A generalised Pareto fitted at a finite threshold sees the
         * penultimate shape of the tail, not its limit: for normal data the population PWM fit over the top
         * 10 % has ξ = −0.18 and puts a 1e-4 probability at 0.24e-4, over the top 1 % ξ = −0.10 and 0.94e-4
         * (numerical integration, checked in the tests). Deeper thresholds cut this bias but leave fewer
         * exceedances; about 300 balanced the two on normal data in trials with 2·10^4 to 10^5 samples.
         */
        public double tailFraction(int n) {
            if (tailFraction > 0) {
                return tailFraction;
            }
            return Math.max(AUTO_MIN_FRACTION, Math.min(AUTO_MAX_FRACTION, AUTO_EXCEEDANCES / (double) n));
        }
    }

    /** One result per target. */
    public static List<TailFitResult> of(SampleTable table, List<Target> targets, Options o) {
        int[] col = YieldEstimate.columns(table, targets);
        List<TailFitResult> out = new ArrayList<>();
        for (int t = 0; t < targets.size(); t++) {
            out.add(of(table.outputs()[col[t]], table.ok(), targets.get(t), o));
        }
        return out;
    }

    /**
     * Tail fits of one target's output.
     *
     * @throws org.fabspread.study.StudyException when the target names an output the samples do not have
     */
    public static TailFitResult of(SampleTable table, Target target, Options o) {
        return of(table, List.of(target), o).get(0);
    }

    /**
     * Tail fits of the values of one output ({@code ok[j]} false: left out).
     *
     * @throws IllegalArgumentException with fewer than 10 values that evaluated
     */
    public static TailFitResult of(double[] values, boolean[] ok, Target target, Options o) {
        int n = 0;
        for (int j = 0; j < values.length; j++) {
            if (ok[j] && Double.isFinite(values[j])) {
                n++;
            }
        }
        if (n < 10) {
            throw new IllegalArgumentException("a tail fit needs at least 10 samples that evaluated, got " + n);
        }
        // orient so that failures lie in the upper tail: v = y (y <= t fails above), v = −y (y >= t fails below)
        double sign = target.atLeast() ? -1 : 1;
        double[] v = new double[n];
        int m = 0;
        for (int j = 0; j < values.length; j++) {
            if (ok[j] && Double.isFinite(values[j])) {
                v[m++] = sign * values[j];
            }
        }
        double limit = sign * target.value();
        Arrays.sort(v);
        long fails = 0;
        for (double x : v) {
            if (!target.isMet(sign * x)) {
                fails++;
            }
        }
        Interval cp = Intervals.clopperPearson(fails, n, o.confidence());
        TailFitResult.Counted counted = new TailFitResult.Counted(fails, fails / (double) n, cp.low(), cp.high());
        UniformRandomProvider rng = RandomSource.XO_SHI_RO_256_PP.create(new long[] {o.seed(), SALT});
        TailFitResult.NormalTail normal = normal(v, limit, sign, o, rng);
        TailFitResult.ParetoTail pareto = pareto(v, limit, sign, o, rng);

        String preferred;
        double p;
        double lo;
        double hi;
        if (limit <= sign * pareto.threshold()) {
            preferred = "counted";
            p = counted.probability();
            lo = counted.low();
            hi = counted.high();
        } else if (pareto.applicable()) {
            preferred = "generalised-pareto";
            p = pareto.probability();
            lo = pareto.low();
            hi = pareto.high();
        } else {
            preferred = "normal";
            p = normal.probability();
            lo = normal.low();
            hi = normal.high();
        }
        String caveat = caveat(target, n, o, normal, pareto, counted, preferred);
        int failed = ok.length - n;
        return new TailFitResult(target.describe(), target.output(), target.atLeast() ? "below" : "above", n, failed,
                o.confidence(), counted, normal, pareto, preferred, 1 - p, 1 - hi, 1 - lo, caveat);
    }

    private static TailFitResult.NormalTail normal(double[] v, double limit, double sign, Options o,
                                                   UniformRandomProvider rng) {
        int n = v.length;
        double mean = Stats.mean(v);
        double sd = Math.sqrt(Stats.variance(v));
        double dist = sd > 0 ? (limit - mean) / sd : Double.POSITIVE_INFINITY;
        double p = TailYield.upperTail(dist);
        double[] boot = new double[o.bootstrap()];
        ZigguratSampler.NormalizedGaussian gauss = ZigguratSampler.NormalizedGaussian.of(rng);
        ContinuousSampler chi2 = AhrensDieterMarsagliaTsangGammaSampler.of(rng, 0.5 * (n - 1), 2);
        for (int b = 0; b < boot.length; b++) {
            double m = mean + sd * gauss.sample() / Math.sqrt(n);
            double s = sd * Math.sqrt(chi2.sample() / (n - 1));
            boot[b] = s > 0 ? TailYield.upperTail((limit - m) / s) : Double.NaN;
        }
        Interval ci = sd > 0 ? Stats.percentile(boot, o.confidence()) : new Interval(p, p);
        return new TailFitResult.NormalTail(sign * mean, sd, dist, p, ci.low(), ci.high());
    }

    private static TailFitResult.ParetoTail pareto(double[] v, double limit, double sign, Options o,
                                                   UniformRandomProvider rng) {
        int n = v.length;
        int k = Math.min(n - 1, (int) Math.round(o.tailFraction(n) * n));
        double u = v[n - k - 1];
        double zeta = k / (double) n;
        if (k < o.minExceedances()) {
            return notApplicable(sign * u, zeta, k, String.format(Locale.ROOT, "only %d samples beyond the %.2g %%"
                    + " threshold; a Pareto fit needs %d", k, 100 * zeta, o.minExceedances()));
        }
        if (limit <= u) {
            return notApplicable(sign * u, zeta, k, String.format(Locale.ROOT, "the limit lies inside the %.2g %%"
                    + " tail: the failure is not rare, the count answers it", 100 * zeta));
        }
        double[] ex = new double[k];
        for (int i = 0; i < k; i++) {
            ex[i] = v[n - k + i] - u;
        }
        GeneralizedPareto fit;
        try {
            fit = GeneralizedPareto.fitPwm(ex);
        } catch (IllegalArgumentException e) {
            return notApplicable(sign * u, zeta, k, "the exceedances cannot be fitted: " + e.getMessage());
        }
        double p = zeta * fit.survival(limit - u);
        BinomialDistribution binom = new BinomialDistribution(null, n, zeta);
        double[] boot = new double[o.bootstrap()];
        double[] shapes = new double[o.bootstrap()];
        double[] sim = new double[n];
        for (int b = 0; b < boot.length; b++) {
            int kb = binom.inverseCumulativeProbability(rng.nextDouble());
            if (kb < 3) {
                boot[b] = Double.NaN;
                shapes[b] = Double.NaN;
                continue;
            }
            for (int i = 0; i < kb; i++) {
                sim[i] = fit.inverseCdf(rng.nextDouble());
            }
            try {
                GeneralizedPareto g = GeneralizedPareto.fitPwm(Arrays.copyOf(sim, kb));
                boot[b] = kb / (double) n * g.survival(limit - u);
                shapes[b] = g.shape();
            } catch (IllegalArgumentException e) {
                boot[b] = Double.NaN;
                shapes[b] = Double.NaN;
            }
        }
        Interval ci = Stats.percentile(boot, o.confidence());
        Interval si = Stats.percentile(shapes, o.confidence());
        String note = "";
        if (fit.shape() < 0 && limit - u >= fit.upperEnd()) {
            note = String.format(Locale.ROOT, "the fitted tail ends at %.6g, before the limit: probability 0 within"
                    + " the fit", sign * (u + fit.upperEnd()));
        }
        return new TailFitResult.ParetoTail(true, sign * u, zeta, k, fit.shape(), fit.scale(), si.low(), si.high(), p,
                ci.low(), ci.high(), note);
    }

    private static TailFitResult.ParetoTail notApplicable(double threshold, double zeta, int k, String why) {
        return new TailFitResult.ParetoTail(false, threshold, zeta, k, Double.NaN, Double.NaN, Double.NaN, Double.NaN,
                Double.NaN, Double.NaN, Double.NaN, why);
    }

    private static String caveat(Target target, int n, Options o, TailFitResult.NormalTail normal,
                                 TailFitResult.ParetoTail pareto, TailFitResult.Counted counted, String preferred) {
        StringBuilder b = new StringBuilder();
        if (preferred.equals("counted")) {
            b.append(String.format(Locale.ROOT, "%d of %d samples violate %s: counted directly, no extrapolation.",
                    counted.failures(), n, target.describe()));
        } else {
            b.append(String.format(Locale.ROOT, "Extrapolated: the limit lies %.1f standard deviations from the mean,"
                    + " where %d samples saw %d failures. ", normal.distance(), n, counted.failures()));
            if (preferred.equals("generalised-pareto")) {
                b.append(String.format(Locale.ROOT, "The estimate assumes the tail keeps the generalised Pareto shape"
                        + " (xi = %.3f) fitted to the %d samples beyond the %.2g %% threshold all the way out to the"
                        + " limit.", pareto.shape(), pareto.exceedances(), 100 * pareto.tailFraction()));
            } else {
                b.append("The estimate assumes the output is normal out to the limit.");
            }
            b.append(" A failure mechanism that the sampled range never reached is invisible to it: confirm with"
                    + " importance sampling on the model when the answer matters.");
        }
        if (pareto.applicable() && pareto.shapeLow() <= 0 && pareto.shapeHigh() >= 0) {
            b.append(" The fitted shape is compatible with an exponential-type (normal-like) tail.");
        } else if (pareto.applicable() && pareto.shapeLow() > 0) {
            b.append(" The tail is heavier than a normal one (xi > 0): the normal fit understates the failures.");
        } else if (pareto.applicable() && pareto.shapeHigh() < 0) {
            b.append(" The tail is bounded (xi < 0): the normal fit overstates the failures.");
        }
        if (!pareto.note().isEmpty()) {
            b.append(" Pareto fit: ").append(pareto.note()).append('.');
        }
        if (preferred.equals("generalised-pareto") && pareto.probability() > 0
                && pareto.tailFraction() / pareto.probability() > 1000) {
            b.append(String.format(Locale.ROOT, " The limit lies %.1f decades of probability beyond the threshold:"
                    + " expect the estimate to be off by a factor of several.",
                    Math.log10(pareto.tailFraction() / pareto.probability())));
        }
        if (pareto.tailFraction() > 0.2) {
            b.append(" The threshold is far from the tail; the Pareto limit may not hold there.");
        }
        return b.toString();
    }
}
