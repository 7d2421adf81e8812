package org.fabspread.plan;

import java.util.ArrayList;
import java.util.List;

import org.fabspread.study.PlanSettings;

/**
 * Every design of a kind the program can build for k factors, of any size: the tabled
 * minimum-aberration regular fractions in 4 to 128 runs and the full factorial
 * ({@link MinimumAberrationCatalog}), the 12-, 20- and 24-run Plackett–Burman designs, the rotatable
 * central composite design on the smallest resolution V cube, and the Box–Behnken design. The
 * {@link PlanAdvisor} searches this list exhaustively for the best one that fits the budget.
 *
 * <p>Which kinds a study's {@code plan.kind} admits: {@code auto} all two-level designs (regular
 * fractions, full factorial, Plackett–Burman); {@code fractional} the regular fractions and the full
 * factorial (never a Plackett–Burman design, whose interactions are spread over the main effects);
 * {@code full-factorial}, {@code plackett-burman}, {@code central-composite}, {@code box-behnken} only
 * their own kind.
 */
public final class DesignCandidates {

    /** Largest full factorial offered (2^11 = 2048 runs). */
    public static final int MAX_FULL_FACTORS = 11;

    private DesignCandidates() {
    }

    /** All designs of the kind for k factors, smallest first within each family. */
    public static List<CodedDesign> of(PlanSettings.Kind kind, int k) {
        return of(kind, ResponseSurfaceDesigns.Axial.ROTATABLE, k);
    }

    /** As {@link #of(PlanSettings.Kind, int)} with the axial distance of a central composite design. */
    public static List<CodedDesign> of(PlanSettings.Kind kind, ResponseSurfaceDesigns.Axial axial, int k) {
        List<CodedDesign> out = new ArrayList<>();
        if (k < 1) {
            return out;
        }
        switch (kind) {
            case FULL_FACTORIAL -> {
                if (k <= MAX_FULL_FACTORS) {
                    out.add(CodedDesign.of(TwoLevelDesign.full(k)));
                }
            }
            case PLACKETT_BURMAN -> addPlackettBurman(out, k);
            case CENTRAL_COMPOSITE -> {
                if (k >= 2 && MinimumAberrationCatalog.smallest(k, 5).isPresent()) {
                    out.add(CodedDesign.centralComposite(k, axial));
                }
            }
            case BOX_BEHNKEN -> {
                if (k >= 3 && k <= 7) {
                    out.add(CodedDesign.boxBehnken(k));
                }
            }
            case FRACTIONAL -> addRegular(out, k);
            default -> {
                addRegular(out, k);
                addPlackettBurman(out, k);
            }
        }
        return out;
    }

    private static void addRegular(List<CodedDesign> out, int k) {
        if (k > MinimumAberrationCatalog.MAX_FACTORS) {
            return;
        }
        for (int runs = 4; runs <= 128 && runs < (1 << k); runs *= 2) {
            if (MinimumAberrationCatalog.covers(k, runs)) {
                out.add(CodedDesign.of(MinimumAberrationCatalog.design(k, runs)));
            }
        }
        if (k <= MAX_FULL_FACTORS) {
            out.add(CodedDesign.of(TwoLevelDesign.full(k)));
        }
    }

    private static void addPlackettBurman(List<CodedDesign> out, int k) {
        for (int n : PlackettBurman.RUN_SIZES) {
            if (n - 1 >= k) {
                out.add(CodedDesign.plackettBurman(k, n));
            }
        }
    }

    /**
     * The resolution the advisor ranks a design by: the regular design's own ({@link Integer#MAX_VALUE}
     * for a full factorial), III for Plackett–Burman (main effects are clear of each other but
     * partially aliased with two-factor interactions), and {@link Integer#MAX_VALUE} for second-order
     * designs, whose model holds every two-factor interaction.
     */
    public static int resolution(CodedDesign d) {
        if (d.isSecondOrder()) {
            return Integer.MAX_VALUE;
        }
        if (d.kind() == PlanSettings.Kind.PLACKETT_BURMAN) {
            return 3;
        }
        return d.regular().resolution();
    }

    /** Two-factor interactions the design keeps clear of main effects and other two-factor interactions. */
    public static int clearInteractions(CodedDesign d) {
        int k = d.factors();
        if (d.isSecondOrder()) {
            return k * (k - 1) / 2;
        }
        if (d.kind() == PlanSettings.Kind.PLACKETT_BURMAN) {
            return 0;
        }
        TwoLevelDesign r = d.regular();
        return r.resolution() >= 5 ? k * (k - 1) / 2 : r.clearTwoFactorInteractions().size();
    }
}
