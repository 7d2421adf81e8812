package org.fabspread.pipeline;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.LinkedHashMap;
import java.util.Map;
import java.util.Optional;

import com.fasterxml.jackson.core.JacksonException;
import com.fasterxml.jackson.databind.DeserializationFeature;
import com.fasterxml.jackson.databind.ObjectMapper;
import com.fasterxml.jackson.databind.SerializationFeature;

import org.fabspread.io.AtomicFiles;
import org.fabspread.sampling.FileDigest;
import org.fabspread.study.StudyException;

/**
 * The finished phases of an unfinished run, kept in its staging folder so {@code --resume} continues
 * from the last finished phase: {@value #STATE} names the run (study digest, seed, sample count) and, per
 * finished phase, the SHA-256 of its file under {@value #FOLDER}/ (FIPS 180-4), so a changed or cut-short
 * file is refused in one line rather than resumed. A phase result is kept only when it reads back to
 * exactly the JSON it was written as; otherwise it is recorded as {@value #NOT_KEPT} and simply run again on
 * resume (same seed, same bits).
 */
final class PhaseStore {

    static final String STATE = "run-state.json";
    static final String FOLDER = "phases";
    /** Recorded for a finished phase whose result does not read back exactly: it runs again on resume. */
    static final String NOT_KEPT = "not-kept";

    private static final ObjectMapper JSON = new ObjectMapper().enable(SerializationFeature.INDENT_OUTPUT)
            .configure(DeserializationFeature.FAIL_ON_UNKNOWN_PROPERTIES, true);

    /** The content of {@value #STATE}. */
    record State(String run, Map<String, String> phases) {
    }

    private final Path dir;
    private final String run;
    private final Map<String, String> phases;

    private PhaseStore(Path dir, String run, Map<String, String> phases) {
        this.dir = dir;
        this.run = run;
        this.phases = phases;
    }

    /** A new store for run {@code run} in {@code dir} (forgetting any earlier state). */
    static PhaseStore fresh(Path dir, String run) throws IOException {
        PhaseStore s = new PhaseStore(dir, run, new LinkedHashMap<>());
        s.writeState();
        return s;
    }

    /** The store of the unfinished run in {@code dir}; refuses another run's state or an unreadable one. */
    static PhaseStore resume(Path dir, String run) throws IOException {
        Path file = dir.resolve(STATE);
        if (!Files.isRegularFile(file)) {
            return fresh(dir, run);
        }
        State st;
        try {
            st = JSON.readValue(file.toFile(), State.class);
        } catch (JacksonException e) {
            throw new StudyException(file + ": damaged (not the state this program wrote); run again without"
                    + " --resume");
        }
        if (st.run() == null || !st.run().equals(run)) {
            throw new StudyException(file + ": belongs to a different run (study, model, seed or sample count"
                    + " changed); run again without --resume");
        }
        return new PhaseStore(dir, run, new LinkedHashMap<>(st.phases() == null ? Map.of() : st.phases()));
    }

    /** The digest recorded for a phase, if it finished. */
    Optional<String> digest(String phase) {
        return Optional.ofNullable(phases.get(phase));
    }

    /** Records a finished phase whose result is a file of the run itself (its digest given). */
    void record(String phase, String sha256) throws IOException {
        phases.put(phase, sha256);
        writeState();
    }

    /** Keeps a phase's result, when it reads back to the same JSON. */
    void save(String phase, Object result, Class<?> type) throws IOException {
        String text;
        try {
            text = JSON.writeValueAsString(result);
            if (!JSON.writeValueAsString(JSON.readValue(text, type)).equals(text)) {
                record(phase, NOT_KEPT);
                return;
            }
        } catch (JacksonException e) {
            record(phase, NOT_KEPT);
            return;
        }
        Path file = file(phase);
        byte[] bytes = text.getBytes(StandardCharsets.UTF_8);
        AtomicFiles.write(file, o -> o.write(bytes));
        record(phase, FileDigest.of(file));
    }

    /** A finished phase's result, checked against its digest; empty when the phase did not finish. */
    <T> Optional<T> load(String phase, Class<T> type) throws IOException {
        String sha = phases.get(phase);
        Path file = file(phase);
        if (sha == null || sha.equals(NOT_KEPT) || !Files.isRegularFile(file)) {
            return Optional.empty();
        }
        if (!FileDigest.of(file).equals(sha)) {
            throw new StudyException(file + ": changed since the run wrote it (SHA-256 differs); run again without"
                    + " --resume");
        }
        return Optional.of(JSON.readValue(file.toFile(), type));
    }

    private Path file(String phase) {
        return dir.resolve(FOLDER).resolve(phase + ".json");
    }

    private void writeState() throws IOException {
        AtomicFiles.writeString(dir.resolve(STATE), JSON.writeValueAsString(new State(run, phases)) + "\n");
    }
}
