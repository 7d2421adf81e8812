package org.fabspread.plan;

/**
 * One run of a plan.
 *
 * @param runOrder      position in the randomised order the operator follows (1-based)
 * @param standardOrder position of the design point in the design's standard order (1-based); centre
 *                      points follow the design points
 * @param block         block (1-based)
 * @param replicate     replicate (1-based)
 * @param type          factorial (cube), axial, or centre point
 * @param coded         coded factor levels in plan factor order
 */
public record Run(int runOrder, int standardOrder, int block, int replicate, PointType type, double[] coded) {

    public Run {
        coded = coded.clone();
    }

    @Override
    public double[] coded() {
        return coded.clone();
    }

    /** Coded level of factor i. */
    public double level(int i) {
        return coded[i];
    }

    /** Kinds of design points. */
    public enum PointType { FACTORIAL, AXIAL, CENTRE }
}
