package org.fabspread.study;

import java.util.ArrayList;
import java.util.LinkedHashMap;
import java.util.List;
import java.util.Locale;
import java.util.Map;
import java.util.regex.Matcher;
import java.util.regex.Pattern;

/**
 * The units a study file may use and their conversion to the program's canonical units (nm,
 * fraction, eV, m/s, cm^2/V, V, mA/cm^2, ohm cm^2, K; "1" for dimensionless numbers). Units are
 * parsed and converted only here.
 */
public final class Units {

    private static final Pattern NUMBER = Pattern.compile(
            "\\s*([+-]?(?:\\d+(?:\\.\\d*)?|\\.\\d+)(?:[eE][+-]?\\d+)?)\\s*(.*?)\\s*");

    private Units() {
    }

    /** A physical quantity: its canonical unit and the units accepted for it with their factors. */
    public enum Quantity {
        LENGTH("length", "nm", new Object[] {"nm", 1.0, "µm", 1e3, "um", 1e3, "mm", 1e6, "m", 1e9}),
        FRACTION("fraction", "fraction", new Object[] {"%", 0.01, "", 1.0}),
        ENERGY("energy", "eV", new Object[] {"eV", 1.0, "meV", 1e-3}),
        SPEED("speed", "m/s", new Object[] {"m/s", 1.0, "cm/s", 1e-2, "km/s", 1e3}),
        MU_TAU("mobility-lifetime product", "cm^2/V", new Object[] {"cm^2/V", 1.0, "m^2/V", 1e4}),
        VOLTAGE("voltage", "V", new Object[] {"V", 1.0, "mV", 1e-3}),
        CURRENT_DENSITY("current density", "mA/cm^2",
                new Object[] {"mA/cm^2", 1.0, "A/cm^2", 1e3, "µA/cm^2", 1e-3, "nA/cm^2", 1e-6, "A/m^2", 0.1}),
        AREA_RESISTANCE("area resistance", "ohm cm^2",
                new Object[] {"ohm cm^2", 1.0, "kohm cm^2", 1e3, "ohm m^2", 1e4}),
        TEMPERATURE("temperature", "K", new Object[] {"K", 1.0}),
        DIMENSIONLESS("dimensionless number", "1", new Object[] {"", 1.0});

        private final String noun;
        private final String canonical;
        private final Map<String, Double> factors = new LinkedHashMap<>();

        Quantity(String noun, String canonical, Object[] table) {
            this.noun = noun;
            this.canonical = canonical;
            for (int i = 0; i < table.length; i += 2) {
                factors.put((String) table[i], (Double) table[i + 1]);
            }
        }

        /** The canonical unit string stored in {@link Parameter#unit()}. */
        public String canonical() {
            return canonical;
        }

        /** Plain name, e.g. "length". */
        public String noun() {
            return noun;
        }

        /** True when a bare number (no unit) is a valid value of this quantity. */
        public boolean acceptsBareNumber() {
            return factors.containsKey("");
        }

        /** The accepted unit spellings, e.g. "nm, µm, um, mm or m". */
        public String unitList() {
            List<String> u = new ArrayList<>();
            for (String s : factors.keySet()) {
                if (!s.isEmpty()) {
                    u.add(s);
                }
            }
            if (u.size() == 1) {
                return u.get(0);
            }
            return String.join(", ", u.subList(0, u.size() - 1)) + " or " + u.get(u.size() - 1);
        }

        /** Factor from {@code unit} to canonical, or NaN when this quantity does not accept it. */
        double factor(String unit) {
            Double f = factors.get(normalise(unit));
            return f == null ? Double.NaN : f;
        }

        /** A canonical value written for users: fractions in %, others in the canonical unit. */
        public String show(double canonicalValue) {
            switch (this) {
                case FRACTION:
                    return format(canonicalValue * 100) + " %";
                case DIMENSIONLESS:
                    return format(canonicalValue);
                default:
                    return format(canonicalValue) + " " + canonical;
            }
        }
    }

    /** A number with its (normalised, possibly empty) unit as written. */
    record Reading(double value, String unit) {
    }

    /**
     * Splits "35 nm" into 35 and "nm"; "infinite"/"inf" reads as +Infinity with no unit.
     * Returns null when the text does not start with a number.
     */
    static Reading split(String text) {
        String t = text.strip();
        String lower = t.toLowerCase(Locale.ROOT);
        if (lower.equals("infinite") || lower.equals("inf") || lower.equals("infinity")) {
            return new Reading(Double.POSITIVE_INFINITY, "");
        }
        Matcher m = NUMBER.matcher(t);
        if (!m.matches()) {
            return null;
        }
        return new Reading(Double.parseDouble(m.group(1)), normalise(m.group(2)));
    }

    /** Normalises spelling variants: ² → ^2, Ω/Ohm → ohm, · and * → space, μ (Greek) → µ (micro). */
    static String normalise(String unit) {
        String u = unit.strip()
                .replace("²", "^2")
                .replace('\u03bc', '\u00b5')
                .replace("Ω", "ohm")
                .replace("Ohm", "ohm")
                .replace('·', ' ')
                .replace('*', ' ')
                .replaceAll("\\s+", " ");
        u = u.replaceAll("(?<=m)2(?=/|$)", "^2");
        u = u.replace("ohmcm^2", "ohm cm^2");
        return u;
    }

    /** Which quantity a unit belongs to (ignoring bare numbers), or null. */
    static Quantity quantityOf(String unit) {
        String u = normalise(unit);
        if (u.isEmpty()) {
            return null;
        }
        for (Quantity q : Quantity.values()) {
            if (!Double.isNaN(q.factor(u)) && q != Quantity.FRACTION) {
                return q;
            }
        }
        return u.equals("%") ? Quantity.FRACTION : null;
    }

    /**
     * Converts {@code text} (a number with its unit) to the canonical unit of {@code q}.
     *
     * @throws IllegalArgumentException with the user-facing reason (no location)
     */
    static double toCanonical(String text, Quantity q) {
        Reading r = split(text);
        if (r == null) {
            throw new IllegalArgumentException("'" + text.strip() + "' is not a number"
                    + (q == Quantity.DIMENSIONLESS ? "" : " with a unit (" + q.noun() + " in " + q.unitList() + ")"));
        }
        return convert(r, text, q);
    }

    /**
     * Reads one cell of a table the user gives (e.g. {@code eval}'s input rows): a number with its own unit
     * ("5 %", "102 nm", "0.1 µm") is converted to the canonical unit of {@code q}; a bare number is taken in
     * {@code bareUnit} (the column's unit from an {@code id [unit]} header, or null for the canonical unit).
     *
     * @throws IllegalArgumentException with the user-facing reason (no location)
     */
    public static double cell(String text, Quantity q, String bareUnit) {
        Reading r = split(text);
        if (r == null) {
            throw new IllegalArgumentException("'" + text.strip() + "' is not a number"
                    + (q == Quantity.DIMENSIONLESS ? "" : " (a " + q.noun() + " in " + q.unitList() + ")"));
        }
        if (r.unit().isEmpty() && !Double.isInfinite(r.value())) {
            if (bareUnit == null || normalise(bareUnit).equals(q.canonical())) {
                return r.value();
            }
            return convert(new Reading(r.value(), normalise(bareUnit)), text.strip() + " " + bareUnit, q);
        }
        return convert(r, text, q);
    }

    static double convert(Reading r, String text, Quantity q) {
        if (Double.isInfinite(r.value())) {
            return r.value();
        }
        if (r.unit().isEmpty()) {
            if (q.acceptsBareNumber()) {
                return r.value();
            }
            throw new IllegalArgumentException("'" + text.strip() + "' needs a unit: a " + q.noun() + " in " + q.unitList());
        }
        double f = q.factor(r.unit());
        if (Double.isNaN(f)) {
            if (q == Quantity.DIMENSIONLESS) {
                throw new IllegalArgumentException("'" + text.strip() + "': a dimensionless number takes no unit");
            }
            Quantity other = quantityOf(r.unit());
            String what = other == null ? "'" + r.unit() + "' is not a known unit"
                    : "'" + r.unit() + "' is a unit of " + other.noun();
            throw new IllegalArgumentException("'" + text.strip() + "': " + what + "; expected a " + q.noun()
                    + " in " + q.unitList());
        }
        return r.value() * f;
    }

    /** Compact number formatting for messages and tables: 35, 0.5, 1e-09, 1390000. */
    public static String format(double v) {
        if (Double.isNaN(v)) {
            return "none";
        }
        if (Double.isInfinite(v)) {
            return v > 0 ? "infinite" : "-infinite";
        }
        if (v == Math.rint(v) && Math.abs(v) < 1e15) {
            return Long.toString((long) v);
        }
        String s = String.format(Locale.ROOT, "%.6g", v);
        if (s.contains("e")) {
            String[] parts = s.split("e");
            String mant = parts[0].contains(".") ? parts[0].replaceAll("0+$", "").replaceAll("\\.$", "") : parts[0];
            return mant + "e" + Integer.parseInt(parts[1]);
        }
        return s.contains(".") ? s.replaceAll("0+$", "").replaceAll("\\.$", "") : s;
    }
}
