package org.fabspread.plan;

import java.util.ArrayList;
import java.util.Comparator;
import java.util.List;
import java.util.Locale;

import org.fabspread.study.PlanSettings;
import org.fabspread.study.SourceLocation;
import org.fabspread.study.StudyException;

/**
 * Proposes the smallest plan that still sees the effects that matter. Factors: the study's list when
 * given, otherwise the ranked inputs from the top until their total-order indices reach 90 % of the
 * ranking's sum (at most eleven).
 *
 * <p>The plan comes from an exhaustive search over every design of the admitted kinds and sizes
 * ({@link DesignCandidates}) whose runs plus the centre points fit the budget; the centre points are
 * counted openly ("16 runs = 13 + 3 centre points"). Designs are ranked by the resolution they reach,
 * up to the one wanted (IV keeps main effects clear of two-factor interactions, V keeps the
 * interactions clear too; with no wish, IV); when the wanted resolution does not fit, by the number of
 * two-factor interactions kept clear (so 7 factors in a 32-run budget get the 32-run resolution IV
 * plan with 15 clear interactions rather than the 16-run one with none); then by the fewest runs, a
 * regular fraction before a Plackett–Burman design of the same size. When the advisor chose the
 * factors and the budget cannot hold the wanted resolution for all of them, the lowest-ranked
 * factors are dropped first; only when no subset reaches it is the resolution lowered. What could not
 * be done is said in one sentence with the budget that would do it.
 *
 * <p>Second-order plans (central composite, Box–Behnken) need centre points: without them the
 * squared terms cannot be told from the mean. When the study asks for none, {@link
 * #SECOND_ORDER_CENTRE_POINTS} are added and the explanation says so.
 */
public final class PlanAdvisor {

    /** Cumulative share of the total indices the default factor choice covers. */
    public static final double COVERAGE = 0.90;

    /** Centre points added to a second-order plan when the study asks for none (common practice: 3 to 5). */
    public static final int SECOND_ORDER_CENTRE_POINTS = 3;

    /**
     * The advice.
     *
     * @param design       the coded design
     * @param factorIds    factors in design order (letters A, B, … in this order)
     * @param leftOut      inputs of the ranking not taken, each with the reason
     * @param resolution   the plan's resolution ({@link Integer#MAX_VALUE} for a full factorial; 0 when
     *                     not a regular two-level design)
     * @param coveredShare share of the ranking's total indices the factors carry
     * @param centrePoints centre points the plan adds (the study's, or those a second-order plan needs)
     * @param explanation  one plain paragraph
     */
    public record Advice(CodedDesign design, List<String> factorIds, List<String> leftOut, int resolution,
                         double coveredShare, int centrePoints, String explanation) {
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
        return advise(ranking, settings, ResponseSurfaceDesigns.Axial.ROTATABLE, "");
    }

    /**
     * As {@link #advise(List, PlanSettings)} with the axial distance of a central composite design
     * chosen and a note on why, said in the explanation.
     */
    public static Advice advise(List<RankedInput> ranking, PlanSettings settings, ResponseSurfaceDesigns.Axial axial,
                                String axialNote) {
        List<RankedInput> ranked = new ArrayList<>(ranking);
        ranked.sort(Comparator.comparingDouble(RankedInput::totalIndex).reversed());
        double sum = ranked.stream().mapToDouble(r -> Math.max(0, r.totalIndex())).sum();
        PlanSettings.Kind kind = settings.kind() == null ? PlanSettings.Kind.AUTO : settings.kind();
        int budget = settings.maxRuns();
        boolean secondOrder = kind == PlanSettings.Kind.CENTRAL_COMPOSITE || kind == PlanSettings.Kind.BOX_BEHNKEN;
        int centre = Math.max(0, settings.centrePoints());
        StringBuilder notes = new StringBuilder(axialNote.isEmpty() ? "" : " " + axialNote);
        if (secondOrder && centre < 1) {
            centre = SECOND_ORDER_CENTRE_POINTS;
            notes.append(String.format(Locale.ROOT, " The study asks for no centre points, but a second-order plan "
                    + "cannot tell the squared terms from the mean without them, so %d were added.", centre));
        }
        int wanted = wantedResolution(kind, settings.resolution());
        String resWhy = wanted == 0 || kind == PlanSettings.Kind.PLACKETT_BURMAN ? "the study asks for a "
                + kindName(kind) + " plan"
                : settings.resolution() > 0 ? "the study asks for resolution "
                + TwoLevelDesign.resolutionLabel(settings.resolution())
                : "resolution IV by default, so that no main effect is mixed up with a two-factor interaction";
        List<String> leftOut = new ArrayList<>();
        List<String> chosen = new ArrayList<>();
        boolean userFactors = settings.factors() != null && !settings.factors().isEmpty();
        chooseFactors(ranked, sum, settings, userFactors, chosen, leftOut);
        if (chosen.size() < 2 && kind != PlanSettings.Kind.FULL_FACTORIAL && kind != PlanSettings.Kind.AUTO) {
            throw StudyException.at(SourceLocation.unknown("plan.factors"), "a " + kind + " plan needs at least 2 factors");
        }
        int minK = userFactors ? chosen.size() : Math.min(chosen.size(), kind == PlanSettings.Kind.BOX_BEHNKEN ? 3 : 2);
        CodedDesign design = null;
        int used = 0;
        for (int kk = chosen.size(); kk >= Math.max(1, minK) && design == null; kk--) {
            CodedDesign b = best(kind, axial, kk, wanted, budget, centre);
            if (b != null && DesignCandidates.resolution(b) >= wanted) {
                design = b;
                used = kk;
            }
        }
        for (int kk = chosen.size(); kk >= Math.max(1, minK) && design == null; kk--) {
            design = best(kind, axial, kk, wanted, budget, centre);
            used = kk;
        }
        if (design == null) {
            int fewest = Math.max(1, minK);
            CodedDesign smallest = smallest(kind, fewest, 0);
            String factorCount = fewest < chosen.size() ? fewest + " to " + chosen.size() : String.valueOf(chosen.size());
            throw StudyException.at(SourceLocation.unknown("plan.max_runs"), "no " + kindName(kind) + " plan of "
                    + factorCount + " factors fits in " + budget + " runs" + (smallest == null ? ""
                    : String.format(Locale.ROOT, ": the smallest, a %s%s, needs %d runs + %d centre points = %d",
                    smallest.name(), fewest < chosen.size() ? " of " + fewest + " factors" : "", smallest.size(),
                    centre, smallest.size() + centre)));
        }
        if (budget > 0 && centre > 0) {
            notes.append(String.format(Locale.ROOT, " The budget of %d runs = %d %s runs + %d centre point%s.", budget,
                    budget - centre, secondOrder ? "design" : "factorial", centre, centre > 1 ? "s" : ""));
        }
        if (used < chosen.size()) {
            List<String> dropped = new ArrayList<>(chosen.subList(used, chosen.size()));
            CodedDesign all = smallest(kind, chosen.size(), wanted);
            if (all != null) {
                notes.append(String.format(Locale.ROOT, " Keeping all %d ranked factors at resolution %s would need "
                        + "the %s: a budget of %d runs%s.", chosen.size(), TwoLevelDesign.resolutionLabel(wanted),
                        all.name(), all.size() + centre, centre > 0 ? " (" + all.size() + " + " + centre + " centre points)" : ""));
            }
            for (String last : dropped) {
                double ti = ranked.stream().filter(r -> r.id().equals(last)).mapToDouble(RankedInput::totalIndex)
                        .findFirst().orElse(Double.NaN);
                leftOut.add(String.format(Locale.ROOT, "%s (total index %.3g; dropped to fit the budget of %d runs)",
                        last, ti, budget));
            }
            chosen = new ArrayList<>(chosen.subList(0, used));
        }
        int reached = DesignCandidates.resolution(design);
        if (reached < wanted) {
            notes.append(shortfall(kind, design, used, wanted, budget, centre));
        }
        double covered = 0;
        for (RankedInput r : ranked) {
            if (chosen.contains(r.id())) {
                covered += Math.max(0, r.totalIndex());
            }
        }
        double share = sum > 0 ? covered / sum : Double.NaN;
        int resolution = design.regular() != null && !design.isSecondOrder() ? design.regular().resolution() : 0;
        String text = explain(design, chosen, leftOut, share, resWhy, notes.toString(), centre, userFactors);
        return new Advice(design, chosen, leftOut, resolution, share, centre, text);
    }

    /** The resolution wished: the study's; IV for two-level kinds; III for Plackett–Burman; 0 (any) otherwise. */
    static int wantedResolution(PlanSettings.Kind kind, int asked) {
        if (asked > 0) {
            return kind == PlanSettings.Kind.AUTO || kind == PlanSettings.Kind.FRACTIONAL
                    || kind == PlanSettings.Kind.PLACKETT_BURMAN ? asked : 0;
        }
        return switch (kind) {
            case AUTO, FRACTIONAL -> 4;
            case PLACKETT_BURMAN -> 3;
            default -> 0;
        };
    }

    private static void chooseFactors(List<RankedInput> ranked, double sum, PlanSettings settings, boolean userFactors,
                                      List<String> chosen, List<String> leftOut) {
        if (userFactors) {
            chosen.addAll(settings.factors());
            for (RankedInput r : ranked) {
                if (!chosen.contains(r.id())) {
                    leftOut.add(r.id() + " (not in the study's factor list)");
                }
            }
            return;
        }
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

    /**
     * The best design of the kind for k factors whose runs plus centre points fit the budget (≤ 0: no
     * limit), or null: by resolution up to the wanted one, then (below it) the most clear two-factor
     * interactions, then the fewest runs, then regular before Plackett–Burman.
     */
    static CodedDesign best(PlanSettings.Kind kind, ResponseSurfaceDesigns.Axial axial, int k, int wanted, int budget,
                            int centre) {
        CodedDesign best = null;
        for (CodedDesign d : DesignCandidates.of(kind, axial, k)) {
            if (budget > 0 && d.size() + centre > budget) {
                continue;
            }
            if (best == null || better(d, best, wanted)) {
                best = d;
            }
        }
        return best;
    }

    private static boolean better(CodedDesign a, CodedDesign b, int wanted) {
        int ra = Math.min(DesignCandidates.resolution(a), wanted);
        int rb = Math.min(DesignCandidates.resolution(b), wanted);
        if (ra != rb) {
            return ra > rb;
        }
        if (ra < wanted) {
            int ca = DesignCandidates.clearInteractions(a);
            int cb = DesignCandidates.clearInteractions(b);
            if (ca != cb) {
                return ca > cb;
            }
        }
        if (a.size() != b.size()) {
            return a.size() < b.size();
        }
        return a.regular() != null && b.regular() == null;
    }

    /** The smallest design of the kind for k factors reaching the resolution, ignoring the budget, or null. */
    static CodedDesign smallest(PlanSettings.Kind kind, int k, int resolution) {
        CodedDesign best = null;
        for (CodedDesign d : DesignCandidates.of(kind, k)) {
            if (DesignCandidates.resolution(d) >= resolution && (best == null || d.size() < best.size())) {
                best = d;
            }
        }
        return best;
    }

    private static String shortfall(PlanSettings.Kind kind, CodedDesign design, int k, int wanted, int budget,
                                    int centre) {
        CodedDesign need = smallest(kind, k, wanted);
        String needs = need == null ? String.format(Locale.ROOT, "no %s of %d factors reaches it", kindName(kind), k)
                : String.format(Locale.ROOT, "that needs the %s in %d runs: a budget of %d%s", need.name(),
                need.size(), need.size() + centre, centre > 0 ? " with the " + centre + " centre points, or "
                        + need.size() + " without them" : "");
        int reached = DesignCandidates.resolution(design);
        String consequence = reached == 3
                ? ": main effects are then aliased with two-factor interactions and a follow-up fold-over may be needed"
                : String.format(Locale.ROOT, ", keeping %d of the %d two-factor interactions clear",
                DesignCandidates.clearInteractions(design), k * (k - 1) / 2);
        return String.format(Locale.ROOT, " The budget of %d runs cannot hold resolution %s for these %d factors (%s), "
                        + "so the plan drops to resolution %s%s.", budget, TwoLevelDesign.resolutionLabel(wanted), k,
                needs, TwoLevelDesign.resolutionLabel(reached), consequence);
    }

    private static String kindName(PlanSettings.Kind kind) {
        return switch (kind) {
            case AUTO -> "two-level";
            case FULL_FACTORIAL -> "full factorial";
            case FRACTIONAL -> "fractional factorial";
            case PLACKETT_BURMAN -> "Plackett-Burman";
            case CENTRAL_COMPOSITE -> "central composite";
            case BOX_BEHNKEN -> "Box-Behnken";
        };
    }

    private static String explain(CodedDesign d, List<String> factors, List<String> leftOut, double share,
                                  String resWhy, String notes, int centre, boolean userFactors) {
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
        b.append(". It uses a ").append(d.name()).append(", in ").append(d.size()).append(" runs");
        if (centre > 0) {
            b.append(" plus ").append(centre).append(" centre point").append(centre > 1 ? "s" : "")
                    .append(" (").append(d.size() + centre).append(" runs in all)");
        }
        b.append(", chosen by a search over every design that fits: ").append(resWhy).append('.')
                .append(notes).append(' ');
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
