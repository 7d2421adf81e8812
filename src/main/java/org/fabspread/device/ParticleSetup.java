package org.fabspread.device;

import org.fabspread.particles.DipoleTable;
import org.fabspread.study.ParticleLayer;

/**
 * Everything the particle layer needs that does not change from sample to sample: the study's particle
 * block, its slots, the metal's permittivity on the grid and, where they apply, the sphere table of the
 * built-in optics or the user's enhancement table.
 *
 * @param layer        the study's particle block
 * @param slots        where its inputs sit in the parameter vector
 * @param metalEpsRe   Re ε of the bulk metal on the grid (null with an enhancement table)
 * @param metalEpsIm   Im ε of the bulk metal on the grid (null with an enhancement table)
 * @param sphereTable  single-sphere quantities tabulated in the diameter ({@link SphereTable}), or null
 * @param table        the user's enhancement table on the grid, or null: the built-in particle optics
 * @param optics       makes the particle physics of each evaluator (ignored with an enhancement table)
 * @param shapeTable   a named shape's discrete-dipole table, or null (spheres, ellipsoids, enhancement table)
 */
record ParticleSetup(ParticleLayer layer, ParticleSlots slots, double[] metalEpsRe, double[] metalEpsIm,
                     DipoleTable sphereTable, EnhancementTable.OnGrid table, ParticleOptics.Maker optics,
                     ShapeTables.Built shapeTable) {

    /** A new instance of the particle physics for one evaluator. */
    ParticleOptics newOptics(double[] lambda) {
        return optics.make(this, lambda);
    }

    /** The same setup with another particle physics. */
    ParticleSetup withOptics(ParticleOptics.Maker maker) {
        return new ParticleSetup(layer, slots, metalEpsRe, metalEpsIm, sphereTable, table, maker, shapeTable);
    }

    /** Whether a user's enhancement table replaces the built-in particle optics. */
    boolean usesTable() {
        return table != null;
    }
}
