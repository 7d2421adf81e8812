package org.fabspread.cli;

import java.io.IOException;
import java.io.PrintWriter;
import java.nio.file.Path;
import java.util.concurrent.Callable;

import org.fabspread.device.DeviceModel;
import org.fabspread.study.Study;
import org.fabspread.study.StudyReader;

import picocli.CommandLine.Command;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Option;
import picocli.CommandLine.Parameters;
import picocli.CommandLine.Spec;

/** {@code particles STUDY --out DIR}: the nominal ensemble's cross-sections. */
@Command(name = "particles", mixinStandardHelpOptions = true,
        description = "Write the nominal particle ensemble's extinction, scattering and absorption cross-sections,"
                + " per particle (nm^2) and per unit area, against wavelength, to DIR/particles.csv.")
public final class ParticlesCommand implements Callable<Integer> {

    @Spec
    CommandSpec spec;

    @Parameters(index = "0", paramLabel = "STUDY", description = "The study file (YAML).")
    Path studyFile;

    @Mixin
    DataFileOptions dataFiles = new DataFileOptions();

    @Option(names = "--out", paramLabel = "DIR", required = true, description = "Folder for particles.csv.")
    Path out;

    @Option(names = "--shape", paramLabel = "SHAPE", description = "Also solve one particle of this shape by the"
            + " discrete-dipole method, e.g. crescent:outer_diameter=80,bite_diameter=56,bite_offset=24,thickness=20"
            + " (nm; kinds: sphere, spheroid, rod, disk, triangular_prism, crescent, voxel_file:PATH), and write"
            + " DIR/shape-spectra.csv (per polarisation) and DIR/shape.png.")
    String shape;

    @Option(names = "--pitch", paramLabel = "NM", description = "Lattice pitch for --shape (default: ${DEFAULT-VALUE} nm).")
    double pitch = org.fabspread.dda.DdaSettings.DEFAULT_PITCH_NM;

    @Option(names = "--step", paramLabel = "NM", description = "Wavelength step for --shape (default: ${DEFAULT-VALUE} nm).")
    double step = 20;

    @Override
    public Integer call() throws IOException {
        Study study = StudyReader.read(studyFile, dataFiles.forTools());
        org.fabspread.shapes.Shape parsed = shape == null ? null
                : ShapeSpectra.parse(shape, studyFile.toAbsolutePath().getParent());
        if (shape != null && (!(pitch > 0) || !(step > 0))) {
            throw new org.fabspread.study.StudyException("--pitch and --step must be > 0 nm");
        }
        DeviceModel.writeParticleCrossSections(study, out);
        PrintWriter w = spec.commandLine().getOut();
        w.println("wrote " + out.resolve("particles.csv"));
        if (parsed != null) {
            ShapeSpectra.write(study, parsed, pitch, step, out, new PrintWriter(spec.commandLine().getErr(), true));
            w.println("wrote " + out.resolve("shape-spectra.csv") + " and " + out.resolve("shape.png"));
        }
        w.flush();
        return ExitCodes.OK;
    }
}
