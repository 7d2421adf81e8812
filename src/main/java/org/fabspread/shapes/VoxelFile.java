package org.fabspread.shapes;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Map;

import org.fabspread.study.StudyException;

/**
 * A user's own lattice, read from a plain text file: a line {@code pitch_nm: P} giving the cell size, then one
 * filled cell per line as three integers {@code x y z}; {@code #} starts a comment, blank lines are ignored.
 * The box spans the cells given and is centred on the origin; the lattice is used as it is (its volume is
 * N P³, the requested pitch is ignored).
 */
public record VoxelFile(String name, double pitch, Voxels lattice) implements Shape {

    public VoxelFile {
        Checks.positive("voxel file", "pitch_nm", pitch);
    }

    /** Reads a voxel file; a malformed file gives one {@code file:line:col: …} error. */
    public static VoxelFile read(Path file) {
        String name = file.getFileName().toString();
        List<String> lines;
        try {
            lines = Files.readAllLines(file, StandardCharsets.UTF_8);
        } catch (IOException e) {
            throw new StudyException(name + ": cannot read voxel file: " + e.getMessage());
        }
        return parse(name, lines);
    }

    static VoxelFile parse(String name, List<String> lines) {
        double pitch = Double.NaN;
        List<int[]> cells = new ArrayList<>();
        for (int ln = 0; ln < lines.size(); ln++) {
            String raw = lines.get(ln);
            int hash = raw.indexOf('#');
            String s = hash >= 0 ? raw.substring(0, hash) : raw;
            if (s.isBlank()) {
                continue;
            }
            int col = firstNonBlank(s) + 1;
            String t = s.trim();
            String where = name + ":" + (ln + 1) + ":" + col + ": ";
            if (t.startsWith("pitch_nm")) {
                String v = t.substring("pitch_nm".length()).replaceFirst("^\\s*:?\\s*", "");
                try {
                    pitch = Double.parseDouble(v);
                } catch (NumberFormatException e) {
                    throw new StudyException(where + "pitch_nm: expected a number, got '" + v + "'");
                }
                if (!(pitch > 0) || Double.isInfinite(pitch)) {
                    throw new StudyException(where + "pitch_nm: must be > 0 nm, got " + v);
                }
                continue;
            }
            String[] f = t.split("\\s+");
            if (f.length != 3) {
                throw new StudyException(where + "voxel: expected three integers 'x y z', got '" + t + "'");
            }
            int[] c = new int[3];
            for (int i = 0; i < 3; i++) {
                try {
                    c[i] = Integer.parseInt(f[i]);
                } catch (NumberFormatException e) {
                    throw new StudyException(where + "voxel: '" + f[i] + "' is not an integer");
                }
            }
            cells.add(c);
        }
        if (Double.isNaN(pitch)) {
            throw new StudyException(name + ":1:1: pitch_nm: missing (a line 'pitch_nm: 2.0' gives the cell size)");
        }
        if (cells.isEmpty()) {
            throw new StudyException(name + ":1:1: voxel: the file lists no cell");
        }
        return new VoxelFile(name, pitch, lattice(name, cells, pitch));
    }

    private static Voxels lattice(String name, List<int[]> cells, double pitch) {
        int[] lo = {Integer.MAX_VALUE, Integer.MAX_VALUE, Integer.MAX_VALUE};
        int[] hi = {Integer.MIN_VALUE, Integer.MIN_VALUE, Integer.MIN_VALUE};
        for (int[] c : cells) {
            for (int i = 0; i < 3; i++) {
                lo[i] = Math.min(lo[i], c[i]);
                hi[i] = Math.max(hi[i], c[i]);
            }
        }
        long nx = (long) hi[0] - lo[0] + 1;
        long ny = (long) hi[1] - lo[1] + 1;
        long nz = (long) hi[2] - lo[2] + 1;
        if (nx * ny * nz > 50_000_000L) {
            throw new StudyException(name + ":1:1: voxel: the cells span " + nx + " x " + ny + " x " + nz
                    + ", too large a box");
        }
        int[] idx = new int[cells.size()];
        for (int j = 0; j < idx.length; j++) {
            int[] c = cells.get(j);
            idx[j] = (int) (((c[2] - lo[2]) * ny + (c[1] - lo[1])) * nx + (c[0] - lo[0]));
        }
        Arrays.sort(idx);
        int n = 0;
        for (int j = 0; j < idx.length; j++) {
            if (n == 0 || idx[j] != idx[n - 1]) {
                idx[n++] = idx[j];
            }
        }
        return new Voxels((int) nx, (int) ny, (int) nz, pitch, Arrays.copyOf(idx, n),
                new double[] {-(nx - 1) / 2.0, -(ny - 1) / 2.0, -(nz - 1) / 2.0});
    }

    private static int firstNonBlank(String s) {
        int i = 0;
        while (i < s.length() && Character.isWhitespace(s.charAt(i))) {
            i++;
        }
        return i;
    }

    @Override
    public String kind() {
        return "voxel_file";
    }

    @Override
    public Map<String, Double> parameters() {
        Map<String, Double> m = new LinkedHashMap<>();
        m.put("pitch_nm", pitch);
        m.put("cells", (double) lattice.count());
        return m;
    }

    @Override
    public double volume() {
        return lattice.volume();
    }

    @Override
    public Voxels voxelise(double pitchNm) {
        return lattice;
    }
}
