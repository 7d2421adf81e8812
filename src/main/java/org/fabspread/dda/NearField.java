package org.fabspread.dda;

/**
 * Mean near-field intensity in a host shell around the particle: the field E = E_inc + Σ_j G(r − r_j) P_j
 * (the point-dipole field of every dipole, as discrete-dipole codes evaluate near fields; Flatau &amp; Draine,
 * Opt. Express 20, 1247 (2012)) at the centres of the host cells within {@code shell} of the particle, on a
 * lattice box widened by the shell. A host cell is in the shell when its centre lies within t/d + 1/2
 * cells of a dipole centre (the nearest dipole to an outside cell is always a surface dipole, so only
 * surface dipoles are searched). Allocation-free after construction.
 */
final class NearField {
    private final int pad;
    private final int cx;
    private final int cy;
    private final int cz;
    private final Convolution conv;
    private final int[] dipoleIndex;
    private final int[] shell;
    private final double[] sx;
    private final double[] sy;
    private final double[] sz;

    NearField(int nx, int ny, int nz, double[] origin, int[] xs, int[] ys, int[] zs, double shellCells) {
        pad = (int) Math.ceil(shellCells + 0.5);
        int tx = nx + 2 * pad;
        int ty = ny + 2 * pad;
        int tz = nz + 2 * pad;
        cx = nx + pad;
        cy = ny + pad;
        cz = nz + pad;
        conv = new Convolution(tx, ty, tz, nx + pad - 1, ny + pad - 1, nz + pad - 1);
        int n = xs.length;
        dipoleIndex = new int[n];
        boolean[] occupied = new boolean[tx * ty * tz];
        for (int j = 0; j < n; j++) {
            occupied[((zs[j] + pad) * ty + ys[j] + pad) * tx + xs[j] + pad] = true;
            dipoleIndex[j] = conv.index(xs[j] + pad, ys[j] + pad, zs[j] + pad);
        }
        double reach = shellCells + 0.5;
        double reach2 = reach * reach;
        int r = (int) Math.floor(reach);
        boolean[] inShell = new boolean[tx * ty * tz];
        int count = 0;
        for (int j = 0; j < n; j++) {
            int x = xs[j] + pad;
            int y = ys[j] + pad;
            int z = zs[j] + pad;
            if (!surface(occupied, tx, ty, x, y, z)) {
                continue;
            }
            for (int dz = -r; dz <= r; dz++) {
                for (int dy = -r; dy <= r; dy++) {
                    for (int dx = -r; dx <= r; dx++) {
                        if (dx * dx + dy * dy + dz * dz > reach2) {
                            continue;
                        }
                        int c = ((z + dz) * ty + y + dy) * tx + x + dx;
                        if (!occupied[c] && !inShell[c]) {
                            inShell[c] = true;
                            count++;
                        }
                    }
                }
            }
        }
        shell = new int[count];
        sx = new double[count];
        sy = new double[count];
        sz = new double[count];
        int k = 0;
        for (int z = 0; z < tz; z++) {
            for (int y = 0; y < ty; y++) {
                for (int x = 0; x < tx; x++) {
                    int c = (z * ty + y) * tx + x;
                    if (inShell[c]) {
                        shell[k] = conv.index(x, y, z);
                        sx[k] = origin[0] + x - pad;
                        sy[k] = origin[1] + y - pad;
                        sz[k] = origin[2] + z - pad;
                        k++;
                    }
                }
            }
        }
    }

    private static boolean surface(boolean[] occ, int tx, int ty, int x, int y, int z) {
        int c = (z * ty + y) * tx + x;
        int sxy = tx * ty;
        return !occ[c - 1] || !occ[c + 1] || !occ[c - tx] || !occ[c + tx] || !occ[c - sxy] || !occ[c + sxy];
    }

    /** Number of host cells in the shell. */
    int cells() {
        return shell.length;
    }

    /** Mean |E|²/|E₀|² over the shell for dipoles P (lattice units) under the incident wave. */
    double meanIntensity(double kappa, Incidence inc, double[] pr, double[] pi) {
        if (shell.length == 0) {
            return Double.NaN;
        }
        conv.setWavenumber(kappa);
        conv.clear();
        for (int c = 0; c < 3; c++) {
            double[] re = conv.re(c);
            double[] im = conv.im(c);
            for (int j = 0; j < dipoleIndex.length; j++) {
                re[dipoleIndex[j]] = pr[3 * j + c];
                im[dipoleIndex[j]] = pi[3 * j + c];
            }
        }
        conv.convolve(cx, cy, cz);
        double sum = 0;
        for (int k = 0; k < shell.length; k++) {
            double phase = kappa * (inc.dir(0) * sx[k] + inc.dir(1) * sy[k] + inc.dir(2) * sz[k]);
            double cr = Math.cos(phase);
            double ci = Math.sin(phase);
            double e2 = 0;
            for (int c = 0; c < 3; c++) {
                double er = inc.pol(c) * cr + conv.re(c)[shell[k]];
                double ei = inc.pol(c) * ci + conv.im(c)[shell[k]];
                e2 += er * er + ei * ei;
            }
            sum += e2;
        }
        return sum / shell.length;
    }
}
