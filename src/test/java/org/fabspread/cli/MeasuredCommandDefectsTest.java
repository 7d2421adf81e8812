package org.fabspread.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.io.PrintWriter;
import java.io.StringWriter;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;

import com.fasterxml.jackson.databind.JsonNode;
import com.fasterxml.jackson.databind.ObjectMapper;

import org.junit.jupiter.api.BeforeAll;
import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * {@code fabspread measured} on the demo's plan filled with the model's own predictions (a noiseless
 * "line" that agrees with the study), with and without an offset, through {@link Main#run}.
 */
class MeasuredCommandDefectsTest {

    static final Path DEMO = Path.of("demo-studies/pilot-line-inverted.yaml");

    @TempDir
    static Path tmp;

    static List<String> sheet;
    static double[] predicted;
    static int measuredCol;

    record Run(int code, String out, String err) {
    }

    static Run cli(String... args) {
        StringWriter out = new StringWriter();
        StringWriter err = new StringWriter();
        int code = Main.run(args, new PrintWriter(out), new PrintWriter(err));
        return new Run(code, out.toString(), err.toString());
    }

    @BeforeAll
    static void planAndPredict() throws IOException {
        Path planDir = tmp.resolve("plan");
        Run p = cli("plan", DEMO.toString(), "--out", planDir.toString(), "--screening-samples", "60", "--threads", "1");
        assertEquals(0, p.code(), p.err());
        sheet = Files.readAllLines(planDir.resolve("plan.csv"));
        List<String> header = List.of(sheet.get(0).split(","));
        List<Integer> factorCols = new ArrayList<>();
        StringBuilder points = new StringBuilder();
        for (int i = 0; i < header.size(); i++) {
            if (header.get(i).startsWith("measured_")) {
                measuredCol = i;
            } else if (header.get(i).contains(" [")) {
                factorCols.add(i);
                points.append(points.length() == 0 ? "" : ",").append(header.get(i), 0, header.get(i).indexOf(' '));
            }
        }
        points.append('\n');
        for (String row : sheet.subList(1, sheet.size())) {
            String[] f = row.split(",", -1);
            StringBuilder line = new StringBuilder();
            for (int c : factorCols) {
                String v = header.get(c).endsWith("[%]") ? Double.toString(Double.parseDouble(f[c]) / 100) : f[c];
                line.append(line.length() == 0 ? "" : ",").append(v);
            }
            points.append(line).append('\n');
        }
        Path in = tmp.resolve("points.csv");
        Files.writeString(in, points.toString());
        Path evalOut = tmp.resolve("eval.csv");
        assertEquals(0, cli("eval", DEMO.toString(), "--inputs", in.toString(), "--output-file", evalOut.toString()).code());
        List<String> ev = Files.readAllLines(evalOut);
        int jsc = List.of(ev.get(0).split(",")).indexOf("jsc");
        predicted = new double[ev.size() - 1];
        for (int r = 1; r < ev.size(); r++) {
            predicted[r - 1] = Double.parseDouble(ev.get(r).split(",")[jsc]);
        }
    }

    static Path filled(String name, double offset) throws IOException {
        StringBuilder b = new StringBuilder(sheet.get(0)).append('\n');
        for (int r = 1; r < sheet.size(); r++) {
            String[] f = sheet.get(r).split(",", -1);
            f[measuredCol] = Double.toString(predicted[r - 1] + offset);
            b.append(String.join(",", f)).append('\n');
        }
        Path p = tmp.resolve(name);
        Files.writeString(p, b.toString());
        return p;
    }

    @Test
    void dataThatAgreeWithTheModelGiveTheNominalValueAndNoFalseAlarm() throws IOException {
        // the runs are the model at the study's nominal values, so a sound calibration finds dissociation
        // 92 % (the demo's nominal) and says the line agrees; the old one fitted dissociation and the k scale
        // together (70.7 % [56, 85] and 2.14 [-0.96, 5.24]) and said the line "differs"
        Path out = tmp.resolve("agree");
        Run m = cli("measured", DEMO.toString(), "--sheet", filled("agree.csv", 0).toString(), "--out", out.toString());
        assertEquals(0, m.code(), m.err());
        JsonNode c = new ObjectMapper().readTree(out.resolve("measured.json").toFile()).get("calibration");
        assertEquals("collection.dissociation", c.get("ids").get(0).asText(), c.toString());
        assertEquals(1, c.get("ids").size());
        assertEquals("stack.absorber.k_scale", c.get("heldAtNominal").get(0).asText());
        assertEquals(0.92, c.get("estimates").get(0).asDouble(), 1e-4);
        assertTrue(m.out().contains("The runs cannot tell collection.dissociation from stack.absorber.k_scale in jsc "
                + "alone"), m.out());
        String report = Files.readString(out.resolve("report.md"));
        assertTrue(report.contains("these runs give no reason to change what the study assumes"), report);
        assertTrue(!report.contains("differs from what the study assumed"), report);
    }

    @Test
    void anOffsetNoLongerEndsTheCommandAndIntervalsStayPhysical() throws IOException {
        // +0.4 mA/cm^2 on every run (about 3 % of J_sc): the old command exited 1 and lost the effects.
        // +2 mA/cm^2 (about 15 %) would need a dissociation above 100 %: the fit stops at the physical limit
        // and the interval ends there, flagged
        for (double offset : new double[] {0.4, 2.0}) {
            Path out = tmp.resolve("offset" + offset);
            Run m = cli("measured", DEMO.toString(), "--sheet", filled("offset" + offset + ".csv", offset).toString(),
                    "--out", out.toString());
            assertEquals(0, m.code(), m.err());
            JsonNode j = new ObjectMapper().readTree(out.resolve("measured.json").toFile());
            assertTrue(j.get("analysis").get("effects").size() > 0);
            JsonNode c = j.get("calibration");
            assertEquals(1, c.get("ids").size(), c.toString());
            assertTrue(c.get("lower").get(0).asDouble() >= 0, c.toString());
            assertTrue(c.get("upper").get(0).asDouble() <= 1, c.toString());
            assertTrue(c.get("estimates").get(0).asDouble() > 0.92, c.toString());
            if (offset > 1) {
                assertEquals(1.0, c.get("estimates").get(0).asDouble(), 1e-4, c.toString());
                assertTrue(c.get("upperAtLimit").get(0).asBoolean(), c.toString());
                assertTrue(m.out().contains("(limit)]"), m.out());
            }
        }
    }
}
