package org.fabspread.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.io.PrintWriter;
import java.io.StringWriter;

import java.nio.file.Path;
import java.util.ArrayList;
import java.util.Iterator;
import java.util.List;
import java.util.Map;
import java.util.Set;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import com.fasterxml.jackson.databind.node.ObjectNode;
import com.networknt.schema.JsonSchema;
import com.networknt.schema.JsonSchemaFactory;
import com.networknt.schema.SpecVersion;
import com.networknt.schema.ValidationMessage;
import org.fabspread.sampling.RunSummary;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * {@code summary.json} of a demo run against its published layout, {@code shared/schema/summary.schema.json}
 * (JSON Schema draft 2020-12, checked by the networknt validator from Maven Central): one key style
 * (snake_case) throughout, a {@code format_version}, the yield written once.
 */
class SummaryFormatTest {

    private static final ObjectMapper JSON = new ObjectMapper();

    @TempDir
    static Path tmp;

    private static JsonNode summary;
    private static JsonSchema schema;

    @BeforeAll
    static void run() throws IOException {
        Path out = tmp.resolve("demo");
        StringWriter err = new StringWriter();
        int code = Main.run(new String[] {"run", "demo-studies/pilot-line-inverted.yaml", "--out", out.toString(),
            "--samples", "200", "--threads", "2", "--no-report", "--quiet"}, new PrintWriter(new StringWriter()),
                new PrintWriter(err));
        assertEquals(0, code, err::toString);
        summary = JSON.readTree(out.resolve("summary.json").toFile());
        schema = JsonSchemaFactory.getInstance(SpecVersion.VersionFlag.V202012)
                .getSchema(JSON.readTree(Path.of("shared/schema/summary.schema.json").toFile()));
    }

    @Test
    void theDemoSummaryFollowsTheSchema() {
        Set<ValidationMessage> errors = schema.validate(summary);
        assertEquals(Set.of(), errors);
        assertEquals(RunSummary.FORMAT_VERSION, summary.get("format_version").asInt());
        assertEquals("format_version", summary.fieldNames().next(), "the version comes first");
    }

    @Test
    void theSchemaRefusesWhatTheLayoutForbids() {
        // the schema is not vacuous: a camelCase key, a missing run field and a wrong version each fail it
        ObjectNode camel = summary.deepCopy();
        camel.set("samplesOk", camel.get("samples_ok"));
        assertFalse(schema.validate(camel).isEmpty());
        ObjectNode missing = summary.deepCopy();
        missing.remove("outputs");
        assertFalse(schema.validate(missing).isEmpty());
        ObjectNode old = summary.deepCopy();
        old.put("format_version", 1);
        assertFalse(schema.validate(old).isEmpty());
    }

    @Test
    void everyKeyIsSnakeCaseAndTheYieldIsWrittenOnce() {
        List<String> camel = new ArrayList<>();
        keys(summary, "", camel);
        assertEquals(List.of(), camel, "keys not in snake_case");
        assertTrue(summary.has("yield"));
        assertFalse(summary.has("yields") || summary.has("all_targets"), "the yield appears once");
    }

    /** Collects every object key (at any depth) with a lower-case letter followed by a capital. */
    private static void keys(JsonNode n, String path, List<String> camel) {
        if (n.isObject()) {
            for (Iterator<Map.Entry<String, JsonNode>> it = n.fields(); it.hasNext(); ) {
                Map.Entry<String, JsonNode> e = it.next();
                if (e.getKey().matches(".*[a-z][A-Z].*")) {
                    camel.add(path + "/" + e.getKey());
                }
                keys(e.getValue(), path + "/" + e.getKey(), camel);
            }
        } else if (n.isArray()) {
            for (int i = 0; i < n.size(); i++) {
                keys(n.get(i), path + "[" + i + "]", camel);
            }
        }
    }

}
