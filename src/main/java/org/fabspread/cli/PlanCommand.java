package org.fabspread.cli;

import java.io.IOException;
import java.io.PrintWriter;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.concurrent.Callable;

import org.fabspread.analysis.Screening;
import org.fabspread.analysis.ScreeningResult;
import org.fabspread.device.DeviceModel;
import org.fabspread.model.ModelException;
import org.fabspread.plan.PlanJob;
import org.fabspread.plan.PlanRefused;
import org.fabspread.plan.PlanReport;
import org.fabspread.plan.RankedInput;
import org.fabspread.pipeline.InMemoryRun;
import org.fabspread.sampling.SampleTable;
import org.fabspread.sampling.StudyInputSpace;
import org.fabspread.study.PlanSettings;
import org.fabspread.study.Study;
import org.fabspread.study.StudyException;
import org.fabspread.study.StudyReader;

import picocli.CommandLine.Command;
import picocli.CommandLine.Model.CommandSpec;
import picocli.CommandLine.Mixin;
import picocli.CommandLine.Option;
import picocli.CommandLine.Parameters;
import picocli.CommandLine.Spec;

/** {@code plan STUDY --runs N --out DIR}: a suggested experiment plan. */
@Command(name = "plan", mixinStandardHelpOptions = true,
        description = {"Suggest the smallest experiment plan that can see the inputs that matter: ranks the inputs"
                + " with a quick given-data screening (Monte Carlo in memory), then picks a two-level plan of the"
                + " resolution the study asks for within the run budget.",
                "Writes DIR/plan.csv (the run sheet for the operator, with an empty measured column), plan.json and"
                        + " plan.txt."})
public final class PlanCommand implements Callable<Integer> {

    @Spec
    CommandSpec spec;

    @Parameters(index = "0", paramLabel = "STUDY", description = "The study file (YAML).")
    Path studyFile;

    @Mixin
    DataFileOptions dataFiles = new DataFileOptions();

    @Option(names = "--runs", paramLabel = "N", description = "Run budget (default: the study's plan.max_runs).")
    int runs;

    @Option(names = "--out", paramLabel = "DIR", required = true, description = "Folder for the plan files.")
    Path out;

    @Option(names = "--screening-samples", paramLabel = "N", description = "Samples of the screening run"
            + " (default: ${DEFAULT-VALUE}).")
    int screeningSamples = 1000;

    @Option(names = "--threads", paramLabel = "T", description = "Worker threads (default: all processors).")
    int threads = Runtime.getRuntime().availableProcessors();

    @Override
    public Integer call() throws IOException {
        if (runs < 0 || screeningSamples < 20 || threads < 1) {
            throw new StudyException("--runs must be >= 0, --screening-samples >= 20 and --threads >= 1");
        }
        Study study = withBudget(StudyReader.read(studyFile, dataFiles.forTools()), runs);
        DeviceModel model = DeviceModel.of(study);
        StudyInputSpace space = StudyInputSpace.of(study);
        if (space.dimension() == 0) {
            throw new StudyException(studyFile + ": the study has no uncertain inputs to plan experiments on");
        }
        SampleTable table = InMemoryRun.run(model, space, study.analysis().sampler(), screeningSamples,
                study.analysis().seed(), threads);
        ScreeningResult screening = Screening.of(table);
        String response = study.plan().response() == null ? "jsc" : study.plan().response();
        List<RankedInput> ranking = new ArrayList<>();
        ScreeningResult.OutputScreening os = screening.output(response);
        if (os != null) {
            for (ScreeningResult.InputScreening is : os.inputs()) {
                ranking.add(new RankedInput(is.input(), Math.max(Math.max(0, is.firstOrder()), is.srrc() * is.srrc())));
            }
        }
        ranking.sort((a, b) -> Double.compare(b.totalIndex(), a.totalIndex()));
        PlanReport r;
        try {
            r = PlanJob.run(study, model, space, ranking, out);
        } catch (PlanRefused e) {
            throw new StudyException(studyFile.getFileName() + ": plan: " + e.getMessage() + "; " + e.remedy());
        } catch (ModelException e) {
            throw new StudyException(studyFile.getFileName() + ": plan: the device model refuses one of the plan's runs ("
                    + e.getMessage() + "); move plan.limits or plan.levels inside the range the model accepts");
        }
        PrintWriter w = spec.commandLine().getOut();
        w.print(PlanJob.text(r));
        w.println("wrote " + out.resolve("plan.csv") + " (run sheet), plan.json and plan.txt");
        w.flush();
        return ExitCodes.OK;
    }

    /** The study with its run budget replaced. */
    static Study withBudget(Study s, int runs) {
        if (runs <= 0) {
            return s;
        }
        PlanSettings p = s.plan();
        PlanSettings q = new PlanSettings(p.factors(), runs, p.levelSigmas(), p.limits(), p.kind(), p.resolution(),
                p.centrePoints(), p.blocks(), p.replicates(), p.effectOfInterest(), p.response(), p.alpha(), p.power(),
                p.seed(), p.precision());
        return new Study(s.file(), s.name(), s.description(), s.grid(), s.stack(), s.particles(), s.collection(),
                s.diode(), s.targets(), s.analysis(), q, s.costs(), s.correlations());
    }
}
