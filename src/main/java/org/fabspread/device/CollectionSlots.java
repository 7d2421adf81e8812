package org.fabspread.device;

/**
 * Where the charge-collection inputs sit in the {@link ParameterVector}. Read by {@link CollectionStage}.
 *
 * @param dissociation      {@code collection.dissociation} η_d
 * @param electronMuTau     {@code collection.electron_mu_tau}, cm²/V
 * @param holeMuTau         {@code collection.hole_mu_tau}, cm²/V
 * @param builtInVoltage    {@code collection.built_in_voltage}, V
 * @param quenchingDistance {@code collection.quenching_distance}, nm ({@link ParameterVector#NONE}: 0)
 * @param electronsAtFront  whether electrons are collected at the absorber's front face
 */
record CollectionSlots(int dissociation, int electronMuTau, int holeMuTau, int builtInVoltage, int quenchingDistance,
                       boolean electronsAtFront) {
}
