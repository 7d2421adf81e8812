package org.fabspread.device;

/**
 * Where each layer's inputs sit in the {@link ParameterVector}, by layer index in the study's stack order
 * ({@link ParameterVector#NONE}: the study does not set it; n shift 0, k scale 1). Read by
 * {@link OpticsStage}.
 *
 * @param thickness slot of {@code stack.NAME.thickness} (every layer has one)
 * @param nShift    slot of {@code stack.NAME.n_shift}
 * @param kScale    slot of {@code stack.NAME.k_scale}
 */
record StackSlots(int[] thickness, int[] nShift, int[] kScale) {
}
