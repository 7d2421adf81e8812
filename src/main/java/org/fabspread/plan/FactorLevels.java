package org.fabspread.plan;

import java.util.ArrayList;
import java.util.List;
import java.util.Locale;

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
 */
public final class FactorLevels {

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
                out.add(new Factor(id, unit, d.nominal(), sigma, lim.low(), lim.high(), "limits"));
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
            out.add(new Factor(id, unit, d.nominal(), sigma, lo, hi, src));
        }
        return out;
    }
}
