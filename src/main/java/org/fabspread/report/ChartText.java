package org.fabspread.report;

import java.util.Locale;

/** How numbers read on charts: tick labels, superscript exponents, percentages, legend values. */
final class ChartText {

    private ChartText() {
    }

    /** An integer exponent in superscript digits (−12 → ⁻¹²). */
    static String superscript(int e) {
        String digits = "⁰¹²³⁴⁵⁶⁷⁸⁹";
        StringBuilder sb = new StringBuilder();
        if (e < 0) {
            sb.append('⁻');
        }
        for (char ch : Integer.toString(Math.abs(e)).toCharArray()) {
            sb.append(digits.charAt(ch - '0'));
        }
        return sb.toString();
    }

    /** A tick value: at most six significant digits, no exponent, no trailing zeros, a true minus sign. */
    static String tick(double v) {
        if (!Double.isFinite(v)) {
            return "";
        }
        if (Math.abs(v) < 1e-12) {
            return "0";
        }
        String s = new java.math.BigDecimal(v).round(new java.math.MathContext(6)).stripTrailingZeros().toPlainString();
        return s.replace('-', '−');
    }

    /** A fraction as a percentage with one decimal. */
    static String percent(double fraction) {
        return String.format(Locale.ROOT, "%.1f", 100 * fraction);
    }

    /** Up to four significant digits, no exponent for everyday magnitudes. */
    static String number(double v) {
        if (v == 0) {
            return "0";
        }
        double a = Math.abs(v);
        if (a >= 1e-3 && a < 1e6) {
            String s = new java.math.BigDecimal(v).round(new java.math.MathContext(4)).stripTrailingZeros().toPlainString();
            return s.replace('-', '−');
        }
        return String.format(Locale.ROOT, "%.3e", v).replace('-', '−');
    }
}
