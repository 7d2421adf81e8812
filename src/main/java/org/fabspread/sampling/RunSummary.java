package org.fabspread.sampling;

import java.io.IOException;
import java.nio.file.Path;
import java.util.List;
import java.util.Map;

import com.fasterxml.jackson.annotation.JsonInclude;
import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import com.fasterxml.jackson.databind.PropertyNamingStrategies;
import com.fasterxml.jackson.databind.SerializationFeature;
import com.fasterxml.jackson.databind.node.ObjectNode;

import org.fabspread.io.AtomicFiles;

/**
 * What a Monte Carlo run found: the content of {@code summary.json}. Statistics cover the good
 * samples only; failures are counted by reason. Intervals are at {@code confidence}.
 *
 * <p>Later layers add their own sections without changing this record: {@link #toJson(Map)} writes
 * this summary's fields followed by extra top-level sections (for example {@code "sensitivity"}),
 * and {@link #read(Path)} reads the run part back, ignoring sections it does not know.
 *
 * @param failurePolicy     REJECT, TRUNCATE or STOP; under TRUNCATE a failed sample is dropped,
 *                          which is exact rejection sampling of the input distribution truncated
 *                          to the region where the model is valid, and {@code truncatedByModel}
 *                          estimates the probability mass removed
 * @param correlationRepaired true when the study's correlation targets were inconsistent and the
 *                          normal correlation matrix had to be repaired
 */
@JsonInclude(JsonInclude.Include.ALWAYS)
public record RunSummary(String study, long seed, String sampler, int chunkSize, long samplesRequested,
                         long samplesOk, Map<String, Long> failures, String failurePolicy,
                         Double truncatedByModel, double confidence, List<OutputStats> outputs,
                         List<YieldStats> yields, YieldStats allTargets, List<InputTruncation> truncatedInputs,
                         boolean correlationRepaired, String quantileMethod) {

    /** Moments and quantiles of one output over the good samples. */
    public record OutputStats(String id, String unit, long n, double mean, double sd, double standardError,
                              double min, double max, double skewness, List<QuantileStats> quantiles) {
    }

    /**
     * A sample quantile (type 7 interpolation) and its distribution-free order-statistic interval;
     * a bound is null when n is too small for one at this confidence.
     */
    public record QuantileStats(double p, double value, Double lower, Double upper) {
    }

    /** Yield against one target (or all together): met / good samples, with the Wilson interval. */
    public record YieldStats(String target, long met, long n, double yield, double lower, double upper) {
    }

    /** Probability mass removed from a truncated input's parent distribution. */
    public record InputTruncation(String input, double removedMass) {
    }

    /**
     * The version of the {@code summary.json} layout (its first key, {@code format_version}); raised whenever a
     * key is renamed, moved or removed. Layout: {@code shared/schema/summary.schema.json}.
     */
    public static final int FORMAT_VERSION = 2;

    /** Every key of summary.json in snake_case, whichever record it comes from; map keys (ids) as they are. */
    private static final ObjectMapper JSON = new ObjectMapper().enable(SerializationFeature.INDENT_OUTPUT)
            .setPropertyNamingStrategy(PropertyNamingStrategies.SNAKE_CASE)
            .configure(com.fasterxml.jackson.databind.DeserializationFeature.FAIL_ON_UNKNOWN_PROPERTIES, false);

    /**
     * This summary as a JSON object: {@code format_version}, the run's fields, then the given extra
     * sections (names must not clash). A {@code yield} section, when given, replaces the run's own yield
     * counts, so the yield is written once.
     */
    public ObjectNode toJson(Map<String, ?> sections) {
        ObjectNode fields = JSON.valueToTree(this);
        if (sections.containsKey("yield")) {
            fields.remove(List.of("yields", "all_targets"));
        }
        ObjectNode root = JSON.createObjectNode();
        root.put("format_version", FORMAT_VERSION);
        root.setAll(fields);
        for (Map.Entry<String, ?> e : sections.entrySet()) {
            if (root.has(e.getKey())) {
                throw new IllegalArgumentException("section '" + e.getKey() + "' clashes with a run field");
            }
            root.set(e.getKey(), JSON.valueToTree(e.getValue()));
        }
        return root;
    }

    /** Writes {@code summary.json} (with extra sections) atomically; ends with a newline. */
    public void write(Path file, Map<String, ?> sections) throws IOException {
        String text = JSON.writeValueAsString(toJson(sections)) + "\n";
        AtomicFiles.writeString(file, text);
    }

    /** Reads the run part of a summary file (the yield counts are null when the file has a yield section). */
    public static RunSummary read(Path file) throws IOException {
        JsonNode n = JSON.readTree(file.toFile());
        return JSON.treeToValue(n, RunSummary.class);
    }
}
