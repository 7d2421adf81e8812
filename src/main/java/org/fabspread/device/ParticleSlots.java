package org.fabspread.device;

/**
 * Where the particle layer's inputs sit in the {@link ParameterVector} ({@link ParameterVector#NONE}: the
 * study does not set it). Read by {@link ParticleStage} (built-in particle optics) and
 * {@link EnhancementStage} (a user's enhancement table).
 *
 * @param offset            {@code particles.offset}, nm from the host's front face (placement OFFSET)
 * @param diameter          {@code particles.diameter}, median volume-equivalent diameter, nm
 * @param sizeCv            {@code particles.size_cv} (default 0)
 * @param inPlaneAspect     {@code particles.in_plane_aspect} p = a/b (default 1)
 * @param outOfPlaneAspect  {@code particles.out_of_plane_aspect} q = c/a (default 1)
 * @param coverage          {@code particles.coverage} θ, areal fraction
 * @param forwardFraction   {@code particles.forward_fraction} of scattered light (default 0.5)
 * @param plasmaEnergy      {@code particles.plasma_energy}, eV
 * @param bulkDamping       {@code particles.bulk_damping}, eV
 * @param fermiVelocity     {@code particles.fermi_velocity}, m/s
 * @param surfaceScattering {@code particles.surface_scattering} A of the size correction
 * @param shape             {@code particles.shape.<name>} in the shape's parameter order (empty without a shape)
 */
record ParticleSlots(int offset, int diameter, int sizeCv, int inPlaneAspect, int outOfPlaneAspect, int coverage,
                     int forwardFraction, int plasmaEnergy, int bulkDamping, int fermiVelocity,
                     int surfaceScattering, int[] shape) {
}
