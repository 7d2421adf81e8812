package org.fabspread.device;

import org.fabspread.study.SourceLocation;

/**
 * The study's parameters as one flat vector, in {@link org.fabspread.study.Study#parameters()} order: a
 * sample copies {@link #nominal} and overwrites the slots of the uncertain inputs ({@link #inputSlots}).
 * Every slot record ({@link StackSlots}, {@link ParticleSlots}, {@link CollectionSlots}, {@link DiodeSlots})
 * holds indices into this vector; {@link #NONE} marks a parameter the study does not set.
 *
 * @param ids        parameter id of each slot ({@code particles.coverage}, ...)
 * @param where      where each parameter is written in the study file
 * @param nominal    nominal value of each slot
 * @param inputSlots the slot of each uncertain input, in {@link DeviceModel#inputIds()} order
 */
record ParameterVector(String[] ids, SourceLocation[] where, double[] nominal, int[] inputSlots) {
    /** The slot of a parameter the study leaves out (the model takes its default). */
    static final int NONE = -1;

    /** Number of slots. */
    int size() {
        return nominal.length;
    }

    /** The value in slot {@code slot} of {@code v}, or {@code dflt} for {@link #NONE}. */
    static double value(double[] v, int slot, double dflt) {
        return slot < 0 ? dflt : v[slot];
    }

    /** Whether the slot holds an uncertain input (one that a sample overwrites). */
    boolean uncertain(int slot) {
        for (int s : inputSlots) {
            if (s == slot) {
                return true;
            }
        }
        return false;
    }

    /** A sample's value outside the model's domain, named by the parameter's id ("input" for none). */
    InputException error(String reason, int slot, String what) {
        String id = slot >= 0 ? ids[slot] : "input";
        return new InputException(reason, slot, id + ": " + what);
    }
}
