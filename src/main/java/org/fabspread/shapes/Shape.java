package org.fabspread.shapes;

import java.util.Map;

/**
 * A particle shape that can be placed on a cubic lattice. Frame: x and y in the film plane, z along the
 * film normal; lengths in nm.
 */
public interface Shape {

    /** Short kind name as written in a study ({@code sphere}, {@code crescent}, …). */
    String kind();

    /** The named parameters (nm) in a fixed order, for display and for the cache key. */
    Map<String, Double> parameters();

    /** The shape's true volume (nm³); the lattice is rescaled to hold exactly this volume. */
    double volume();

    /** The dipole lattice of this shape at the given voxelisation pitch (nm). */
    Voxels voxelise(double pitchNm);
}
