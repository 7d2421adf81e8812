package org.fabspread.study;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;
import java.util.Set;
import java.util.stream.Stream;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import com.fasterxml.jackson.dataformat.yaml.YAMLFactory;
import com.networknt.schema.JsonSchema;
import com.networknt.schema.JsonSchemaFactory;
import com.networknt.schema.SpecVersion;
import com.networknt.schema.ValidationMessage;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.params.ParameterizedTest;
import org.junit.jupiter.params.provider.MethodSource;

/**
 * Keeps {@code shared/schema/study.schema.json} and the reader in step: every shipped study validates
 * against the schema; every malformed case marked "schema" in {@code malformed/cases.tsv} fails it.
 */
class StudySchemaTest {

    static final Path SCHEMA = Path.of("shared/schema/study.schema.json");
    static final Path MALFORMED = Path.of("src/test/resources/malformed");
    private static final ObjectMapper YAML = new ObjectMapper(new YAMLFactory());
    private static final JsonSchema SCHEMA_VALIDATOR = load();

    private static JsonSchema load() {
        try {
            JsonNode node = new ObjectMapper().readTree(SCHEMA.toFile());
            return JsonSchemaFactory.getInstance(SpecVersion.VersionFlag.V202012).getSchema(node);
        } catch (IOException e) {
            throw new IllegalStateException(e);
        }
    }

    static Stream<Path> shipped() throws IOException {
        return Stream.concat(Files.list(Path.of("studies")), Files.list(Path.of("demo-studies")))
                .filter(p -> p.toString().endsWith(".yaml")).sorted();
    }

    static Stream<String> schemaLevelCases() throws IOException {
        List<String> out = new ArrayList<>();
        for (String line : Files.readAllLines(MALFORMED.resolve("cases.tsv"), StandardCharsets.UTF_8)) {
            if (!line.startsWith("#") && !line.isBlank() && line.split("\t")[1].equals("schema")) {
                out.add(line.split("\t")[0]);
            }
        }
        return out.stream();
    }

    private static Set<ValidationMessage> validate(Path yaml) throws IOException {
        return SCHEMA_VALIDATOR.validate(YAML.readTree(yaml.toFile()));
    }

    @ParameterizedTest(name = "{0}")
    @MethodSource("shipped")
    void shippedStudiesValidateAndPointAtTheSchema(Path study) throws IOException {
        assertEquals(Set.of(), validate(study));
        String first = Files.readAllLines(study, StandardCharsets.UTF_8).get(0);
        String prefix = "# yaml-language-server: $schema=";
        assertTrue(first.startsWith(prefix), first);
        Path target = study.getParent().resolve(first.substring(prefix.length()).strip()).normalize();
        assertEquals(SCHEMA.normalize(), target, "the comment's relative path leads to the schema");
    }

    @ParameterizedTest(name = "{0}")
    @MethodSource("schemaLevelCases")
    void schemaLevelMistakesFailTheSchemaToo(String file) throws IOException {
        assertFalse(validate(MALFORMED.resolve(file)).isEmpty(), file + " should fail the schema");
    }

    @Test
    void thereAreSchemaLevelCasesOfEachKind() throws IOException {
        // unknown key, wrong type (list / single value), bad enum
        List<String> c = schemaLevelCases().toList();
        assertTrue(c.contains("unknown-key.yaml") && c.contains("list-for-number.yaml")
                && c.contains("single-value-for-list.yaml") && c.contains("unknown-role.yaml"), c.toString());
    }

    /** Every key the reader accepts is described in the schema, with a description. */
    @Test
    void schemaDescribesEveryTopLevelSection() throws IOException {
        JsonNode s = new ObjectMapper().readTree(SCHEMA.toFile());
        assertEquals("https://json-schema.org/draft/2020-12/schema", s.get("$schema").asText());
        for (String k : List.of("name", "description", "wavelengths", "stack", "particles", "collection", "diode",
                "targets", "analysis", "plan", "costs", "correlations")) {
            assertTrue(s.get("properties").has(k), k);
            assertTrue(s.get("properties").get(k).has("description"), k);
        }
        JsonNode analysis = s.get("properties").get("analysis").get("properties");
        assertEquals(1000, analysis.get("samples").get("default").asInt());
        assertEquals("latin-hypercube", analysis.get("sampler").get("default").asText());
    }
}
