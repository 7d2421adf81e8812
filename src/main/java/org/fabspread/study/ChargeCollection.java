package org.fabspread.study;

/**
 * From absorbed photons to collected charge (Hecht drift collection with a uniform field).
 *
 * @param dissociation      exciton dissociation efficiency η_d, fraction ({@code collection.dissociation})
 * @param electronMuTau     μ_e τ_e, cm^2/V ({@code collection.electron_mu_tau})
 * @param holeMuTau         μ_h τ_h, cm^2/V ({@code collection.hole_mu_tau})
 * @param builtInVoltage    V_bi, V ({@code collection.built_in_voltage}); must be &gt; 0
 * @param quenchingDistance δ_q, nm ({@code collection.quenching_distance}); 0 = no quenching
 * @param electronsAtFront  true when the electron-collecting contact is on the light-entry side
 *                          (inverted cell); false for a conventional cell
 */
public record ChargeCollection(Parameter dissociation, Parameter electronMuTau, Parameter holeMuTau,
                               Parameter builtInVoltage, Parameter quenchingDistance, boolean electronsAtFront) {
}
