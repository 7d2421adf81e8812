package org.fabspread.plan;

import java.io.IOException;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;

import com.fasterxml.jackson.databind.ObjectMapper;
import com.fasterxml.jackson.databind.SerializationFeature;

import org.fabspread.io.AtomicFiles;
import org.fabspread.model.Model;
import org.fabspread.model.OutputDef;
import org.fabspread.sampling.Engine;
import org.fabspread.sampling.InputSpace;
import org.fabspread.study.PlanSettings;
import org.fabspread.study.Study;
import org.fabspread.study.StudyException;
import org.fabspread.study.SourceLocation;

/**
 * Proposes a plan for a study and writes {@code plan.csv} (the run sheet), {@code plan.json} (a
 * {@link PlanReport}) and {@code plan.txt} (the explanation, the alias structure, predictions and power).
 *
 * <p>Replicates, unless the study fixes them, are the fewest reaching the wanted power for the effect
 * of interest (the study's, or else the smallest predicted main effect) within the run budget; ν is
 * the residual degrees of freedom of the model the plan estimates (runs − 1 − terms: pure error from
 * replicates and centre points plus the unused contrasts).
 */
public final class PlanJob {

    /** Monte Carlo draws per design point for the noise. */
    public static final int NOISE_DRAWS = 300;
    /** Design points at which the noise is sampled. */
    public static final int NOISE_POINTS = 8;
    /** Replicate cap when the study sets no budget. */
    public static final int MAX_REPLICATES = 20;

    private PlanJob() {
    }

    /** Default plan settings when the study has no plan section. */
    public static PlanSettings defaults() {
        return new PlanSettings(List.of(), 0, 2.0, List.of(), PlanSettings.Kind.AUTO, 0, 0, 1, 0, Double.NaN, "jsc",
                0.05, 0.8, 1L);
    }

    public static PlanReport run(Study study, Model model, InputSpace space, List<RankedInput> ranking, Path outDir)
            throws IOException {
        return run(Engine.local(1), study, model, space, ranking, outDir);
    }

    /** As {@link #run(Study, Model, InputSpace, List, Path)}, the noise estimate's model runs on {@code engine}. */
    public static PlanReport run(Engine engine, Study study, Model model, InputSpace space, List<RankedInput> ranking,
                                 Path outDir) throws IOException {
        PlanSettings s = study.plan() == null ? defaults() : study.plan();
        String response = s.response() == null || s.response().isEmpty() ? "jsc" : s.response();
        int out = model.outputIndex(response);
        if (out < 0) {
            throw StudyException.at(SourceLocation.unknown("plan.response"), "the model has no output " + response);
        }
        OutputDef od = model.outputs().get(out);
        double alpha = s.alpha() > 0 && s.alpha() < 1 ? s.alpha() : 0.05;
        double wantedPower = s.power() > 0 && s.power() < 1 ? s.power() : 0.8;
        PlanAdvisor.Advice advice = PlanAdvisor.advise(ranking, s);
        List<Factor> factors = FactorLevels.of(study, space, advice.factorIds());
        String axialNote = AxialCheck.outsideSupport(advice.design(), factors, space);
        if (!axialNote.isEmpty()) {
            advice = PlanAdvisor.advise(ranking, s, ResponseSurfaceDesigns.Axial.FACE_CENTRED, axialNote);
            factors = FactorLevels.of(study, space, advice.factorIds());
        }
        CodedDesign design = advice.design();
        Predictor.Result pred = Predictor.predict(engine, model, space, design, factors, response, NOISE_DRAWS, NOISE_POINTS,
                s.seed());

        // power and replicates
        double delta;
        String deltaSource;
        if (Double.isFinite(s.effectOfInterest()) && s.effectOfInterest() > 0) {
            delta = s.effectOfInterest();
            deltaSource = "the study's effect of interest";
        } else {
            int t = Predictor.smallestMainEffect(pred);
            delta = Math.abs(pred.effects()[t]);
            deltaSource = "the smallest predicted main effect (" + pred.terms().get(t).label() + ")";
        }
        int centre = advice.centrePoints();
        int nTerms = pred.terms().size();
        int pts = design.size();
        double[][] fitPoints = Predictor.fitPoints(design, factors);
        LeastSquares unit = LeastSquares.fit(pred.terms(), fitPoints, new double[fitPoints.length]);
        double cMax = 0;
        for (int t = 0; t < nTerms; t++) {
            if (pred.terms().get(t).isMain()) {
                cMax = Math.max(cMax, unit.unscaledCov()[t + 1][t + 1]);
            }
        }
        double effRunsPerRep = 1 / cMax;
        int maxReps = MAX_REPLICATES;
        if (s.maxRuns() > 0) {
            maxReps = Math.max(1, (s.maxRuns() - centre) / pts);
        }
        Power.Replicates rep;
        if (s.replicates() > 0) {
            int r = s.replicates();
            rep = Power.replicatesNeeded(delta, pred.sigmaNoise(), effRunsPerRep * r, q -> pts * r + centre - 1.0 - nTerms,
                    alpha, 2, 1);
            rep = new Power.Replicates(r, rep.effectRuns(), rep.dof(), rep.noncentrality(), rep.power(),
                    rep.power() >= wantedPower);
        } else {
            rep = Power.replicatesNeeded(delta, pred.sigmaNoise(), effRunsPerRep,
                    r -> pts * r + centre - 1.0 - nTerms, alpha, wantedPower, maxReps);
        }
        PowerNeeded needed = PowerNeeded.of(rep, delta, pred.sigmaNoise(), effRunsPerRep, pts, centre, nTerms, alpha,
                wantedPower);
        Plan plan;
        try {
            plan = Plan.build(design, factors, rep.replicates(), centre, Math.max(1, s.blocks()), s.seed());
        } catch (IllegalArgumentException e) {
            throw StudyException.at(SourceLocation.unknown("plan.blocks"), e.getMessage());
        }
        PlanReport.PowerReport pr = new PlanReport.PowerReport(delta, deltaSource, pred.sigmaNoise(), pred.draws(),
                pred.noisePoints(), alpha, wantedPower, rep.replicates(), rep.effectRuns(), rep.dof(),
                "residual degrees of freedom of the fitted model (runs - 1 - " + nTerms
                        + " terms): pure error from replicates and centre points plus unused contrasts",
                rep.noncentrality(), rep.power(), Double.isFinite(rep.noncentrality())
                ? Power.normalApproximation(rep.noncentrality(), alpha) : 1.0, rep.reached(), needed.replicates(),
                needed.runs(), needed.statement());
        List<PlanReport.PredictedEffect> pe = new ArrayList<>();
        for (int t = 0; t < nTerms; t++) {
            Term term = pred.terms().get(t);
            pe.add(new PlanReport.PredictedEffect(term.label(), term.named(advice.factorIds()), pred.effects()[t]));
        }
        TwoLevelDesign reg = design.regular();
        boolean regular = reg != null && !design.isSecondOrder();
        List<String> blockGen = new ArrayList<>();
        if (plan.blocking() != null) {
            blockGen.addAll(plan.blocking().confoundedWith());
        }
        PlanReport report = new PlanReport(study.name(), response, od.unit(), design.kind().name(), design.name(),
                regular ? reg.resolutionLabel() : "", regular ? reg.generatorText() : List.of(),
                regular ? reg.aliasStructure() : null, factors, advice.leftOut(), plan.size(), plan.replicates(),
                centre, plan.blocks(), blockGen, s.seed(), pe, pr, advice.explanation());
        RunSheet.write(plan, response, od.unit(), outDir.resolve("plan.csv"));
        AtomicFiles.writeString(outDir.resolve("plan.json"), json().writeValueAsString(report));
        AtomicFiles.writeString(outDir.resolve("plan.txt"), text(report));
        return report;
    }

    static ObjectMapper json() {
        return new ObjectMapper().enable(SerializationFeature.INDENT_OUTPUT);
    }

    /** The plain-text report. */
    public static String text(PlanReport r) {
        StringBuilder b = new StringBuilder();
        b.append("Experiment plan for ").append(r.study()).append(" (response ").append(r.response()).append(" [")
                .append(r.unit()).append("])\n\n");
        b.append(r.explanation()).append("\n\n");
        b.append(String.format(Locale.ROOT, "%d runs: %d replicate(s), %d centre point(s), %d block(s), seed %d%n",
                r.runs(), r.replicates(), r.centrePoints(), r.blocks(), r.seed()));
        if (!r.blockGenerators().isEmpty()) {
            b.append("Confounded with blocks: ").append(String.join(", ", r.blockGenerators())).append('\n');
        }
        b.append("\nFactor levels:\n");
        for (Factor f : r.factors()) {
            b.append(String.format(Locale.ROOT, "  %-32s low %s  high %s %s  (nominal %s, sigma %s; %s)%n", f.id(),
                    RunSheet.format(f.toSheet(f.low())), RunSheet.format(f.toSheet(f.high())), f.sheetUnit(),
                    RunSheet.format(f.toSheet(f.nominal())), RunSheet.format(f.toSheet(f.sigma())), f.levelSource()));
        }
        if (r.aliases() != null) {
            b.append("\nGenerators: ").append(r.generators().isEmpty() ? "none (full factorial)"
                    : String.join(", ", r.generators())).append('\n');
            List<String> ids = r.factors().stream().map(Factor::id).toList();
            b.append(r.aliases().text(ids));
        }
        b.append("\nPredicted effects (others at nominal):\n");
        for (PlanReport.PredictedEffect e : r.predictions()) {
            b.append(String.format(Locale.ROOT, "  %-6s %12.5g  %s%n", e.term(), e.effect(), e.name()));
        }
        PlanReport.PowerReport p = r.power();
        b.append(String.format(Locale.ROOT, "%nNoise from the uncontrolled inputs: sigma = %.4g %s (%d draws at %d design points)%n",
                p.sigmaNoise(), r.unit(), p.noiseDraws(), p.noisePoints()));
        b.append(String.format(Locale.ROOT, "Effect to detect: %.4g %s, %s%n", p.effectOfInterest(), r.unit(), p.effectSource()));
        b.append(String.format(Locale.ROOT, "Replicates: %d -> N = %.4g, nu = %.0f (%s), delta = %.3g, power %.3f "
                        + "(normal approximation %.3f) at alpha %.3g; wanted %.2f%s%n",
                p.replicates(), p.effectRuns(), p.dof(), p.dofKind(), p.noncentrality(), p.power(),
                p.normalApproximation(), p.alpha(), p.wantedPower(), p.reached() ? "" : " - NOT reached within the budget"));
        b.append(p.statement()).append('\n');
        return b.toString();
    }
}
