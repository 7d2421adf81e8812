package org.fabspread.spark;

import java.io.IOException;
import java.io.UncheckedIOException;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Map;
import java.util.concurrent.ConcurrentHashMap;

import org.fabspread.device.DeviceModel;
import org.fabspread.study.Study;

/**
 * The study and its device model rebuilt from a {@link StudySource}, once per JVM and source digest: every
 * task of an executor (the main Monte Carlo's and every row batch's) shares one model and its tables, as
 * the threads of one machine do.
 */
final class StudyModels {

    /** A study read back from its source and the device model compiled from it. */
    record Built(Study study, DeviceModel model) {
    }

    private static final Map<String, Built> BUILT = new ConcurrentHashMap<>();

    private StudyModels() {
    }

    /** The study and model of {@code source}, built on first use in this JVM. */
    static Built of(StudySource source) {
        return BUILT.computeIfAbsent(source.digest(), d -> build(source));
    }

    private static Built build(StudySource source) {
        try {
            Path folder = Files.createTempDirectory("fabspread-study-");
            Study study = source.materialise(folder);
            return new Built(study, DeviceModel.of(study));
        } catch (IOException e) {
            throw new UncheckedIOException(e);
        }
    }
}
