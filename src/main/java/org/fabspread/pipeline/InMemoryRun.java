package org.fabspread.pipeline;

import java.io.IOException;
import java.util.ArrayList;
import java.util.List;

import org.fabspread.model.Model;
import org.fabspread.model.OutputDef;
import org.fabspread.sampling.Engine;
import org.fabspread.sampling.InputSpace;
import org.fabspread.sampling.LocalEngine;
import org.fabspread.sampling.PointSets;
import org.fabspread.sampling.Runner;
import org.fabspread.sampling.SampleTable;
import org.fabspread.study.AnalysisSettings;

/** A small Monte Carlo held in memory (no files), for the plan command's ranking. */
public final class InMemoryRun {

    private InMemoryRun() {
    }

    public static SampleTable run(Model model, InputSpace space, AnalysisSettings.Sampler sampler, int n, long seed,
                                  int threads) throws IOException {
        return run(Engine.local(threads), model, space, sampler, n, seed);
    }

    /** As {@link #run(Model, InputSpace, AnalysisSettings.Sampler, int, long, int)}, on the given engine. */
    public static SampleTable run(Engine engine, Model model, InputSpace space, AnalysisSettings.Sampler sampler,
                                  int n, long seed) throws IOException {
        int threads = engine instanceof LocalEngine l ? l.threads() : 1;
        int k = space.dimension();
        int m = model.outputs().size();
        double[][] x = new double[k][n];
        double[][] y = new double[m][n];
        boolean[] ok = new boolean[n];
        Runner runner = new Runner(model, space, PointSets.of(sampler, k, n, seed), seed,
                new Runner.Config(threads, Runner.DEFAULT_CHUNK, AnalysisSettings.FailurePolicy.REJECT));
        runner.run(engine, 0, c -> {
            for (int r = 0; r < c.count(); r++) {
                int j = (int) (c.first() + r);
                for (int i = 0; i < k; i++) {
                    x[i][j] = c.x()[r * k + i];
                }
                for (int o = 0; o < m; o++) {
                    y[o][j] = c.y()[r * m + o];
                }
                ok[j] = c.ok(r);
            }
        }, null);
        List<String> outIds = new ArrayList<>();
        for (OutputDef o : model.outputs()) {
            outIds.add(o.id());
        }
        return new SampleTable(space.ids(), outIds, x, y, ok);
    }
}
