package org.fabspread.shapes;

/**
 * Places a {@link Solid} on a cubic lattice of pitch h: the box holds ceil(2·half/h) cells along each
 * axis, centred on the origin (so a mirror plane of the shape through the origin is a mirror plane of the
 * lattice), and a cell holds a dipole when its centre lies inside the shape (common practice in
 * discrete-dipole work: Draine &amp; Flatau, JOSA A 11, 1491 (1994)). The dipole spacing is then rescaled to
 * d = (V/N)^{1/3}, V the shape's true volume.
 */
public final class Voxeliser {
    private Voxeliser() {
    }

    public static Voxels voxelise(Solid s, double pitchNm) {
        if (!(pitchNm > 0) || Double.isInfinite(pitchNm)) {
            throw new IllegalArgumentException("lattice pitch must be > 0 nm, got " + pitchNm);
        }
        double[] half = s.halfExtent();
        int nx = cellsAlong(half[0], pitchNm);
        int ny = cellsAlong(half[1], pitchNm);
        int nz = cellsAlong(half[2], pitchNm);
        if ((long) nx * ny * nz > 50_000_000L) {
            throw new IllegalArgumentException("lattice of " + nx + " x " + ny + " x " + nz
                    + " cells is too large; choose a coarser resolution");
        }
        double ox = -(nx - 1) / 2.0;
        double oy = -(ny - 1) / 2.0;
        double oz = -(nz - 1) / 2.0;
        int[] cells = new int[nx * ny * nz];
        int count = 0;
        for (int z = 0; z < nz; z++) {
            double pz = (oz + z) * pitchNm;
            for (int y = 0; y < ny; y++) {
                double py = (oy + y) * pitchNm;
                for (int x = 0; x < nx; x++) {
                    if (s.contains((ox + x) * pitchNm, py, pz)) {
                        cells[count++] = (z * ny + y) * nx + x;
                    }
                }
            }
        }
        if (count == 0) {
            throw new IllegalArgumentException(s.kind() + " holds no lattice cell at a pitch of " + pitchNm
                    + " nm; choose a finer resolution");
        }
        double d = Math.cbrt(s.volume() / count);
        return new Voxels(nx, ny, nz, d, java.util.Arrays.copyOf(cells, count), new double[] {ox, oy, oz});
    }

    private static int cellsAlong(double half, double pitch) {
        return Math.max(1, (int) Math.ceil(2 * half / pitch - 1e-9));
    }
}
