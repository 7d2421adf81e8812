package org.fabspread.report;

import java.util.List;

import org.fabspread.sampling.Interval;

/** How the report writes the interval of a change between two settings (a gain in yield). */
final class PairedText {

    /** What the interval is, for column headings. */
    static final String KIND = "paired interval";

    private PairedText() {
    }

    /** "−0.4 to +2.2 percentage points", or "no interval". */
    static String range(Interval change) {
        if (change == null || !change.bounded()) {
            return "no interval";
        }
        return signed(change.low()) + " to " + signed(change.high()) + " percentage points";
    }

    /** Whether the change is established by its interval: the whole interval above zero. */
    static boolean establishedGain(Interval change) {
        return change != null && change.bounded() && change.above(0);
    }

    static double[] array(List<Double> v) {
        return v.stream().mapToDouble(Double::doubleValue).toArray();
    }

    private static String signed(double fraction) {
        String p = Numbers.points(fraction);
        return p.substring(0, p.length() - " percentage points".length());
    }
}
