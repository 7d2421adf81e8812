package org.fabspread.device;

/**
 * The volume of a spherical segment of one base (a cap): a sphere of radius r cut by a plane at height h
 * from its pole holds V = πh²(3r − h)/3 on the pole's side (Bronshtein &amp; Semendyayev, Handbook of
 * Mathematics, 3.3.4 "spherical segment"; CRC Standard Mathematical Tables, spherical segment of one base),
 * so the two sides of the plane hold V(h) + V(2r − h) = 4πr³/3. A spheroid with semi-axis c normal to the
 * plane is the image of a sphere of radius c under a stretch of the in-plane axes, which scales every
 * volume by the same factor, so the share of its volume on either side is that of the sphere.
 *
 * <p>Used for a particle layer that sticks out of its host: the share of each particle in each layer.
 */
final class SphericalCap {

    private SphericalCap() {
    }

    /** V = πh²(3r − h)/3 of the cap of height h (0 ≤ h ≤ 2r) of a sphere of radius r. */
    static double volume(double r, double h) {
        if (!(r > 0) || !(h >= 0 && h <= 2 * r)) {
            throw new IllegalArgumentException("need r > 0 and 0 <= h <= 2r, got r = " + r + ", h = " + h);
        }
        return Math.PI * h * h * (3 * r - h) / 3;
    }

    /**
     * The share of the body's volume in the cap of height h, h²(3r − h)/(4r³), for a sphere of radius r or a
     * spheroid of semi-axis r normal to the cutting plane; 0 at h = 0 and 1 at h = 2r.
     */
    static double share(double r, double h) {
        if (!(r > 0) || !(h >= 0 && h <= 2 * r)) {
            throw new IllegalArgumentException("need r > 0 and 0 <= h <= 2r, got r = " + r + ", h = " + h);
        }
        double x = h / r;
        return x * x * (3 - x) / 4;
    }
}
