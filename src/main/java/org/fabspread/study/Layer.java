package org.fabspread.study;

/**
 * One layer of the stack, in the order light meets it.
 *
 * @param name       short unique name used in ids and outputs (e.g. {@code etl})
 * @param material   its optical constants
 * @param thickness  id {@code stack.<name>.thickness}, nm
 * @param incoherent true for a thick layer treated by intensities (the glass)
 * @param role       what it does
 * @param nShift     id {@code stack.<name>.n_shift}: added to n at every wavelength (dimensionless, default 0)
 * @param kScale     id {@code stack.<name>.k_scale}: multiplies k at every wavelength (default 1)
 */
public record Layer(String name, MaterialRef material, Parameter thickness, boolean incoherent,
                    LayerRole role, Parameter nShift, Parameter kScale) {

    public boolean isAbsorber() {
        return role == LayerRole.ABSORBER;
    }
}
