package org.fabspread.study;

import static org.junit.jupiter.api.Assertions.assertEquals;

import org.junit.jupiter.api.Test;

import org.fabspread.study.Units.Quantity;

/** The display unit: values shown in the unit the user wrote, or the trade's unit. */
class DisplayUnitTest {

    @Test
    void fractionsAreShownInPercent() {
        // source: BIPM SI Brochure, 9th ed. (2019), §5.4.7 — the percent sign stands for 0.01
        DisplayUnit u = DisplayUnit.tradeUnit(Quantity.FRACTION, 0.055);
        assertEquals("5.5 %", u.format(0.055));
        assertEquals("6 %", u.format(0.06));
        assertEquals("coverage_pct", u.column("coverage"));
    }

    @Test
    void glassIsShownInMillimetresAndFilmsInNanometres() {
        // source: BIPM SI Brochure, 9th ed., Table 7 — milli 1e-3, nano 1e-9, so 1 mm = 1e6 nm
        DisplayUnit glass = DisplayUnit.tradeUnit(Quantity.LENGTH, 1.1e6);
        assertEquals("1.1 mm", glass.format(1.1e6));
        DisplayUnit film = DisplayUnit.tradeUnit(Quantity.LENGTH, 40);
        assertEquals("40 nm", film.format(40));
        assertEquals("thickness_nm", film.column("thickness"));
    }

    @Test
    void theUnitAsWrittenIsKept() {
        DisplayUnit um = DisplayUnit.asWritten("0.12 µm", Quantity.LENGTH, 120);
        assertEquals("0.12 µm", um.format(120));
        assertEquals("thickness_um", um.column("thickness"));
        DisplayUnit mv = DisplayUnit.asWritten("800 mV", Quantity.VOLTAGE, 0.8);
        assertEquals("800 mV", mv.format(0.8));
        // a bare fraction is shown in the trade's unit, %
        assertEquals("92 %", DisplayUnit.asWritten("0.92", Quantity.FRACTION, 0.92).format(0.92));
    }

    @Test
    void numbersCarryFourSignificantDigits() {
        DisplayUnit j = DisplayUnit.canonical(Quantity.CURRENT_DENSITY);
        assertEquals("13.87 mA/cm^2", j.format(13.874));
        assertEquals("0.0002568 mA/cm^2", j.format(2.5678e-4));
        assertEquals("jsc_mA_per_cm2", j.column("jsc"));
        assertEquals("1.5", DisplayUnit.canonical(Quantity.DIMENSIONLESS).format(1.5));
    }

    @Test
    void aStudyParameterKeepsTheUnitItWasWrittenIn() {
        Study s = StudyReader.read(java.nio.file.Path.of("demo-studies/pilot-line-inverted.yaml"));
        assertEquals("1.1 mm", s.layer("glass").thickness().show(s.layer("glass").thickness().nominal()));
        assertEquals("6 %", s.particles().coverage().show(s.particles().coverage().nominal()));
        assertEquals("120 nm", s.layer("ito").thickness().show(120));
    }
}
