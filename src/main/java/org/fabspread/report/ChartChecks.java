package org.fabspread.report;

import java.util.Arrays;
import java.util.HashSet;
import java.util.Set;

/**
 * The argument checks of the chart domains: empty data, data without a finite value, mismatched
 * lengths and blank or repeated labels are refused with an {@link IllegalArgumentException} naming the
 * chart; plus small counts over arrays that skip NaN.
 */
final class ChartChecks {

    private ChartChecks() {
    }

    static double[] finiteSorted(String name, String what, double[] values) {
        requireNonEmpty(name, what, values);
        double[] v = new double[values.length];
        int n = 0;
        for (double x : values) {
            if (Double.isFinite(x)) {
                v[n++] = x;
            }
        }
        if (n == 0) {
            throw new IllegalArgumentException(name + ": " + what + " has no finite value (all NaN)");
        }
        v = Arrays.copyOf(v, n);
        Arrays.sort(v);
        return v;
    }

    static int requireNonEmpty(String name, String what, double[] a) {
        if (a == null || a.length == 0) {
            throw new IllegalArgumentException(name + ": " + what + " is empty");
        }
        return a.length;
    }

    static void requireLength(String name, String what, double[] a, int n) {
        if (a == null || a.length != n) {
            throw new IllegalArgumentException(name + ": " + what + " must have " + n + " values, has "
                    + (a == null ? "none" : a.length));
        }
    }

    static void requireSameLength(String name, String wa, double[] a, String wb, double[] b) {
        requireNonEmpty(name, wa, a);
        requireNonEmpty(name, wb, b);
        if (a.length != b.length) {
            throw new IllegalArgumentException(name + ": " + wa + " has " + a.length + " values, " + wb + " has " + b.length);
        }
    }

    static void requireIncreasing(String name, String what, double[] a) {
        for (int i = 0; i < a.length; i++) {
            if (!Double.isFinite(a[i]) || (i > 0 && a[i] <= a[i - 1])) {
                throw new IllegalArgumentException(name + ": " + what + " must be finite and increasing");
            }
        }
    }

    static void requireSomeFinite(String name, String what, double[]... arrays) {
        boolean empty = true;
        for (double[] a : arrays) {
            if (a == null) {
                continue;
            }
            if (a.length > 0) {
                empty = false;
            }
            for (double x : a) {
                if (Double.isFinite(x)) {
                    return;
                }
            }
        }
        throw new IllegalArgumentException(name + ": " + what + (empty ? " is empty" : " has no finite value (all NaN)"));
    }

    static int requireLabels(String name, String[] labels) {
        Chart.requireFileSafe(name);
        if (labels == null || labels.length == 0) {
            throw new IllegalArgumentException(name + ": no series or categories given (empty)");
        }
        Set<String> seen = new HashSet<>();
        for (String l : labels) {
            if (l == null || l.isBlank()) {
                throw new IllegalArgumentException(name + ": a label is blank");
            }
            if (!seen.add(l)) {
                throw new IllegalArgumentException(name + ": the label '" + l + "' appears twice");
            }
        }
        return labels.length;
    }

    static int countFinite(double[] a) {
        int n = 0;
        for (double x : a) {
            if (Double.isFinite(x)) {
                n++;
            }
        }
        return n;
    }

    static double min(double[] a) {
        double m = Double.POSITIVE_INFINITY;
        for (double x : a) {
            m = Math.min(m, x);
        }
        return m;
    }

    static double max(double[] a) {
        double m = Double.NEGATIVE_INFINITY;
        for (double x : a) {
            m = Math.max(m, x);
        }
        return m;
    }
}
