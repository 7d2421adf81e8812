package org.fabspread.report;

import static org.junit.jupiter.api.Assertions.assertEquals;

import org.junit.jupiter.api.Test;

/** The report's number formatting. */
class NumbersTest {

    @Test
    void significantDigitsKeepTheirPrecisionAndUseATrueMinus() {
        // common practice: report values to 3–4 significant digits, trailing zeros show the precision
        assertEquals("14.20", Numbers.num(14.2));
        assertEquals("0.392", Numbers.num3(0.39217));
        assertEquals("1235", Numbers.num(1234.6));
        assertEquals("−0.181", Numbers.num3(-0.18123));
        assertEquals("1.23e−9", Numbers.num3(1.2345e-9));
        assertEquals("n/a", Numbers.num(Double.NaN));
        assertEquals("1.1", Numbers.plain(1.1));
        assertEquals("0.35", Numbers.plain(0.350));
        assertEquals("120", Numbers.plain(120));
    }

    @Test
    void percentagesNeverPretendToBeZeroOrAHundred() {
        // common practice: a yield of 99.96 % must not print as 100.0 %, nor 0.02 % as 0.0 %
        assertEquals("87.3 %", Numbers.pct(0.8731));
        assertEquals("99.96 %", Numbers.pct(0.9996));
        assertEquals("100.0 %", Numbers.pct(1.0));
        assertEquals("0.02 %", Numbers.pct(0.0002));
        assertEquals("0.0 %", Numbers.pct(0));
        assertEquals("85.1–89.2 %", Numbers.pctRange(0.851, 0.892));
        assertEquals("−0.4 to 9.1 %", Numbers.pctRange(-0.004, 0.091));
        assertEquals("+4.2 percentage points", Numbers.points(0.042));
        assertEquals("95 %", Numbers.level(0.95));
    }

    @Test
    void unitsReadAsPrinted() {
        // common practice: SI superscripts in reader-facing units
        assertEquals("mA/cm²", Numbers.unit("mA/cm^2"));
        assertEquals("Ω·cm²", Numbers.unit("ohm cm^2"));
        assertEquals("–", Numbers.unit("1"));
        assertEquals("15.23 mA/cm²", Numbers.withUnit("15.23", "mA/cm^2"));
        assertEquals("0.5", Numbers.withUnit("0.5", "1"));
    }
}
