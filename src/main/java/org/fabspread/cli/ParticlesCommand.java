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

    @Override
    public Integer call() throws IOException {
        Study study = StudyReader.read(studyFile, dataFiles.forTools());
        DeviceModel.writeParticleCrossSections(study, out);
        PrintWriter w = spec.commandLine().getOut();
        w.println("wrote " + out.resolve("particles.csv"));
        w.flush();
        return ExitCodes.OK;
    }
}
