package org.fabspread.plan;

import java.util.List;

import org.fabspread.study.PlanSettings;

/**
 * The design points of a plan in coded units, in standard order, before centre points, replication,
 * blocking and randomisation.
 *
 * @param kind      the family
 * @param name      e.g. {@code 2^(6-2) IV} or {@code Plackett-Burman 12}
 * @param points    coded levels [point][factor]
 * @param types     the type of each point
 * @param regular   the regular two-level design, or null (Plackett–Burman, second-order designs)
 * @param screeningColumns for Plackett–Burman, the full ±1 matrix (all N − 1 columns) whose first k
 *                  columns are the factors; null otherwise
 * @param alpha     axial distance of a central composite design (NaN otherwise)
 */
public record CodedDesign(PlanSettings.Kind kind, String name, double[][] points, List<Run.PointType> types,
                          TwoLevelDesign regular, int[][] screeningColumns, double alpha) {

    public CodedDesign {
        types = List.copyOf(types);
    }

    public int factors() {
        return points[0].length;
    }

    public int size() {
        return points.length;
    }

    /** A regular two-level design (full or fractional). */
    public static CodedDesign of(TwoLevelDesign d) {
        int[][] m = d.matrix();
        double[][] p = new double[m.length][d.factors()];
        for (int r = 0; r < m.length; r++) {
            for (int i = 0; i < d.factors(); i++) {
                p[r][i] = m[r][i];
            }
        }
        PlanSettings.Kind kind = d.isFull() ? PlanSettings.Kind.FULL_FACTORIAL : PlanSettings.Kind.FRACTIONAL;
        String name = d.isFull() ? "2^" + d.factors() + " full factorial"
                : "2^(" + d.factors() + "-" + d.fraction() + ") fractional factorial, resolution " + d.resolutionLabel();
        return new CodedDesign(kind, name, p, java.util.Collections.nCopies(m.length, Run.PointType.FACTORIAL), d,
                null, Double.NaN);
    }

    /** The first k columns of the N-run Plackett–Burman design. */
    public static CodedDesign plackettBurman(int k, int runs) {
        int[][] m = PlackettBurman.matrix(runs);
        if (k > runs - 1) {
            throw new IllegalArgumentException(runs + "-run Plackett-Burman holds at most " + (runs - 1) + " factors");
        }
        double[][] p = new double[runs][k];
        for (int r = 0; r < runs; r++) {
            for (int i = 0; i < k; i++) {
                p[r][i] = m[r][i];
            }
        }
        return new CodedDesign(PlanSettings.Kind.PLACKETT_BURMAN, "Plackett-Burman " + runs + " runs", p,
                java.util.Collections.nCopies(runs, Run.PointType.FACTORIAL), null, m, Double.NaN);
    }

    /** A central composite design on the smallest resolution V cube. */
    public static CodedDesign centralComposite(int k, ResponseSurfaceDesigns.Axial axial) {
        TwoLevelDesign cube = ResponseSurfaceDesigns.cubeFor(k);
        double a = ResponseSurfaceDesigns.alpha(axial, cube);
        double[][] p = ResponseSurfaceDesigns.centralComposite(cube, a);
        java.util.List<Run.PointType> t = new java.util.ArrayList<>();
        for (int r = 0; r < p.length; r++) {
            t.add(r < cube.runs() ? Run.PointType.FACTORIAL : Run.PointType.AXIAL);
        }
        String name = "central composite (" + (axial == ResponseSurfaceDesigns.Axial.FACE_CENTRED ? "face-centred"
                : "rotatable") + ", alpha = " + String.format(java.util.Locale.ROOT, "%.4g", a) + ") on " + cube;
        return new CodedDesign(PlanSettings.Kind.CENTRAL_COMPOSITE, name, p, t, cube, null, a);
    }

    /** The Box–Behnken design of k = 3 … 7 factors. */
    public static CodedDesign boxBehnken(int k) {
        double[][] p = ResponseSurfaceDesigns.boxBehnken(k);
        return new CodedDesign(PlanSettings.Kind.BOX_BEHNKEN, "Box-Behnken " + k + " factors", p,
                java.util.Collections.nCopies(p.length, Run.PointType.FACTORIAL), null, null, Double.NaN);
    }

    /** True for central composite and Box–Behnken designs, which fit the full second-order model. */
    public boolean isSecondOrder() {
        return kind == PlanSettings.Kind.CENTRAL_COMPOSITE || kind == PlanSettings.Kind.BOX_BEHNKEN;
    }

    /** True for designs whose non-centre points are all at ±1 and pairwise orthogonal (two-level). */
    public boolean isTwoLevel() {
        return kind == PlanSettings.Kind.FULL_FACTORIAL || kind == PlanSettings.Kind.FRACTIONAL
                || kind == PlanSettings.Kind.PLACKETT_BURMAN;
    }
}
