package org.fabspread.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;

import java.io.IOException;
import java.io.PrintWriter;
import java.io.StringWriter;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.security.MessageDigest;
import java.security.NoSuchAlgorithmException;
import java.util.HexFormat;
import java.util.List;
import java.util.Map;
import java.util.TreeMap;

import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;
import com.fasterxml.jackson.databind.node.ObjectNode;

/**
 * Golden digests of the result files of both demo studies (reduced to 300 samples), so that a change
 * meant to restructure code without changing numbers proves it did not. Common practice for numerical
 * code under refactoring: a characterisation ("golden master") test.
 *
 * <p>The digests live in {@code src/test/resources/golden/demo-digests.txt}. A change that is meant to
 * change the numbers updates that file in a commit whose message says why; the failure message prints
 * the new file to paste. In {@code summary.json} only the build's own provenance (version, commit, build
 * date) is left out of the digest, since it changes with every commit by design.
 */
class GoldenDigestTest {

    static final List<String> STUDIES = List.of("pilot-line-inverted", "gold-rods-conventional");
    static final List<String> FILES = List.of("summary.json", "samples.csv", "sensitivity.csv",
            "plan/plan.csv", "plan/plan.json", "plan/plan.txt");
    static final Path GOLDEN = Path.of("src/test/resources/golden/demo-digests.txt");

    @TempDir
    Path tmp;

    @Test
    void demoResultFilesMatchTheirGoldenDigests() throws IOException {
        Map<String, String> actual = new TreeMap<>();
        for (String study : STUDIES) {
            Path out = tmp.resolve(study);
            StringWriter err = new StringWriter();
            int code = Main.run(new String[] {"run", "demo-studies/" + study + ".yaml", "--out", out.toString(),
                    "--samples", "300", "--threads", "2", "--no-report"}, new PrintWriter(new StringWriter()),
                    new PrintWriter(err));
            assertEquals(0, code, err.toString());
            for (String f : FILES) {
                actual.put(study + "/" + f, sha256(canonical(out.resolve(f), f)));
            }
        }
        StringBuilder now = new StringBuilder();
        actual.forEach((k, v) -> now.append(k).append(' ').append(v).append('\n'));
        String expected = Files.readString(GOLDEN, StandardCharsets.UTF_8);
        assertEquals(expected, now.toString(), "result files changed; if that is intended, write this into "
                + GOLDEN + " in a commit that says why:\n" + now);
    }

    static byte[] canonical(Path file, String name) throws IOException {
        byte[] bytes = Files.readAllBytes(file);
        if (!name.equals("summary.json")) {
            return bytes;
        }
        ObjectMapper json = new ObjectMapper();
        JsonNode tree = json.readTree(bytes);
        JsonNode provenance = tree.get("provenance");
        if (provenance instanceof ObjectNode p) {
            p.remove(List.of("version", "commit", "build_date"));
        }
        return json.writerWithDefaultPrettyPrinter().writeValueAsBytes(tree);
    }

    static String sha256(byte[] bytes) {
        try {
            return HexFormat.of().formatHex(MessageDigest.getInstance("SHA-256").digest(bytes));
        } catch (NoSuchAlgorithmException e) {
            throw new IllegalStateException(e);
        }
    }
}
