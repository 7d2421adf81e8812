package org.fabspread.shapes;

import java.util.Arrays;

/**
 * A particle on a cubic lattice: the cells of an nx × ny × nz box (index (z·ny + y)·nx + x) that hold a
 * dipole, in increasing order. {@code spacing} is the dipole spacing d (nm) the solver uses: the pitch
 * rescaled so that N d³ equals the shape's true volume (the volume-equivalent lattice of Draine &amp;
 * Flatau, JOSA A 11, 1491 (1994), §5). Cell (0, 0, 0) has its centre at {@code origin} (in units of d),
 * so cell (i, j, k) sits at (origin[0] + i, origin[1] + j, origin[2] + k)·d in the shape's frame.
 */
public record Voxels(int nx, int ny, int nz, double spacing, int[] cells, double[] origin) {

    public Voxels {
        if (nx < 1 || ny < 1 || nz < 1) {
            throw new IllegalArgumentException("voxel box must be at least 1 x 1 x 1");
        }
        if (!(spacing > 0) || Double.isInfinite(spacing)) {
            throw new IllegalArgumentException("dipole spacing must be > 0, got " + spacing);
        }
        cells = cells.clone();
        origin = origin.clone();
        if (cells.length == 0) {
            throw new IllegalArgumentException("the shape holds no lattice cell at this resolution");
        }
        for (int i = 0; i < cells.length; i++) {
            if (cells[i] < 0 || cells[i] >= nx * ny * nz || (i > 0 && cells[i] <= cells[i - 1])) {
                throw new IllegalArgumentException("voxel cells must be distinct, inside the box and sorted");
            }
        }
    }

    @Override
    public int[] cells() {
        return cells.clone();
    }

    @Override
    public double[] origin() {
        return origin.clone();
    }

    /** Number of dipoles N. */
    public int count() {
        return cells.length;
    }

    /** Cell index of dipole j. */
    public int cell(int j) {
        return cells[j];
    }

    public int xOf(int j) {
        return cells[j] % nx;
    }

    public int yOf(int j) {
        return (cells[j] / nx) % ny;
    }

    public int zOf(int j) {
        return cells[j] / (nx * ny);
    }

    /** The volume N d³ the lattice holds (nm³). */
    public double volume() {
        return cells.length * spacing * spacing * spacing;
    }

    /** True when cell (x, y, z) of the box holds a dipole. */
    public boolean filled(int x, int y, int z) {
        return Arrays.binarySearch(cells, (z * ny + y) * nx + x) >= 0;
    }
}
