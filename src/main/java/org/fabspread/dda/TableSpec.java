package org.fabspread.dda;

import java.nio.ByteBuffer;
import java.nio.charset.StandardCharsets;
import java.security.MessageDigest;
import java.security.NoSuchAlgorithmException;
import java.util.HexFormat;

/**
 * Everything that enters a shape table: the shape family, the nodes of each varying parameter (nm), the
 * wavelength subgrid (nm), the particle's permittivity and the host's real index on it, and the solver
 * settings. {@link #key()} is the SHA-256 of all of it (and of {@link #FORMAT}), the on-disk cache key.
 */
public record TableSpec(ShapeFamily family, double[][] nodes, double[] wavelengths, double[] epsRe,
                        double[] epsIm, double[] hostIndex, DdaSettings settings) {

    /** Version of the solver and file layout; changing the solver's numbers changes it. */
    public static final String FORMAT = "fabspread-dda-table-1";

    public TableSpec {
        if (nodes.length != family.varying().size()) {
            throw new IllegalArgumentException("one node array per varying parameter");
        }
        nodes = nodes.clone();
        for (int i = 0; i < nodes.length; i++) {
            nodes[i] = nodes[i].clone();
            if (nodes[i].length < 1) {
                throw new IllegalArgumentException("each varying parameter needs at least one node");
            }
        }
        int n = wavelengths.length;
        if (n < 1 || epsRe.length != n || epsIm.length != n || hostIndex.length != n) {
            throw new IllegalArgumentException("wavelengths, permittivity and host index must have the same length");
        }
        for (int i = 1; i < n; i++) {
            if (!(wavelengths[i] > wavelengths[i - 1])) {
                throw new IllegalArgumentException("wavelengths must increase");
            }
        }
        wavelengths = wavelengths.clone();
        epsRe = epsRe.clone();
        epsIm = epsIm.clone();
        hostIndex = hostIndex.clone();
    }

    /** Number of parameter nodes (the tensor grid's size). */
    public int nodeCount() {
        int c = 1;
        for (double[] x : nodes) {
            c *= x.length;
        }
        return c;
    }

    /** Values of the varying parameters at grid node {@code node} (first parameter fastest). */
    public double[] nodeValues(int node) {
        double[] v = new double[nodes.length];
        int rest = node;
        for (int d = 0; d < nodes.length; d++) {
            v[d] = nodes[d][rest % nodes[d].length];
            rest /= nodes[d].length;
        }
        return v;
    }

    public double[] nodes(int dim) {
        return nodes[dim].clone();
    }

    @Override
    public double[][] nodes() {
        double[][] c = new double[nodes.length][];
        for (int i = 0; i < c.length; i++) {
            c[i] = nodes[i].clone();
        }
        return c;
    }

    @Override
    public double[] wavelengths() {
        return wavelengths.clone();
    }

    @Override
    public double[] epsRe() {
        return epsRe.clone();
    }

    @Override
    public double[] epsIm() {
        return epsIm.clone();
    }

    @Override
    public double[] hostIndex() {
        return hostIndex.clone();
    }

    /** SHA-256 (hex) of everything that enters the table. */
    public String key() {
        try {
            MessageDigest md = MessageDigest.getInstance("SHA-256");
            md.update(FORMAT.getBytes(StandardCharsets.UTF_8));
            md.update(family.describe().getBytes(StandardCharsets.UTF_8));
            md.update(String.join(",", family.varying()).getBytes(StandardCharsets.UTF_8));
            for (double[] x : nodes) {
                update(md, x);
            }
            update(md, wavelengths);
            update(md, epsRe);
            update(md, epsIm);
            update(md, hostIndex);
            update(md, new double[] {settings.pitchNm(), settings.tolerance(), settings.maxIterations(),
                settings.shellNm()});
            return HexFormat.of().formatHex(md.digest());
        } catch (NoSuchAlgorithmException e) {
            throw new IllegalStateException("SHA-256 is missing from this Java runtime", e);
        }
    }

    private static void update(MessageDigest md, double[] x) {
        ByteBuffer b = ByteBuffer.allocate(8 * x.length + 4);
        b.putInt(x.length);
        for (double v : x) {
            b.putLong(Double.doubleToLongBits(v));
        }
        md.update(b.array());
    }
}
