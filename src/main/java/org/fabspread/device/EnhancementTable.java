package org.fabspread.device;

import java.io.IOException;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Arrays;
import java.util.List;
import java.util.Map;
import java.util.TreeMap;

import com.fasterxml.jackson.databind.MappingIterator;
import com.fasterxml.jackson.dataformat.csv.CsvMapper;
import com.fasterxml.jackson.dataformat.csv.CsvParser;

import org.fabspread.model.ModelException;
import org.fabspread.study.StudyException;
import org.fabspread.study.Units;

/**
 * A user's table of absorption enhancement from a rigorous (full-wave) solver, interpolated
 * multilinearly over (diameter, coverage[, wavelength]). Immutable.
 *
 * <p><b>File.</b> CSV with a header row (lines starting with {@code #} are comments; blank lines are
 * skipped), columns {@value #DIAMETER} (volume-equivalent median diameter, nm), {@value #COVERAGE}
 * (areal coverage, %), {@value #ENHANCEMENT} (the absorber's absorption with particles divided by its
 * absorption without, ≥ 0) and optionally {@value #WAVELENGTH} (nm; without it the enhancement applies
 * uniformly over the wavelength grid). The points must fill a rectangular grid over the axes present:
 * every combination of the distinct axis values exactly once, at least 2 values on each axis.
 *
 * <p><b>Interpolation.</b> Multilinear (tensor-product linear) interpolation on the rectilinear grid
 * (Press, Teukolsky, Vetterling &amp; Flannery, <i>Numerical Recipes</i>, 3rd ed. (2007), §3.6): the grid
 * points are reproduced exactly and the value is linear along every axis between neighbouring points.
 * Asking outside the table's range on any axis is an error naming the axis, the value and the range; it
 * is never extrapolated.
 *
 * <p><b>Use in the device model.</b> {@link DeviceModel} leaves the particle layer out of the transfer
 * matrix and multiplies the planar absorber absorption per wavelength by the interpolated enhancement;
 * see {@link #ASSUMPTION}.
 */
public final class EnhancementTable {

    /** Column of the diameter, nm. */
    public static final String DIAMETER = "diameter_nm";
    /** Column of the coverage, %. */
    public static final String COVERAGE = "coverage_percent";
    /** Column of the wavelength, nm (optional). */
    public static final String WAVELENGTH = "wavelength_nm";
    /** Column of the enhancement factor. */
    public static final String ENHANCEMENT = "enhancement";
    /** {@link ModelException#reason()} of a sample outside the table's range. */
    public static final String OUTSIDE_REASON = "outside-enhancement-table";

    /**
     * The energy bookkeeping of the device model with a table, as a sentence a report can show.
     */
    public static final String ASSUMPTION = "With an enhancement table the particle layer is left out of the "
            + "transfer matrix: the absorber's absorption (and its charge collection, with the planar depth profile) "
            + "is the planar stack's times the tabulated enhancement at the sample's particle diameter and coverage; "
            + "the extra absorption is taken from the reflection (a lost absorption goes back to it), other layers "
            + "keep their planar absorption, the absorber's absorption is capped so the reflection never goes "
            + "negative, and the table cannot say how much the particles absorb or scatter, so loss_metal, "
            + "loss_scattering and loss_quenching are 0 and any such loss is counted in loss_reflection.";

    private static final CsvMapper MAPPER = new CsvMapper();

    /** The axes of the table. */
    enum Axis {
        DIAMETER(EnhancementTable.DIAMETER, "particles.diameter", " nm", 1),
        COVERAGE(EnhancementTable.COVERAGE, "particles.coverage", " %", 100),
        WAVELENGTH(EnhancementTable.WAVELENGTH, "wavelength", " nm", 1);

        private final String column;
        private final String parameter;
        private final String unit;
        private final double display;

        Axis(String column, String parameter, String unit, double display) {
            this.column = column;
            this.parameter = parameter;
            this.unit = unit;
            this.display = display;
        }

        /** The CSV column of this axis. */
        String column() {
            return column;
        }

        /** The study parameter the axis is indexed by ({@code wavelength} for the grid). */
        String parameter() {
            return parameter;
        }

        String show(double canonical) {
            return Units.format(canonical * display) + unit;
        }
    }

    private final String source;
    private final double[] diameter;
    private final double[] coverage;
    private final double[] wavelength;
    /** value of (d, c, w) at ((d * nc) + c) * nw + w, nw = 1 without a wavelength axis. */
    private final double[] values;

    private EnhancementTable(String source, double[] diameter, double[] coverage, double[] wavelength, double[] values) {
        this.source = source;
        this.diameter = diameter;
        this.coverage = coverage;
        this.wavelength = wavelength;
        this.values = values;
    }

    /**
     * A table from its axes and values (a programmatic counterpart of {@link #read}).
     *
     * @param source       a name for messages (the file name)
     * @param diameterNm   strictly increasing diameters, nm, at least 2
     * @param coverage     strictly increasing coverages, fractions 0–1, at least 2
     * @param wavelengthNm strictly increasing wavelengths, nm, at least 2; or null for none
     * @param values       enhancements ≥ 0, wavelength fastest, then coverage, then diameter
     */
    static EnhancementTable of(String source, double[] diameterNm, double[] coverage, double[] wavelengthNm,
                                      double[] values) {
        checkAxis(diameterNm, "diameter");
        checkAxis(coverage, "coverage");
        if (wavelengthNm != null) {
            checkAxis(wavelengthNm, "wavelength");
        }
        int nw = wavelengthNm == null ? 1 : wavelengthNm.length;
        if (values.length != diameterNm.length * coverage.length * nw) {
            throw new IllegalArgumentException("expected " + diameterNm.length * coverage.length * nw + " values, got "
                    + values.length);
        }
        for (double v : values) {
            if (!(v >= 0) || Double.isInfinite(v)) {
                throw new IllegalArgumentException("enhancements must be finite and >= 0, got " + v);
            }
        }
        return new EnhancementTable(source, diameterNm.clone(), coverage.clone(),
                wavelengthNm == null ? null : wavelengthNm.clone(), values.clone());
    }

    private static void checkAxis(double[] a, String name) {
        if (a.length < 2) {
            throw new IllegalArgumentException(name + " axis needs at least 2 values, got " + a.length);
        }
        for (int i = 0; i < a.length; i++) {
            if (!Double.isFinite(a[i]) || (i > 0 && !(a[i] > a[i - 1]))) {
                throw new IllegalArgumentException(name + " axis must be finite and strictly increasing: "
                        + Arrays.toString(a));
            }
        }
    }

    /** The name used in messages (the file name). */
    public String source() {
        return source;
    }

    /** True when the table has a wavelength axis. */
    public boolean perWavelength() {
        return wavelength != null;
    }

    /** The diameter axis, nm (a copy). */
    public double[] diameters() {
        return diameter.clone();
    }

    /** The coverage axis, fractions 0–1 (a copy). */
    public double[] coverages() {
        return coverage.clone();
    }

    /** The wavelength axis, nm (a copy), or an empty array without one. */
    public double[] wavelengths() {
        return wavelength == null ? new double[0] : wavelength.clone();
    }

    /** The sentence describing the device model's bookkeeping with a table ({@link #ASSUMPTION}). */
    public static String assumption() {
        return ASSUMPTION;
    }

    private double[] axis(Axis a) {
        return switch (a) {
            case DIAMETER -> diameter;
            case COVERAGE -> coverage;
            case WAVELENGTH -> wavelength;
        };
    }

    /** True when {@code value} lies inside the table's range on axis {@code a} (always true for a missing axis). */
    boolean covers(Axis a, double value) {
        double[] ax = axis(a);
        if (ax == null) {
            return true;
        }
        double tol = tolerance(ax);
        return value >= ax[0] - tol && value <= ax[ax.length - 1] + tol;
    }

    /** The message for a value outside the range on axis {@code a}: names the value, the axis and its range. */
    String outsideMessage(Axis a, double value) {
        double[] ax = axis(a);
        return a.show(value) + " is outside the enhancement table " + source + ": its " + a.column() + " axis runs from "
                + a.show(ax[0]) + " to " + a.show(ax[ax.length - 1]);
    }

    /**
     * The interpolated enhancement at one point (allocates a little; the hot path uses {@link #onGrid}).
     *
     * @param diameterNm   the particles' median diameter, nm
     * @param coverage     the coverage, fraction 0–1
     * @param wavelengthNm the wavelength, nm (ignored without a wavelength axis)
     * @throws ModelException with reason {@value #OUTSIDE_REASON} outside the table's range
     */
    double at(double diameterNm, double coverage, double wavelengthNm) {
        double[] w = new double[6];
        int id = locate(Axis.DIAMETER, diameterNm, w, 0);
        int ic = locate(Axis.COVERAGE, coverage, w, 2);
        int nw = wavelength == null ? 1 : wavelength.length;
        int iw = 0;
        if (wavelength != null) {
            iw = locate(Axis.WAVELENGTH, wavelengthNm, w, 4);
        } else {
            w[4] = 1;
            w[5] = 0;
        }
        int nc = this.coverage.length;
        double s = 0;
        for (int a = 0; a < 2; a++) {
            for (int b = 0; b < 2; b++) {
                double wab = w[a] * w[2 + b];
                int base = ((id + a) * nc + ic + b) * nw + iw;
                s += wab * (w[4] * values[base] + (wavelength == null ? 0 : w[5] * values[base + 1]));
            }
        }
        return s;
    }

    /**
     * Finds the cell of {@code x} on axis {@code a}: returns its lower index i and stores the weights
     * (1 − t, t) of points i and i + 1 at {@code w[k]}, {@code w[k + 1]}.
     */
    private int locate(Axis a, double x, double[] w, int k) {
        double[] ax = axis(a);
        if (!covers(a, x)) {
            throw new ModelException(OUTSIDE_REASON, a.parameter() + ": " + outsideMessage(a, x));
        }
        return cell(ax, x, w, k);
    }

    private static int cell(double[] ax, double x, double[] w, int k) {
        int n = ax.length;
        double c = Math.max(ax[0], Math.min(ax[n - 1], x));
        int i = Arrays.binarySearch(ax, c);
        if (i < 0) {
            i = -i - 2;
        }
        i = Math.max(0, Math.min(n - 2, i));
        double t = (c - ax[i]) / (ax[i + 1] - ax[i]);
        w[k] = 1 - t;
        w[k + 1] = t;
        return i;
    }

    private static double tolerance(double[] ax) {
        return 1e-9 * (ax[ax.length - 1] - ax[0]);
    }

    /**
     * The table resampled onto a wavelength grid, ready for per-sample use without allocation.
     *
     * @throws StudyException when the table has a wavelength axis that does not cover the grid (the message
     *                        is a tail: the caller prefixes the study file and key)
     */
    OnGrid onGrid(double[] gridNm) {
        int ng = gridNm.length;
        int nd = diameter.length;
        int nc = coverage.length;
        double[] node = new double[nd * nc * ng];
        if (wavelength != null) {
            for (double l : gridNm) {
                if (!covers(Axis.WAVELENGTH, l)) {
                    throw new StudyException(source + " covers " + WAVELENGTH + " " + Units.format(wavelength[0])
                            + " to " + Units.format(wavelength[wavelength.length - 1]) + "; the study's wavelength grid runs from "
                            + Units.format(gridNm[0]) + " to " + Units.format(gridNm[ng - 1]) + " nm");
                }
            }
        }
        double[] w = new double[2];
        int nw = wavelength == null ? 1 : wavelength.length;
        for (int d = 0; d < nd; d++) {
            for (int c = 0; c < nc; c++) {
                int base = (d * nc + c) * nw;
                int out = (d * nc + c) * ng;
                for (int i = 0; i < ng; i++) {
                    if (wavelength == null) {
                        node[out + i] = values[base];
                    } else {
                        int iw = cell(wavelength, gridNm[i], w, 0);
                        node[out + i] = w[0] * values[base + iw] + w[1] * values[base + iw + 1];
                    }
                }
            }
        }
        return new OnGrid(this, ng, node);
    }

    /**
     * A table resampled on a fixed wavelength grid (linear in wavelength, exact at the table's own
     * wavelengths); {@link #fill} interpolates bilinearly in (diameter, coverage), which together make the
     * same multilinear interpolant as {@link EnhancementTable#at}. Immutable and thread-safe.
     */
    static final class OnGrid {
        private final EnhancementTable table;
        private final int ng;
        private final double[] node;

        private OnGrid(EnhancementTable table, int ng, double[] node) {
            this.table = table;
            this.ng = ng;
            this.node = node;
        }

        /** The table this was resampled from. */
        EnhancementTable table() {
            return table;
        }

        /** Number of grid wavelengths. */
        int size() {
            return ng;
        }

        /**
         * Writes the enhancement at every grid wavelength into {@code out} (length ≥ {@link #size()});
         * allocates nothing.
         *
         * @throws ModelException with reason {@value #OUTSIDE_REASON} outside the table's range
         */
        void fill(double diameterNm, double coverage, double[] out) {
            if (!table.covers(Axis.DIAMETER, diameterNm)) {
                throw new ModelException(OUTSIDE_REASON, Axis.DIAMETER.parameter() + ": "
                        + table.outsideMessage(Axis.DIAMETER, diameterNm));
            }
            if (!table.covers(Axis.COVERAGE, coverage)) {
                throw new ModelException(OUTSIDE_REASON, Axis.COVERAGE.parameter() + ": "
                        + table.outsideMessage(Axis.COVERAGE, coverage));
            }
            double[] da = table.diameter;
            double[] ca = table.coverage;
            int id = lower(da, diameterNm);
            int ic = lower(ca, coverage);
            double t = weight(da, id, diameterNm);
            double s = weight(ca, ic, coverage);
            double w00 = (1 - t) * (1 - s);
            double w01 = (1 - t) * s;
            double w10 = t * (1 - s);
            double w11 = t * s;
            int nc = ca.length;
            int b00 = (id * nc + ic) * ng;
            int b01 = (id * nc + ic + 1) * ng;
            int b10 = ((id + 1) * nc + ic) * ng;
            int b11 = ((id + 1) * nc + ic + 1) * ng;
            for (int i = 0; i < ng; i++) {
                out[i] = w00 * node[b00 + i] + w01 * node[b01 + i] + w10 * node[b10 + i] + w11 * node[b11 + i];
            }
        }

        private static int lower(double[] ax, double x) {
            int n = ax.length;
            double c = Math.max(ax[0], Math.min(ax[n - 1], x));
            int i = Arrays.binarySearch(ax, c);
            if (i < 0) {
                i = -i - 2;
            }
            return Math.max(0, Math.min(n - 2, i));
        }

        private static double weight(double[] ax, int i, double x) {
            double c = Math.max(ax[0], Math.min(ax[ax.length - 1], x));
            return (c - ax[i]) / (ax[i + 1] - ax[i]);
        }
    }

    // ---- reading ----

    /** One data row as read. */
    private record Row(int line, double d, double c, double w, double e) {
    }

    /**
     * Reads a table (see the class comment for the format).
     *
     * @throws StudyException one line, {@code file:line: column: what is wrong}, for a missing or unknown
     *                        column, a non-numeric or out-of-range cell, a negative enhancement, a missing or
     *                        repeated grid point, or an axis with fewer than 2 values
     */
    static EnhancementTable read(Path csv) {
        String name = csv.getFileName().toString();
        List<Row> rows = new ArrayList<>();
        int headerLine;
        int[] col = new int[4];
        boolean hasW;
        try (MappingIterator<String[]> it = MAPPER.readerFor(String[].class)
                .with(CsvParser.Feature.WRAP_AS_ARRAY)
                .with(CsvParser.Feature.SKIP_EMPTY_LINES)
                .with(CsvParser.Feature.ALLOW_COMMENTS)
                .readValues(org.fabspread.study.TextFiles.read(csv))) {
            String[] header = null;
            headerLine = 1;
            while (header == null && it.hasNextValue()) {
                headerLine = it.getCurrentLocation().getLineNr();
                String[] r = it.nextValue();
                if (!(r.length == 1 && r[0].isBlank())) {
                    header = r;
                }
            }
            if (header == null) {
                throw new StudyException(name + ":" + headerLine + ": header: the file has no header row; expected "
                        + expected());
            }
            hasW = header(name, headerLine, header, col);
            int ncol = header.length;
            while (it.hasNextValue()) {
                int line = it.getCurrentLocation().getLineNr();
                String[] r = it.nextValue();
                if (r.length == 1 && r[0].isBlank()) {
                    continue;
                }
                if (r.length > ncol) {
                    throw new StudyException(name + ":" + line + ": row: " + r.length + " cells, but the header names "
                            + ncol + " columns");
                }
                double d = cell(name, line, r, col[0], DIAMETER);
                // + 0.0 folds a "-0" onto 0 so the grid sees one value
                double c = cell(name, line, r, col[1], COVERAGE) + 0.0;
                double e = cell(name, line, r, col[2], ENHANCEMENT);
                double w = hasW ? cell(name, line, r, col[3], WAVELENGTH) : 0;
                if (!(d > 0)) {
                    throw new StudyException(name + ":" + line + ": " + DIAMETER + ": must be > 0 nm, got " + Units.format(d));
                }
                if (!(c >= 0 && c <= 100)) {
                    throw new StudyException(name + ":" + line + ": " + COVERAGE + ": must be in [0, 100] %, got "
                            + Units.format(c));
                }
                if (hasW && !(w > 0)) {
                    throw new StudyException(name + ":" + line + ": " + WAVELENGTH + ": must be > 0 nm, got " + Units.format(w));
                }
                if (!(e >= 0)) {
                    throw new StudyException(name + ":" + line + ": " + ENHANCEMENT + ": must be >= 0 (a ratio of absorptions), got "
                            + Units.format(e));
                }
                rows.add(new Row(line, d, c, w, e));
            }
        } catch (IOException | RuntimeException e) {
            throw StudyException.readingCsv(name, e);
        }
        return grid(name, headerLine, rows, hasW);
    }

    private static String expected() {
        return DIAMETER + ", " + COVERAGE + ", " + ENHANCEMENT + " and optionally " + WAVELENGTH;
    }

    /** Maps the columns into {@code col} (d, c, e, w); returns whether there is a wavelength column. */
    private static boolean header(String name, int line, String[] header, int[] col) {
        Arrays.fill(col, -1);
        String[] names = {DIAMETER, COVERAGE, ENHANCEMENT, WAVELENGTH};
        List<String> seen = new ArrayList<>();
        for (int i = 0; i < header.length; i++) {
            String h = header[i].strip();
            if (seen.contains(h)) {
                throw new StudyException(name + ":" + line + ": " + h + ": the column appears twice in the header");
            }
            seen.add(h);
            for (int k = 0; k < names.length; k++) {
                if (names[k].equals(h)) {
                    col[k] = i;
                }
            }
        }
        for (int k = 0; k < 3; k++) {
            if (col[k] < 0) {
                throw new StudyException(name + ":" + line + ": " + names[k] + ": missing column; the header names "
                        + String.join(", ", seen) + " (expected " + expected() + ")");
            }
        }
        for (String h : seen) {
            if (!Arrays.asList(names).contains(h)) {
                throw new StudyException(name + ":" + line + ": " + h + ": unknown column; expected " + expected());
            }
        }
        return col[3] >= 0;
    }

    private static double cell(String name, int line, String[] row, int idx, String column) {
        String s = idx < row.length ? row[idx].strip() : "";
        if (s.isEmpty()) {
            throw new StudyException(name + ":" + line + ": " + column + ": empty cell; expected a number");
        }
        double v;
        try {
            v = Double.parseDouble(s);
        } catch (NumberFormatException e) {
            throw new StudyException(name + ":" + line + ": " + column + ": not a number: '" + s + "'");
        }
        if (!Double.isFinite(v)) {
            throw new StudyException(name + ":" + line + ": " + column + ": not a finite number: '" + s + "'");
        }
        return v;
    }

    /** Checks the rows fill the grid exactly once and builds the table. */
    private static EnhancementTable grid(String name, int headerLine, List<Row> rows, boolean hasW) {
        // distinct values per axis, each with the first line it appears on
        TreeMap<Double, Integer> ds = new TreeMap<>();
        TreeMap<Double, Integer> cs = new TreeMap<>();
        TreeMap<Double, Integer> ws = new TreeMap<>();
        for (Row r : rows) {
            ds.putIfAbsent(r.d, r.line);
            cs.putIfAbsent(r.c, r.line);
            if (hasW) {
                ws.putIfAbsent(r.w, r.line);
            }
        }
        double[] d = keys(ds);
        double[] c = keys(cs);
        double[] w = hasW ? keys(ws) : null;
        int nd = d.length;
        int nc = c.length;
        int nw = hasW ? w.length : 1;
        int[] lineOf = new int[nd * nc * nw];
        double[] v = new double[lineOf.length];
        for (Row r : rows) {
            int k = (Arrays.binarySearch(d, r.d) * nc + Arrays.binarySearch(c, r.c)) * nw
                    + (hasW ? Arrays.binarySearch(w, r.w) : 0);
            if (lineOf[k] != 0) {
                throw new StudyException(name + ":" + r.line + ": " + DIAMETER + ": the point " + point(r.d, r.c, r.w, hasW)
                        + " appears again (first at line " + lineOf[k] + "); the table needs every combination exactly once");
            }
            lineOf[k] = r.line;
            v[k] = r.e;
        }
        String[] cols = {DIAMETER, COVERAGE, WAVELENGTH};
        double[][] axes = {d, c, w};
        for (int a = 0; a < (hasW ? 3 : 2); a++) {
            if (axes[a].length < 2) {
                throw new StudyException(name + ":" + headerLine + ": " + cols[a] + ": " + axes[a].length
                        + " distinct value(s)" + (axes[a].length == 1 ? " (" + Units.format(axes[a][0]) + ")" : "")
                        + "; every axis needs at least 2 to interpolate");
            }
        }
        for (int k = 0; k < lineOf.length; k++) {
            if (lineOf[k] == 0) {
                int iw = k % nw;
                int ic = (k / nw) % nc;
                int id = k / (nw * nc);
                throw new StudyException(name + ":" + ds.get(d[id]) + ": " + DIAMETER + ": no row for the point "
                        + point(d[id], c[ic], hasW ? w[iw] : 0, hasW) + "; the points must fill the grid " + nd + " "
                        + DIAMETER + " x " + nc + " " + COVERAGE + (hasW ? " x " + nw + " " + WAVELENGTH : "")
                        + " (every combination exactly once)");
            }
        }
        double[] cf = new double[nc];
        for (int i = 0; i < nc; i++) {
            cf[i] = c[i] / 100;
        }
        return new EnhancementTable(name, d, cf, w, v);
    }

    private static String point(double d, double c, double w, boolean hasW) {
        return DIAMETER + " " + Units.format(d) + ", " + COVERAGE + " " + Units.format(c)
                + (hasW ? ", " + WAVELENGTH + " " + Units.format(w) : "");
    }

    private static double[] keys(Map<Double, Integer> m) {
        double[] out = new double[m.size()];
        int i = 0;
        for (double x : m.keySet()) {
            out[i++] = x;
        }
        return out;
    }
}
