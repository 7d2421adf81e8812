package org.fabspread.study;

/**
 * One-diode model parameters. Ids {@code diode.saturation_current} (mA/cm^2),
 * {@code diode.ideality} (1), {@code diode.series_resistance} (ohm cm^2),
 * {@code diode.shunt_resistance} (ohm cm^2; +Infinity allowed), {@code diode.temperature} (K).
 */
public record Diode(Parameter saturationCurrent, Parameter ideality, Parameter seriesResistance,
                    Parameter shuntResistance, Parameter temperature) {
}
