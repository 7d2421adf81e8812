package org.fabspread.cli;

import java.io.IOException;
import java.io.PrintWriter;
import java.nio.file.Path;
import java.util.Map;
import java.util.concurrent.Callable;

import org.fabspread.device.DeviceModel;
import org.fabspread.sampling.EvalJob;
import org.fabspread.study.Study;
import org.fabspread.study.StudyReader;

import picocli.CommandLine.Command;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Option;
import picocli.CommandLine.Parameters;
import picocli.CommandLine.Spec;

/** {@code eval STUDY --inputs IN.csv --out OUT.csv}: the model on points the user lists. */
@Command(name = "eval", mixinStandardHelpOptions = true,
        description = "Evaluate the device model on rows you give (an external design, or measured wafers): columns"
                + " named by input ids; absent columns take their nominal value.")
public final class EvalCommand implements Callable<Integer> {

    @Spec
    CommandSpec spec;

    @Parameters(index = "0", paramLabel = "STUDY", description = "The study file (YAML).")
    Path studyFile;

    @Mixin
    DataFileOptions dataFiles = new DataFileOptions();

    @Option(names = "--inputs", paramLabel = "IN.csv", required = true, description = "Rows to evaluate.")
    Path inputs;

    @Option(names = "--out", paramLabel = "OUT.csv", required = true, description = "Where to write the results.")
    Path out;

    @Override
    public Integer call() throws IOException {
        Study study = StudyReader.read(studyFile, dataFiles.forTools());
        EvalJob.Result r = new EvalJob(study, DeviceModel.of(study), inputs, out).run();
        PrintWriter w = spec.commandLine().getOut();
        w.println("evaluated " + r.rows() + " rows into " + out);
        for (Map.Entry<String, Long> f : r.failures().entrySet()) {
            w.println("  failed (" + f.getKey() + "): " + f.getValue());
        }
        w.flush();
        return ExitCodes.OK;
    }
}
