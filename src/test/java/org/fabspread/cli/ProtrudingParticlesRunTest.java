package org.fabspread.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.io.PrintWriter;
import java.io.StringWriter;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.Arrays;
import java.util.List;

import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;

/**
 * A realistic case that used to lose samples: 30 nm gold spheres (with their lot-to-lot spread) settled in a
 * 37 nm PEDOT:PSS layer. The samples whose particles come out taller than the layer were refused
 * ("particle-layer-outside-host", 13 of 400 with the code before this change, main at 38bdead); in a real device
 * they stick out into the absorber, and the model now computes them so. Through the run command.
 */
class ProtrudingParticlesRunTest {

    /**
     * SHA-256 of the samples.csv rows whose particles fit their layer (diameter ≤ PEDOT:PSS thickness; 387 rows),
     * measured with the code before this change: those samples must keep their numbers bit for bit.
     */
    private static final String FITTING_ROWS = "680c40f4f3d75bf5031bc67e671c644d0d93be68742eedbb96af49f7635f2ba4";

    @TempDir
    Path tmp;

    @Test
    void particlesTallerThanTheirLayerAreComputedAndTheOthersUnchanged() throws Exception {
        Path out = tmp.resolve("out");
        StringWriter err = new StringWriter();
        int code = Main.run(new String[] {"run", "src/test/resources/protruding/au-30-in-pedot.yaml", "--out",
                out.toString(), "--threads", "2", "--no-report", "--quiet"}, new PrintWriter(new StringWriter()),
                new PrintWriter(err));
        assertEquals(0, code, err.toString());
        JsonNode s = new ObjectMapper().readTree(out.resolve("summary.json").toFile());
        assertEquals(400, s.get("samples_ok").asInt(), "no sample refused: " + s.get("failures"));
        assertEquals(0, s.get("failures").size(), s.get("failures").toString());
        // the study does reach particles taller than their layer: the validity envelope counts them
        int taller = s.get("validity_envelope").get("outside_by_reason").get("larger_than_film").asInt();
        assertTrue(taller >= 10, "samples with particles taller than the layer: " + taller);
        assertEquals(FITTING_ROWS, fittingRowsDigest(out.resolve("samples.csv")));
    }

    private static String fittingRowsDigest(Path samples) throws IOException, java.security.NoSuchAlgorithmException {
        List<String> lines = Files.readAllLines(samples, StandardCharsets.UTF_8);
        List<String> header = Arrays.asList(lines.get(0).split(","));
        int t = header.indexOf("stack.pedot.thickness");
        int d = header.indexOf("particles.diameter");
        StringBuilder kept = new StringBuilder();
        int n = 0;
        for (String l : lines.subList(1, lines.size())) {
            String[] f = l.split(",");
            if (Double.parseDouble(f[d]) <= Double.parseDouble(f[t])) {
                kept.append(l).append('\n');
                n++;
            }
        }
        assertEquals(387, n, "rows whose particles fit");
        byte[] h = java.security.MessageDigest.getInstance("SHA-256").digest(kept.toString().getBytes(StandardCharsets.UTF_8));
        return java.util.HexFormat.of().formatHex(h);
    }
}
