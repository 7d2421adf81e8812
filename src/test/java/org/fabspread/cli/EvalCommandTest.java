package org.fabspread.cli;

import static org.junit.jupiter.api.Assertions.assertEquals;
import static org.junit.jupiter.api.Assertions.assertFalse;
import static org.junit.jupiter.api.Assertions.assertTrue;

import java.io.IOException;
import java.io.PrintWriter;
import java.io.StringWriter;
import java.nio.file.Files;
import java.nio.file.Path;
import java.util.ArrayList;
import java.util.List;

import org.junit.jupiter.api.Test;
import org.junit.jupiter.api.io.TempDir;

/**
 * {@code eval} through the command line: ID columns pass through unchanged, values may carry units, the run
 * sheet the {@code plan} command writes is read as it is, and {@code --out} names a folder like every other
 * command ({@code --output-file} names a file). Unit factors are the SI prefix definitions (BIPM, The
 * International System of Units, 9th ed. 2019, table 7: micro = 1e-6, nano = 1e-9, so 1 µm = 1000 nm) and
 * the percent as 0.01 (ISO 80000-1:2009, 3.1 and annex); every value here is exact in binary or compared
 * with a file of the same rows in canonical units, so the test fails if a factor is wrong.
 */
class EvalCommandTest {

    private static final String DEMO = "demo-studies/pilot-line-inverted.yaml";

    @TempDir
    Path tmp;

    private record Outcome(int code, String out, String err) {
    }

    private static Outcome cli(String... args) {
        StringWriter o = new StringWriter();
        StringWriter e = new StringWriter();
        int code = Main.run(args, new PrintWriter(o), new PrintWriter(e));
        return new Outcome(code, o.toString(), e.toString());
    }

    private List<String> eval(String name, String csv) throws IOException {
        Path in = Files.writeString(tmp.resolve(name + ".csv"), csv);
        Path out = tmp.resolve(name + "-out.csv");
        Outcome r = cli("eval", DEMO, "--inputs", in.toString(), "--output-file", out.toString());
        assertEquals(ExitCodes.OK, r.code(), r.err());
        return Files.readAllLines(out);
    }

    /** The columns after {@code row} and the ID columns: inputs, outputs and status. */
    private static String results(String line, int idColumns) {
        String[] f = line.split(",", -1);
        return String.join(",", List.of(f).subList(1 + idColumns, f.length));
    }

    @Test
    void idColumnsTravelToTheOutputUnchanged() throws IOException {
        List<String> with = eval("ids", "wafer,stack.absorber.thickness,lot\nW-01,100,\"L7, spring\"\nW-02,110,L8\n");
        List<String> plain = eval("plain", "stack.absorber.thickness\n100\n110\n");
        assertEquals(3, with.size());
        assertTrue(with.get(0).startsWith("row,wafer,lot,"), with.get(0));
        assertEquals(plain.get(0).replaceFirst("^row,", "row,wafer,lot,"), with.get(0));
        assertTrue(with.get(1).startsWith("1,W-01,\"L7, spring\","), with.get(1));
        assertTrue(with.get(2).startsWith("2,W-02,L8,"), with.get(2));
        // the quoted lot holds a comma: drop the ID cells by their text, then the numbers match the plain file
        assertEquals(plain.get(1), with.get(1).replace("W-01,\"L7, spring\",", ""));
        assertEquals(plain.get(2), with.get(2).replace("W-02,L8,", ""));
    }

    @Test
    void aMistypedInputIsRefusedNotPassedThrough() throws IOException {
        Path in = Files.writeString(tmp.resolve("typo.csv"), "wafer,stack.absorber.thicknes\nW1,100\n");
        Path out = tmp.resolve("typo-out.csv");
        Outcome r = cli("eval", DEMO, "--inputs", in.toString(), "--output-file", out.toString());
        assertEquals(ExitCodes.BAD_INPUT, r.code(), r.err());
        assertTrue(r.err().strip().startsWith("fabspread: typo.csv:1: column 2 'stack.absorber.thicknes' is not an"
                + " uncertain input of the study; did you mean 'stack.absorber.thickness'?"), r.err());
        assertEquals(1, r.err().strip().lines().count(), r.err());
        assertFalse(Files.exists(out), "nothing written");
    }

    @Test
    void valuesWithUnitsAreConvertedToTheInputsCanonicalUnit() throws IOException {
        String ids = "particles.coverage,stack.absorber.thickness,particles.diameter\n";
        List<String> canonical = eval("canonical", ids + "0.05,102,20\n0.0625,96,24\n");
        List<String> units = eval("units", ids + "5 %,102 nm,0.02 µm\n6.25%,0.096 um,24 nm\n");
        List<String> headed = eval("headed", "particles.coverage [%],stack.absorber.thickness [µm],"
                + "particles.diameter [nm]\n5,0.102,20\n6.25,0.096,24\n");
        assertEquals(canonical, units);
        assertEquals(canonical, headed);
        assertTrue(canonical.get(1).startsWith("1,"), canonical.get(1));
        // a cell's own unit wins over its column's: 20 nm in a column declared in µm
        List<String> mixed = eval("mixed", "particles.diameter [µm]\n20 nm\n0.024\n");
        List<String> plain = eval("plain-d", "particles.diameter\n20\n24\n");
        assertEquals(plain, mixed);
    }

    @Test
    void aValueOfTheWrongDimensionIsOneLineAndWritesNothing() throws IOException {
        Path in = Files.writeString(tmp.resolve("bad.csv"), "wafer,particles.coverage\nW1,5 %\nW2,5 nm\n");
        Path out = tmp.resolve("bad-out.csv");
        Outcome r = cli("eval", DEMO, "--inputs", in.toString(), "--output-file", out.toString());
        assertEquals(ExitCodes.BAD_INPUT, r.code(), r.err());
        assertEquals("fabspread: bad.csv:3:4: particles.coverage: '5 nm': 'nm' is a unit of length; expected a"
                + " fraction in %", r.err().strip());
        assertFalse(Files.exists(out));
        Files.writeString(in, "particles.coverage [kg]\n5\n");
        r = cli("eval", DEMO, "--inputs", in.toString(), "--output-file", out.toString());
        assertEquals(ExitCodes.BAD_INPUT, r.code(), r.err());
        assertTrue(r.err().strip().startsWith("fabspread: bad.csv:1: particles.coverage [kg]: "), r.err());
        assertFalse(Files.exists(out));
    }

    @Test
    void outNamesAFolderAndOutputFileNamesAFile() throws IOException {
        Path in = Files.writeString(tmp.resolve("in.csv"), "stack.absorber.thickness\n100\n");
        Path dir = tmp.resolve("results");
        Outcome r = cli("eval", DEMO, "--inputs", in.toString(), "--out", dir.toString());
        assertEquals(ExitCodes.OK, r.code(), r.err());
        assertTrue(Files.isRegularFile(dir.resolve("eval.csv")), "--out DIR writes DIR/eval.csv");
        assertTrue(r.out().contains(dir.resolve("eval.csv").toString()), r.out());
        Path file = tmp.resolve("one.csv");
        r = cli("eval", DEMO, "--inputs", in.toString(), "--output-file", file.toString());
        assertEquals(ExitCodes.OK, r.code(), r.err());
        assertEquals(Files.readString(dir.resolve("eval.csv")), Files.readString(file));

        Outcome asFile = cli("eval", DEMO, "--inputs", in.toString(), "--out", tmp.resolve("x.csv").toString());
        assertEquals(ExitCodes.BAD_INPUT, asFile.code());
        assertEquals("fabspread: --out " + tmp.resolve("x.csv") + ": names a folder (eval writes DIR/eval.csv); to"
                + " write one file, use --output-file " + tmp.resolve("x.csv"), asFile.err().strip());
        assertFalse(Files.exists(tmp.resolve("x.csv")));
        Outcome both = cli("eval", DEMO, "--inputs", in.toString(), "--out", dir.toString(), "--output-file",
                file.toString());
        assertEquals(ExitCodes.BAD_INPUT, both.code());
        assertTrue(both.err().startsWith("fabspread: "), both.err());
        Outcome neither = cli("eval", DEMO, "--inputs", in.toString());
        assertEquals(ExitCodes.BAD_INPUT, neither.code());
        assertTrue(neither.err().startsWith("fabspread: "), neither.err());
    }

    @Test
    void theRunSheetThePlanCommandWroteIsEvaluatedAsItIs() throws IOException {
        Path planDir = tmp.resolve("plan");
        Outcome p = cli("plan", DEMO, "--runs", "16", "--out", planDir.toString(), "--screening-samples", "100");
        assertEquals(ExitCodes.OK, p.code(), p.err());
        Path sheet = planDir.resolve("plan.csv");
        List<String> rows = Files.readAllLines(sheet);
        List<String> header = List.of(rows.get(0).split(","));
        assertTrue(header.stream().anyMatch(h -> h.endsWith(" [%]")), "the sheet holds a fraction in %: " + header);

        Path evalDir = tmp.resolve("eval");
        Outcome e = cli("eval", DEMO, "--inputs", sheet.toString(), "--out", evalDir.toString());
        assertEquals(ExitCodes.OK, e.code(), e.err());
        List<String> ev = Files.readAllLines(evalDir.resolve("eval.csv"));
        assertEquals(rows.size(), ev.size(), "one output row per run");

        // the same runs written by hand in canonical units (fractions as fractions, not percent)
        List<Integer> factorCols = new ArrayList<>();
        List<String> idCols = new ArrayList<>();
        for (int i = 0; i < header.size(); i++) {
            if (header.get(i).contains(".") && header.get(i).contains(" [")) {
                factorCols.add(i);
            } else {
                idCols.add(header.get(i));
            }
        }
        StringBuilder manual = new StringBuilder();
        for (int c : factorCols) {
            manual.append(manual.length() == 0 ? "" : ",").append(header.get(c), 0, header.get(c).indexOf(' '));
        }
        manual.append('\n');
        for (String row : rows.subList(1, rows.size())) {
            String[] f = row.split(",", -1);
            StringBuilder line = new StringBuilder();
            for (int c : factorCols) {
                String v = header.get(c).endsWith("[%]") ? Double.toString(Double.parseDouble(f[c]) / 100) : f[c];
                line.append(line.length() == 0 ? "" : ",").append(v);
            }
            manual.append(line).append('\n');
        }
        List<String> byHand = eval("by-hand", manual.toString());
        assertEquals("row," + String.join(",", idCols) + "," + results(byHand.get(0), 0), ev.get(0),
                "the sheet's run, std_order, block, measured and notes columns pass through");
        for (int r = 1; r < ev.size(); r++) {
            String[] sheetCells = rows.get(r).split(",", -1);
            String[] evCells = ev.get(r).split(",", -1);
            assertEquals(sheetCells[header.indexOf("run")], evCells[1 + idCols.indexOf("run")], "run " + r);
            // percent / 100 by hand against percent × 0.01 in the reader: equal to the last bit or two
            String[] want = results(byHand.get(r), 0).split(",");
            String[] got = results(ev.get(r), idCols.size()).split(",");
            assertEquals(want.length, got.length);
            assertEquals(want[want.length - 1], got[got.length - 1], "status, run " + r);
            for (int c = 0; c < want.length - 1; c++) {
                double w = Double.parseDouble(want[c]);
                assertEquals(w, Double.parseDouble(got[c]), 1e-12 * Math.abs(w), "run " + r + ", column " + c);
            }
        }
    }
}
