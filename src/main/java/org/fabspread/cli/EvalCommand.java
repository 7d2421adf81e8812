package org.fabspread.cli;

import java.io.IOException;
import java.io.PrintWriter;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Locale;
import java.util.Map;
import java.util.concurrent.Callable;

import org.fabspread.device.DeviceModel;
import org.fabspread.sampling.EvalJob;
import org.fabspread.study.Study;
import org.fabspread.study.StudyException;
import org.fabspread.study.StudyReader;

import picocli.CommandLine.ArgGroup;
import picocli.CommandLine.Command;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Option;
import picocli.CommandLine.Parameters;
import picocli.CommandLine.Spec;

/**
 * {@code eval STUDY --inputs IN.csv (--out DIR | --output-file FILE)}: the model on points the user lists
 * (measured wafers with their ID columns, values with units, or the run sheet the {@code plan} command wrote).
 */
@Command(name = "eval", mixinStandardHelpOptions = true,
        description = {"Evaluate the device model on rows you give (an external design, measured wafers, or a run"
                + " sheet from 'fabspread plan'): columns named by input ids, as 'id' or 'id [unit]'; absent"
                + " inputs take their nominal value.",
                "Values may carry units ('5 %', '102 nm', '0.1 µm'); other columns (wafer, lot, run, notes …)"
                        + " are copied to the output unchanged."})
public final class EvalCommand implements Callable<Integer> {

    @Spec
    CommandSpec spec;

    @Parameters(index = "0", paramLabel = "STUDY", description = "The study file (YAML).")
    Path studyFile;

    @Mixin
    DataFileOptions dataFiles = new DataFileOptions();

    @Option(names = "--inputs", paramLabel = "IN.csv", required = true, description = "Rows to evaluate.")
    Path inputs;

    /** Where the results go: a folder (like every other command) or one file. */
    static final class Destination {
        @Option(names = "--out", paramLabel = "DIR", required = true,
                description = "Folder for the results: writes DIR/" + FILE_NAME + " (the folder is created).")
        Path folder;

        @Option(names = "--output-file", paramLabel = "FILE", required = true,
                description = "Write the results to this one CSV file instead.")
        Path file;
    }

    /** The file name eval writes inside its {@code --out} folder. */
    static final String FILE_NAME = "eval.csv";

    @ArgGroup(exclusive = true, multiplicity = "1")
    Destination destination;

    @Override
    public Integer call() throws IOException {
        Path out = destination.file;
        if (out == null) {
            Path dir = destination.folder;
            if (dir.getFileName() != null && dir.getFileName().toString().toLowerCase(Locale.ROOT).endsWith(".csv")) {
                throw new StudyException("--out " + dir + ": names a folder (eval writes DIR/" + FILE_NAME
                        + "); to write one file, use --output-file " + dir);
            }
            if (Files.exists(dir) && !Files.isDirectory(dir)) {
                throw new StudyException("--out " + dir + ": is a file, not a folder; to write one file, use"
                        + " --output-file " + dir);
            }
            out = dir.resolve(FILE_NAME);
        }
        Study study = StudyReader.read(studyFile, dataFiles.forTools());
        EvalJob job = new EvalJob(study, DeviceModel.of(study), inputs, out);
        if (destination.folder != null) {
            Files.createDirectories(destination.folder);
        }
        EvalJob.Result r = job.run();
        PrintWriter w = spec.commandLine().getOut();
        w.println("evaluated " + r.rows() + " rows into " + out);
        for (Map.Entry<String, Long> f : r.failures().entrySet()) {
            w.println("  failed (" + f.getKey() + "): " + f.getValue());
        }
        w.flush();
        return ExitCodes.OK;
    }
}
