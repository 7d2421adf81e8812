package org.fabspread.cli;

import static org.junit.jupiter.api.Assertions.assertArrayEquals;
import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.io.PrintWriter;
import java.io.StringWriter;
import java.nio.charset.StandardCharsets;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;

import org.fabspread.device.DeviceModel;
import org.fabspread.study.Study;
import org.fabspread.study.StudyReader;
import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;

/**
 * The commands of the main job, end to end on the demo study, through {@link Main#run}. These are
 * checks of the program's own contract (common practice for a command-line tool): reproducibility for
 * any thread count, exit codes, files written, and that the pieces agree with each other. The physics
 * and statistics are held to published values in their own packages' tests.
 */
class PipelineCommandsTest {

    static final Path DEMO = Path.of("demo-studies/pilot-line-inverted.yaml");

    @TempDir
    static Path tmp;

    static Path oneThread;
    static Path twoThreads;
    static String log1;

    record Run(int code, String out, String err) {
    }

    static Run cli(String... args) {
        StringWriter out = new StringWriter();
        StringWriter err = new StringWriter();
        int code = Main.run(args, new PrintWriter(out), new PrintWriter(err));
        return new Run(code, out.toString(), err.toString());
    }

    @BeforeAll
    static void runDemoTwice() {
        oneThread = tmp.resolve("t1");
        twoThreads = tmp.resolve("t2");
        Run a = cli("run", DEMO.toString(), "--out", oneThread.toString(), "--samples", "300", "--threads", "1");
        assertEquals(0, a.code(), a.err());
        log1 = a.out();
        Run b = cli("run", DEMO.toString(), "--out", twoThreads.toString(), "--samples", "300", "--threads", "2");
        assertEquals(0, b.code(), b.err());
    }

    @Test
    void sameSeedGivesBitIdenticalFilesOnAnyThreadCount() throws IOException {
        // common practice: results must not depend on the number of worker threads
        for (String f : List.of("samples.csv", "summary.json", "sensitivity.csv", "plan/plan.csv", "plan/plan.json")) {
            assertArrayEquals(Files.readAllBytes(oneThread.resolve(f)), Files.readAllBytes(twoThreads.resolve(f)), f);
        }
    }

    @Test
    void summaryHoldsEveryAnalysisAndAgreesWithTheSamples() throws IOException {
        JsonNode s = new ObjectMapper().readTree(oneThread.resolve("summary.json").toFile());
        for (String key : List.of("format_version", "outputs", "nominal", "yield", "capability", "screening", "sobol",
                "what_ifs", "tolerance_ranking", "tolerance_allocation", "plan", "provenance")) {
            assertTrue(s.has(key), key);
        }
        // the yield in the summary is the share of rows of samples.csv meeting the target (jsc >= 13.3)
        List<String> lines = Files.readAllLines(oneThread.resolve("samples.csv"), StandardCharsets.UTF_8);
        List<String> header = List.of(lines.get(0).split(","));
        int jsc = header.indexOf("jsc");
        int status = header.indexOf("status");
        long ok = 0;
        long met = 0;
        for (String line : lines.subList(1, lines.size())) {
            String[] f = line.split(",");
            if (f[status].equals("ok")) {
                ok++;
                met += Double.parseDouble(f[jsc]) >= 13.3 ? 1 : 0;
            }
        }
        assertEquals(300, lines.size() - 1);
        JsonNode y = s.get("yield").get("per_target").get(0);
        assertEquals(met, y.get("passed").asLong());
        assertEquals((double) met / ok, y.get("yield").asDouble(), 1e-15);
        assertTrue(log1.contains("Sobol design: N(k + 2 + groups) = 128(9 + 2 + 1) = 1536"), log1);
    }

    @Test
    void badStudyExitsTwoAndWritesNothing() throws IOException {
        Path bad = tmp.resolve("bad.yaml");
        Files.writeString(bad, Files.readString(DEMO).replace("thickness: 120 nm", "thickness: -120 nm"));
        Path out = tmp.resolve("never");
        Run r = cli("run", bad.toString(), "--out", out.toString());
        assertEquals(2, r.code());
        assertEquals(1, r.err().strip().lines().count(), r.err());
        assertTrue(r.err().startsWith("fabspread: bad.yaml:"), r.err());
        assertFalse(Files.exists(out));
    }

    @Test
    void evalReproducesTheNominalPointAndMovesWithTheInput() throws IOException {
        Path in = tmp.resolve("points.csv");
        Files.writeString(in, "stack.absorber.thickness\n90\n100\n110\n");
        Path out = tmp.resolve("eval/out.csv");
        Run r = cli("eval", DEMO.toString(), "--inputs", in.toString(), "--output-file", out.toString());
        assertEquals(0, r.code(), r.err());
        List<String> lines = Files.readAllLines(out);
        assertEquals(4, lines.size());
        int jsc = List.of(lines.get(0).split(",")).indexOf("jsc");
        Study study = StudyReader.read(DEMO);
        DeviceModel m = DeviceModel.of(study);
        double nominal = m.evaluate(m.nominalInputs())[m.outputIndex("jsc")];
        assertEquals(nominal, Double.parseDouble(lines.get(2).split(",")[jsc]), 1e-9 * nominal);
        assertTrue(Double.parseDouble(lines.get(1).split(",")[jsc]) != nominal);
    }

    @Test
    void planThenMeasuredRoundTrip() throws IOException {
        Path planDir = tmp.resolve("plan");
        Run p = cli("plan", DEMO.toString(), "--runs", "16", "--out", planDir.toString(), "--screening-samples", "200");
        assertEquals(0, p.code(), p.err());
        List<String> sheet = Files.readAllLines(planDir.resolve("plan.csv"));
        assertTrue(sheet.size() - 1 <= 16 + 2, "runs within the budget plus centre points");
        // fill the measured column with the model's own prediction at each run (a noiseless "line")
        List<String> header = List.of(sheet.get(0).split(","));
        int measured = -1;
        List<Integer> factorCols = new ArrayList<>();
        for (int i = 0; i < header.size(); i++) {
            if (header.get(i).startsWith("measured_")) {
                measured = i;
            } else if (header.get(i).contains(" [")) {
                factorCols.add(i);
            }
        }
        StringBuilder points = new StringBuilder();
        for (int c : factorCols) {
            points.append(points.length() == 0 ? "" : ",").append(header.get(c).substring(0, header.get(c).indexOf(' ')));
        }
        points.append('\n');
        for (String row : sheet.subList(1, sheet.size())) {
            String[] f = row.split(",", -1);
            StringBuilder line = new StringBuilder();
            for (int c : factorCols) {
                // the run sheet writes fractions in percent; eval takes canonical units
                String v = header.get(c).endsWith("[%]") ? Double.toString(Double.parseDouble(f[c]) / 100) : f[c];
                line.append(line.length() == 0 ? "" : ",").append(v);
            }
            points.append(line).append('\n');
        }
        Path in = tmp.resolve("plan-points.csv");
        Files.writeString(in, points.toString());
        Path evalOut = tmp.resolve("plan-eval.csv");
        assertEquals(0, cli("eval", DEMO.toString(), "--inputs", in.toString(), "--output-file", evalOut.toString()).code());
        List<String> ev = Files.readAllLines(evalOut);
        int jsc = List.of(ev.get(0).split(",")).indexOf("jsc");
        StringBuilder filled = new StringBuilder(sheet.get(0)).append('\n');
        for (int r = 1; r < sheet.size(); r++) {
            String[] f = sheet.get(r).split(",", -1);
            f[measured] = ev.get(r).split(",")[jsc];
            filled.append(String.join(",", f)).append('\n');
        }
        Path filledSheet = tmp.resolve("plan-measured.csv");
        Files.writeString(filledSheet, filled.toString());
        Path mOut = tmp.resolve("measured");
        Run m = cli("measured", DEMO.toString(), "--sheet", filledSheet.toString(), "--out", mOut.toString(),
                "--calibrate", "collection.dissociation");
        assertEquals(0, m.code(), m.err());
        JsonNode j = new ObjectMapper().readTree(mOut.resolve("measured.json").toFile());
        // measured = model at nominal dissociation, so the calibration must find the nominal 0.92
        String text = j.toString();
        assertTrue(text.contains("collection.dissociation"), text);
        assertTrue(Files.exists(mOut.resolve("measured.txt")));
    }

    @Test
    void benchPrintsFigures() {
        Run r = cli("bench", DEMO.toString(), "--seconds", "0.3");
        assertEquals(0, r.code(), r.err());
        assertTrue(r.out().contains("evaluations/s"), r.out());
    }
}
