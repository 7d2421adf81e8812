package org.fabspread.device;

/**
 * Where the one-diode inputs sit in the {@link ParameterVector}. Read by {@link DiodeStage}.
 *
 * @param saturationCurrent {@code diode.saturation_current} J_0, mA/cm²
 * @param ideality          {@code diode.ideality} n
 * @param seriesResistance  {@code diode.series_resistance} R_s, Ω cm²
 * @param shuntResistance   {@code diode.shunt_resistance} R_sh, Ω cm²
 * @param temperature       {@code diode.temperature}, K
 */
record DiodeSlots(int saturationCurrent, int ideality, int seriesResistance, int shuntResistance, int temperature) {
}
