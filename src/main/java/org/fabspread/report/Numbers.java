package org.fabspread.report;

import java.math.BigDecimal;
import java.math.MathContext;
import java.util.Locale;

/**
 * How the reports print numbers: {@link Locale#ROOT}, a few significant digits, plain notation for
 * everyday magnitudes, a true minus sign, fractions as percentages, and units with superscripts.
 * Every number a report shows goes through here, so that a test can format a reference value the
 * same way and find it in the report.
 */
public final class Numbers {

    private Numbers() {
    }

    /**
     * {@code v} rounded to {@code digits} significant digits, trailing zeros kept (so that 14.20 shows
     * its precision); plain notation for 1e-4 ≤ |v| &lt; 1e7, else {@code 1.23e−9}. NaN prints "n/a".
     */
    public static String sig(double v, int digits) {
        if (Double.isNaN(v)) {
            return "n/a";
        }
        if (Double.isInfinite(v)) {
            return v > 0 ? "∞" : "−∞";
        }
        if (v == 0) {
            return "0";
        }
        double a = Math.abs(v);
        String s;
        if (a >= 1e-4 && a < 1e7) {
            BigDecimal b = new BigDecimal(v).round(new MathContext(digits));
            s = b.scale() < 0 ? b.setScale(0).toPlainString() : b.toPlainString();
        } else {
            s = String.format(Locale.ROOT, "%." + Math.max(0, digits - 1) + "e", v);
            int e = s.indexOf('e');
            String mant = s.substring(0, e);
            int exp = Integer.parseInt(s.substring(e + 1));
            s = mant + "e" + exp;
        }
        return s.replace('-', '−');
    }

    /** Four significant digits without trailing zeros: for settings and levels (1.1 mm, 0.35, 16.79 nm). */
    public static String plain(double v) {
        String s = sig(v, 4);
        if (s.contains(".") && !s.contains("e")) {
            s = s.replaceAll("0+$", "").replaceAll("\\.$", "");
        }
        return s;
    }

    /** A confidence level or other round fraction as a percentage without needless decimals: 95 %, 99.5 %. */
    public static String level(double fraction) {
        return plain(100 * fraction) + " %";
    }

    /** Four significant digits: the default for a reported value. */
    public static String num(double v) {
        return sig(v, 4);
    }

    /** Three significant digits: for spreads, intervals and indices. */
    public static String num3(double v) {
        return sig(v, 3);
    }

    /**
     * A fraction as a percentage without the sign: one decimal, or as many (up to four) as it takes
     * not to print 0.0 or 100.0 for a value that is neither.
     */
    public static String pctNumber(double fraction) {
        if (Double.isNaN(fraction)) {
            return "n/a";
        }
        double p = 100 * fraction;
        int decimals = 1;
        while (decimals < 4) {
            String s = String.format(Locale.ROOT, "%." + decimals + "f", p);
            double back = Double.parseDouble(s);
            boolean fakeZero = back == 0 && p != 0;
            boolean fakeHundred = back == 100 && p != 100;
            if (!fakeZero && !fakeHundred) {
                break;
            }
            decimals++;
        }
        return String.format(Locale.ROOT, "%." + decimals + "f", p).replace('-', '−');
    }

    /** A fraction as a percentage, e.g. {@code 87.3 %}. */
    public static String pct(double fraction) {
        return pctNumber(fraction) + " %";
    }

    /**
     * An interval of fractions as percentages, e.g. {@code 85.1–89.2 %}; with a negative bound the
     * bounds are joined by "to" ({@code −0.4 to 9.1 %}) so that no dash reads as a minus sign.
     */
    public static String pctRange(double low, double high) {
        String join = low < 0 || high < 0 ? " to " : "–";
        return pctNumber(low) + join + pctNumber(high) + " %";
    }

    /** A change of a fraction in percentage points with its sign, e.g. {@code +4.2 percentage points}. */
    public static String points(double deltaFraction) {
        String s = pctNumber(Math.abs(deltaFraction));
        return (deltaFraction < 0 ? "−" : "+") + s + " percentage points";
    }

    /** A unit as shown to readers: {@code mA/cm^2} reads mA/cm², {@code ohm cm^2} Ω·cm², {@code 1} –. */
    public static String unit(String u) {
        if (u == null || u.isBlank() || u.equals("1")) {
            return Quantity.NO_UNIT;
        }
        return u.replace("ohm cm^2", "Ω·cm²").replace("ohm", "Ω").replace("^-3", "⁻³").replace("^-1", "⁻¹")
                .replace("^2", "²").replace("^3", "³");
    }

    /** A value with its unit, e.g. {@code 15.23 mA/cm²}; a dimensionless value stands alone. */
    public static String withUnit(String value, String unit) {
        String u = unit(unit);
        return u.equals(Quantity.NO_UNIT) ? value : value + " " + u;
    }

    /** The axis quantity of a value in a canonical unit. */
    public static Quantity quantity(String label, String unit) {
        String u = unit(unit);
        return u.equals(Quantity.NO_UNIT) ? Quantity.dimensionless(label) : Quantity.of(label, u);
    }
}
