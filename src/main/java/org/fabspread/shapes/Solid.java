package org.fabspread.shapes;

/**
 * A shape given by a point-membership test inside a bounding box centred on the origin; voxelised by
 * {@link Voxeliser}.
 */
public interface Solid extends Shape {

    /** True when the point (nm) lies inside the shape. */
    boolean contains(double x, double y, double z);

    /** Half the bounding box's size along x, y, z (nm); the box is centred on the origin. */
    double[] halfExtent();

    @Override
    default Voxels voxelise(double pitchNm) {
        return Voxeliser.voxelise(this, pitchNm);
    }
}
