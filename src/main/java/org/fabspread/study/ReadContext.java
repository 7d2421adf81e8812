package org.fabspread.study;

import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;

/**
 * What the section readers of one study file share: the file, its folder (data files are named
 * relative to it), the material catalog, and the materials named so far with their tabulated
 * ranges (for the wavelength-grid check, which runs once every material is known).
 */
final class ReadContext {

    /** Per layer / metal: material range and where it was named, for the grid check. */
    record MaterialUse(String material, String usedBy, double[] range) {
    }

    private final Path file;
    private final Path dir;
    private final MaterialCatalog catalog;
    private final List<MaterialUse> materialUses = new ArrayList<>();
    private final ReadOptions options;

    ReadContext(Path file, MaterialCatalog catalog, ReadOptions options) {
        this.file = file;
        this.options = options;
        Path parent = file.toAbsolutePath().getParent();
        this.dir = parent == null ? Path.of(".") : parent;
        this.catalog = catalog;
    }

    Path file() {
        return file;
    }

    Path dir() {
        return dir;
    }

    ReadOptions options() {
        return options;
    }

    MaterialCatalog catalog() {
        return catalog;
    }

    /** The materials named so far (a live list: readers add to it). */
    List<MaterialUse> materialUses() {
        return materialUses;
    }
}
