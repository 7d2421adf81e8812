package org.fabspread.study;

/**
 * Free-electron parameters of the particle metal for the size-limited damping correction
 * (Kreibig &amp; Vollmer 1995; Coronado &amp; Schatz 2003). Ids {@code particles.plasma_energy} (eV),
 * {@code particles.bulk_damping} (eV), {@code particles.fermi_velocity} (m/s),
 * {@code particles.surface_scattering} (A_s, dimensionless, convention l = 4V/S).
 */
public record MetalParameters(Parameter plasmaEnergyEv, Parameter bulkDampingEv, Parameter fermiVelocity,
                              Parameter surfaceScattering) {
}
