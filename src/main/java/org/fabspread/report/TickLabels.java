package org.fabspread.report;

import java.util.HashMap;
import java.util.Map;
import java.util.function.Function;
import java.util.function.IntFunction;

/**
 * Tick labels that name integer positions of a numeric axis (category bars, powers of two) and leave
 * every other tick blank. The chart library insists on distinct labels, so each blank tick gets its
 * own short run of ordinary and no-break spaces, which draw as nothing.
 */
final class TickLabels implements Function<Double, String> {

    private final IntFunction<String> atInteger;
    private final Map<Long, String> blanks = new HashMap<>();

    private TickLabels(IntFunction<String> atInteger) {
        this.atInteger = atInteger;
    }

    /** Labels integer position k with {@code atInteger.apply(k)}, or a blank where that returns null. */
    static TickLabels atIntegers(IntFunction<String> atInteger) {
        return new TickLabels(atInteger);
    }

    @Override
    public String apply(Double value) {
        double v = value;
        long k = Math.round(v);
        if (Math.abs(v - k) < 1e-6 && Math.abs(k) < Integer.MAX_VALUE) {
            String label = atInteger.apply((int) k);
            if (label != null) {
                return label;
            }
        }
        return blanks.computeIfAbsent(Math.round(v * 1e6), key -> blank(blanks.size()));
    }

    /** The k-th distinct blank: k + 1 written in binary without its leading one, digits as two kinds of space. */
    static String blank(int k) {
        String bits = Integer.toBinaryString(k + 1).substring(1);
        StringBuilder sb = new StringBuilder(bits.length() + 1).append(' ');
        for (int i = 0; i < bits.length(); i++) {
            sb.append(bits.charAt(i) == '0' ? ' ' : '\u00a0');
        }
        return sb.toString();
    }
}
