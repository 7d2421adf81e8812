package org.fabspread.plan;

import java.util.ArrayList;
import java.util.Comparator;
import java.util.List;
import java.util.Locale;
import java.util.Optional;

import org.fabspread.study.PlanSettings;
import org.fabspread.study.SourceLocation;
import org.fabspread.study.StudyException;

/**
 * Proposes the smallest plan that still sees the effects that matter. Factors: the study's list when
 * given, otherwise the ranked inputs from the top until their total-order indices reach 90 % of the
 * ranking's sum (at most eleven). Plan: the smallest tabled minimum-aberration design of the wanted
 * resolution — IV keeps main effects clear of two-factor interactions, V keeps the interactions clear
 * too; with no wish, IV. When the run budget cannot hold that plan, the lowest-ranked factors are
 * dropped first, then the resolution is lowered to III (for which a Plackett–Burman design is used
 * when it is smaller). Other kinds are honoured when asked for.
 */
public final class PlanAdvisor {

    /** Cumulative share of the total indices the default factor choice covers. */
    public static final double COVERAGE = 0.90;

    /**
     * The advice.
     *
     * @param design      the coded design
     * @param factorIds   factors in design order (letters A, B, … in this order)
     * @param leftOut     inputs of the ranking not taken, each with the reason
     * @param resolution  the plan's resolution ({@link Integer#MAX_VALUE} for a full factorial; 0 when
     *                    not a regular two-level design)
     * @param coveredShare share of the ranking's total indices the factors carry
     * @param explanation one plain paragraph
     */
    public record Advice(CodedDesign design, List<String> factorIds, List<String> leftOut, int resolution,
                         double coveredShare, String explanation) {
        public Advice {
            factorIds = List.copyOf(factorIds);
            leftOut = List.copyOf(leftOut);
        }
    }

    private PlanAdvisor() {
    }

    /**
     * @param ranking  inputs with their total-order indices (any order; sorted here)
     * @param settings the study's plan section
     */
    public static Advice advise(List<RankedInput> ranking, PlanSettings settings) {
        List<RankedInput> ranked = new ArrayList<>(ranking);
        ranked.sort(Comparator.comparingDouble(RankedInput::totalIndex).reversed());
        double sum = ranked.stream().mapToDouble(r -> Math.max(0, r.totalIndex())).sum();
        PlanSettings.Kind kind = settings.kind() == null ? PlanSettings.Kind.AUTO : settings.kind();
        int budget = settings.maxRuns();
        int centre = Math.max(0, settings.centrePoints());
        int wanted = settings.resolution();
        List<String> leftOut = new ArrayList<>();
        List<String> chosen = new ArrayList<>();
        boolean userFactors = settings.factors() != null && !settings.factors().isEmpty();
        if (userFactors) {
            chosen.addAll(settings.factors());
            for (RankedInput r : ranked) {
                if (!chosen.contains(r.id())) {
                    leftOut.add(r.id() + " (not in the study's factor list)");
                }
            }
        } else {
            if (ranked.isEmpty()) {
                throw StudyException.at(SourceLocation.unknown("plan.factors"),
                        "no factors given and no sensitivity ranking to choose them from");
            }
            double cum = 0;
            for (RankedInput r : ranked) {
                if (chosen.size() >= MinimumAberrationCatalog.MAX_FACTORS) {
                    leftOut.add(r.id() + String.format(Locale.ROOT, " (total index %.3g; at most %d factors)",
                            r.totalIndex(), MinimumAberrationCatalog.MAX_FACTORS));
                } else if (sum > 0 && cum >= COVERAGE * sum) {
                    leftOut.add(r.id() + String.format(Locale.ROOT,
                            " (total index %.3g; the factors above already carry %.0f %% of the variance)",
                            r.totalIndex(), 100 * cum / sum));
                } else {
                    chosen.add(r.id());
                    cum += Math.max(0, r.totalIndex());
                }
            }
        }
        if (chosen.size() < 2 && kind != PlanSettings.Kind.FULL_FACTORIAL && kind != PlanSettings.Kind.AUTO) {
            throw StudyException.at(SourceLocation.unknown("plan.factors"), "a " + kind + " plan needs at least 2 factors");
        }
        int res = wanted > 0 ? wanted : 4;
        String resWhy = wanted > 0 ? "the study asks for resolution " + TwoLevelDesign.resolutionLabel(wanted)
                : "resolution IV by default, so that no main effect is mixed up with a two-factor interaction";
        CodedDesign design = null;
        List<String> dropped = new ArrayList<>();
        String lowered = "";
        while (design == null) {
            int k = chosen.size();
            Optional<CodedDesign> d = candidate(kind, k, res);
            if (d.isPresent() && (budget <= 0 || d.get().size() + centre <= budget)) {
                design = d.get();
                break;
            }
            if (!userFactors && k > 2 && kind != PlanSettings.Kind.BOX_BEHNKEN) {
                String last = chosen.remove(k - 1);
                dropped.add(last);
                double ti = ranked.stream().filter(r -> r.id().equals(last)).mapToDouble(RankedInput::totalIndex)
                        .findFirst().orElse(Double.NaN);
                leftOut.add(String.format(Locale.ROOT, "%s (total index %.3g; dropped to fit the budget of %d runs)",
                        last, ti, budget));
                continue;
            }
            if (res > 3 && (kind == PlanSettings.Kind.AUTO || kind == PlanSettings.Kind.FRACTIONAL)) {
                lowered = String.format(Locale.ROOT, " The budget of %d runs cannot hold resolution %s for these "
                        + "factors, so the plan drops to resolution III: main effects are then aliased with "
                        + "two-factor interactions and a follow-up fold-over may be needed.", budget,
                        TwoLevelDesign.resolutionLabel(res));
                res = 3;
                continue;
            }
            throw StudyException.at(SourceLocation.unknown("plan.max_runs"), "no " + kind + " plan of " + k
                    + " factors fits in " + budget + " runs");
        }
        double covered = 0;
        for (RankedInput r : ranked) {
            if (chosen.contains(r.id())) {
                covered += Math.max(0, r.totalIndex());
            }
        }
        double share = sum > 0 ? covered / sum : Double.NaN;
        int resolution = design.regular() != null && design.kind() != PlanSettings.Kind.CENTRAL_COMPOSITE
                ? design.regular().resolution() : 0;
        String text = explain(design, chosen, leftOut, share, resWhy + lowered, centre, userFactors);
        return new Advice(design, chosen, leftOut, resolution, share, text);
    }

    /** The smallest design of the kind for k factors at resolution ≥ res, if one exists. */
    static Optional<CodedDesign> candidate(PlanSettings.Kind kind, int k, int res) {
        switch (kind) {
            case FULL_FACTORIAL:
                return k <= 11 ? Optional.of(CodedDesign.of(TwoLevelDesign.full(k))) : Optional.empty();
            case PLACKETT_BURMAN: {
                int n = PlackettBurman.runsFor(k);
                return n < 0 ? Optional.empty() : Optional.of(CodedDesign.plackettBurman(k, n));
            }
            case CENTRAL_COMPOSITE:
                return k >= 2 && k <= 11 ? Optional.of(CodedDesign.centralComposite(k, ResponseSurfaceDesigns.Axial.ROTATABLE))
                        : Optional.empty();
            case BOX_BEHNKEN:
                return k >= 3 && k <= 7 ? Optional.of(CodedDesign.boxBehnken(k)) : Optional.empty();
            default: {
                if (k < 1 || k > MinimumAberrationCatalog.MAX_FACTORS) {
                    return Optional.empty();
                }
                Optional<TwoLevelDesign> d = MinimumAberrationCatalog.smallest(k, res);
                if (res <= 3) {
                    int pb = PlackettBurman.runsFor(k);
                    if (pb > 0 && (d.isEmpty() || pb < d.get().runs()) && k >= 4) {
                        return Optional.of(CodedDesign.plackettBurman(k, pb));
                    }
                }
                return d.map(CodedDesign::of);
            }
        }
    }

    private static String explain(CodedDesign d, List<String> factors, List<String> leftOut, double share,
                                  String resWhy, int centre, boolean userFactors) {
        StringBuilder b = new StringBuilder();
        b.append("The plan varies ").append(factors.size()).append(factors.size() == 1 ? " factor (" : " factors (");
        for (int i = 0; i < factors.size(); i++) {
            if (i > 0) {
                b.append(", ");
            }
            b.append(EffectNames.letter(i)).append(" = ").append(factors.get(i));
        }
        b.append(")");
        if (userFactors) {
            b.append(", as the study lists them");
        } else if (!Double.isNaN(share)) {
            b.append(String.format(Locale.ROOT, ", the inputs that together carry %.0f %% of the summed total-order "
                    + "indices of the sensitivity ranking", 100 * share));
        }
        b.append(". It uses a ").append(d.name()).append(" in ").append(d.size()).append(" runs");
        if (centre > 0) {
            b.append(" plus ").append(centre).append(" centre point").append(centre > 1 ? "s" : "");
        }
        b.append(", the smallest such plan: ").append(resWhy).append(". ");
        TwoLevelDesign r = d.regular();
        if (d.kind() == PlanSettings.Kind.FULL_FACTORIAL) {
            b.append("Every main effect and interaction is estimated separately; nothing is aliased. ");
        } else if (d.kind() == PlanSettings.Kind.FRACTIONAL) {
            AliasStructure a = r.aliasStructure();
            b.append("Its defining relation is ").append(a.definingRelation()).append(". ");
            if (r.resolution() >= 5) {
                b.append("Main effects and two-factor interactions are all clear of each other; they are aliased "
                        + "only with interactions of three or more factors. ");
            } else if (r.resolution() == 4) {
                b.append("Main effects are aliased only with three-factor interactions; two-factor interactions are "
                        + "aliased in chains such as ");
                b.append(a.interactions().isEmpty() ? "none" : a.interactions().get(0).text());
                b.append(a.clearInteractions().isEmpty() ? ", and none of them is clear. "
                        : ", and " + a.clearInteractions().size() + " of them are clear. ");
            } else {
                b.append("Main effects are aliased with two-factor interactions (e.g. ")
                        .append(a.mainEffects().get(0).text()).append("), so an effect that looks large may belong to "
                                + "an interaction. ");
            }
        } else if (d.kind() == PlanSettings.Kind.PLACKETT_BURMAN) {
            b.append("It estimates main effects only; each two-factor interaction is spread partially over several "
                    + "main effects, so assume interactions are small. ");
        } else {
            b.append("It fits a full second-order model (main effects, two-factor interactions and squares). ");
        }
        if (leftOut.isEmpty()) {
            b.append("No input of the ranking was left out.");
        } else {
            b.append("Left out and held at nominal: ").append(String.join("; ", leftOut)).append('.');
        }
        return b.toString();
    }
}
