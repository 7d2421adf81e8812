package org.fabspread.sampling;

import java.io.IOException;
import java.nio.file.Path;

import com.fasterxml.jackson.core.JacksonException;
import com.fasterxml.jackson.databind.DeserializationFeature;
import com.fasterxml.jackson.databind.ObjectMapper;
import com.fasterxml.jackson.databind.SerializationFeature;

import org.fabspread.io.AtomicFiles;
import org.fabspread.study.StudyException;

/**
 * The state of an interrupted run, {@code checkpoint.json} beside {@code samples.csv.part}: the
 * first {@code partBytes} bytes of the part file hold the header and exactly the chunks
 * 0 .. chunksDone − 1, in order, and their SHA-256 is {@code partSha256} (FIPS 180-4), so a part file
 * changed or cut short since is detected before it is resumed. Written atomically, so it is either
 * complete or absent.
 *
 * @param digest     SHA-256 of the study and model the run belongs to ({@link StudyDigest})
 * @param partSha256 SHA-256 of the part file's first {@code partBytes} bytes, in lower-case hex
 */
public record Checkpoint(int version, String digest, long seed, long samples, int chunkSize, String sampler,
                         String failurePolicy, long chunksDone, long partBytes, String partSha256) {

    public static final int VERSION = 2;
    private static final ObjectMapper JSON = new ObjectMapper().enable(SerializationFeature.INDENT_OUTPUT)
            .enable(DeserializationFeature.FAIL_ON_NULL_FOR_PRIMITIVES)
            .enable(DeserializationFeature.FAIL_ON_MISSING_CREATOR_PROPERTIES);

    public void write(Path file) throws IOException {
        AtomicFiles.writeString(file, JSON.writeValueAsString(this) + "\n");
    }

    /** Reads a checkpoint; one that cannot be read is refused in one line. */
    public static Checkpoint read(Path file) throws IOException {
        Checkpoint c;
        try {
            c = JSON.readValue(file.toFile(), Checkpoint.class);
        } catch (JacksonException e) {
            throw new StudyException(file + ": not a checkpoint this version can read (damaged or changed);"
                    + " run again without --resume");
        }
        if (c.version != VERSION || c.digest == null || c.partSha256 == null || c.chunksDone < 0
                || c.partBytes < 0) {
            throw new StudyException(file + ": not a checkpoint this version can read (version " + c.version
                    + "); run again without --resume");
        }
        return c;
    }

    /** True when this checkpoint continues a run with the same study, model and settings. */
    public boolean sameRunAs(Checkpoint other) {
        return version == other.version && digest.equals(other.digest) && seed == other.seed
                && samples == other.samples && chunkSize == other.chunkSize && sampler.equals(other.sampler)
                && failurePolicy.equals(other.failurePolicy);
    }
}
