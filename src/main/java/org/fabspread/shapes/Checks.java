package org.fabspread.shapes;

/** Argument checks shared by the shape records. */
final class Checks {
    private Checks() {
    }

    static void positive(String kind, String name, double v) {
        if (!(v > 0) || Double.isInfinite(v)) {
            throw new IllegalArgumentException(kind + ": " + name + " must be > 0 nm, got " + v);
        }
    }
}
