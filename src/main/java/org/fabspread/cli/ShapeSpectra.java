package org.fabspread.cli;

import java.io.IOException;
import java.io.PrintWriter;
import java.nio.file.Path;
import java.util.LinkedHashMap;
import java.util.Locale;
import java.util.Map;

import org.fabspread.dda.DdaSettings;
import org.fabspread.dda.DdaSolution;
import org.fabspread.dda.DdaSolver;
import org.fabspread.dda.Incidence;
import org.fabspread.io.AtomicFiles;
import org.fabspread.optics.MaterialLibrary;
import org.fabspread.optics.NkTable;
import org.fabspread.shapes.Shape;
import org.fabspread.shapes.Shapes;
import org.fabspread.shapes.VoxelFile;
import org.fabspread.shapes.VoxelPicture;
import org.fabspread.shapes.Voxels;
import org.fabspread.study.Layer;
import org.fabspread.study.Study;
import org.fabspread.study.StudyException;

/**
 * The per-polarisation spectra of one particle of any shape by the discrete-dipole solver, in the study's
 * metal (bulk optical constants) and host layer (real index), written to {@code shape-spectra.csv}, and a
 * picture of its lattice, {@code shape.png}.
 */
final class ShapeSpectra {
    private ShapeSpectra() {
    }

    /** Parses {@code KIND:NAME=VALUE,…} (values in nm) or {@code voxel_file:PATH}. */
    static Shape parse(String text, Path base) {
        int colon = text.indexOf(':');
        if (colon <= 0) {
            throw new StudyException("--shape: expected KIND:NAME=VALUE,... or voxel_file:PATH, got '" + text + "'");
        }
        String kind = text.substring(0, colon).strip();
        String rest = text.substring(colon + 1).strip();
        if (kind.equals("voxel_file")) {
            return VoxelFile.read(base.resolve(rest));
        }
        Map<String, Double> p = new LinkedHashMap<>();
        for (String part : rest.split(",")) {
            String[] kv = part.split("=", 2);
            if (kv.length != 2) {
                throw new StudyException("--shape: expected NAME=VALUE, got '" + part.strip() + "'");
            }
            String v = kv[1].strip().replaceFirst("\\s*nm$", "");
            try {
                p.put(kv[0].strip(), Double.parseDouble(v));
            } catch (NumberFormatException e) {
                throw new StudyException("--shape: " + kv[0].strip() + ": expected a length in nm, got '" + kv[1].strip() + "'");
            }
        }
        try {
            return Shapes.create(kind, p);
        } catch (IllegalArgumentException e) {
            throw new StudyException("--shape: " + e.getMessage());
        }
    }

    static void write(Study study, Shape shape, double pitch, double step, Path out, PrintWriter log)
            throws IOException {
        if (study.particles() == null) {
            throw new StudyException(study.file().getFileName() + ": particles: the study has no particle layer");
        }
        NkTable metal = MaterialLibrary.bundled().resolve(study.particles().metal());
        NkTable host = null;
        for (Layer l : study.stack()) {
            if (l.name().equals(study.particles().host())) {
                host = MaterialLibrary.bundled().resolve(l.material());
            }
        }
        if (host == null) {
            throw new StudyException("particles.host: no such layer");
        }
        DdaSettings settings = DdaSettings.defaults().withPitch(pitch);
        Voxels v;
        try {
            v = shape.voxelise(pitch);
        } catch (IllegalArgumentException e) {
            throw new StudyException("--shape: " + e.getMessage());
        }
        DdaSolver solver = new DdaSolver(v, settings);
        StringBuilder sb = new StringBuilder("wavelength_nm");
        for (String pol : new String[] {"x", "y"}) {
            for (String q : new String[] {"extinction", "absorption", "scattering"}) {
                sb.append(',').append(q).append('_').append(pol).append("_nm2");
            }
            sb.append(",forward_fraction_").append(pol).append(",near_field_").append(pol);
        }
        sb.append(",extinction_unpolarised_nm2\n");
        double start = study.grid().startNm();
        double stop = study.grid().stopNm();
        int count = (int) Math.floor((stop - start) / step + 1e-9) + 1;
        for (int i = 0; i < count; i++) {
            double l = start + i * step;
            double n = metal.n(l);
            double k = metal.k(l);
            solver.setMedium(l, n * n - k * k, 2 * n * k, host.n(l));
            sb.append(fmt(l));
            double ext = 0;
            for (int pol = 0; pol < 2; pol++) {
                DdaSolution s = solver.solve(pol == 0 ? Incidence.X : Incidence.Y, pol);
                sb.append(',').append(fmt(s.extinction())).append(',').append(fmt(s.absorption())).append(',')
                        .append(fmt(s.scattering())).append(',').append(fmt(s.forwardFraction())).append(',')
                        .append(fmt(s.nearField()));
                ext += 0.5 * s.extinction();
            }
            sb.append(',').append(fmt(ext)).append('\n');
            log.printf(Locale.ROOT, "\rshape spectra: %d/%d wavelengths", i + 1, count);
            log.flush();
        }
        log.println();
        AtomicFiles.writeString(out.resolve("shape-spectra.csv"), sb.toString());
        VoxelPicture.write(v, String.format(Locale.ROOT, "%s %s: %d dipoles, spacing %.2f nm", shape.kind(),
                shape.parameters(), v.count(), v.spacing()), out.resolve("shape.png"));
    }

    private static String fmt(double x) {
        return Double.isNaN(x) ? "" : String.format(Locale.ROOT, "%.6g", x);
    }
}
