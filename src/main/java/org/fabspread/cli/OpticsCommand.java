package org.fabspread.cli;

import java.io.IOException;
import java.io.PrintWriter;
import java.nio.file.Path;
import java.util.Locale;
import java.util.concurrent.Callable;

import org.fabspread.device.DeviceModel;
import org.fabspread.device.Spectra;
import org.fabspread.device.SpectraCsv;
import org.fabspread.optics.OpticsOutput;
import org.fabspread.study.Study;
import org.fabspread.study.StudyReader;

import picocli.CommandLine.Command;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Option;
import picocli.CommandLine.Parameters;
import picocli.CommandLine.Spec;

/** {@code optics STUDY --out DIR}: the nominal spectra and the optical limit of J_sc. */
@Command(name = "optics", mixinStandardHelpOptions = true,
        description = {"Write the nominal spectra of a study (R, T, the absorptance of every layer, the absorber's"
                + " EQE) as CSV and print the optical limit of J_sc (every photon absorbed in the absorber gives"
                + " one electron).",
                "Files: spectra.csv (the device, particles included), spectra-planar.csv (the same stack without"
                        + " particles, when the study has a particle layer)."})
public final class OpticsCommand implements Callable<Integer> {

    @Spec
    CommandSpec spec;

    @Parameters(index = "0", paramLabel = "STUDY", description = "The study file (YAML).")
    Path studyFile;

    @Mixin
    DataFileOptions dataFiles = new DataFileOptions();

    @Option(names = "--out", paramLabel = "DIR", required = true, description = "Folder for the CSV files.")
    Path out;

    @Override
    public Integer call() throws IOException {
        Study study = StudyReader.read(studyFile, dataFiles.forTools());
        DeviceModel model = DeviceModel.of(study);
        Spectra spectra = model.nominalSpectra();
        double[] y = model.evaluate(model.nominalInputs());
        PrintWriter w = spec.commandLine().getOut();
        SpectraCsv.write(spectra, study, out.resolve("spectra.csv"));
        w.println("wrote " + out.resolve("spectra.csv"));
        if (study.particleLayer().isPresent()) {
            double planar = OpticsOutput.write(study, out.resolve("planar"));
            w.println("wrote " + out.resolve("planar").resolve(OpticsOutput.SPECTRA_FILE));
            w.printf(Locale.ROOT, "optical J_sc without particles: %.3f mA/cm^2%n", planar);
        }
        w.printf(Locale.ROOT, "optical J_sc (100 %% internal quantum efficiency): %.3f mA/cm^2%n",
                y[model.outputIndex("jsc_optical")]);
        w.printf(Locale.ROOT, "J_sc with charge collection: %.3f mA/cm^2%n", y[model.outputIndex("jsc")]);
        w.flush();
        return ExitCodes.OK;
    }
}
