package org.fabspread.dda;

/**
 * A plane wave E = ê e^{i k â·r} (time factor e^{−iωt}) of unit amplitude: direction â and real linear
 * polarisation ê ⟂ â, both normalised here. Phase reference: the origin of the shape's frame.
 */
public record Incidence(double[] direction, double[] polarisation) {

    public Incidence {
        direction = unit(direction, "direction");
        polarisation = unit(polarisation, "polarisation");
        double dot = direction[0] * polarisation[0] + direction[1] * polarisation[1]
                + direction[2] * polarisation[2];
        if (Math.abs(dot) > 1e-12) {
            throw new IllegalArgumentException("polarisation must be perpendicular to the direction");
        }
    }

    /** Normal incidence along +z, field along x (the first in-plane polarisation). */
    public static final Incidence X = new Incidence(new double[] {0, 0, 1}, new double[] {1, 0, 0});
    /** Normal incidence along +z, field along y (the second in-plane polarisation). */
    public static final Incidence Y = new Incidence(new double[] {0, 0, 1}, new double[] {0, 1, 0});
    /** Incidence along +x, field along z (for the out-of-plane column of the polarisability tensor). */
    public static final Incidence Z = new Incidence(new double[] {1, 0, 0}, new double[] {0, 0, 1});

    @Override
    public double[] direction() {
        return direction.clone();
    }

    @Override
    public double[] polarisation() {
        return polarisation.clone();
    }

    double dir(int a) {
        return direction[a];
    }

    double pol(int a) {
        return polarisation[a];
    }

    /** S = Σ_a (â_a ê_a)² of the lattice dispersion relation (Draine &amp; Goodman 1993, eq. 3.5). */
    double ldrS() {
        double s = 0;
        for (int a = 0; a < 3; a++) {
            s += direction[a] * polarisation[a] * direction[a] * polarisation[a];
        }
        return s;
    }

    private static double[] unit(double[] v, String what) {
        if (v == null || v.length != 3) {
            throw new IllegalArgumentException(what + " must have three components");
        }
        double n = Math.sqrt(v[0] * v[0] + v[1] * v[1] + v[2] * v[2]);
        if (!(n > 0) || Double.isInfinite(n)) {
            throw new IllegalArgumentException(what + " must be a finite nonzero vector");
        }
        return new double[] {v[0] / n, v[1] / n, v[2] / n};
    }
}
