package org.fabspread.device;

/**
 * The diode stage of one evaluator: reads J_0, n, R_s, R_sh and T from {@link DiodeSlots} and solves the
 * one-diode model ({@link OneDiode}) at the collected J_sc for V_oc, FF and efficiency. Owns its result
 * array; allocation-free.
 */
final class DiodeStage {
    private final DiodeSlots slots;
    private final OutputSlots outputs;
    private final double[] result = new double[OneDiode.RESULT_SIZE];

    DiodeStage(DiodeSlots slots, OutputSlots outputs) {
        this.slots = slots;
        this.outputs = outputs;
    }

    /**
     * Writes V_oc, FF and efficiency at photocurrent {@code jsc} (mA/cm²).
     *
     * @throws InputException for diode inputs the model refuses, naming the first one at fault
     */
    void solve(double[] v, double jsc, double[] out) {
        double j0 = v[slots.saturationCurrent()];
        double n = v[slots.ideality()];
        double rs = v[slots.seriesResistance()];
        double rsh = v[slots.shuntResistance()];
        double t = v[slots.temperature()];
        String why = OneDiode.check(jsc, j0, n, rs, rsh, t);
        if (why != null) {
            int slot = jsc >= 0 ? slotAtFault(j0, n, rs, rsh) : ParameterVector.NONE;
            throw new InputException("out-of-range", slot, why);
        }
        OneDiode.solve(jsc, j0, n, rs, rsh, t, result);
        out[outputs.voc()] = result[OneDiode.VOC];
        out[outputs.ff()] = result[OneDiode.FF];
        out[outputs.efficiency()] = result[OneDiode.EFFICIENCY];
    }

    private int slotAtFault(double j0, double n, double rs, double rsh) {
        if (!(j0 > 0) || Double.isInfinite(j0)) {
            return slots.saturationCurrent();
        }
        if (!(n > 0) || Double.isInfinite(n)) {
            return slots.ideality();
        }
        if (!(rs >= 0) || Double.isInfinite(rs)) {
            return slots.seriesResistance();
        }
        if (!(rsh > 0)) {
            return slots.shuntResistance();
        }
        return slots.temperature();
    }
}
