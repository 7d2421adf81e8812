package org.fabspread.plan;

import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.function.DoubleFunction;

import org.fabspread.sampling.Distribution;
import org.fabspread.sampling.InputSpace;
import org.fabspread.study.Parameter;
import org.fabspread.study.PlanSettings;
import org.fabspread.study.SourceLocation;
import org.fabspread.study.Study;
import org.fabspread.study.StudyException;

/**
 * Real-unit levels of plan factors: low/high at nominal ∓ levelSigmas·σ, σ the standard deviation of
 * the input's marginal (the process window), or the study's explicit limits. Levels that would leave
 * the marginal's support (a negative thickness) are moved onto it and the factor says so.
 *
 * <p>An operator sets a thickness to a tenth of a nanometre, not to 86.8366 nm: the centre and the
 * half-range of the levels are rounded to the input's run-sheet precision (the study's
 * {@code plan.precision}, or else {@link #defaultPrecision} of the unit), so low, centre and high are
 * all settable values; the half-range is rounded down when a level sits on the support's end, so the
 * levels stay inside it.
 */
public final class FactorLevels {

    /** Default run-sheet precision of lengths: 0.1 nm (common practice for a film-thickness monitor). */
    public static final double LENGTH_PRECISION = 0.1;
    /** Default run-sheet precision of fractions: 0.1 % (common practice). */
    public static final double FRACTION_PRECISION = 0.001;
    /** Default run-sheet precision of voltages: 1 mV. */
    public static final double VOLTAGE_PRECISION = 0.001;

    private FactorLevels() {
    }

    public static List<Factor> of(Study study, InputSpace space, List<String> ids) {
        PlanSettings s = study.plan();
        double k = s == null || !(s.levelSigmas() > 0) ? 2.0 : s.levelSigmas();
        List<Factor> out = new ArrayList<>();
        for (String id : ids) {
            int i = space.ids().indexOf(id);
            if (i < 0) {
                throw StudyException.at(SourceLocation.unknown("plan.factors"),
                        id + " is not an uncertain input of the study (inputs: " + String.join(", ", space.ids()) + ")");
            }
            Distribution d = space.marginals().get(i);
            Parameter p = study.parameters().get(id);
            String unit = p == null ? "1" : p.unit();
            PlanSettings.FactorLimits lim = null;
            if (s != null && s.limits() != null) {
                for (PlanSettings.FactorLimits l : s.limits()) {
                    if (l.input().equals(id)) {
                        lim = l;
                    }
                }
            }
            double sigma = d.standardDeviation();
            if (lim != null) {
                if (!(lim.high() > lim.low())) {
                    throw StudyException.at(SourceLocation.unknown("plan.limits." + id),
                            "high limit must exceed low limit, got " + lim.low() + " .. " + lim.high() + " " + unit);
                }
                out.add(rounded(p, id, unit, d, sigma, lim.low(), lim.high(), "limits", false, precision(s, id, unit, sigma)));
                continue;
            }
            if (!(sigma > 0)) {
                throw StudyException.at(SourceLocation.unknown("plan.factors"),
                        id + " has no spread (sigma = 0); give plan limits for it");
            }
            double lo = d.nominal() - k * sigma;
            double hi = d.nominal() + k * sigma;
            String src = String.format(Locale.ROOT, "nominal -/+ %.3g sigma", k);
            if (lo < d.supportLower()) {
                lo = d.supportLower();
                src += ", low moved to the support's lower end";
            }
            if (hi > d.supportUpper()) {
                hi = d.supportUpper();
                src += ", high moved to the support's upper end";
            }
            boolean onSupport = lo <= d.supportLower() || hi >= d.supportUpper();
            out.add(rounded(p, id, unit, d, sigma, lo, hi, src, onSupport, precision(s, id, unit, sigma)));
        }
        return out;
    }

    /** The run-sheet precision of an input: the study's, or the unit's default. */
    static double precision(PlanSettings s, String id, String unit, double sigma) {
        if (s != null && s.precision().containsKey(id)) {
            return s.precision().get(id);
        }
        return defaultPrecision(unit, sigma);
    }

    /**
     * The unit's default precision: 0.1 nm, 0.1 % for fractions, 1 mV; for any other unit the power of
     * ten at or below a tenth of σ (so the levels ±2σ keep at least two significant steps).
     */
    public static double defaultPrecision(String unit, double sigma) {
        switch (unit) {
            case "nm":
                return LENGTH_PRECISION;
            case Factor.FRACTION:
                return FRACTION_PRECISION;
            case "V":
                return VOLTAGE_PRECISION;
            default:
                if (!(sigma > 0) || !Double.isFinite(sigma)) {
                    return 0;
                }
                return Math.pow(10, Math.floor(Math.log10(sigma / 10)));
        }
    }

    private static Factor rounded(Parameter p, String id, String unit, Distribution d, double sigma, double lo, double hi,
                                  String src, boolean onSupport, double step) {
        if (!(step > 0)) {
            return new Factor(id, unit, d.nominal(), sigma, lo, hi, src, 0);
        }
        double c = Factor.round(0.5 * (lo + hi), step);
        double h = onSupport ? Factor.floor(0.5 * (hi - lo), step) : Factor.round(0.5 * (hi - lo), step);
        while (h > step && (c - h < d.supportLower() || c + h > d.supportUpper())) {
            h = Factor.round(h - step, step);
        }
        if (!(h > 0)) {
            DoubleFunction<String> show = v -> p != null ? p.show(v) : v + " " + unit;
            throw StudyException.at(SourceLocation.unknown("plan.precision." + id), "the run-sheet precision "
                    + show.apply(Factor.round(step, step)) + " is coarser than the levels' half-range "
                    + show.apply(0.5 * (hi - lo)) + "; give a finer plan.precision for " + id);
        }
        double nlo = Factor.round(c - h, step);
        double nhi = Factor.round(c + h, step);
        if (nlo != lo || nhi != hi) {
            src += String.format(Locale.ROOT, "; rounded to the run-sheet precision %s %s",
                    RunSheet.format(Factor.FRACTION.equals(unit) ? 100 * step : step),
                    Factor.FRACTION.equals(unit) ? "%" : unit);
        }
        return new Factor(id, unit, d.nominal(), sigma, nlo, nhi, src, step);
    }
}
