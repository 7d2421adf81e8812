package org.fabspread.cli;

import java.io.IOException;
import java.io.PrintWriter;
import java.nio.file.Path;
import java.util.List;
import java.util.concurrent.Callable;

import org.fabspread.device.DeviceModel;
import org.fabspread.plan.MeasuredJob;
import org.fabspread.plan.MeasuredReport;
import org.fabspread.report.MeasuredDocument;
import org.fabspread.report.ReportWriter;
import org.fabspread.sampling.StudyInputSpace;
import org.fabspread.study.Study;
import org.fabspread.study.StudyReader;

import picocli.CommandLine.Command;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Option;
import picocli.CommandLine.Parameters;
import picocli.CommandLine.Spec;

/** {@code measured STUDY --sheet plan.csv --out DIR}: analyse the measured run sheet. */
@Command(name = "measured", mixinStandardHelpOptions = true,
        description = {"Analyse a run sheet whose measured column the line has filled in: effect estimates, ANOVA"
                + " when runs were replicated or Lenth's pseudo standard error when not, the half-normal plot data,"
                + " measured effects beside the model's predictions, and a least-squares calibration of up to three"
                + " model inputs with intervals.",
                "Writes DIR/measured.json, measured.txt, and a report (report.html, report.md, charts/)."})
public final class MeasuredCommand implements Callable<Integer> {

    @Spec
    CommandSpec spec;

    @Parameters(index = "0", paramLabel = "STUDY", description = "The study file the plan was made from.")
    Path studyFile;

    @Mixin
    DataFileOptions dataFiles = new DataFileOptions();

    @Option(names = "--sheet", paramLabel = "SHEET.csv", required = true,
            description = "The run sheet (plan.csv) with its measured column filled in.")
    Path sheet;

    @Option(names = "--calibrate", paramLabel = "ID", split = ",",
            description = "Up to three input ids to calibrate (default: collection.dissociation and the absorber's"
                    + " k_scale).")
    List<String> calibrate;

    @Option(names = "--out", paramLabel = "DIR", required = true, description = "Folder for the analysis.")
    Path out;

    @Override
    public Integer call() throws IOException {
        Study study = StudyReader.read(studyFile, dataFiles.forTools());
        DeviceModel model = DeviceModel.of(study);
        StudyInputSpace space = StudyInputSpace.of(study);
        MeasuredReport r = calibrate == null || calibrate.isEmpty()
                ? MeasuredJob.run(study, model, space, sheet, out)
                : MeasuredJob.run(study, model, space, sheet, out, calibrate);
        PrintWriter w = spec.commandLine().getOut();
        w.print(MeasuredJob.text(r));
        Path report = ReportWriter.write(MeasuredDocument.build(study, r, null), out);
        w.println("wrote " + out.resolve("measured.json") + ", measured.txt and " + report);
        w.flush();
        return ExitCodes.OK;
    }
}
