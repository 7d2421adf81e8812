package org.fabspread.sampling;

import java.io.IOException;
import java.nio.file.Path;

import com.fasterxml.jackson.databind.ObjectMapper;
import com.fasterxml.jackson.databind.SerializationFeature;

import org.fabspread.io.AtomicFiles;

/**
 * The state of an interrupted run, {@code checkpoint.json} beside {@code samples.csv.part}: the
 * first {@code partBytes} bytes of the part file hold the header and exactly the chunks
 * 0 .. chunksDone − 1, in order. Written atomically, so it is either complete or absent.
 *
 * @param digest SHA-256 of the study and model the run belongs to ({@link StudyDigest})
 */
public record Checkpoint(int version, String digest, long seed, long samples, int chunkSize, String sampler,
                         String failurePolicy, long chunksDone, long partBytes) {

    public static final int VERSION = 1;
    private static final ObjectMapper JSON = new ObjectMapper().enable(SerializationFeature.INDENT_OUTPUT);

    public void write(Path file) throws IOException {
        AtomicFiles.writeString(file, JSON.writeValueAsString(this) + "\n");
    }

    public static Checkpoint read(Path file) throws IOException {
        return JSON.readValue(file.toFile(), Checkpoint.class);
    }

    /** True when this checkpoint continues a run with the same study, model and settings. */
    public boolean sameRunAs(Checkpoint other) {
        return version == other.version && digest.equals(other.digest) && seed == other.seed
                && samples == other.samples && chunkSize == other.chunkSize && sampler.equals(other.sampler)
                && failurePolicy.equals(other.failurePolicy);
    }
}
