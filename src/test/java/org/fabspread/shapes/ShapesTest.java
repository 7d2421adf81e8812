package org.fabspread.shapes;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertThrows;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.util.List;
import java.util.Map;

import org.fabspread.study.StudyException;
import org.junit.jupiter.api.Test;

class ShapesTest {

    /**
     * source: volume formulas (sphere πD³/6, spheroid πLW²/6, capsule πr²(L − 2r) + 4πr³/3, cylinder, triangle
     * √3a²/4 times thickness, circle–circle lens area: Weisstein, "Circle-Circle Intersection", MathWorld),
     * cross-checked a second way by counting the cells of a fine lattice.
     */
    @Test
    void analyticVolumesMatchFineLatticeCounts() {
        List<Solid> shapes = List.of(new Sphere(40), new Spheroid(60, 20), new Rod(70, 20), new Disk(50, 12),
                new TriangularPrism(60, 14), new Crescent(80, 56, 24, 20), new Crescent(80, 30, 0, 20));
        for (Solid s : shapes) {
            Voxels v = s.voxelise(0.5);
            double counted = v.count() * 0.125;
            assertEquals(s.volume(), counted, 0.02 * s.volume(), s.kind() + " " + s.parameters());
            assertEquals(s.volume(), v.volume(), 1e-9 * s.volume(), "the lattice is rescaled to the true volume");
        }
        double r = 15;
        assertEquals(Math.PI * (40 * 40 - r * r) * 20, new Crescent(80, 30, 0, 20).volume(), 1e-9);
    }

    /** source: symmetry: the crescent's y = 0 mirror plane is a mirror plane of its lattice. */
    @Test
    void crescentLatticeIsMirrorSymmetric() {
        Voxels v = new Crescent(80, 56, 24, 20).voxelise(4);
        for (int z = 0; z < v.nz(); z++) {
            for (int y = 0; y < v.ny(); y++) {
                for (int x = 0; x < v.nx(); x++) {
                    assertEquals(v.filled(x, y, z), v.filled(x, v.ny() - 1 - y, z));
                }
            }
        }
        assertTrue(v.filled(0, v.ny() / 2, 0), "the closed back of the crescent at −x");
        assertTrue(!v.filled(v.nx() - 1, v.ny() / 2, 0), "the opening at +x");
    }

    @Test
    void voxelFileIsReadAndBadLinesAreLocated() {
        VoxelFile f = VoxelFile.parse("cube.txt", List.of("# a 2 x 2 x 1 slab", "pitch_nm: 3", "0 0 0", "1 0 0",
                "0 1 0", "1 1 0"));
        assertEquals(4, f.lattice().count());
        assertEquals(4 * 27.0, f.volume(), 1e-12);
        StudyException e = assertThrows(StudyException.class,
                () -> VoxelFile.parse("bad.txt", List.of("pitch_nm: 2", "0 0", "1 1 1")));
        assertEquals("bad.txt:2:1: voxel: expected three integers 'x y z', got '0 0'", e.getMessage());
        assertThrows(StudyException.class, () -> VoxelFile.parse("nopitch.txt", List.of("0 0 0")));
    }

    @Test
    void factoryBuildsEveryKindAndRefusesNonsense() {
        assertEquals(new Crescent(80, 56, 24, 20), Shapes.create("crescent",
                Map.of("outer_diameter", 80.0, "bite_diameter", 56.0, "bite_offset", 24.0, "thickness", 20.0)));
        assertThrows(IllegalArgumentException.class, () -> Shapes.create("star", Map.of()));
        assertThrows(IllegalArgumentException.class, () -> new Crescent(40, 100, 5, 10));
        assertThrows(IllegalArgumentException.class, () -> new Rod(10, 20));
    }
}
