package org.fabspread.study;

import java.util.ArrayList;
import java.util.List;
import java.util.Locale;
import java.util.regex.Matcher;
import java.util.regex.Pattern;

/**
 * The layout of an optical-constant table as detected from its header row: the separator (comma,
 * tab or semicolon), the spectral axis (wavelength in nm or µm, or photon energy in eV) and the
 * value columns (n and k, or the permittivity ε1 and ε2), with header variants such as
 * {@code Wavelength (nm)}, {@code lambda [um]}, {@code E(eV)}, {@code eps1}, {@code ε2}.
 *
 * <p>Conversions: λ[nm] = hc / E with hc = 1239.841984 eV nm (CODATA 2018); from ε = ε1 + iε2 to
 * N = n + ik with n = sqrt((|ε| + ε1)/2), k = ε2 / (2n) (Born and Wolf, Principles of Optics, §14.1).
 */
record NkColumns(char separator, Axis axis, boolean permittivity) {

    /** hc in eV nm (CODATA 2018: h = 6.62607015e-34 J s, c = 299792458 m/s, e = 1.602176634e-19 C). */
    static final double HC_EV_NM = 1239.841984;

    /** The spectral axis of the first column. */
    enum Axis {
        NANOMETRE("wavelength in nm", "wavelength_nm"),
        MICROMETRE("wavelength in µm", "wavelength_um"),
        ELECTRONVOLT("photon energy in eV", "energy_eV");

        final String description;
        final String label;

        Axis(String description, String label) {
            this.description = description;
            this.label = label;
        }
    }

    private static final Pattern UNIT = Pattern.compile("^(.*?)[\\s_]*[(\\[]\\s*([^)\\]]*?)\\s*[)\\]]$");

    /** The layout of {@code header}, or null when it names no known layout. */
    static NkColumns detect(String header) {
        char sep = header.indexOf('\t') >= 0 ? '\t' : header.indexOf(';') >= 0 ? ';' : ',';
        String[] cols = split(header, sep);
        if (cols.length != 3) {
            return null;
        }
        Axis axis = axis(cols[0]);
        String a = name(cols[1]);
        String b = name(cols[2]);
        if (axis == null) {
            return null;
        }
        if (a.equals("n") && (b.equals("k") || b.equals("kappa"))) {
            return new NkColumns(sep, axis, false);
        }
        if (isEps(a, "1") && isEps(b, "2")) {
            return new NkColumns(sep, axis, true);
        }
        return null;
    }

    /** The names of the three columns in messages: "wavelength_nm", "n", "k" or "e1", "e2". */
    String[] labels() {
        return permittivity ? new String[] {axis.label, "e1", "e2"} : new String[] {axis.label, "n", "k"};
    }

    /** One line saying what was detected, e.g. "tab-separated, photon energy in eV, ε1 and ε2 (converted to n, k)". */
    String describe() {
        String s = separator == '\t' ? "tab" : separator == ';' ? "semicolon" : "comma";
        return s + "-separated, " + axis.description + (axis == Axis.ELECTRONVOLT ? " (converted to wavelength)" : "")
                + ", " + (permittivity ? "ε1 and ε2 (converted to n and k)" : "n and k");
    }

    /** The cells of a data row. */
    String[] cells(String line) {
        return split(line, separator);
    }

    /** The first column's value in nm. */
    double toNanometres(double v) {
        return switch (axis) {
            case NANOMETRE -> v;
            case MICROMETRE -> v * 1000;
            case ELECTRONVOLT -> HC_EV_NM / v;
        };
    }

    /** {n, k} from the two value columns. */
    double[] toNk(double a, double b) {
        if (!permittivity) {
            return new double[] {a, b};
        }
        double n = Math.sqrt(0.5 * (Math.hypot(a, b) + a));
        return new double[] {n, n > 0 ? b / (2 * n) : Math.sqrt(Math.max(0, -a))};
    }

    private static String[] split(String line, char sep) {
        List<String> out = new ArrayList<>();
        int start = 0;
        for (int i = 0; i <= line.length(); i++) {
            if (i == line.length() || line.charAt(i) == sep) {
                out.add(line.substring(start, i).strip());
                start = i + 1;
            }
        }
        return out.toArray(new String[0]);
    }

    private static Axis axis(String col) {
        String c = col.strip().toLowerCase(Locale.ROOT).replace('μ', 'µ');
        String unit = "";
        Matcher m = UNIT.matcher(c);
        if (m.matches()) {
            c = m.group(1).strip();
            unit = m.group(2).strip();
        } else if (c.matches("[a-zλ ]+_(nm|um|µm|ev)")) {
            unit = c.substring(c.lastIndexOf('_') + 1);
            c = c.substring(0, c.lastIndexOf('_'));
        }
        boolean wavelength = c.equals("wavelength") || c.equals("lambda") || c.equals("λ") || c.equals("wl");
        boolean energy = c.equals("energy") || c.equals("photon energy") || c.equals("photon_energy") || c.equals("e");
        if (wavelength && (unit.isEmpty() || unit.equals("nm"))) {
            return Axis.NANOMETRE;
        }
        if (wavelength && (unit.equals("um") || unit.equals("µm") || unit.equals("micron") || unit.equals("microns"))) {
            return Axis.MICROMETRE;
        }
        if (energy && (unit.isEmpty() || unit.equals("ev"))) {
            return Axis.ELECTRONVOLT;
        }
        return null;
    }

    private static String name(String col) {
        return col.strip().toLowerCase(Locale.ROOT).replace(" ", "").replace("_", "").replace("ε", "e")
                .replace("epsilon", "e").replace("eps", "e");
    }

    private static boolean isEps(String n, String i) {
        return n.equals("e" + i) || n.equals("er" + i) || (i.equals("1") && n.equals("er")) || (i.equals("2") && n.equals("ei"));
    }
}
