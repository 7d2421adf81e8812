/**
 * Particle shapes as voxel generators for the discrete-dipole solver: each shape is an immutable record
 * with plain parameters in nm in a fixed frame (x, y in the film plane, z along the film normal, the
 * light's direction), and {@link org.fabspread.shapes.Voxeliser} places it on a cubic lattice.
 */
package org.fabspread.shapes;
