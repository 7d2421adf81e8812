package org.fabspread.report;

/** Small real charts for the renderer and writer tests. */
final class TestCharts {

    private static final ChartFactory SMALL = new ChartFactory(400, 260);

    private TestCharts() {
    }

    /** A quick three-curve chart whose title is {@code title}. */
    static Chart small(String name, String title) {
        double[] wl = {400, 450, 500, 550, 600};
        return SMALL.crossSections(name, title, wl, new double[] {3, 5, 4, 2, 1}, new double[] {1, 2, 2, 1, 0.5},
                new double[] {2, 3, 2, 1, 0.5}, "nm²");
    }
}
