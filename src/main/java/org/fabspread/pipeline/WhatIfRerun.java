package org.fabspread.pipeline;

import java.io.IOException;
import java.util.ArrayList;
import java.util.List;
import java.util.Locale;

import org.apache.commons.rng.UniformRandomProvider;
import org.fabspread.analysis.WhatIf;
import org.fabspread.analysis.WhatIfResult;
import org.fabspread.model.Model;
import org.fabspread.sampling.Engine;
import org.fabspread.sampling.InputSpace;
import org.fabspread.sampling.Intervals;
import org.fabspread.sampling.ModelRows;
import org.fabspread.sampling.PointSet;
import org.fabspread.sampling.PointSets;
import org.fabspread.sampling.RowBatch;
import org.fabspread.sampling.RowInputs;
import org.fabspread.sampling.RunFailedException;
import org.fabspread.sampling.Runner;
import org.fabspread.sampling.SampleTable;
import org.fabspread.sampling.Streams;
import org.fabspread.sampling.StudyInputSpace;
import org.fabspread.study.AnalysisSettings;
import org.fabspread.study.Study;
import org.fabspread.study.Target;

/**
 * A what-if whose likelihood-ratio reweighting cannot be trusted (too few effective samples, or a widened
 * normal): new samples from the changed distribution, run on the engine and counted against the targets,
 * with Wilson intervals (source: Wilson, J. Am. Stat. Assoc. 22, 209 (1927)).
 */
final class WhatIfRerun {

    /** What-ifs re-run with at most this many samples when reweighting cannot be trusted. */
    static final int RERUN_SAMPLES = 2000;

    private WhatIfRerun() {
    }

    /** The seed of a what-if's re-run: the master seed mixed with the input's id. */
    static long seed(long seed, WhatIf.Change change) {
        return seed ^ 0x5DEECE66DL ^ (long) change.input().hashCode();
    }

    /** Sample count of a what-if's re-run, for a run that holds {@code tableSize} samples in memory. */
    static int samples(int tableSize) {
        return (int) Math.min(RERUN_SAMPLES, Math.max(200, tableSize));
    }

    static WhatIfResult run(Engine engine, Study study, Model model, InputSpace space, WhatIf.Change change,
                            WhatIfResult reweighted, long seed, SampleTable before) throws IOException {
        InputSpace changed = WhatIf.modifiedSpace(space, List.of(change));
        int n = samples(before.size());
        long rerunSeed = seed(seed, change);
        AnalysisSettings.Sampler sampler = study.analysis().sampler();
        PointSet points = PointSets.of(sampler, changed.dimension(), n, rerunSeed);
        boolean stop = study.analysis().onFailure() == AnalysisSettings.FailurePolicy.STOP;
        List<Target> targets = study.targets();
        int[] outIndex = new int[targets.size()];
        for (int t = 0; t < targets.size(); t++) {
            outIndex[t] = model.outputIndex(targets.get(t).output());
        }
        long[] met = new long[targets.size() + 1];
        long[] ok = new long[1];
        ModelRows.run(engine, new Draws(model, changed, points, rerunSeed), (in, out) -> {
            for (int row = 0; row < in.rows(); row++) {
                String status = out.status(row);
                if (status != null) {
                    if (stop) {
                        throw new RunFailedException("sample " + (in.chunk() * Runner.DEFAULT_CHUNK + row)
                                + " failed (" + status + ") and the study's failure policy is stop");
                    }
                    continue;
                }
                ok[0]++;
                boolean all = true;
                for (int t = 0; t < targets.size(); t++) {
                    boolean pass = targets.get(t).isMet(out.value(row, outIndex[t]));
                    met[t] += pass ? 1 : 0;
                    all &= pass;
                }
                met[targets.size()] += all ? 1 : 0;
            }
        });
        List<WhatIfResult.WeightedYield> yields = new ArrayList<>();
        for (int t = 0; t <= targets.size(); t++) {
            WhatIfResult.WeightedYield old = reweighted.yields().get(Math.min(t, reweighted.yields().size() - 1));
            double p = ok[0] == 0 ? Double.NaN : (double) met[t] / ok[0];
            var ci = Intervals.wilson(met[t], ok[0], study.analysis().confidence());
            double se = ok[0] == 0 ? Double.NaN : Math.sqrt(p * (1 - p) / ok[0]);
            long nBefore = 0;
            for (boolean good : before.ok()) {
                nBefore += good ? 1 : 0;
            }
            // new samples, independent of the baseline's: Newcombe's interval for the difference
            yields.add(new WhatIfResult.WeightedYield(old.spec(), old.before(), p, se, ci.low(), ci.high(),
                    Intervals.newcombeDifference(met[t], ok[0], Math.round(old.before() * nBefore), nBefore,
                            study.analysis().confidence())));
        }
        String message = String.format(Locale.ROOT, "re-run with %d new samples; reweighting was not usable: %s",
                ok[0], reweighted.message().isEmpty() ? "see the effective sample size" : reweighted.message());
        return new WhatIfResult(reweighted.description(), reweighted.inputs(), false, false, message, (int) ok[0],
                ok[0], 1.0, 1.0, yields, reweighted.outputs());
    }

    /**
     * The re-run's samples in the main run's chunks ({@link Runner#DEFAULT_CHUNK}, stream (seed, chunk)):
     * each point of the point set mapped through the changed input space, in the model's input order.
     */
    private record Draws(Model model, InputSpace space, PointSet points, long seed) implements RowBatch {

        @Override
        public String name() {
            return "what-if re-run";
        }

        @Override
        public long chunkCount() {
            return (points.size() + Runner.DEFAULT_CHUNK - 1) / Runner.DEFAULT_CHUNK;
        }

        @Override
        public RowInputs inputs(long chunk) {
            int k = space.dimension();
            List<String> ids = model.inputIds();
            int[] modelToSpace = new int[ids.size()];
            for (int i = 0; i < modelToSpace.length; i++) {
                modelToSpace[i] = space.ids().indexOf(ids.get(i));
            }
            long first = chunk * Runner.DEFAULT_CHUNK;
            int count = (int) Math.min(Runner.DEFAULT_CHUNK, points.size() - first);
            double[] x = new double[count * modelToSpace.length];
            double[] u = new double[k];
            double[] xs = new double[k];
            UniformRandomProvider rng = Streams.chunkStream(seed, chunk);
            for (int r = 0; r < count; r++) {
                points.point(first + r, rng, u);
                space.map(u, xs);
                for (int i = 0; i < modelToSpace.length; i++) {
                    x[r * modelToSpace.length + i] = xs[modelToSpace[i]];
                }
            }
            return RowInputs.of(chunk, modelToSpace.length, x);
        }
    }

    /** The copula's normal-score correlation over all inputs, for reweighting correlated inputs. */
    static WhatIf.Options options(StudyInputSpace space, double confidence) {
        WhatIf.Options o = WhatIf.Options.defaults().withConfidence(confidence);
        if (!space.correlated()) {
            return o;
        }
        int k = space.dimension();
        double[][] full = new double[k][k];
        for (int i = 0; i < k; i++) {
            full[i][i] = 1;
        }
        List<String> ids = space.ids();
        List<String> block = space.correlatedIds();
        double[][] r = space.normalCorrelation();
        for (int i = 0; i < block.size(); i++) {
            for (int j = 0; j < block.size(); j++) {
                full[ids.indexOf(block.get(i))][ids.indexOf(block.get(j))] = r[i][j];
            }
        }
        return o.withCorrelation(full);
    }
}
