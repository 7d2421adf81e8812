package org.fabspread.spark;

import java.io.Serializable;
import java.util.Map;
import java.util.concurrent.ConcurrentHashMap;

import org.fabspread.device.DeviceModel;
import org.fabspread.sampling.ChunkStore;
import org.fabspread.sampling.PointSets;
import org.fabspread.sampling.Runner;
import org.fabspread.sampling.StudyInputSpace;
import org.fabspread.study.AnalysisSettings;
import org.fabspread.study.Study;

/**
 * How to rebuild the study's main Monte Carlo runner on any machine: the study's source plus the run's
 * sample count, seed and chunk size. {@link #runner()} does what the driver does (read the study, compile
 * the device model, build the input space and point set) and keeps the result per JVM, keyed by the
 * source's digest and the run's numbers, so every task of an executor shares one model and its tables.
 *
 * @param source      the study's files
 * @param samples     sample count
 * @param seed        master seed
 * @param chunkSize   samples per chunk
 * @param policy      the failure policy the driver runs with
 * @param fingerprint the driver's {@link RunnerFingerprint} of the run, checked after the rebuild
 * @param store       where the tasks write each chunk's samples (null: nowhere)
 */
public record MonteCarloRecipe(StudySource source, long samples, long seed, int chunkSize,
                               AnalysisSettings.FailurePolicy policy, String fingerprint, ChunkStore store)
        implements Serializable {

    private static final Map<String, Runner> BUILT = new ConcurrentHashMap<>();

    /** The recipe of a driver-side runner of the study in {@code source}. */
    static MonteCarloRecipe of(StudySource source, Runner runner) {
        return new MonteCarloRecipe(source, runner.points().size(), runner.seed(), runner.config().chunkSize(),
                runner.config().policy(), RunnerFingerprint.of(runner), runner.store());
    }

    private String key() {
        return source.digest() + "/" + samples + "/" + seed + "/" + chunkSize + "/" + policy + "/" + store;
    }

    /** The rebuilt runner, made once per JVM. */
    public Runner runner() {
        return BUILT.computeIfAbsent(key(), k -> build());
    }

    /** Builds the runner as the driver's run job does, on this JVM's shared model of the study ({@link StudyModels}). */
    Runner build() {
        StudyModels.Built built = StudyModels.of(source);
        Study study = built.study();
        DeviceModel model = built.model();
        StudyInputSpace space = StudyInputSpace.of(study);
        AnalysisSettings a = study.analysis();
        AnalysisSettings.Sampler sampler = a == null || a.sampler() == null
                ? AnalysisSettings.Sampler.RANDOM : a.sampler();
        Runner r = new Runner(model, space, PointSets.of(sampler, space.dimension(), samples, seed), seed,
                new Runner.Config(1, chunkSize, policy));
        String fp = RunnerFingerprint.of(r);
        if (fingerprint != null && !fingerprint.equals(fp)) {
            throw new IllegalStateException("the runner rebuilt from the study source differs from the driver's"
                    + " (driver " + fingerprint + ", here " + fp + ")");
        }
        r.storeChunks(store);
        return r;
    }
}
