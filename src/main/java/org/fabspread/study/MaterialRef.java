package org.fabspread.study;

import java.nio.file.Path;

/**
 * A material: either a bundled library id ({@code csvFile == null}) or a user CSV of
 * {@code wavelength_nm,n,k} (path resolved against the study file's folder), given a display id.
 */
public record MaterialRef(String id, Path csvFile) {

    public static MaterialRef bundled(String id) {
        return new MaterialRef(id, null);
    }

    public boolean isBundled() {
        return csvFile == null;
    }
}
