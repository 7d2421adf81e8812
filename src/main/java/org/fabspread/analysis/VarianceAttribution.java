package org.fabspread.analysis;

import java.io.IOException;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;

import org.fabspread.model.Model;
import org.fabspread.model.OutputDef;
import org.fabspread.sampling.Engine;
import org.fabspread.sampling.StudyInputSpace;

/**
 * The variance-based sensitivity of one study: the Sobol design with one group per correlated set of
 * inputs (their group indices do not depend on the order of the inputs), the Shapley effects of every
 * output (the ranking to follow when inputs are correlated), the estimates that are not converged, and
 * both designs for export.
 *
 * @param sobol          Sobol indices of the inputs and groups
 * @param shapley        Shapley effects, or null with fewer than two inputs
 * @param unconverged    estimates whose interval is too wide ({@link ConvergenceCheck})
 * @param sobolDesign    the Sobol design's rows and outputs
 * @param shapleyDesign  the Shapley design's rows and outputs, or null
 */
public record VarianceAttribution(SobolResult sobol, ShapleyResult shapley, List<ConvergenceCheck.Flag> unconverged,
                                  SobolDesign sobolDesign, ShapleyDesign shapleyDesign) {

    public VarianceAttribution {
        unconverged = List.copyOf(unconverged);
    }

    /**
     * Runs both designs.
     *
     * @param groups the study's own groups, beside the correlated sets added here
     */
    public static VarianceAttribution run(Engine engine, Model model, StudyInputSpace space,
                                          SobolIndices.Options sobolOptions, ShapleyEffects.Options shapleyOptions,
                                          List<InputGroup> groups, ProgressListener sobolProgress,
                                          ProgressListener shapleyProgress) {
        GaussianCopula copula = GaussianCopula.of(space);
        List<InputGroup> all = allGroups(space, groups);
        SobolIndices.Run s = SobolIndices.run(engine, model, space, sobolOptions, all, sobolProgress);
        ShapleyEffects.Run sh = space.dimension() >= 2
                ? ShapleyEffects.compute(engine, model, copula, shapleyOptions, shapleyProgress) : null;
        List<ConvergenceCheck.Flag> flags = new ArrayList<>(ConvergenceCheck.of(s.result()));
        if (sh != null) {
            flags.addAll(ConvergenceCheck.of(sh.result()));
        }
        return new VarianceAttribution(s.result(), sh == null ? null : sh.result(), flags, s.design(),
                sh == null ? null : sh.design());
    }

    /** The study's groups, then each correlated set that is not already one of them. */
    public static List<InputGroup> allGroups(StudyInputSpace space, List<InputGroup> groups) {
        List<InputGroup> all = new ArrayList<>(groups);
        for (InputGroup g : InputGroup.correlated(GaussianCopula.of(space))) {
            if (all.stream().noneMatch(h -> h.inputs().equals(g.inputs()))) {
                all.add(g);
            }
        }
        return all;
    }

    /** Whether the Shapley effects should lead the ranking: some inputs are correlated. */
    public boolean shapleyLeads() {
        return shapley != null && sobolDesign.space().correlated();
    }

    /** Writes {@code sobol_design.csv} and (when computed) {@code shapley_design.csv} into {@code dir}. */
    public void writeDesigns(Path dir, List<OutputDef> outputs) throws IOException {
        List<String> ids = outputs.stream().map(OutputDef::id).toList();
        DesignCsv.writeSobol(dir.resolve(DesignCsv.SOBOL_FILE), sobolDesign, ids);
        if (shapleyDesign != null) {
            DesignCsv.writeShapley(dir.resolve(DesignCsv.SHAPLEY_FILE), shapleyDesign, ids);
        }
    }
}
